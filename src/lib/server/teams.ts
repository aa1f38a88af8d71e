import { randomUUID } from 'node:crypto';
import { and, asc, eq, sql } from 'drizzle-orm';
import { getDb, write, type Transaction } from '../../db/client';
import { memberships, teams, users, type Team } from '../../db/schema';
import type { Role } from '../roles';
import { HttpError } from './http';
import { recordAudit } from './audit';

export interface TeamOfPerson {
  id: string;
  name: string;
  role: Role;
}

export interface Member {
  id: string;
  userId: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
}

/** Creates a team with the caller as its owner, and makes it the caller's current team. */
export async function createTeam(userId: string, name: string): Promise<Team> {
  return write(async (tx) => {
    const [team] = await tx.insert(teams).values({ id: randomUUID(), name }).returning();
    if (!team) throw new Error('insert returned no row');
    await tx.insert(memberships).values({ teamId: team.id, userId, role: 'owner' });
    await tx.update(users).set({ currentTeamId: team.id }).where(eq(users.id, userId));
    await recordAudit(tx, {
      teamId: team.id,
      actorId: userId,
      action: 'create',
      recordType: 'team',
      recordId: team.id,
      after: { name },
    });
    return team;
  });
}

/** Every team the person belongs to, with their role in it. */
export async function listTeamsOf(userId: string): Promise<TeamOfPerson[]> {
  const db = await getDb();
  return db
    .select({ id: teams.id, name: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(teams.name));
}

/** The person's role in the team, read fresh from the database, or null when not a member. */
export async function findRole(teamId: string, userId: string): Promise<Role | null> {
  const db = await getDb();
  const row = await db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    .get();
  return row?.role ?? null;
}

/** Makes `teamId` the person's current team; 404 when they are not in it. */
export async function switchTeam(userId: string, teamId: string): Promise<void> {
  if (!(await findRole(teamId, userId))) throw new HttpError(404, 'No such team.', { teamId: 'not one of your teams' });
  await write((tx) => tx.update(users).set({ currentTeamId: teamId }).where(eq(users.id, userId)));
}

export async function listMembers(teamId: string): Promise<Member[]> {
  const db = await getDb();
  const rows = await db
    .select({
      userId: users.id,
      name: users.name,
      email: users.email,
      role: memberships.role,
      joined: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, teamId))
    .orderBy(asc(users.name));
  return rows.map((row) => ({
    id: row.userId,
    userId: row.userId,
    name: row.name,
    email: row.email,
    role: row.role,
    joinedAt: row.joined.toISOString(),
  }));
}

async function requireMemberRow(tx: Transaction, teamId: string, userId: string): Promise<Role> {
  const row = await tx
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    .get();
  if (!row) throw new HttpError(404, 'No such member in this team.');
  return row.role;
}

async function countOwners(tx: Transaction, teamId: string): Promise<number> {
  const row = await tx
    .select({ n: sql<number>`count(*)` })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'owner')))
    .get();
  return Number(row?.n ?? 0);
}

/** Changes a member's role; a team always keeps at least one owner (409). */
export async function changeMemberRole(actorId: string, teamId: string, userId: string, role: Role): Promise<void> {
  await write(async (tx) => {
    const before = await requireMemberRow(tx, teamId, userId);
    if (before === 'owner' && role !== 'owner' && (await countOwners(tx, teamId)) <= 1) {
      throw new HttpError(409, 'role: the team needs at least one owner; make someone else owner first.', {
        role: 'last owner',
      });
    }
    await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
    await recordAudit(tx, {
      teamId,
      actorId,
      action: 'change-role',
      recordType: 'membership',
      recordId: userId,
      before: { role: before },
      after: { role },
    });
  });
}

/** Removes a member at once; their next request no longer reaches the team. */
export async function removeMember(actorId: string, teamId: string, userId: string): Promise<void> {
  await write(async (tx) => {
    const role = await requireMemberRow(tx, teamId, userId);
    if (role === 'owner' && (await countOwners(tx, teamId)) <= 1) {
      throw new HttpError(409, 'The team needs at least one owner; make someone else owner first.');
    }
    await tx.delete(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
    // Ends the person's sessions everywhere, so nothing they had open keeps showing this team.
    await tx
      .update(users)
      .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(eq(users.id, userId));
    await tx
      .update(users)
      .set({ currentTeamId: null })
      .where(and(eq(users.id, userId), eq(users.currentTeamId, teamId)));
    await recordAudit(tx, {
      teamId,
      actorId,
      action: 'remove',
      recordType: 'membership',
      recordId: userId,
      before: { role },
    });
  });
}
