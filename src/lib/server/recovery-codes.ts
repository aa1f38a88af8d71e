import { createHmac, hkdfSync, randomBytes } from 'node:crypto';
import { and, count, eq, isNull } from 'drizzle-orm';
import { getDb, write, type Transaction } from '../../db/client';
import { recoveryCodes } from '../../db/schema';
import { resolveAuthSecret } from './auth-secret';

/**
 * Recovery codes: ten per person, each 80 random bits written `xxxxx-xxxxx-xxxxx-xxxxx`, kept only as
 * HMAC-SHA-256 under a key derived from the session secret, and spent by one conditional update.
 * Why an HMAC and not argon2id: docs/decisions/008-sessions-and-recovery-codes.md.
 */
const RECOVERY_CODES = 10;

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
export function makeRecoveryCodes(): string[] {
  return Array.from({ length: RECOVERY_CODES }, () =>
    randomBytes(RECOVERY_CODE_BYTES)
      .toString('hex')
      .replace(/(.{5})(?=.)/g, '$1-'),
  );
}

/** Whether `code` has a recovery code's shape (20 hex digits once spaces and dashes are gone). */
export function isRecoveryCodeShaped(code: string): boolean {
  return /^[0-9a-f]{20}$/.test(normaliseRecoveryCode(code));
}

/** Puts `codes` in place of every recovery code the person had, inside the caller's transaction. */
export async function replaceRecoveryCodes(tx: Transaction, userId: string, codes: string[]): Promise<void> {
  await tx.delete(recoveryCodes).where(eq(recoveryCodes.userId, userId));
  await tx.insert(recoveryCodes).values(codes.map((code) => ({ userId, codeHash: hashRecoveryCode(code) })));
}

/** Uses up a recovery code in one conditional update: of two requests with one code, one wins. */
export async function spendRecoveryCode(userId: string, code: string): Promise<boolean> {
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

/** How many unused recovery codes the person has (0 after the old 40-bit codes were retired). */
export async function countRecoveryCodesLeft(userId: string): Promise<number> {
  const db = await getDb();
  const row = await db
    .select({ left: count() })
    .from(recoveryCodes)
    .where(and(eq(recoveryCodes.userId, userId), isNull(recoveryCodes.usedAt)))
    .get();
  return row?.left ?? 0;
}
