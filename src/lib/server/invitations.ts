import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { and, desc, eq, gt, isNull, sql } from 'drizzle-orm';
import { getDb, write } from '../../db/client';
import { invitations, memberships, teams, users } from '../../db/schema';
import { ROLE_LABELS, rolesGrantableBy, type Role } from '../roles';
import { HttpError } from './http';
import { queueMessage } from './outbox';
import { recordAudit } from './audit';

export const INVITATION_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000;

/** The SHA-256 of an invitation token, as stored. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export interface InvitationRequest {
  teamId: string;
  actorId: string;
  actorRole: Role;
  email: string;
  role: Role;
  baseUrl: string;
}

/** Invites someone by e-mail: stores the token's hash, queues the mail with the link, returns the id. */
export async function createInvitation(request: InvitationRequest): Promise<{ id: string; expiresAt: Date }> {
  if (!rolesGrantableBy(request.actorRole).includes(request.role)) {
    throw new HttpError(
      403,
      `role: a ${ROLE_LABELS[request.actorRole].toLowerCase()} cannot invite a ${ROLE_LABELS[request.role].toLowerCase()}.`,
      { role: 'not allowed for you' },
    );
  }
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_MS);
  const id = randomUUID();
  return write(async (tx) => {
    const team = await tx.select({ name: teams.name }).from(teams).where(eq(teams.id, request.teamId)).get();
    const inviter = await tx.select({ name: users.name }).from(users).where(eq(users.id, request.actorId)).get();
    if (!team || !inviter) throw new HttpError(404, 'No such team.');
    await tx.insert(invitations).values({
      id,
      teamId: request.teamId,
      email: request.email,
      role: request.role,
      tokenHash: hashToken(token),
      invitedBy: request.actorId,
      expiresAt,
    });
    const link = `${request.baseUrl}/invitations/accept?token=${token}`;
    await queueMessage(tx, {
      teamId: request.teamId,
      to: request.email,
      subject: `You are invited to ${team.name} on Lashline`,
      text: [
        `${inviter.name} invited you to join ${team.name} on Lashline as ${ROLE_LABELS[request.role].toLowerCase()}.`,
        '',
        "Lashline keeps the team's gear-set inspections, runs and decisions in one place.",
        '',
        `Accept the invitation (the link works once, until ${expiresAt.toUTCString()}):`,
        link,
        '',
        'If you did not expect this, ignore this message.',
      ].join('\n'),
    });
    await recordAudit(tx, {
      teamId: request.teamId,
      actorId: request.actorId,
      action: 'invite',
      recordType: 'invitation',
      recordId: id,
      after: { email: request.email, role: request.role },
    });
    return { id, expiresAt };
  });
}

/**
 * Accepts an invitation for the signed-in person: single use, within 7 days, for the invited address.
 * An account whose address is not proved may accept only this way: the link, mailed to that very
 * address, is the proof, and the address counts as verified from then on.
 */
export async function acceptInvitation(userId: string, token: string): Promise<{ teamId: string; role: Role }> {
  return write(async (tx) => {
    const invitation = await tx
      .select()
      .from(invitations)
      .where(eq(invitations.tokenHash, hashToken(token)))
      .get();
    if (!invitation)
      throw new HttpError(404, 'token: this invitation link is not known; ask for a new one.', { token: 'unknown' });
    if (invitation.acceptedAt)
      throw new HttpError(410, 'token: this invitation was already used; ask for a new one.', {
        token: 'already used',
      });
    if (invitation.expiresAt.getTime() < Date.now())
      throw new HttpError(410, 'token: this invitation has expired; ask for a new one.', { token: 'expired' });
    const person = await tx.select({ email: users.email }).from(users).where(eq(users.id, userId)).get();
    if (!person || person.email !== invitation.email) {
      throw new HttpError(403, `This invitation is for ${invitation.email}; sign in with that address to accept it.`);
    }
    const existing = await tx
      .select({ role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.teamId, invitation.teamId), eq(memberships.userId, userId)))
      .get();
    if (!existing) await tx.insert(memberships).values({ teamId: invitation.teamId, userId, role: invitation.role });
    await tx
      .update(invitations)
      .set({ acceptedAt: new Date(), acceptedBy: userId })
      .where(eq(invitations.id, invitation.id));
    // The link was mailed to this address and the person holds it: that proves the address.
    await tx
      .update(users)
      .set({
        currentTeamId: invitation.teamId,
        emailVerifiedAt: sql`coalesce(${users.emailVerifiedAt}, ${Date.now()})`,
      })
      .where(eq(users.id, userId));
    await recordAudit(tx, {
      teamId: invitation.teamId,
      actorId: userId,
      action: 'accept',
      recordType: 'invitation',
      recordId: invitation.id,
    });
    return { teamId: invitation.teamId, role: existing?.role ?? invitation.role };
  });
}

/** Invitations of a team that are neither used nor expired. */
export async function listOpenInvitations(
  teamId: string,
): Promise<{ id: string; email: string; role: Role; expiresAt: string }[]> {
  const db = await getDb();
  const rows = await db
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt })
    .from(invitations)
    .where(and(eq(invitations.teamId, teamId), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())))
    .orderBy(desc(invitations.createdAt));
  return rows.map((row) => ({ ...row, expiresAt: row.expiresAt.toISOString() }));
}
