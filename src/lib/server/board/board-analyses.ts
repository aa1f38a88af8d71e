import { and, count, eq, max, sum } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { inspections } from '../../../db/schema';
import type { ReaderUnits } from '../../inspections/summary';
import type { ProfileView, StoredAnalysis } from '../../inspections/views';
import type { PartView } from '../../register/views';
import { analyseFromRows, type ProfileBook, readSubmittedBySet } from '../inspections/read-analyses';

/**
 * The board's analyses of every set in use, without re-reading and re-judging a set's whole life on
 * every look. Each request reads, in one light query, a fingerprint of each set's submitted inspections
 * (how many, the latest change, the sum of their revisions — every edit bumps both, every submission the
 * count); an analysis is kept in this process only under the key made of that fingerprint and everything
 * else it was computed from (the set's runs, life limit and geometry, the profile version, the service
 * interval, the reader's units). So a change made through any process shows on the next request: the key
 * no longer matches and that set alone is read again (one more query, for every changed set at once).
 * Kept analyses are shared between requests and never changed after they are made.
 */

const KEPT_MAX = 5000;
const kept = new Map<string, { key: string; analysis: StoredAnalysis }>();

function keep(slot: string, key: string, analysis: StoredAnalysis): void {
  kept.delete(slot);
  kept.set(slot, { key, analysis });
  // Oldest first in a Map: past the bound, forget the longest unused.
  while (kept.size > KEPT_MAX) kept.delete(kept.keys().next().value!);
}

/** One row per set with submitted inspections: count, latest change and revision total. */
async function readFingerprints(teamId: string): Promise<Map<string, string>> {
  const db = await getDb();
  const rows = await db
    .select({
      gearSetId: inspections.gearSetId,
      n: count(),
      changed: max(inspections.updatedAt),
      revisions: sum(inspections.revision),
    })
    .from(inspections)
    .where(and(eq(inspections.teamId, teamId), eq(inspections.status, 'submitted')))
    .groupBy(inspections.gearSetId);
  return new Map(
    rows.map((r) => [
      r.gearSetId,
      `${r.n}|${r.changed instanceof Date ? r.changed.getTime() : String(r.changed)}|${r.revisions}`,
    ]),
  );
}

export interface BoardSet {
  set: PartView;
  profile: ProfileView;
}

/**
 * The analyses of `sets` (all the team's, each with the profile it is judged by now), in two queries
 * whatever the size: the fingerprints, then the submitted inspections of the sets whose key changed.
 */
export async function analyseBoardSets(
  teamId: string,
  sets: readonly BoardSet[],
  book: ProfileBook,
  serviceIntervalRuns: number,
  units: ReaderUnits,
): Promise<Map<string, StoredAnalysis>> {
  const fingerprints = await readFingerprints(teamId);
  const keys = new Map(
    sets.map(({ set, profile }) => [
      set.id,
      JSON.stringify([
        teamId,
        fingerprints.get(set.id) ?? 'none',
        profile.versionId,
        set.totalRuns,
        set.runsSinceInstall,
        set.lifeLimitRuns,
        set.ringTeeth ?? null,
        set.pinionTeeth ?? null,
        set.pressureAngleDeg ?? null,
        serviceIntervalRuns,
        units.lengthUnit,
        units.torqueUnit,
      ]),
    ]),
  );
  // Kept per set and reader units, so readers in inches and in millimetres do not push each other out.
  const slot = (setId: string) => `${setId}|${units.lengthUnit}|${units.torqueUnit}`;
  const changed = sets.filter(({ set }) => kept.get(slot(set.id))?.key !== keys.get(set.id)).map(({ set }) => set.id);
  const rowsBySet = await readSubmittedBySet(teamId, changed);
  const analyses = new Map<string, StoredAnalysis>();
  for (const { set, profile } of sets) {
    const key = keys.get(set.id)!;
    const found = kept.get(slot(set.id));
    if (found && found.key === key) {
      analyses.set(set.id, found.analysis);
      continue;
    }
    const analysis = analyseFromRows(set, rowsBySet.get(set.id) ?? [], book, profile, serviceIntervalRuns, units);
    keep(slot(set.id), key, analysis);
    analyses.set(set.id, analysis);
  }
  return analyses;
}
