import { randomBytes, randomUUID } from 'node:crypto';
import { and, eq, gt, isNull } from 'drizzle-orm';
import type { Transaction } from '../../db/client';
import { emailTokens, type EMAIL_TOKEN_PURPOSES } from '../../db/schema';
import { HttpError } from './http';
import { hashToken } from './invitations';

/**
 * Single-use links mailed to a person (verify the address, reset the password). The link carries 256
 * random bits; only their SHA-256 is stored, so a copy of the database opens nothing.
 */
export type EmailTokenPurpose = (typeof EMAIL_TOKEN_PURPOSES)[number];

export const EMAIL_TOKEN_LIFETIME_MS: Record<EmailTokenPurpose, number> = {
  'verify-email': 24 * 60 * 60_000,
  'reset-password': 60 * 60_000,
};

/** Stores a new token's hash inside the caller's transaction and returns the token for the link. */
export async function issueEmailToken(
  tx: Transaction,
  userId: string,
  purpose: EmailTokenPurpose,
  now = new Date(),
): Promise<{ token: string; expiresAt: Date }> {
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(now.getTime() + EMAIL_TOKEN_LIFETIME_MS[purpose]);
  await tx.insert(emailTokens).values({ id: randomUUID(), userId, purpose, tokenHash: hashToken(token), expiresAt });
  return { token, expiresAt };
}

/**
 * Uses a token up in one conditional update (unused, unexpired, this purpose), so two requests with
 * one link cannot both pass; answers whose it was. 404 unknown, 410 used or expired, naming the field.
 */
export async function consumeEmailToken(
  tx: Transaction,
  token: string,
  purpose: EmailTokenPurpose,
  now = new Date(),
): Promise<{ userId: string }> {
  const tokenHash = hashToken(token);
  const [used] = await tx
    .update(emailTokens)
    .set({ usedAt: now })
    .where(
      and(
        eq(emailTokens.tokenHash, tokenHash),
        eq(emailTokens.purpose, purpose),
        isNull(emailTokens.usedAt),
        gt(emailTokens.expiresAt, now),
      ),
    )
    .returning({ userId: emailTokens.userId });
  if (used) return used;
  const known = await tx
    .select({ usedAt: emailTokens.usedAt, purpose: emailTokens.purpose })
    .from(emailTokens)
    .where(eq(emailTokens.tokenHash, tokenHash))
    .get();
  if (!known || known.purpose !== purpose)
    throw new HttpError(404, 'token: this link is not known; ask for a new one.', { token: 'unknown' });
  if (known.usedAt)
    throw new HttpError(410, 'token: this link was already used; ask for a new one.', { token: 'already used' });
  throw new HttpError(410, 'token: this link has expired; ask for a new one.', { token: 'expired' });
}

/** Ends every other open link of this purpose for the person (after a reset, older reset links die). */
export async function retireEmailTokens(
  tx: Transaction,
  userId: string,
  purpose: EmailTokenPurpose,
  now = new Date(),
): Promise<void> {
  await tx
    .update(emailTokens)
    .set({ usedAt: now })
    .where(and(eq(emailTokens.userId, userId), eq(emailTokens.purpose, purpose), isNull(emailTokens.usedAt)));
}
