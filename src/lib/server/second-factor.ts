import { createCipheriv, createDecipheriv, createHmac, hkdfSync, randomBytes } from 'node:crypto';
import { and, eq, isNull, lt, or, sql } from 'drizzle-orm';
import { Secret, TOTP } from 'otpauth';
import { getDb, write } from '../../db/client';
import { recoveryCodes, users, type User } from '../../db/schema';
import { SECOND_FACTOR_CODE_LIMIT, SECOND_FACTOR_CONFIRM_LIMIT } from '../rate-limit';
import { requireAttemptAllowed } from './attempt-limits';
import { requireRightPassword } from './password-recheck';
import { SECOND_FACTOR_CODE } from './sign-in-limiter';
import { resolveAuthSecret } from './auth-secret';
import { HttpError } from './http';
import { recordAudit } from './audit';

/**
 * The second factor: time-based one-time codes (RFC 6238 through otpauth: SHA-1, 6 digits, 30 s,
 * one step of clock drift either way), each time step accepted once per person, and ten single-use
 * recovery codes of 80 random bits kept only as HMACs. The TOTP secret is stored encrypted
 * (AES-256-GCM, key derived from the session secret).
 */
const RECOVERY_CODES = 10;

function secretKey(): Buffer {
  return Buffer.from(hkdfSync('sha256', resolveAuthSecret(), 'lashline', 'totp-secret', 32));
}

export function encryptSecret(base32: string): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', secretKey(), iv);
  const body = Buffer.concat([cipher.update(base32, 'utf8'), cipher.final()]);
  return [iv, cipher.getAuthTag(), body].map((part) => part.toString('base64url')).join('.');
}

export function decryptSecret(stored: string): string {
  const [iv, tag, body] = stored.split('.').map((part) => Buffer.from(part, 'base64url'));
  const decipher = createDecipheriv('aes-256-gcm', secretKey(), iv!);
  decipher.setAuthTag(tag!);
  return Buffer.concat([decipher.update(body!), decipher.final()]).toString('utf8');
}

function totpFor(email: string, base32: string): TOTP {
  return new TOTP({
    issuer: 'Lashline',
    label: email,
    algorithm: 'SHA1',
    digits: 6,
    period: 30,
    secret: Secret.fromBase32(base32),
  });
}

// 80 random bits, the least ASVS 6.5.2 accepts for a recovery code.
const RECOVERY_CODE_BYTES = 10;

// Recovery codes are kept as HMAC-SHA-256 under a key derived from the session secret: a copy of the
// database alone cannot test guesses against them, and checking one costs no argon2 run (so a right
// password with a wrong code takes as long as a wrong password).
function recoveryKey(): Buffer {
  return Buffer.from(hkdfSync('sha256', resolveAuthSecret(), 'lashline', 'recovery-code', 32));
}

const normaliseRecoveryCode = (code: string) => code.replace(/[\s-]/g, '').toLowerCase();
const hashRecoveryCode = (code: string) =>
  createHmac('sha256', recoveryKey()).update(normaliseRecoveryCode(code)).digest('hex');

/** Ten new recovery codes, 80 random bits each, written `xxxxx-xxxxx-xxxxx-xxxxx`. */
function makeRecoveryCodes(): string[] {
  return Array.from({ length: RECOVERY_CODES }, () =>
    randomBytes(RECOVERY_CODE_BYTES)
      .toString('hex')
      .replace(/(.{5})(?=.)/g, '$1-'),
  );
}

/** The 30-second step a code from `totp` matches now, or null (one step of drift either way). */
function matchingStep(totp: TOTP, token: string, now = Date.now()): number | null {
  const delta = totp.validate({ token, window: 1, timestamp: now });
  return delta === null ? null : Math.floor(now / 1000 / totp.period) + delta;
}

/** Takes a time step for the person, once: false when it, or a later one, was already used (ASVS 6.5.1). */
async function takeTimeStep(userId: string, step: number): Promise<boolean> {
  const taken = await write((tx) =>
    tx
      .update(users)
      .set({ totpLastStep: step })
      .where(and(eq(users.id, userId), or(isNull(users.totpLastStep), lt(users.totpLastStep, step))))
      .returning({ id: users.id }),
  );
  return taken.length === 1;
}

