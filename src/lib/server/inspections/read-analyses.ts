import { lengthFiguresToMm, type LengthFigures } from '../../analysis/published-limits';
import { publishedLimitsOf } from '../../analysis/tolerance';
import { and, asc, eq, inArray, type SQL } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { inspections, toleranceProfileVersions, type Inspection } from '../../../db/schema';
import type { ToleranceProfile } from '../../analysis/tolerance';
import { analyseGearSet } from '../../inspections/gear-set-analysis';
import { summariseInspection, type InspectionSummary, type ReaderUnits } from '../../inspections/summary';
import type { ProfileView, StoredAnalysis } from '../../inspections/views';
import type { PartView } from '../../register/views';
import { mmToLength } from '../../units';
import { ensureDefaultProfile, profileRowToView } from './profiles';

export type { StoredAnalysis };

/** Every tolerance profile version of a team, indexed the ways the read models look them up. */
export interface ProfileBook {
  defaultId: string;
  byVersion: Map<string, ProfileView>;
  newest: Map<string, ProfileView>;
}

/** The team's profile versions in one query (the default profile's id is kept per process after its first look-up). */
export async function readProfileBook(teamId: string): Promise<ProfileBook> {
  const defaultId = await ensureDefaultProfile(teamId);
  const db = await getDb();
  const rows = await db
    .select()
    .from(toleranceProfileVersions)
    .where(eq(toleranceProfileVersions.teamId, teamId))
    .orderBy(asc(toleranceProfileVersions.version));
  const byVersion = new Map<string, ProfileView>();
  const newest = new Map<string, ProfileView>();
  for (const row of rows) {
    const view = profileRowToView(row, defaultId);
    byVersion.set(view.versionId, view);
    newest.set(view.profileId, view); // ascending versions: the last one seen is the newest
  }
  return { defaultId, byVersion, newest };
}

/** The profile a gear set is judged by now: its own, or the team default (profileForGearSet, from the book). */
export function profileOfSet(book: ProfileBook, toleranceProfileId: string | null): ProfileView {
  const found = book.newest.get(toleranceProfileId ?? book.defaultId) ?? book.newest.get(book.defaultId);
  if (!found) throw new Error('The team has no default tolerance profile.');
  return found;
}

/** The profile values one inspection is judged by: the version it kept at submission, else its set's current one. */
export function valuesForInspection(
  book: ProfileBook,
  row: Pick<Inspection, 'profileVersionId'>,
  current: ProfileView,
): ToleranceProfile {
  return (row.profileVersionId && book.byVersion.get(row.profileVersionId)?.values) || current.values;
}

export type AnalysisRow = Pick<
  Inspection,
  'id' | 'gearSetId' | 'inspectedAt' | 'runsAtInspection' | 'data' | 'profileVersionId'
>;

/**
 * The submitted inspections of the team's gear sets (all of them, or those named), oldest first, in one
 * query, grouped by set. Only the columns an analysis reads: a set's whole life is read on every look.
 */
export async function readSubmittedBySet(
  teamId: string,
  gearSetIds?: readonly string[],
): Promise<Map<string, AnalysisRow[]>> {
  const grouped = new Map<string, AnalysisRow[]>();
  // Asked even for no set (the IN list is then false), so a read model's count of queries stays fixed.
  const db = await getDb();
  const conditions: SQL[] = [eq(inspections.teamId, teamId), eq(inspections.status, 'submitted')];
  if (gearSetIds) conditions.push(inArray(inspections.gearSetId, [...gearSetIds]));
  const rows = await db
    .select({
      id: inspections.id,
      gearSetId: inspections.gearSetId,
      inspectedAt: inspections.inspectedAt,
      runsAtInspection: inspections.runsAtInspection,
      data: inspections.data,
      profileVersionId: inspections.profileVersionId,
    })
    .from(inspections)
    .where(and(...conditions))
    .orderBy(asc(inspections.inspectedAt), asc(inspections.createdAt));
  for (const row of rows) {
    const list = grouped.get(row.gearSetId);
    if (list) list.push(row);
    else grouped.set(row.gearSetId, [row]);
  }
  return grouped;
}

/**
 * A stored gear set's analysis from what was already read: each submitted inspection judged by the
 * profile version it kept (a version of another profile — the set changed profile — falls back to the
 * current one), then the pure engine. No database.
 */
export function analyseFromRows(
  set: PartView,
  rows: readonly AnalysisRow[],
  book: ProfileBook,
  profile: ProfileView,
  serviceIntervalRuns: number,
  units: ReaderUnits,
  /** Summaries already made for these rows (the page's inspection views), used when judged by the same values. */
  made?: ReadonlyMap<string, { values: ToleranceProfile; summary: InspectionSummary }>,
): StoredAnalysis {
  const geometry = {
    ringTeeth: set.ringTeeth ?? null,
    pinionTeeth: set.pinionTeeth ?? null,
    pressureAngleDeg: set.pressureAngleDeg ?? null,
    cutMethod: set.cutMethod ?? 'unknown',
    spiralAngleDeg: set.spiralAngleDeg ?? null,
    runoutK: set.runoutK ?? null,
  };
  const analysed = rows.map((row) => {
    const kept = row.profileVersionId ? book.byVersion.get(row.profileVersionId) : undefined;
    const values = kept && kept.profileId === profile.profileId ? kept.values : profile.values;
    return {
      id: row.id,
      inspectedAt: row.inspectedAt.toISOString(),
      runsAtInspection: row.runsAtInspection,
      data: row.data,
      summary: reuse(made?.get(row.id), values) ?? summariseInspection(row.data, values, geometry, units),
    };
  });
  // The trend limits as published in the reader's unit where printed (0.005 in, never 0.00512).
  const published = publishedLimitsOf(profile.values);
  const limitIn = (figures: LengthFigures) =>
    figures[units.lengthUnit] !== undefined
      ? Number(figures[units.lengthUnit])
      : mmToLength(lengthFiguresToMm(figures), units.lengthUnit);
  const analysis = analyseGearSet({
    inspections: analysed,
    limits: {
      backlashMin: limitIn(published.backlashMin),
      backlashMax: limitIn(published.backlashMax),
      maxSpread: limitIn(published.maxSpread),
    },
    totalRuns: set.totalRuns,
    runsSinceInstall: set.runsSinceInstall,
    lifeLimitRuns: set.lifeLimitRuns,
    serviceIntervalRuns,
  });
  return {
    gearSetId: set.id,
    unit: units.lengthUnit,
    torqueUnit: units.torqueUnit,
    profile: { name: profile.name, version: profile.version },
    ...analysis,
  };
}

function reuse(
  made: { values: ToleranceProfile; summary: InspectionSummary } | undefined,
  values: ToleranceProfile,
): InspectionSummary | undefined {
  return made && made.values === values ? made.summary : undefined;
}
