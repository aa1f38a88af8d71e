import { randomUUID } from 'node:crypto';
import { and, desc, eq, gt, lte } from 'drizzle-orm';
import type { Transaction } from '../../db/client';
import { mailLinkRequests } from '../../db/schema';
import { HttpError } from './http';

/**
 * How often a mailed link (password reset, verification again) may be asked for: per address and per
 * client, counted in the database so every server process sees the same counts and a restart forgets
 * nothing. One small file on purpose: a general database-backed limiter can take its place.
 */
export const MAIL_LINK_LIMITS = {
  perAddress: { max: 3, windowMs: 60 * 60_000 },
  perClient: { max: 20, windowMs: 60 * 60_000 },
} as const;

export type MailLinkKind = 'reset' | 'verify';

/**
 * Counts one request inside the caller's transaction, or throws 429 with Retry-After when the address
 * or the client has used its allowance. A refused request writes nothing. The answer is the same whether
 * the address has an account or not: the count is of what was asked for, not of what exists.
 */
export async function takeMailLinkAllowance(
  tx: Transaction,
  request: { kind: MailLinkKind; email: string; clientAddress: string },
  now = new Date(),
): Promise<void> {
  const keys = [
    { key: `${request.kind}:address:${request.email}`, limit: MAIL_LINK_LIMITS.perAddress },
    { key: `${request.kind}:client:${request.clientAddress}`, limit: MAIL_LINK_LIMITS.perClient },
  ];
  let waitMs = 0;
  for (const { key, limit } of keys) {
    const since = new Date(now.getTime() - limit.windowMs);
    // At most `max` rows per key fall inside the window: nothing is counted once a key is full.
    const recent = await tx
      .select({ at: mailLinkRequests.at })
      .from(mailLinkRequests)
      .where(and(eq(mailLinkRequests.key, key), gt(mailLinkRequests.at, since)))
      .orderBy(desc(mailLinkRequests.at))
      .limit(limit.max);
    if (recent.length < limit.max) continue;
    // The place frees when the oldest of the last `max` requests leaves the window.
    const oldest = recent.at(-1)!.at.getTime();
    waitMs = Math.max(waitMs, oldest + limit.windowMs - now.getTime());
  }
  if (waitMs > 0) {
    const seconds = Math.max(1, Math.ceil(waitMs / 1000));
    const minutes = Math.ceil(seconds / 60);
    throw new HttpError(
      429,
      `Too many requests for a link. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
      undefined,
      { 'Retry-After': String(seconds) },
    );
  }
  const longest = Math.max(MAIL_LINK_LIMITS.perAddress.windowMs, MAIL_LINK_LIMITS.perClient.windowMs);
  await tx.delete(mailLinkRequests).where(lte(mailLinkRequests.at, new Date(now.getTime() - longest)));
  await tx.insert(mailLinkRequests).values(keys.map(({ key }) => ({ id: randomUUID(), key, at: now })));
}
