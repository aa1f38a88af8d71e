import { createCipheriv, createDecipheriv, hkdfSync, randomBytes } from 'node:crypto';
import { and, eq, isNull, lt, or, sql } from 'drizzle-orm';
import { Secret, TOTP } from 'otpauth';
import { getDb, write } from '../../db/client';
import { recoveryCodes, users, type User } from '../../db/schema';
import { isRecoveryCodeShaped, makeRecoveryCodes, replaceRecoveryCodes, spendRecoveryCode } from './recovery-codes';
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
    await replaceRecoveryCodes(tx, userId, codes);
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

/**
 * A signed-in person proving it again: the password (limited per account) and a current or recovery code
 * (limited per account with the sign-in's code limit); 400 naming the field that is wrong, 429 past a limit.
 */
async function requirePasswordAndCode(user: User, password: string, code: string): Promise<void> {
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
}

/** Ten new recovery codes in place of the old ones (used, lost or retired), with the password and a code. */
export async function remakeRecoveryCodes(userId: string, password: string, code: string): Promise<string[]> {
  const db = await getDb();
  const user = await db.select().from(users).where(eq(users.id, userId)).get();
  if (!user?.totpEnabledAt) throw new HttpError(409, 'The second factor is not on.');
  await requirePasswordAndCode(user, password, code);
  const codes = makeRecoveryCodes();
  await write(async (tx) => {
    await replaceRecoveryCodes(tx, userId, codes);
    await recordAudit(tx, {
      teamId: null,
      actorId: userId,
      action: 'recovery-codes-remade',
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
  await requirePasswordAndCode(user, password, code);
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
  if (!isRecoveryCodeShaped(code)) return false;
  return spendRecoveryCode(user.id, code);
}
