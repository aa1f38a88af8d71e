import { randomUUID } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import { getDb, write } from '../../db/client';
import { users, type User } from '../../db/schema';
import type { SignUpInput } from '../account-schemas';
import { HttpError } from './http';
import { getDecoyHash, hashPassword, verifyPassword } from './password';
import { recordAudit } from './audit';
import { requireRightPassword } from './password-recheck';
import { queueVerificationMail } from './address-verification';
import { queueResetMail } from './password-reset';
import { takeMailLinkAllowance } from './reset-limit';

/** The password hash of an account a team import made: it matches no password until claimed. */
export const IMPORTED_ACCOUNT_HASH = 'imported-account:no-password';

export interface PublicUser {
  id: string;
  email: string;
  name: string;
  lengthUnit: User['lengthUnit'];
  torqueUnit: User['torqueUnit'];
  currentTeamId: string | null;
  secondFactor: boolean;
}

/** The fields of a person that may leave the server. */
export function userToPublic(user: User): PublicUser {
  const { id, email, name, lengthUnit, torqueUnit, currentTeamId } = user;
  return { id, email, name, lengthUnit, torqueUnit, currentTeamId, secondFactor: Boolean(user.totpEnabledAt) };
}

export type SignUpOutcome =
  | { kind: 'created'; user: User }
  /** The address has an account a team import made: its owner was mailed a link to choose a password. */
  | { kind: 'claim-mailed' };

/**
 * Creates an account and mails its verification link; 409 when the e-mail already has an account.
 * An account made by a team import is not taken over by whoever signs up with its address first: the
 * address is mailed a link to choose the password, and nothing changes until it is followed.
 */
export async function createAccount(
  input: SignUpInput,
  request: { baseUrl: string; clientAddress: string },
): Promise<SignUpOutcome> {
  const { baseUrl, clientAddress } = request;
  const passwordHash = await hashPassword(input.password);
  return write(async (tx) => {
    const existing = await tx.select().from(users).where(eq(users.email, input.email)).get();
    if (existing?.passwordHash === IMPORTED_ACCOUNT_HASH) {
      // The claim link is a reset link, limited like one, so sign-ups cannot flood the address with mail.
      await takeMailLinkAllowance(tx, { kind: 'reset', email: input.email, clientAddress });
      await queueResetMail(tx, existing, baseUrl);
      await recordAudit(tx, {
        teamId: null,
        actorId: null,
        action: 'claim-requested',
        recordType: 'account',
        recordId: existing.id,
      });
      return { kind: 'claim-mailed' as const };
    }
    if (existing)
      throw new HttpError(409, 'An account with this e-mail already exists; sign in instead.', {
        email: 'already registered',
      });
    const [user] = await tx
      .insert(users)
      .values({ id: randomUUID(), email: input.email, name: input.name, passwordHash })
      .returning();
    if (!user) throw new Error('insert returned no row');
    await recordAudit(tx, {
      teamId: null,
      actorId: user.id,
      action: 'create',
      recordType: 'account',
      recordId: user.id,
    });
    await queueVerificationMail(tx, user, baseUrl);
    return { kind: 'created' as const, user };
  });
}

/** The account for these credentials, or null; an unknown e-mail costs the same time as a wrong password. */
export async function verifyCredentials(email: string, password: string): Promise<User | null> {
  const db = await getDb();
  const user = await db.select().from(users).where(eq(users.email, email)).get();
  if (!user) {
    await verifyPassword(await getDecoyHash(), password);
    return null;
  }
  return (await verifyPassword(user.passwordHash, password)) ? user : null;
}

export async function findUserById(id: string): Promise<User | undefined> {
  const db = await getDb();
  return db.select().from(users).where(eq(users.id, id)).get();
}

/** Changes name and units. */
export async function updateAccountSettings(
  userId: string,
  changes: Partial<Pick<User, 'name' | 'lengthUnit' | 'torqueUnit'>>,
): Promise<User> {
  // An empty change (`{}` is a valid body) has nothing to set, and Drizzle refuses an UPDATE without a SET.
  if (Object.values(changes).every((value) => value === undefined)) {
    const user = await findUserById(userId);
    if (!user) throw new HttpError(404, 'No such account.');
    return user;
  }
  return write(async (tx) => {
    const [user] = await tx.update(users).set(changes).where(eq(users.id, userId)).returning();
    if (!user) throw new HttpError(404, 'No such account.');
    return user;
  });
}

/** Changes the password and ends every other session (the session version moves on). */
export async function changePassword(userId: string, currentPassword: string, newPassword: string): Promise<User> {
  const user = await findUserById(userId);
  if (!user) throw new HttpError(404, 'No such account.');
  await requireRightPassword(user, currentPassword, 'currentPassword');
  const passwordHash = await hashPassword(newPassword);
  return write(async (tx) => {
    const [updated] = await tx
      .update(users)
      .set({ passwordHash, sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(eq(users.id, userId))
      .returning();
    if (!updated) throw new HttpError(404, 'No such account.');
    await recordAudit(tx, {
      teamId: null,
      actorId: userId,
      action: 'change-password',
      recordType: 'account',
      recordId: userId,
    });
    return updated;
  });
}
