import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { and, desc, eq, gt, isNull, sql } from 'drizzle-orm';
import { getDb, write, type Transaction } from '../../db/client';
import { invitations, memberships, teams, users } from '../../db/schema';
import { ROLE_LABELS, rolesGrantableBy, type Role } from '../roles';
import { HttpError } from './http';
import { queueMessage } from './outbox';
import { recordAudit } from './audit';
import type { TeamAccess } from './guard';

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

export interface InvitationSent {
  id: string;
  expiresAt: Date;
  /** The address already had an open invitation: it was sent again with a new link instead of a second one. */
  resent: boolean;
}

/**
 * Invites someone by e-mail: stores the token's hash, queues the mail with the link. Someone already in the
 * team is refused (409) rather than invited twice; an address with an open invitation gets that one again,
 * with a new link and the role now chosen, so the pending list never shows the same person twice.
 */
export async function createInvitation(request: InvitationRequest): Promise<InvitationSent> {
  if (!rolesGrantableBy(request.actorRole).includes(request.role)) {
    throw new HttpError(
      403,
      `role: a ${ROLE_LABELS[request.actorRole].toLowerCase()} cannot invite a ${ROLE_LABELS[request.role].toLowerCase()}.`,
      { role: 'not allowed for you' },
    );
  }
  return write(async (tx) => {
    const team = await tx.select({ name: teams.name }).from(teams).where(eq(teams.id, request.teamId)).get();
    if (!team) throw new HttpError(404, 'No such team.');
    const member = await tx
      .select({ name: users.name })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.teamId, request.teamId), eq(users.email, request.email)))
      .get();
    if (member)
      throw new HttpError(409, `email: ${member.name} (${request.email}) is already a member of ${team.name}.`, {
        email: 'already a member of this team',
      });
    const open = await tx
      .select({ id: invitations.id })
      .from(invitations)
      .where(
        and(
          eq(invitations.teamId, request.teamId),
          eq(invitations.email, request.email),
          isNull(invitations.acceptedAt),
          gt(invitations.expiresAt, new Date()),
        ),
      )
      .get();
    const id = open?.id ?? randomUUID();
    const { token, expiresAt } = newLink();
    if (open)
      await tx
        .update(invitations)
        .set({ role: request.role, tokenHash: hashToken(token), invitedBy: request.actorId, expiresAt })
        .where(eq(invitations.id, id));
    else
      await tx.insert(invitations).values({
        id,
        teamId: request.teamId,
        email: request.email,
        role: request.role,
        tokenHash: hashToken(token),
        invitedBy: request.actorId,
        expiresAt,
      });
    await queueInvitationMail(tx, { ...request, teamName: team.name, token, expiresAt });
    await recordAudit(tx, {
      teamId: request.teamId,
      actorId: request.actorId,
      action: open ? 'resend' : 'invite',
      recordType: 'invitation',
      recordId: id,
      after: { email: request.email, role: request.role },
    });
    return { id, expiresAt, resent: Boolean(open) };
  });
}

/** A fresh single-use token and when it stops working. */
function newLink(): { token: string; expiresAt: Date } {
  return { token: randomBytes(32).toString('base64url'), expiresAt: new Date(Date.now() + INVITATION_LIFETIME_MS) };
}

async function queueInvitationMail(
  tx: Transaction,
  invitation: Pick<InvitationRequest, 'teamId' | 'actorId' | 'email' | 'role' | 'baseUrl'> & {
    teamName: string;
    token: string;
    expiresAt: Date;
  },
): Promise<void> {
  const inviter = await tx.select({ name: users.name }).from(users).where(eq(users.id, invitation.actorId)).get();
  if (!inviter) throw new HttpError(404, 'No such person.');
  await queueMessage(tx, {
    teamId: invitation.teamId,
    to: invitation.email,
    subject: `You are invited to ${invitation.teamName} on Lashline`,
    text: [
      `${inviter.name} invited you to join ${invitation.teamName} on Lashline as ${ROLE_LABELS[invitation.role].toLowerCase()}.`,
      '',
      "Lashline keeps the team's gear-set inspections, runs and decisions in one place.",
      '',
      `Accept the invitation (the link works once, until ${invitation.expiresAt.toUTCString()}):`,
      `${invitation.baseUrl}/invitations/accept?token=${invitation.token}`,
      '',
      'If you did not expect this, ignore this message.',
    ].join('\n'),
  });
}

