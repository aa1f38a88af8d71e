import { toGearSetChartInput, type GearSetChartInput } from '../../lib/charts/gear-set-input';
import type { GearSetAnalysis } from '../../lib/inspections/gear-set-analysis';
import type { TeamAccess } from '../../lib/server/guard';
import { HttpError } from '../../lib/server/http';
import { analyseStoredGearSet } from '../../lib/server/inspections/gear-set-analysis';
import {
  listInspectionRows,
  readerUnitsOf,
  toInspectionView,
  type InspectionView,
} from '../../lib/server/inspections/inspections';
import { profileForGearSet, type ProfileView } from '../../lib/server/inspections/profiles';
import { listAssemblies } from '../../lib/server/register/assemblies';
import { listCars } from '../../lib/server/register/cars';
import { getPart, type PartView } from '../../lib/server/register/parts';
import { readTeamSettings } from '../../lib/server/register/team-settings';

/**
 * Everything the gear-set pages read, through the lib/server use-cases (reading only): the set, its
 * analysis, its submitted inspections in the reader's units, its profile, where it sits, and the
 * charts' input made by the same function the islands use. Null for an unknown set or another
 * team's (the page answers 404 either way).
 */
export interface GearSetPageData {
  set: PartView;
  analysis: GearSetAnalysis & { profile: { name: string; version: number } };
  inspections: InspectionView[];
  drafts: number;
  profile: ProfileView;
  car: { id: string; name: string } | null;
  serviceIntervalRuns: number;
  chartInput: GearSetChartInput;
  renderedAt: number;
}

export async function loadGearSetPage(access: TeamAccess, gearSetId: string): Promise<GearSetPageData | null> {
  const teamId = access.team.id;
  const units = readerUnitsOf(access);
  let set: PartView;
  try {
    set = await getPart(teamId, gearSetId);
  } catch (error) {
    if (error instanceof HttpError && error.status === 404) return null;
    throw error;
  }
  if (set.kind !== 'gear-set') return null;
  const renderedAt = Date.now();
  const [analysis, rows, profile, settings, assemblies, cars] = await Promise.all([
    analyseStoredGearSet(teamId, gearSetId, units),
    listInspectionRows(teamId, gearSetId),
    profileForGearSet(teamId, gearSetId),
    readTeamSettings(teamId),
    listAssemblies(teamId),
    listCars(teamId),
  ]);
  const submitted = rows.filter((r) => r.status === 'submitted');
  const inspections = await Promise.all(submitted.map((row) => toInspectionView(teamId, row, units)));
  const loc = set.location;
  const carId = !loc
    ? null
    : loc.targetType === 'car'
      ? loc.targetId
      : (assemblies.find((a) => a.id === loc.targetId)?.carId ?? null);
  const car = carId ? (cars.find((c) => c.id === carId) ?? null) : null;
  return {
    set,
    analysis,
    inspections,
    drafts: rows.length - submitted.length,
    profile,
    car: car ? { id: car.id, name: car.name } : null,
    serviceIntervalRuns: settings.serviceIntervalRuns,
    chartInput: toGearSetChartInput(analysis, inspections, profile, units),
    renderedAt,
  };
}
