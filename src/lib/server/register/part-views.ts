import { and, asc, eq, inArray, type SQL } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { assemblies, cars, parts, type Part } from '../../../db/schema';
import { ratioToLabel, teethToRatio } from '../../register/gear-ratio';
import type { PartKind } from '../../register/kinds';
import type { PartView, PlaceNames } from '../../register/views';
import { listCurrentInstalls } from './locations';
import { countRunsForParts, type RunCounts } from './run-counts';

/** A part row as the API answers it, with its run counts and where it is. */
export function partToView(
  part: Part,
  counts: RunCounts = { totalRuns: 0, runsSinceInstall: 0 },
  location: PartView['location'] = null,
): PartView {
  const view: PartView = {
    id: part.id,
    kind: part.kind,
    serial: part.serial,
    status: part.status,
    lifeLimitRuns: part.lifeLimitRuns,
    runsSinceInstall: counts.runsSinceInstall,
    totalRuns: counts.totalRuns,
    runsLeft: part.lifeLimitRuns === null ? null : part.lifeLimitRuns - counts.totalRuns,
    maker: part.maker,
    model: part.model,
    material: part.material,
    notes: part.notes,
    location,
    createdAt: part.createdAt.toISOString(),
  };
  if (part.kind === 'gear-set') {
    const ratio = part.ringTeeth && part.pinionTeeth ? teethToRatio(part.ringTeeth, part.pinionTeeth) : null;
    Object.assign(view, {
      ringTeeth: part.ringTeeth,
      pinionTeeth: part.pinionTeeth,
      ratio,
      ratioLabel: ratio === null ? null : ratioToLabel(ratio),
      pressureAngleDeg: part.pressureAngleDeg ?? 20,
      cutMethod: part.cutMethod,
      spiralAngleDeg: part.spiralAngleDeg,
      runoutK: part.runoutK,
    });
  }
  return view;
}

export interface PartViewsRead {
  /** The parts asked for, ordered by kind, serial and id. */
  parts: PartView[];
  /** The rows themselves (the tolerance profile a gear set is judged by lives only there). */
  rows: Map<string, Part>;
  /** Every car and assembly of the team, each assembly with the car it is in now. */
  places: PlaceNames;
}

/**
 * Parts of a team as views, in five queries however many parts, runs or installations there are:
 * the parts, the run counts of every part (one windowed query), what is installed where now, and the
 * team's cars and assemblies, joined here through maps. Every query filters by the team.
 */
export async function readPartViews(
  teamId: string,
  filter: { kind?: PartKind; ids?: readonly string[] } = {},
): Promise<PartViewsRead> {
  const db = await getDb();
  const conditions: SQL[] = [eq(parts.teamId, teamId)];
  if (filter.kind) conditions.push(eq(parts.kind, filter.kind));
  if (filter.ids) conditions.push(inArray(parts.id, [...filter.ids]));
  const [rows, counts, installs, carRows, assemblyRows] = await Promise.all([
    filter.ids?.length === 0
      ? Promise.resolve([] as Part[])
      : db
          .select()
          .from(parts)
          .where(and(...conditions))
          .orderBy(asc(parts.kind), asc(parts.serial), asc(parts.id)),
    countRunsForParts(teamId, undefined, filter.ids),
    listCurrentInstalls(teamId),
    db.select({ id: cars.id, name: cars.name }).from(cars).where(eq(cars.teamId, teamId)).orderBy(asc(cars.name)),
    db
      .select({ id: assemblies.id, serial: assemblies.serial, name: assemblies.name })
      .from(assemblies)
      .where(eq(assemblies.teamId, teamId))
      .orderBy(asc(assemblies.serial)),
  ]);
  const carNames = new Map(carRows.map((c) => [c.id, c.name]));
  const assemblyCar = new Map<string, string>();
  const partInstall = new Map<string, (typeof installs)[number]>();
  for (const install of installs) {
    if (install.subjectType === 'assembly' && install.targetType === 'car')
      assemblyCar.set(install.subjectId, install.targetId);
    if (install.subjectType === 'part') partInstall.set(install.subjectId, install);
  }
  const assemblyById = new Map(assemblyRows.map((a) => [a.id, a]));
  // The same words describeTarget() uses, e.g. "assembly RE-2 (Spare rear end)".
  const label = (targetType: 'assembly' | 'car', targetId: string): string => {
    if (targetType === 'car') return `car ${carNames.get(targetId) ?? targetId}`;
    const assembly = assemblyById.get(targetId);
    return assembly ? `assembly ${assembly.serial} (${assembly.name})` : `assembly ${targetId}`;
  };
  const views = rows.map((part) => {
    const install = partInstall.get(part.id);
    const location: PartView['location'] = install
      ? {
          targetType: install.targetType,
          targetId: install.targetId,
          label: label(install.targetType, install.targetId),
          since: install.since.toISOString(),
        }
      : null;
    return partToView(part, counts.get(part.id), location);
  });
  return {
    parts: views,
    rows: new Map(rows.map((r) => [r.id, r])),
    places: {
      cars: carRows,
      assemblies: assemblyRows.map((a) => ({ ...a, carId: assemblyCar.get(a.id) ?? null })),
    },
  };
}