/** An open invitation of the team, or 404 (another team's, used or expired ones included). */
async function requireOpenInvitation(tx: Transaction, teamId: string, invitationId: string) {
  const invitation = await tx
    .select()
    .from(invitations)
    .where(
      and(
        eq(invitations.id, invitationId),
        eq(invitations.teamId, teamId),
        isNull(invitations.acceptedAt),
        gt(invitations.expiresAt, new Date()),
      ),
    )
    .get();
  if (!invitation) throw new HttpError(404, 'No open invitation with that id in this team.');
  return invitation;
}

/** Sends an open invitation again with a new link (the old one stops working) and a new week to answer. */
export async function resendInvitation(
  access: TeamAccess,
  invitationId: string,
  baseUrl: string,
): Promise<{ id: string; email: string; role: Role; expiresAt: string }> {
  return write(async (tx) => {
    const invitation = await requireOpenInvitation(tx, access.team.id, invitationId);
    if (!rolesGrantableBy(access.team.role).includes(invitation.role))
      throw new HttpError(
        403,
        `A ${ROLE_LABELS[access.team.role].toLowerCase()} cannot invite a ${ROLE_LABELS[invitation.role].toLowerCase()}.`,
      );
    const { token, expiresAt } = newLink();
    await tx
      .update(invitations)
      .set({ tokenHash: hashToken(token), expiresAt, invitedBy: access.user.id })
      .where(eq(invitations.id, invitation.id));
    await queueInvitationMail(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      email: invitation.email,
      role: invitation.role,
      baseUrl,
      teamName: access.team.name,
      token,
      expiresAt,
    });
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'resend',
      recordType: 'invitation',
      recordId: invitation.id,
      after: { email: invitation.email, role: invitation.role },
    });
    return { id: invitation.id, email: invitation.email, role: invitation.role, expiresAt: expiresAt.toISOString() };
  });
}

/** Cancels an open invitation: its link stops working at once; the audit trail keeps who was invited. */
export async function cancelInvitation(access: TeamAccess, invitationId: string): Promise<void> {
  await write(async (tx) => {
    const invitation = await requireOpenInvitation(tx, access.team.id, invitationId);
    await tx.delete(invitations).where(eq(invitations.id, invitation.id));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'cancel',
      recordType: 'invitation',
      recordId: invitation.id,
      before: { email: invitation.email, role: invitation.role },
    });
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
      throw new HttpError(
        404,
        'token: this invitation link is not known (it may have been cancelled or sent again); ask for a new one.',
        {
          token: 'unknown',
        },
      );
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

/** What an invitation link is, as its page tells the person who follows it. */
export interface InvitationDescription {
  state: 'open' | 'used' | 'expired' | 'unknown';
  teamName?: string;
  role?: Role;
  inviterName?: string;
  email?: string;
}

/** Describes the invitation behind a link without using it: the team, the role, who invited, and its state. */
export async function describeInvitation(token: string, now = new Date()): Promise<InvitationDescription> {
  if (!token) return { state: 'unknown' };
  const db = await getDb();
  const row = await db
    .select({
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      teamName: teams.name,
      inviterName: users.name,
    })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, hashToken(token)))
    .get();
  if (!row) return { state: 'unknown' };
  const state = row.acceptedAt ? 'used' : row.expiresAt.getTime() < now.getTime() ? 'expired' : 'open';
  return { state, teamName: row.teamName, role: row.role, inviterName: row.inviterName, email: row.email };
}
