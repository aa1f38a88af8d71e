import { sortBoardRows, toBoardRow, type BoardRow } from '../../lib/board/board';
import type { TeamAccess } from '../../lib/server/guard';
import { analyseStoredGearSet } from '../../lib/server/inspections/gear-set-analysis';
import { readerUnitsOf } from '../../lib/server/inspections/inspections';
import { listAssemblies } from '../../lib/server/register/assemblies';
import { listCars } from '../../lib/server/register/cars';
import { listParts } from '../../lib/server/register/parts';
import { readTeamSettings } from '../../lib/server/register/team-settings';

/** A board row with what its sparkline draws: mean backlash at each inspection, and the band. */
export interface BoardEntry extends BoardRow {
  spark: { points: { runs: number; value: number }[]; band: { min: number; max: number } | null };
}

export interface BoardData {
  /** Every gear set the team has, retired and scrapped included (for the honest empty state). */
  gearSetCount: number;
  entries: BoardEntry[];
  cars: { id: string; name: string }[];
  serviceIntervalRuns: number;
  unit: string;
}

/**
 * Reads the board on the server: the gear sets, an analysis of each one still in use, and where each
 * sits. Reading only, through the lib/server use-cases.
 */
export async function loadBoard(access: TeamAccess): Promise<BoardData> {
  const teamId = access.team.id;
  const units = readerUnitsOf(access);
  const [sets, assemblies, cars, settings] = await Promise.all([
    listParts(teamId, 'gear-set'),
    listAssemblies(teamId),
    listCars(teamId),
    readTeamSettings(teamId),
  ]);
  const inUse = sets.filter((s) => s.status !== 'retired' && s.status !== 'scrapped');
  const analyses = await Promise.all(inUse.map((s) => analyseStoredGearSet(teamId, s.id, units)));
  const carName = (carId: string) => cars.find((c) => c.id === carId)?.name ?? null;
  const carOf = (assemblyId: string) => {
    const carId = assemblies.find((a) => a.id === assemblyId)?.carId ?? null;
    const name = carId ? carName(carId) : null;
    return carId && name ? { id: carId, name } : null;
  };
  const entries = inUse.map((set, i): BoardEntry => {
    const analysis = analyses[i]!;
    const mean = analysis.trends.find((t) => t.measure === 'backlash-mean');
    const band =
      mean && mean.limits.min !== undefined && mean.limits.max !== undefined
        ? { min: mean.limits.min, max: mean.limits.max }
        : null;
    return {
      ...toBoardRow(set, analysis, carOf, carName),
      spark: { points: mean?.points.map((p) => ({ runs: p.runs, value: p.value })) ?? [], band },
    };
  });
  return {
    gearSetCount: sets.length,
    entries: sortBoardRows(entries),
    cars: cars.map((c) => ({ id: c.id, name: c.name })),
    serviceIntervalRuns: settings.serviceIntervalRuns,
    unit: units.lengthUnit,
  };
}
