import type { ReaderUnits } from '../../inspections/summary';
import { HttpError } from '../http';
import { readPartViews } from '../register/part-views';
import { readTeamSettings } from '../register/team-settings';
import {
  analyseFromRows,
  profileOfSet,
  readProfileBook,
  readSubmittedBySet,
  type StoredAnalysis,
} from './read-analyses';

export type { StoredAnalysis };

/**
 * The analysis of a stored gear set: each submitted inspection judged by the profile version it kept.
 * A fixed number of queries however many inspections the set has (the set, its submitted inspections,
 * the team's profile versions and settings).
 */
export async function analyseStoredGearSet(
  teamId: string,
  gearSetId: string,
  units: ReaderUnits,
): Promise<StoredAnalysis> {
  const [register, rowsBySet, book, settings] = await Promise.all([
    readPartViews(teamId, { ids: [gearSetId] }),
    readSubmittedBySet(teamId, [gearSetId]),
    readProfileBook(teamId),
    readTeamSettings(teamId),
  ]);
  const set = register.parts[0];
  const row = register.rows.get(gearSetId);
  if (!set || !row || set.kind !== 'gear-set') throw new HttpError(404, 'No such gear set in this team.');
  const profile = profileOfSet(book, row.toleranceProfileId);
  return analyseFromRows(set, rowsBySet.get(gearSetId) ?? [], book, profile, settings.serviceIntervalRuns, units);
}
