import { eq, sql } from 'drizzle-orm';
import { getDb, write, type Transaction } from '../../db/client';
import { users } from '../../db/schema';
import { IMPORTED_ACCOUNT_HASH } from './accounts';
import { recordAudit } from './audit';
import { consumeEmailToken, issueEmailToken } from './email-tokens';
import { queueMessage } from './outbox';
import { takeMailLinkAllowance } from './reset-limit';
import { logSecurityEvent } from './security-log';

/**
 * Proof that a person reads mail at their address: sign-up mails a single-use link (24 h). Until it is
 * followed the account accepts no invitation but one mailed to that address, claims no imported
 * account and is mailed no notices. Such mail belongs to no team (`teamId: null`), so no team's
 * caught-mail page lists it.
 */

/** The one answer to asking for the link again, whether or not the address waits for one. */
export const VERIFICATION_REQUESTED_MESSAGE =
  'If an account waits for this address to be confirmed, a new link is on its way; it works once, for 24 hours.';

/** Queues the verification link for a person inside the caller's transaction. */
export async function queueVerificationMail(
  tx: Transaction,
  person: { id: string; email: string; name: string },
  baseUrl: string,
): Promise<void> {
  const { token, expiresAt } = await issueEmailToken(tx, person.id, 'verify-email');
  await queueMessage(tx, {
    teamId: null,
    to: person.email,
    subject: 'Confirm your address for Lashline',
    text: [
      `Hello ${person.name},`,
      '',
      'Confirm that this is your address to finish making your Lashline account',
      `(the link works once, until ${expiresAt.toUTCString()}):`,
      `${baseUrl}/verify-email?token=${token}`,
      '',
      'If you did not make an account, ignore this message; nothing happens without the link.',
    ].join('\n'),
  });
}

/**
 * Mails the link again when the address has an account that is not verified yet. The answer is the
 * same either way (the caller says "if an account waits for this address, a link is on its way").
 */
export async function requestVerificationMail(request: {
  email: string;
  clientAddress: string;
  baseUrl: string;
}): Promise<void> {
  await write(async (tx) => {
    await takeMailLinkAllowance(tx, { kind: 'verify', email: request.email, clientAddress: request.clientAddress });
    const person = await tx.select().from(users).where(eq(users.email, request.email)).get();
    if (!person || person.emailVerifiedAt || person.passwordHash === IMPORTED_ACCOUNT_HASH) return;
    await queueVerificationMail(tx, person, request.baseUrl);
  });
}

/** Whether the person has proved their address (any link mailed to it, followed). */
export async function isAddressConfirmed(userId: string): Promise<boolean> {
  const db = await getDb();
  const row = await db.select({ at: users.emailVerifiedAt }).from(users).where(eq(users.id, userId)).get();
  return Boolean(row?.at);
}

/** Follows a verification link: single use, within 24 h; answers the address it proved. */
export async function confirmAddress(token: string): Promise<{ email: string }> {
  const email = await write(async (tx) => {
    const { userId } = await consumeEmailToken(tx, token, 'verify-email');
    const [person] = await tx
      .update(users)
      .set({ emailVerifiedAt: sql`coalesce(${users.emailVerifiedAt}, ${Date.now()})` })
      .where(eq(users.id, userId))
      .returning({ email: users.email });
    await recordAudit(tx, {
      teamId: null,
      actorId: userId,
      action: 'verify-email',
      recordType: 'account',
      recordId: userId,
    });
    return person!.email;
  });
  logSecurityEvent('address-verified', { email });
  return { email };
}
