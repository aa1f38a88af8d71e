import type { Transaction } from '../../db/client';
import { countAttemptsIn } from './attempt-limits';
import { HttpError } from './http';

/**
 * How often a mailed link (password reset, verification again) may be asked for: per address and per
 * client, counted in the database so every server process sees the same counts and a restart forgets
 * nothing: the same table and rule as every other limit (`attempt-limits.ts`).
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
  const { waitMs } = await countAttemptsIn(
    tx,
    [
      { kind: `mail-link-${request.kind}-address`, key: request.email, ...MAIL_LINK_LIMITS.perAddress },
      { kind: `mail-link-${request.kind}-client`, key: request.clientAddress, ...MAIL_LINK_LIMITS.perClient },
    ],
    now.getTime(),
  );
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
}
