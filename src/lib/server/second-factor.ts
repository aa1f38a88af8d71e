import { createCipheriv, createDecipheriv, createHash, hkdfSync, randomBytes } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import { Secret, TOTP } from 'otpauth';
import { getDb, write } from '../../db/client';
import { users, type User } from '../../db/schema';
import { resolveAuthSecret } from './auth-secret';
import { HttpError } from './http';
import { verifyPassword } from './password';
import { recordAudit } from './audit';

/**
 * The second factor: time-based one-time codes (RFC 6238 through otpauth: SHA-1, 6 digits, 30 s,
 * one step of clock drift either way) and ten single-use recovery codes kept only as hashes. The
 * TOTP secret is stored encrypted (AES-256-GCM, key derived from the session secret).
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

const hashCode = (code: string) => createHash('sha256').update(code.replace(/[\s-]/g, '').toLowerCase()).digest('hex');

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
  const secret = decryptSecret(user.totpPendingSecret);
  if (totpFor(user.email, secret).validate({ token: code.replace(/\s/g, ''), window: 1 }) === null) {
    throw new HttpError(400, 'code: that code does not match; check the time on the phone and try the next one.', {
      code: 'does not match',
    });
  }
  const codes = Array.from({ length: RECOVERY_CODES }, () =>
    randomBytes(5)
      .toString('hex')
      .replace(/(.{5})/, '$1-'),
  );
  await write(async (tx) => {
    await tx
      .update(users)
      .set({
        totpSecret: user.totpPendingSecret,
        totpPendingSecret: null,
        totpEnabledAt: new Date(),
        recoveryCodeHashes: codes.map(hashCode),
      })
      .where(eq(users.id, userId));
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
  if (!(await verifyPassword(user.passwordHash, password)))
    throw new HttpError(400, 'password: not right.', { password: 'not right' });
  if (!(await checkSecondFactor(user, code)))
    throw new HttpError(400, 'code: that code does not match.', { code: 'does not match' });
  await write(async (tx) => {
    await tx
      .update(users)
      .set({
        totpSecret: null,
        totpPendingSecret: null,
        totpEnabledAt: null,
        recoveryCodeHashes: null,
        sessionVersion: sql`${users.sessionVersion} + 1`,
      })
      .where(eq(users.id, userId));
    await recordAudit(tx, {
      teamId: null,
      actorId: userId,
      action: 'second-factor-off',
      recordType: 'account',
      recordId: userId,
    });
  });
}

/** Whether `code` is the current one-time code, or an unused recovery code (which it then uses up). */
export async function checkSecondFactor(user: User, code: string): Promise<boolean> {
  if (!user.totpSecret || !code) return false;
  const token = code.replace(/\s/g, '');
  if (/^\d{6}$/.test(token))
    return totpFor(user.email, decryptSecret(user.totpSecret)).validate({ token, window: 1 }) !== null;
  const hash = hashCode(code);
  const remaining = user.recoveryCodeHashes ?? [];
  if (!remaining.includes(hash)) return false;
  await write((tx) =>
    tx
      .update(users)
      .set({ recoveryCodeHashes: remaining.filter((h) => h !== hash) })
      .where(eq(users.id, user.id)),
  );
  return true;
}
