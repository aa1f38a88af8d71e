import { eq, sql } from 'drizzle-orm';
import { write, type Transaction } from '../../db/client';
import { users, type User } from '../../db/schema';
import { IMPORTED_ACCOUNT_HASH } from './accounts';
import { recordAudit } from './audit';
import { consumeEmailToken, issueEmailToken, retireEmailTokens } from './email-tokens';
import { queueMessage } from './outbox';
import { hashPassword } from './password';
import { takeMailLinkAllowance } from './reset-limit';
import { logSecurityEvent } from './security-log';

/**
 * The way back from a forgotten password: a single-use link (1 h) mailed to the account's address.
 * Asking answers the same whether the address has an account or not, and is limited per address and
 * per client. Following the link sets the new password, proves the address, ends every session of the
 * person and leaves a row in the audit trail. The same link lets the owner of an address claim an
 * account a team import made for it.
 */

/** The one answer to a reset request, whether or not the address has an account. */
export const RESET_REQUESTED_MESSAGE =
  'If an account uses this address, a link to choose a new password is on its way; it works once, for an hour.';

/** Queues a reset (or, for an imported account, a claim) link inside the caller's transaction. */
export async function queueResetMail(tx: Transaction, person: User, baseUrl: string): Promise<void> {
  const { token, expiresAt } = await issueEmailToken(tx, person.id, 'reset-password');
  const link = `${baseUrl}/reset-password?token=${token}`;
  const claim = person.passwordHash === IMPORTED_ACCOUNT_HASH;
  await queueMessage(tx, {
    teamId: null,
    to: person.email,
    subject: claim ? 'Choose a password for your Lashline account' : 'Reset your Lashline password',
    text: [
      `Hello ${person.name},`,
      '',
      claim
        ? 'A team brought its Lashline records over, and an account with this address came with them. Choose its password here'
        : 'Someone (we hope you) asked to reset the password of your Lashline account. Choose a new one here',
      `(the link works once, until ${expiresAt.toUTCString()}):`,
      link,
      '',
      claim
        ? 'If you did not ask for this, ignore this message; the account stays closed without the link.'
        : 'If you did not ask for this, ignore this message; your password stays as it is.',
    ].join('\n'),
  });
}

/** Mails a reset link when the address has an account; otherwise does nothing, with the same answer. */
export async function requestPasswordReset(request: {
  email: string;
  clientAddress: string;
  baseUrl: string;
}): Promise<void> {
  await write(async (tx) => {
    await takeMailLinkAllowance(tx, { kind: 'reset', email: request.email, clientAddress: request.clientAddress });
    const person = await tx.select().from(users).where(eq(users.email, request.email)).get();
    if (person) await queueResetMail(tx, person, request.baseUrl);
  });
  logSecurityEvent('password-reset-requested', { email: request.email, clientAddress: request.clientAddress });
}

/** Sets a new password from a reset link: single use, within the hour; every session of the person ends. */
export async function resetPassword(token: string, newPassword: string): Promise<{ email: string }> {
  const passwordHash = await hashPassword(newPassword);
  const email = await write(async (tx) => {
    const { userId } = await consumeEmailToken(tx, token, 'reset-password');
    const [person] = await tx
      .update(users)
      .set({
        passwordHash,
        // The session version moves on: every session of this person, on every device, ends.
        sessionVersion: sql`${users.sessionVersion} + 1`,
        // The link went to this address, so following it proves the address.
        emailVerifiedAt: sql`coalesce(${users.emailVerifiedAt}, ${Date.now()})`,
      })
      .where(eq(users.id, userId))
      .returning({ email: users.email });
    await retireEmailTokens(tx, userId, 'reset-password');
    await recordAudit(tx, {
      teamId: null,
      actorId: userId,
      action: 'reset-password',
      recordType: 'account',
      recordId: userId,
    });
    return person!.email;
  });
  logSecurityEvent('password-reset', { email });
  return { email };
}
