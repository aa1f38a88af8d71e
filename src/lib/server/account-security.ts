import { eq, sql } from 'drizzle-orm';
import { getDb, write } from '../../db/client';
import { sessions, teams, users } from '../../db/schema';
import type { PublicUser } from './accounts';
import { HttpError } from './http';
import { recordAudit } from './audit';

/** Only owners and crew chiefs turn on a second factor (their accounts carry the most power). */
export function requireSecondFactorRole(locals: App.Locals): PublicUser {
  const user = locals.user;
  if (!user) throw new HttpError(401, 'Sign in first.');
  if (!locals.team || !['owner', 'crew-chief'].includes(locals.team.role)) {
    throw new HttpError(
      403,
      'A second factor is for owners and crew chiefs; switch to a team where you hold one of those roles.',
    );
  }
  return user;
}

/** Ends every session of the person, this one included (the session version moves on). */
export async function signOutEverywhere(userId: string): Promise<void> {
  await write(async (tx) => {
    await tx
      .update(users)
      .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(eq(users.id, userId));
    await tx.delete(sessions).where(eq(sessions.userId, userId));
    await recordAudit(tx, {
      teamId: null,
      actorId: userId,
      action: 'sign-out-everywhere',
      recordType: 'account',
      recordId: userId,
    });
  });
}

/** Whether the team asks its owners and crew chiefs for a second factor (owner sets it). */
export async function setTeamSecondFactorRule(teamId: string, actorId: string, required: boolean): Promise<void> {
  await write(async (tx) => {
    await tx.update(teams).set({ requireSecondFactor: required }).where(eq(teams.id, teamId));
    await recordAudit(tx, {
      teamId,
      actorId,
      action: required ? 'require-second-factor' : 'allow-without-second-factor',
      recordType: 'team',
      recordId: teamId,
    });
  });
}

export async function readTeamSecondFactorRule(teamId: string): Promise<boolean> {
  const db = await getDb();
  return Boolean(
    (await db.select({ required: teams.requireSecondFactor }).from(teams).where(eq(teams.id, teamId)).get())?.required,
  );
}
