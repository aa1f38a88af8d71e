import { decisionOf, readLatestDecisions } from '../reviews/read-decisions';
import { and, asc, count, eq, max, sql, sum } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { inspections, reviews, type Inspection, type Part } from '../../../db/schema';
import { toGearSetChartInput } from '../../charts/gear-set-input';
import type { ToleranceProfile } from '../../analysis/tolerance';
import type { InspectionSummary, ReaderUnits } from '../../inspections/summary';
import type { GearSetPageView, ProfileView } from '../../inspections/views';
import type { PartView } from '../../register/views';
import type { TeamAccess } from '../guard';
import { readPartViews } from '../register/part-views';
import { readTeamSettings } from '../register/team-settings';
import { readerUnitsOf, rowToInspectionView } from './inspections';
import { analyseFromRows, profileOfSet, readProfileBook, valuesForInspection, type ProfileBook } from './read-analyses';

// Each set's views and analysis, kept per set and reader units under the key they were made from (see
// `readGearSet`); a change through any process changes the key read on the next request. Bounded.
const KEPT_MAX = 1000;
const kept = new Map<
  string,
  { key: string; made: Pick<GearSetPageView, 'analysis' | 'inspections' | 'drafts' | 'chartInput'> }
>();

/**
 * The gear set page, its compare page and GET /api/gear-sets/:id/analysis, in ten queries however many
 * inspections the set has: the set with its run counts and place (five), a fingerprint of its
 * inspections, the team's profile versions, its settings and the set's open review (one each), then its
 * inspections — read only when the key made of that fingerprint and everything else the views are made
 * from (runs, life, geometry, profile version, settings, units) differs from the one this process kept
 * (decision 011). Every query filters by the team. Null for an unknown set or another team's (the page
 * answers 404, the endpoint too).
 */
export async function readGearSet(access: TeamAccess, gearSetId: string): Promise<GearSetPageView | null> {
  const teamId = access.team.id;
  const units = readerUnitsOf(access);
  const db = await getDb();
  const ofThisSet = and(eq(inspections.teamId, teamId), eq(inspections.gearSetId, gearSetId));
  const [register, fingerprint, book, settings, openReview, decisions] = await Promise.all([
    readPartViews(teamId, { ids: [gearSetId] }),
    // Every edit bumps updated_at and the revision, every submission or deleted draft the counts.
    db
      .select({
        n: count(),
        submitted: sql<number>`sum(${inspections.status} = 'submitted')`,
        changed: max(inspections.updatedAt),
        revisions: sum(inspections.revision),
      })
      .from(inspections)
      .where(ofThisSet)
      .get(),
    readProfileBook(teamId),
    readTeamSettings(teamId),
    db
      .select({ id: reviews.id })
      .from(reviews)
      .where(and(eq(reviews.teamId, teamId), eq(reviews.gearSetId, gearSetId), eq(reviews.status, 'open')))
      .get(),
    readLatestDecisions(teamId, gearSetId),
  ]);
  const set = register.parts[0];
  const setRow = register.rows.get(gearSetId);
  if (!set || !setRow || set.kind !== 'gear-set') return null;
  const renderedAt = Date.now();
  const profile = profileOfSet(book, setRow.toleranceProfileId);
  const slot = `${gearSetId}|${units.lengthUnit}|${units.torqueUnit}`;
  const key = JSON.stringify([
    teamId,
    fingerprint?.n ?? 0,
    fingerprint?.submitted ?? 0,
    fingerprint?.changed instanceof Date ? fingerprint.changed.getTime() : String(fingerprint?.changed ?? ''),
    fingerprint?.revisions ?? 0,
    profile.versionId,
    set.totalRuns,
    set.runsSinceInstall,
    set.lifeLimitRuns,
    set.ringTeeth ?? null,
    set.pinionTeeth ?? null,
    set.pressureAngleDeg ?? null,
    settings.serviceIntervalRuns,
  ]);
  const found = kept.get(slot);
  // Asked even when nothing changed (then for no row), so the count of queries stays fixed.
  const rows = await db
    .select()
    .from(inspections)
    .where(found?.key === key ? sql`0` : ofThisSet)
    .orderBy(asc(inspections.inspectedAt), asc(inspections.createdAt));
  const made =
    found?.key === key ? found.made : makeViews(set, setRow, rows, book, profile, settings.serviceIntervalRuns, units);
  if (found?.key !== key) {
    kept.delete(slot);
    kept.set(slot, { key, made });
    while (kept.size > KEPT_MAX) kept.delete(kept.keys().next().value!);
  }
  const loc = set.location;
  const carId = !loc
    ? null
    : loc.targetType === 'car'
      ? loc.targetId
      : (register.places.assemblies.find((a) => a.id === loc.targetId)?.carId ?? null);
  const car = carId ? (register.places.cars.find((c) => c.id === carId) ?? null) : null;
  return {
    set,
    ...made,
    profile,
    car,
    serviceIntervalRuns: settings.serviceIntervalRuns,
    openReviewId: openReview?.id ?? null,
    decision: decisionOf(decisions, set.id, set.totalRuns),
    renderedAt,
  };
}

/** The set's submitted inspections as views, its analysis and the charts' input, from its rows. Pure. */
function makeViews(
  set: PartView,
  setRow: Part,
  rows: readonly Inspection[],
  book: ProfileBook,
  profile: ProfileView,
  serviceIntervalRuns: number,
  units: ReaderUnits,
): Pick<GearSetPageView, 'analysis' | 'inspections' | 'drafts' | 'chartInput'> {
  const submitted = rows.filter((r) => r.status === 'submitted');
  const summaries = new Map<string, { values: ToleranceProfile; summary: InspectionSummary }>();
  const views = submitted.map((row) => {
    const values = valuesForInspection(book, row, profile);
    const view = rowToInspectionView(row, units, setRow, values);
    summaries.set(row.id, { values, summary: view.summary });
    return view;
  });
  // The analysis judges each row as its view did, so it takes the summaries already made.
  const analysis = analyseFromRows(set, submitted, book, profile, serviceIntervalRuns, units, summaries);
  return {
    analysis,
    inspections: views,
    drafts: rows.length - submitted.length,
    chartInput: toGearSetChartInput(analysis, views, profile, units),
  };
}
