import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { inspections, reviews } from '../../../db/schema';
import { toGearSetChartInput } from '../../charts/gear-set-input';
import type { ToleranceProfile } from '../../analysis/tolerance';
import type { InspectionSummary } from '../../inspections/summary';
import type { GearSetPageView } from '../../inspections/views';
import type { TeamAccess } from '../guard';
import { readPartViews } from '../register/part-views';
import { readTeamSettings } from '../register/team-settings';
import { readerUnitsOf, rowToInspectionView } from './inspections';
import { analyseFromRows, profileOfSet, readProfileBook, valuesForInspection } from './read-analyses';

/**
 * The gear set page, its compare page and GET /api/gear-sets/:id/analysis, in nine queries however many
 * inspections the set has: the set with its run counts and place (five), all its inspections (one), the
 * team's profile versions, its settings and the set's open review (one each). Every query filters by the
 * team. Null for an unknown set or another team's (the page answers 404, the endpoint too).
 */
export async function readGearSet(access: TeamAccess, gearSetId: string): Promise<GearSetPageView | null> {
  const teamId = access.team.id;
  const units = readerUnitsOf(access);
  const db = await getDb();
  const [register, rows, book, settings, openReview] = await Promise.all([
    readPartViews(teamId, { ids: [gearSetId] }),
    db
      .select()
      .from(inspections)
      .where(and(eq(inspections.teamId, teamId), eq(inspections.gearSetId, gearSetId)))
      .orderBy(asc(inspections.inspectedAt), asc(inspections.createdAt)),
    readProfileBook(teamId),
    readTeamSettings(teamId),
    db
      .select({ id: reviews.id })
      .from(reviews)
      .where(and(eq(reviews.teamId, teamId), eq(reviews.gearSetId, gearSetId), eq(reviews.status, 'open')))
      .get(),
  ]);
  const set = register.parts[0];
  const setRow = register.rows.get(gearSetId);
  if (!set || !setRow || set.kind !== 'gear-set') return null;
  const renderedAt = Date.now();
  const profile = profileOfSet(book, setRow.toleranceProfileId);
  const submitted = rows.filter((r) => r.status === 'submitted');
  const made = new Map<string, { values: ToleranceProfile; summary: InspectionSummary }>();
  const views = submitted.map((row) => {
    const values = valuesForInspection(book, row, profile);
    const view = rowToInspectionView(row, units, setRow, values);
    made.set(row.id, { values, summary: view.summary });
    return view;
  });
  // The analysis judges each row as its view did, so it takes the summaries already made.
  const analysis = analyseFromRows(set, submitted, book, profile, settings.serviceIntervalRuns, units, made);
  const loc = set.location;
  const carId = !loc
    ? null
    : loc.targetType === 'car'
      ? loc.targetId
      : (register.places.assemblies.find((a) => a.id === loc.targetId)?.carId ?? null);
  const car = carId ? (register.places.cars.find((c) => c.id === carId) ?? null) : null;
  return {
    set,
    analysis,
    inspections: views,
    drafts: rows.length - submitted.length,
    profile,
    car,
    serviceIntervalRuns: settings.serviceIntervalRuns,
    chartInput: toGearSetChartInput(analysis, views, profile, units),
    openReviewId: openReview?.id ?? null,
    renderedAt,
  };
}
