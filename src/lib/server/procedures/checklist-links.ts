import { and, eq } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { assemblies, installationEvents } from '../../../db/schema';
import type { ChecklistListItem } from '../../procedures/views';
import { listChecklists } from './checklists';

/**
 * The checklists other pages show, each one call: an assembly's, a gear set's (those made for the set,
 * and those made on an assembly while the set was in it), and the assemblies with a rebuild under way.
 */

/** The assembly's checklists, newest first. */
export function listAssemblyChecklists(teamId: string, assemblyId: string): Promise<ChecklistListItem[]> {
  return listChecklists(teamId, { assemblyId });
}

/** Checklists of the set itself, and of each assembly during the time the set was installed in it. */
export async function listGearSetChecklists(teamId: string, gearSetId: string): Promise<ChecklistListItem[]> {
  const db = await getDb();
  const events = await db
    .select()
    .from(installationEvents)
    .where(
      and(
        eq(installationEvents.teamId, teamId),
        eq(installationEvents.subjectType, 'part'),
        eq(installationEvents.subjectId, gearSetId),
        eq(installationEvents.targetType, 'assembly'),
      ),
    )
    .orderBy(installationEvents.at, installationEvents.seq);
  const periods: { assemblyId: string; from: number; to: number }[] = [];
  for (const event of events) {
    if (event.action === 'install')
      periods.push({ assemblyId: event.targetId, from: event.at.getTime(), to: Infinity });
    else {
      const open = periods.findLast((p) => p.assemblyId === event.targetId && p.to === Infinity);
      if (open) open.to = event.at.getTime();
    }
  }
  const all = await listChecklists(teamId);
  return all.filter(
    (c) =>
      c.gearSetId === gearSetId ||
      periods.some(
        (p) => p.assemblyId === c.assemblyId && Date.parse(c.startedAt) >= p.from && Date.parse(c.startedAt) < p.to,
      ),
  );
}

/** Assemblies with a checklist in progress, for the board. */
export async function listRebuildsInProgress(teamId: string): Promise<
  {
    checklistId: string;
    assemblyId: string;
    serial: string;
    name: string;
    procedureName: string;
    stepsRecorded: number;
    stepsTotal: number;
  }[]
> {
  const running = (await listChecklists(teamId, { status: 'in-progress' })).filter((c) => c.assemblyId);
  if (running.length === 0) return [];
  const db = await getDb();
  const rows = await db.select().from(assemblies).where(eq(assemblies.teamId, teamId));
  const byId = new Map(rows.map((row) => [row.id, row]));
  return running.flatMap((c) => {
    const assembly = byId.get(c.assemblyId!);
    return assembly
      ? [
          {
            checklistId: c.id,
            assemblyId: assembly.id,
            serial: assembly.serial,
            name: assembly.name,
            procedureName: c.procedureName,
            stepsRecorded: c.stepsRecorded,
            stepsTotal: c.stepsTotal,
          },
        ]
      : [];
  });
}

// An inspection is often dated to the day of the teardown: a checklist started that day still counts.
const SAME_DAY_MS = 24 * 3600 * 1000;

/**
 * The rebuild checklists an inspection was part of: the set's checklists (or its assembly's while it
 * was installed) that were open when the set was inspected. This is how an inspection opened from a
 * checklist's backlash step links back to it.
 */
export async function listChecklistsOfInspection(
  teamId: string,
  gearSetId: string,
  inspectedAt: string,
): Promise<ChecklistListItem[]> {
  const at = Date.parse(inspectedAt);
  return (await listGearSetChecklists(teamId, gearSetId)).filter(
    (c) =>
      Date.parse(c.startedAt) - SAME_DAY_MS <= at &&
      (c.completedAt === null || Date.parse(c.completedAt) + SAME_DAY_MS >= at),
  );
}
