import { decisionOf, readLatestDecisions } from '../reviews/read-decisions';
import { and, asc, desc, eq } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { inspections, installationEvents, users } from '../../../db/schema';
import type { PartPageView } from '../../inspections/views';
import { listsToPlaceLookup, locationToText } from '../../register/place';
import type { TeamAccess } from '../guard';
import { readerUnitsOf, rowToInspectionView } from '../inspections/inspections';
import { profileOfSet, readProfileBook, valuesForInspection } from '../inspections/read-analyses';
import { readPartViews } from './part-views';
import { readTeamSettings } from './team-settings';

/**
 * A part's page in nine queries however long its history or however many inspections it has: the part
 * with its run counts and the team's places (five), its settings, its installation history, its
 * inspections and the profile versions (one each). Every query filters by the team. Null for an unknown
 * part or another team's.
 */
export async function readPartPage(access: TeamAccess, partId: string): Promise<PartPageView | null> {
  const teamId = access.team.id;
  const units = readerUnitsOf(access);
  const db = await getDb();
  const [register, settings, events, rows, book, decisions] = await Promise.all([
    readPartViews(teamId, { ids: [partId] }),
    readTeamSettings(teamId),
    db
      .select({ event: installationEvents, actorName: users.name })
      .from(installationEvents)
      .leftJoin(users, eq(users.id, installationEvents.actorId))
      .where(
        and(
          eq(installationEvents.teamId, teamId),
          eq(installationEvents.subjectType, 'part'),
          eq(installationEvents.subjectId, partId),
        ),
      )
      .orderBy(desc(installationEvents.seq)),
    db
      .select()
      .from(inspections)
      .where(and(eq(inspections.teamId, teamId), eq(inspections.gearSetId, partId)))
      .orderBy(asc(inspections.inspectedAt), asc(inspections.createdAt)),
    readProfileBook(teamId),
    readLatestDecisions(teamId, partId),
  ]);
  const part = register.parts[0];
  const row = register.rows.get(partId);
  if (!part || !row) return null;
  const { cars, assemblies } = register.places;
  const carNames = new Map(cars.map((c) => [c.id, c.name]));
  const assemblyById = new Map(assemblies.map((a) => [a.id, a]));
  // The words describeTarget() uses, from the places already read.
  const label = (targetType: 'assembly' | 'car', targetId: string): string => {
    if (targetType === 'car') return `car ${carNames.get(targetId) ?? targetId}`;
    const assembly = assemblyById.get(targetId);
    return assembly ? `assembly ${assembly.serial} (${assembly.name})` : `assembly ${targetId}`;
  };
  const current = profileOfSet(book, row.toleranceProfileId);
  return {
    part,
    where: locationToText(part.location, listsToPlaceLookup(assemblies, cars)),
    serviceIntervalRuns: settings.serviceIntervalRuns,
    decision: decisionOf(decisions, part.id, part.totalRuns),
    history: events.map(({ event, actorName }) => ({
      id: event.id,
      action: event.action,
      targetLabel: label(event.targetType, event.targetId),
      at: event.at.toISOString(),
      actorName,
      notes: event.notes,
    })),
    inspections: rows.map((r) => rowToInspectionView(r, units, row, valuesForInspection(book, r, current))).reverse(),
  };
}
