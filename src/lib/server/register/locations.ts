import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import { getDb, type Database, type Transaction } from '../../../db/client';
import { assemblies, cars, installationEvents, parts, type InstallationEvent } from '../../../db/schema';

type Reader = Database | Transaction;

export interface Location {
  targetType: 'assembly' | 'car';
  targetId: string;
  targetLabel: string;
  since: Date;
}

/** The last installation event of a subject in the team's history, or undefined when it has none. */
export async function findLastEvent(
  reader: Reader,
  subjectType: 'part' | 'assembly',
  subjectId: string,
  teamId: string,
): Promise<InstallationEvent | undefined> {
  return reader
    .select()
    .from(installationEvents)
    .where(
      and(
        eq(installationEvents.teamId, teamId),
        eq(installationEvents.subjectType, subjectType),
        eq(installationEvents.subjectId, subjectId),
      ),
    )
    .orderBy(desc(installationEvents.seq))
    .limit(1)
    .get();
}

/** A readable name for an assembly or car, e.g. "assembly RE-2 (Spare rear end)". */
export async function describeTarget(
  reader: Reader,
  targetType: 'assembly' | 'car',
  targetId: string,
  teamId: string,
): Promise<string> {
  if (targetType === 'car') {
    const car = await reader
      .select({ name: cars.name })
      .from(cars)
      .where(and(eq(cars.id, targetId), eq(cars.teamId, teamId)))
      .get();
    return `car ${car?.name ?? targetId}`;
  }
  const assembly = await reader
    .select({ serial: assemblies.serial, name: assemblies.name })
    .from(assemblies)
    .where(and(eq(assemblies.id, targetId), eq(assemblies.teamId, teamId)))
    .get();
  return assembly ? `assembly ${assembly.serial} (${assembly.name})` : `assembly ${targetId}`;
}

/** Where a part or assembly is installed now, or null when it is not installed. */
export async function findLocation(
  reader: Reader,
  subjectType: 'part' | 'assembly',
  subjectId: string,
  teamId: string,
): Promise<Location | null> {
  const last = await findLastEvent(reader, subjectType, subjectId, teamId);
  if (!last || last.action !== 'install') return null;
  return {
    targetType: last.targetType,
    targetId: last.targetId,
    targetLabel: await describeTarget(reader, last.targetType, last.targetId, teamId),
    since: last.at,
  };
}

export interface CurrentInstall {
  subjectType: 'part' | 'assembly';
  subjectId: string;
  targetType: 'assembly' | 'car';
  targetId: string;
  since: Date;
}

/** Everything installed somewhere right now, for a team: the last event of each subject, where it is an install. */
export async function listCurrentInstalls(teamId: string): Promise<CurrentInstall[]> {
  const db = await getDb();
  const rows = await db.all<{
    subject_type: 'part' | 'assembly';
    subject_id: string;
    target_type: 'assembly' | 'car';
    target_id: string;
    at: number;
  }>(sql`
    SELECT e.subject_type, e.subject_id, e.target_type, e.target_id, e.at
    FROM installation_events e
    WHERE e.team_id = ${teamId} AND e.action = 'install'
      AND e.seq = (SELECT MAX(l.seq) FROM installation_events l
                   WHERE l.team_id = ${teamId} AND l.subject_type = e.subject_type AND l.subject_id = e.subject_id)
  `);
  return rows.map((r) => ({
    subjectType: r.subject_type,
    subjectId: r.subject_id,
    targetType: r.target_type,
    targetId: r.target_id,
    since: new Date(Number(r.at)),
  }));
}

/** The ids of the parts a list of assemblies or cars holds now (for one-per-place rules). */
export async function findInstalledIn(
  reader: Reader,
  targetType: 'assembly' | 'car',
  targetId: string,
  teamId: string,
): Promise<{ subjectType: string; subjectId: string }[]> {
  const rows = await reader.all<{ subject_type: string; subject_id: string }>(sql`
    SELECT e.subject_type, e.subject_id FROM installation_events e
    WHERE e.team_id = ${teamId} AND e.target_type = ${targetType} AND e.target_id = ${targetId} AND e.action = 'install'
      AND e.seq = (SELECT MAX(l.seq) FROM installation_events l
                   WHERE l.team_id = ${teamId} AND l.subject_type = e.subject_type AND l.subject_id = e.subject_id)
  `);
  return rows.map((r) => ({ subjectType: r.subject_type, subjectId: r.subject_id }));
}

/** Kinds of the given part ids, for the one-gear-set-per-assembly rule. */
export async function findPartKinds(reader: Reader, ids: string[], teamId: string): Promise<Map<string, string>> {
  if (ids.length === 0) return new Map();
  const rows = await reader
    .select({ id: parts.id, kind: parts.kind })
    .from(parts)
    .where(and(inArray(parts.id, ids), eq(parts.teamId, teamId)));
  return new Map(rows.map((r) => [r.id, r.kind]));
}
