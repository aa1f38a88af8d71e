import { eq } from 'drizzle-orm';
import { getDb, write } from '../../../db/client';
import { teamSettings } from '../../../db/schema';
import { resolveTeamSettings, type TeamSettings } from '../../register/team-settings';
import { recordAudit } from '../audit';

/** The team's settings over the defaults. */
export async function readTeamSettings(teamId: string): Promise<TeamSettings> {
  const db = await getDb();
  const row = await db
    .select({ values: teamSettings.values })
    .from(teamSettings)
    .where(eq(teamSettings.teamId, teamId))
    .get();
  return resolveTeamSettings(row?.values);
}

/** Saves changed settings (owner), keeping the old ones in the audit trail. */
export async function saveTeamSettings(
  teamId: string,
  actorId: string,
  changes: Partial<TeamSettings>,
): Promise<TeamSettings> {
  const before = await readTeamSettings(teamId);
  const after = { ...before, ...changes, lifeLimitRuns: { ...before.lifeLimitRuns, ...changes.lifeLimitRuns } };
  await write(async (tx) => {
    await tx
      .insert(teamSettings)
      .values({ teamId, values: after })
      .onConflictDoUpdate({ target: teamSettings.teamId, set: { values: after, updatedAt: new Date() } });
    await recordAudit(tx, {
      teamId,
      actorId,
      action: 'update',
      recordType: 'team-settings',
      recordId: teamId,
      before,
      after,
    });
  });
  return after;
}
