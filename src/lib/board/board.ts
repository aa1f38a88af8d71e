// The team board: every gear set still in use with its life, latest verdict, projected runs left and
// what it needs next, most urgent first; and the spares that are ready to go in. Pure: the board page
// reads the register and the analyses on the server and hands them here.

import type { Recommendation, RecommendedAction, Verdict } from '../analysis';
import { reasonToText } from '../charts/action-text';
import { worstVerdict } from '../charts/gear-set-input';
import type { PartStatus } from '../register/kinds';

/** The parts of a gear set (PartView) the board reads. */
export interface BoardGearSet {
  id: string;
  serial: string;
  status: PartStatus;
  ratioLabel?: string | null;
  totalRuns: number;
  runsSinceInstall: number;
  lifeLimitRuns: number | null;
  location: { targetType: 'assembly' | 'car'; targetId: string; label: string } | null;
}

/** The parts of a gear-set analysis the board reads. */
export interface BoardAnalysis {
  inspectionCount: number;
  latest: { inspectedAt: string; summary: { verdicts: { measure: string; verdict: Verdict }[] } } | null;
  trends: { measure: string; projection: { runsToLimit: number | null; reason?: { code: string } } }[];
  recommendation: Recommendation | null;
}

export interface BoardRow {
  id: string;
  serial: string;
  href: string;
  ratioLabel: string | null;
  status: PartStatus;
  car: { id: string; name: string } | null;
  placeText: string;
  totalRuns: number;
  runsSinceInstall: number;
  lifeLimitRuns: number | null;
  /** Runs left to the life limit (negative past it), null without a limit. */
  lifeRunsLeft: number | null;
  verdict: Verdict | null;
  /** Which measure set the verdict, e.g. "backlash-max-point"; null when in band or not judged. */
  verdictMeasure: string | null;
  projected: { runs: number; what: string } | null;
  action: RecommendedAction | null;
  topReason: string | null;
  lastInspectedAt: string | null;
  inspectionCount: number;
}

export const ACTION_RANK: Readonly<Record<RecommendedAction, number>> = { retire: 4, 're-shim': 3, watch: 2, keep: 1 };

const OUT_OF_USE: readonly PartStatus[] = ['retired', 'scrapped'];

// A projection this far off is a flat line, not a forecast (the charts say the same).
const NEVER_RUNS = 100_000;

const TREND_WORDS: Readonly<Record<string, string>> = {
  'backlash-mean': 'mean backlash',
  'backlash-min-point': 'tightest backlash',
  'backlash-max-point': 'loosest backlash',
  spread: 'spread',
};

/** The nearest limit ahead: the life limit or a trend crossing, whichever comes first. */
export function findProjectedRunsLeft(
  set: Pick<BoardGearSet, 'totalRuns' | 'lifeLimitRuns'>,
  analysis: Pick<BoardAnalysis, 'trends'> | null,
): BoardRow['projected'] {
  const candidates: { runs: number; what: string }[] = [];
  if (set.lifeLimitRuns !== null) candidates.push({ runs: set.lifeLimitRuns - set.totalRuns, what: 'life limit' });
  for (const trend of analysis?.trends ?? []) {
    const what = TREND_WORDS[trend.measure] ?? trend.measure;
    const code = trend.projection.reason?.code;
    if (code === 'already-past-limit' || code === 'past-limit-now')
      candidates.push({ runs: 0, what: `${what} past its limit` });
    else if (trend.projection.runsToLimit !== null && trend.projection.runsToLimit < NEVER_RUNS)
      candidates.push({ runs: Math.floor(trend.projection.runsToLimit), what });
  }
  if (candidates.length === 0) return null;
  return candidates.reduce((a, b) => (b.runs < a.runs ? b : a));
}

/**
 * One board row from a gear set, its analysis and where its assembly sits.
 * `carOf(assemblyId)` answers the car an assembly is in, or null.
 */