/** Uses up a recovery code in one conditional update: of two requests with one code, one wins. */
async function spendRecoveryCode(userId: string, code: string): Promise<boolean> {
  const used = await write((tx) =>
    tx
      .update(recoveryCodes)
      .set({ usedAt: new Date() })
      .where(
        and(
          eq(recoveryCodes.userId, userId),
          eq(recoveryCodes.codeHash, hashRecoveryCode(code)),
          isNull(recoveryCodes.usedAt),
        ),
      )
      .returning({ userId: recoveryCodes.userId }),
  );
  return used.length === 1;
}

/** Starts setting up: a new secret waits for its first code. Returns what an authenticator app needs. */
export async function beginSecondFactor(user: Pick<User, 'id' | 'email'>): Promise<{ secret: string; uri: string }> {
  const secret = new Secret({ size: 20 }).base32;
  await write((tx) =>
    tx
      .update(users)
      .set({ totpPendingSecret: encryptSecret(secret) })
      .where(eq(users.id, user.id)),
  );
  return { secret, uri: totpFor(user.email, secret).toString() };
}

/** Confirms the pending secret with a code from the app; returns the recovery codes, shown once. */
export async function confirmSecondFactor(userId: string, code: string): Promise<string[]> {
  const db = await getDb();
  const user = await db.select().from(users).where(eq(users.id, userId)).get();
  if (!user?.totpPendingSecret)
    throw new HttpError(409, 'Start the set-up first: no second factor is waiting for a code.');
  const attempt = await requireAttemptAllowed(
    'second-factor-confirm',
    userId,
    SECOND_FACTOR_CONFIRM_LIMIT,
    'wrong codes',
  );
  const secret = decryptSecret(user.totpPendingSecret);
  const step = matchingStep(totpFor(user.email, secret), code.replace(/\s/g, ''));
  if (step === null) {
    throw new HttpError(400, 'code: that code does not match; check the time on the phone and try the next one.', {
      code: 'does not match',
    });
  }
  await attempt.forgive();
  const codes = makeRecoveryCodes();
  await write(async (tx) => {
    await tx
      .update(users)
      .set({
        totpSecret: user.totpPendingSecret,
        totpPendingSecret: null,
        totpEnabledAt: new Date(),
        // The confirming code's step counts as used: it cannot sign in afterwards.
        totpLastStep: step,
      })
      .where(eq(users.id, userId));
    await tx.delete(recoveryCodes).where(eq(recoveryCodes.userId, userId));
    await tx.insert(recoveryCodes).values(codes.map((c) => ({ userId, codeHash: hashRecoveryCode(c) })));
    await recordAudit(tx, {
      teamId: null,
      actorId: userId,
      action: 'second-factor-on',
      recordType: 'account',
      recordId: userId,
    });
  });
  return codes;
}

/** Turns the second factor off, with the password and a current code (or a recovery code). */
export async function disableSecondFactor(userId: string, password: string, code: string): Promise<void> {
  const db = await getDb();
  const user = await db.select().from(users).where(eq(users.id, userId)).get();
  if (!user?.totpEnabledAt) throw new HttpError(409, 'The second factor is not on.');
  await requireRightPassword(user, password, 'password');
  const codeAttempt = await requireAttemptAllowed(
    SECOND_FACTOR_CODE,
    user.email,
    SECOND_FACTOR_CODE_LIMIT,
    'wrong codes',
  );
  if (!(await checkSecondFactor(user, code)))
    throw new HttpError(400, 'code: that code does not match.', { code: 'does not match' });
  await codeAttempt.forgive();
  await write(async (tx) => {
    await tx
      .update(users)
      .set({
        totpSecret: null,
        totpPendingSecret: null,
        totpEnabledAt: null,
        totpLastStep: null,
        sessionVersion: sql`${users.sessionVersion} + 1`,
      })
      .where(eq(users.id, userId));
    await tx.delete(recoveryCodes).where(eq(recoveryCodes.userId, userId));
    await recordAudit(tx, {
      teamId: null,
      actorId: userId,
      action: 'second-factor-off',
      recordType: 'account',
      recordId: userId,
    });
  });
}

/**
 * Whether `code` is a one-time code of a time step not used before, or an unused recovery code; either
 * is used up by the check (one conditional update), so a code works once.
 */
export async function checkSecondFactor(user: User, code: string): Promise<boolean> {
  if (!user.totpSecret || !code) return false;
  const token = code.replace(/\s/g, '');
  if (/^\d{6}$/.test(token)) {
    const step = matchingStep(totpFor(user.email, decryptSecret(user.totpSecret)), token);
    return step !== null && (await takeTimeStep(user.id, step));
  }
  if (!/^[0-9a-f]{20}$/.test(normaliseRecoveryCode(code))) return false;
  return spendRecoveryCode(user.id, code);
}
