import { boardFilterHref } from '../../board/board-filter-links';
import { filterBoardRows, readBoardFilter, sortBoardRows, splitSpares, toBoardRow } from '../../board/board';
import type { BoardEntry, BoardView } from '../../board/views';
import { ACTION_TEXT } from '../../charts/action-text';
import type { TeamAccess } from '../guard';
import { profileOfSet, readProfileBook } from '../inspections/read-analyses';
import { analyseBoardSets } from './board-analyses';
import { readerUnitsOf } from '../inspections/inspections';
import { readPartViews } from '../register/part-views';
import { readTeamSettings } from '../register/team-settings';
import { decisionOf, readLatestDecisions } from '../reviews/read-decisions';

/** Rows shown before "show more": the board's HTML stays small however many sets a team has. */
export const BOARD_FIRST_ROWS = 20;
export const BOARD_FIRST_SPARES = 12;

const SUMMARY_ORDER = ['retire', 're-shim', 'watch', 'keep'] as const;

/**
 * The team board in nine queries however many sets, inspections or runs there are: the gear sets with
 * their run counts and places (five), the profile versions and the settings (one each), a fingerprint of
 * each set's inspections and the inspections of the sets that changed since this process last analysed
 * them (board-analyses.ts). Each set still in use is analysed in memory; the rows come back most urgent first
 * (`sortBoardRows`), the first ones shown and the rest counted behind `showAllHref`.
 */
export async function readBoard(access: TeamAccess, params: URLSearchParams): Promise<BoardView> {
  const teamId = access.team.id;
  const units = readerUnitsOf(access);
  const [register, book, settings, decisions] = await Promise.all([
    readPartViews(teamId, { kind: 'gear-set' }),
    readProfileBook(teamId),
    readTeamSettings(teamId),
    readLatestDecisions(teamId),
  ]);
  const carNames = new Map(register.places.cars.map((c) => [c.id, c.name]));
  const assemblyCar = new Map(register.places.assemblies.map((a) => [a.id, a.carId]));
  const carName = (carId: string) => carNames.get(carId) ?? null;
  const carOf = (assemblyId: string) => {
    const carId = assemblyCar.get(assemblyId) ?? null;
    const name = carId ? carName(carId) : null;
    return carId && name ? { id: carId, name } : null;
  };
  const inUse = register.parts
    .filter((s) => s.status !== 'retired' && s.status !== 'scrapped')
    .map((set) => ({ set, profile: profileOfSet(book, register.rows.get(set.id)?.toleranceProfileId ?? null) }));
  const analyses = await analyseBoardSets(teamId, inUse, book, settings.serviceIntervalRuns, units);
  const entries = inUse.map(({ set }): BoardEntry => {
    const analysis = analyses.get(set.id)!;
    const mean = analysis.trends.find((t) => t.measure === 'backlash-mean');
    const band =
      mean && mean.limits.min !== undefined && mean.limits.max !== undefined
        ? { min: mean.limits.min, max: mean.limits.max }
        : null;
    return {
      ...toBoardRow(set, analysis, carOf, carName),
      spark: { points: mean?.points.map((p) => ({ runs: p.runs, value: p.value })) ?? [], band },
      decision: decisionOf(decisions, set.id, set.totalRuns),
    };
  });
  const sorted = sortBoardRows(entries);
  const filter = readBoardFilter(
    params,
    register.places.cars.map((c) => c.id),
  );
  const showAll = params.get('all') === '1';
  // A serial search narrows the main list: a crew looking for one set among a season's hundred.
  const serialQuery = (params.get('q') ?? '').trim().slice(0, 64);
  const bySerial = (row: { serial: string }) =>
    !serialQuery || row.serial.toLowerCase().includes(serialQuery.toLowerCase());
  // Spares have their own list below; the main one shows them only when the filter asks for spares.
  const matching = filterBoardRows(sorted, filter)
    .filter((r) => filter.status || r.status !== 'spare')
    .filter(bySerial);
  const spares = splitSpares(filterBoardRows(sorted, { car: null, status: null }));
  const rows = showAll ? matching : matching.slice(0, BOARD_FIRST_ROWS);
  const ready = showAll ? spares.ready : spares.ready.slice(0, BOARD_FIRST_SPARES);
  const hidden = matching.length - rows.length + spares.ready.length - ready.length;
  return {
    gearSetCount: register.parts.length,
    filter,
    cars: register.places.cars,
    serviceIntervalRuns: settings.serviceIntervalRuns,
    unit: units.lengthUnit,
    rows,
    moreRows: matching.length - rows.length,
    summaryText: summarise(matching, Boolean(filter.car || filter.status)),
    spares: {
      ready,
      moreReady: spares.ready.length - ready.length,
      notReady: spares.notReady.map((n) => ({ serial: n.row.serial, href: n.row.href, why: n.why })),
    },
    showAllHref:
      hidden > 0
        ? `${boardFilterHref(filter)}${filter.car || filter.status ? '&' : '?'}all=1${serialQuery ? `&q=${encodeURIComponent(serialQuery)}` : ''}`
        : null,
    serialQuery,
  };
}

/** "6 sets, most urgent first: 1 retire, 2 keep, 1 not inspected yet." */
function summarise(rows: readonly BoardEntry[], filtered: boolean): string {
  const parts = [
    ...SUMMARY_ORDER.map((action) => ({ action, n: rows.filter((r) => r.action === action).length }))
      .filter((c) => c.n > 0)
      .map((c) => `${c.n} ${ACTION_TEXT[c.action].word.toLowerCase()}`),
  ];
  const uninspected = rows.filter((r) => r.action === null).length;
  if (uninspected) parts.push(`${uninspected} not inspected yet`);
  const sets = `${rows.length} set${rows.length === 1 ? '' : 's'}${filtered ? ' shown' : ''}`;
  return `${sets}, most urgent first${parts.length ? `: ${parts.join(', ')}.` : '.'}`;
}