export function toBoardRow(
  set: BoardGearSet,
  analysis: BoardAnalysis | null,
  carOf: (assemblyId: string) => { id: string; name: string } | null,
  carName: (carId: string) => string | null,
): BoardRow {
  const loc = set.location;
  const car = !loc
    ? null
    : loc.targetType === 'car'
      ? { id: loc.targetId, name: carName(loc.targetId) ?? loc.label }
      : carOf(loc.targetId);
  const verdicts = analysis?.latest?.summary.verdicts ?? [];
  const verdict = worstVerdict(verdicts);
  const worst =
    verdict && verdict !== 'in-band' ? (verdicts.find((v) => v.verdict === verdict)?.measure ?? null) : null;
  const lifeRunsLeft = set.lifeLimitRuns === null ? null : set.lifeLimitRuns - set.totalRuns;
  let action = analysis?.recommendation?.action ?? null;
  const first = analysis?.recommendation?.reasons[0];
  let topReason = first ? reasonToText(first) : null;
  // Never inspected: the life limit still speaks, nothing else can.
  if (!analysis?.recommendation && lifeRunsLeft !== null && lifeRunsLeft <= 0) {
    action = 'retire';
    topReason = `${set.totalRuns} runs reach the life limit of ${set.lifeLimitRuns}: replace the set.`;
  }
  return {
    id: set.id,
    serial: set.serial,
    href: `/gear-sets/${set.id}`,
    ratioLabel: set.ratioLabel ?? null,
    status: set.status,
    car,
    placeText: loc ? `${loc.label}${car && loc.targetType === 'assembly' ? ` in ${car.name}` : ''}` : 'on the shelf',
    totalRuns: set.totalRuns,
    runsSinceInstall: set.runsSinceInstall,
    lifeLimitRuns: set.lifeLimitRuns,
    lifeRunsLeft,
    verdict,
    verdictMeasure: worst,
    projected: findProjectedRunsLeft(set, analysis),
    action,
    topReason,
    lastInspectedAt: analysis?.latest?.inspectedAt ?? null,
    inspectionCount: analysis?.inspectionCount ?? 0,
  };
}

/**
 * The board's one order, most urgent first (issue 14 defines it; keep it): retire, re-shim, a set in a car
 * that was never inspected (it is running blind), watch, keep, then a set in no car never inspected.
 * @example boardRankOf({ action: null, car: { id: 'c', name: '714' } }) // 3, between re-shim and watch
 */
export function boardRankOf(row: Pick<BoardRow, 'action' | 'car'>): number {
  if (row.action) return BOARD_ACTION_RANK[row.action];
  return row.car ? UNINSPECTED_IN_CAR_RANK : 0;
}

const BOARD_ACTION_RANK: Readonly<Record<RecommendedAction, number>> = { retire: 5, 're-shim': 4, watch: 2, keep: 1 };
const UNINSPECTED_IN_CAR_RANK = 3;

/**
 * Most urgent first by `boardRankOf`; then fewest runs left; then serial.
 * @example sortBoardRows(rows).map((r) => r.action) // ['retire', 're-shim', null (in a car), 'watch', 'keep']
 */
export function sortBoardRows<T extends BoardRow>(rows: readonly T[]): T[] {
  const left = (r: T) => r.projected?.runs ?? Number.POSITIVE_INFINITY;
  return [...rows].sort(
    (a, b) => boardRankOf(b) - boardRankOf(a) || left(a) - left(b) || a.serial.localeCompare(b.serial),
  );
}

/** The statuses a set in use can have, in the order the board's filter offers them. */
export const IN_USE_STATUSES = ['in-service', 'spare', 'under-review'] as const satisfies readonly PartStatus[];

export interface BoardFilter {
  /** A car id, 'none' for sets in no car, or null for all. */
  car: string | null;
  status: PartStatus | null;
}

/** Rows still in use (not retired or scrapped) that pass the filter. */
export function filterBoardRows<T extends BoardRow>(rows: readonly T[], filter: BoardFilter): T[] {
  return rows.filter((r) => {
    if (OUT_OF_USE.includes(r.status)) return false;
    if (filter.status && r.status !== filter.status) return false;
    if (filter.car === 'none') return r.car === null;
    if (filter.car) return r.car?.id === filter.car;
    return true;
  });
}

/** Reads `?car=&status=` leniently: an unknown value shows everything rather than nothing. */
export function readBoardFilter(params: URLSearchParams, carIds: readonly string[]): BoardFilter {
  const car = params.get('car');
  const status = params.get('status');
  const statuses: readonly string[] = IN_USE_STATUSES;
  return {
    car: car && (car === 'none' || carIds.includes(car)) ? car : null,
    status: status && statuses.includes(status) ? (status as PartStatus) : null,
  };
}

/**
 * Spare sets that could go in now: within their life and with no inspection asking to retire or re-shim.
 * Also says why each other spare is not ready.
 */
export function splitSpares<T extends BoardRow>(
  rows: readonly T[],
): { ready: T[]; notReady: { row: T; why: string }[] } {
  const ready: T[] = [];
  const notReady: { row: T; why: string }[] = [];
  for (const row of rows) {
    if (row.status !== 'spare') continue;
    if (row.lifeRunsLeft !== null && row.lifeRunsLeft <= 0) notReady.push({ row, why: 'at or past its life limit' });
    else if (row.action === 'retire' || row.action === 're-shim')
      notReady.push({ row, why: `its last inspection says ${row.action}` });
    else ready.push(row);
  }
  ready.sort((a, b) => (b.lifeRunsLeft ?? Infinity) - (a.lifeRunsLeft ?? Infinity) || a.serial.localeCompare(b.serial));
  return { ready, notReady };
}
