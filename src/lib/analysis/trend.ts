// Straight-line trend of a measure against runs since install, and where that line meets a limit.
// Two-pass centred least squares: reproduces NIST StRD Norris to ~13 digits where the one-pass textbook
// formula (Σxy − n·x̄·ȳ) loses about half of them.

/** One inspection on a trend: runs since install and the measured value. */
export interface TrendPoint {
  readonly runs: number;
  readonly value: number;
}

/** Ordinary least-squares line value = intercept + slope × runs. Nulls where the data cannot define them. */
export interface LineFit {
  readonly count: number;
  /** null with fewer than 2 distinct run counts. */
  readonly slope: number | null;
  readonly intercept: number | null;
  /** null when the values never change (R² is 0/0) or the slope is undefined. */
  readonly r2: number | null;
  /** √(SSE / (n − 2)); null with fewer than 3 points. */
  readonly residualSd: number | null;
  /** Largest run count seen: projections start here. */
  readonly lastRuns: number;
}

/**
 * Fits value on runs by ordinary least squares, centred two-pass sums.
 * @example fitTrendLine([{ runs: 0, value: 1 }, { runs: 10, value: 2 }]) // slope 0.1, intercept 1
 */
export function fitTrendLine(points: readonly TrendPoint[]): LineFit {
  const n = points.length;
  if (n === 0) throw new RangeError('fitTrendLine needs at least one point.');
  const first = points[0] as TrendPoint;
  let sumX = 0;
  let sumY = 0;
  let lastRuns = first.runs;
  for (let i = 0; i < n; i++) {
    const point = points[i] as TrendPoint;
    // Shifted by the first point so large run counts or offsets keep their low digits.
    sumX += point.runs - first.runs;
    sumY += point.value - first.value;
    if (point.runs > lastRuns) lastRuns = point.runs;
  }
  const meanX = first.runs + sumX / n;
  const meanY = first.value + sumY / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const point = points[i] as TrendPoint;
    const dx = point.runs - meanX;
    const dy = point.value - meanY;
    sxx += dx * dx;
    sxy += dx * dy;
    syy += dy * dy;
  }
  if (sxx === 0) return { count: n, slope: null, intercept: null, r2: null, residualSd: null, lastRuns };
  const slope = sxy / sxx;
  let sse = 0;
  for (let i = 0; i < n; i++) {
    const point = points[i] as TrendPoint;
    const residual = point.value - meanY - slope * (point.runs - meanX);
    sse += residual * residual;
  }
  return {
    count: n,
    slope,
    intercept: meanY - slope * meanX,
    r2: syy === 0 ? null : 1 - sse / syy,
    residualSd: n > 2 ? Math.sqrt(sse / (n - 2)) : null,
    lastRuns,
  };
}

/** A limit the trend may run into: a single value, or a band. */
export type TrendLimit = number | { readonly min?: number; readonly max?: number };

export type TrendReasonCode =
  | 'no-limit'
  | 'too-few-points'
  | 'no-run-spread'
  | 'flat'
  | 'moving-away'
  | 'already-past-limit'
  | 'past-limit-now'
  | 'returning'
  | 'mean-not-projected';

/** Why there is no projection: a machine code and a sentence for the screen. */
export interface TrendReason {
  readonly code: TrendReasonCode;
  readonly message: string;
}

/** The latest reading of a trend: its value, and whether its inspection's verdict called it past a limit. */
export type LatestReading = number | { readonly value: number; readonly past?: boolean };

/** The limit a value is past (a float hair past is not past), or null. */
function sidePassed(value: number, band: { min?: number; max?: number }): 'min' | 'max' | null {
  const slack = 1e-9 * Math.max(Math.abs(value), Math.abs(band.max ?? 0), Math.abs(band.min ?? 0));
  if (band.max !== undefined && value > band.max + slack) return 'max';
  if (band.min !== undefined && value < band.min - slack) return 'min';
  return null;
}

/** The limit a value is nearer to (a verdict out of band is past that one). */
function nearestSide(value: number, band: { min?: number; max?: number }): 'min' | 'max' {
  const toMax = band.max === undefined ? Infinity : Math.abs(value - band.max);
  const toMin = band.min === undefined ? Infinity : Math.abs(value - band.min);
  return toMax <= toMin ? 'max' : 'min';
}

/** Where the fitted line meets the limit, looking forward from the last inspection. */
export interface TrendProjection {
  /** Run count (fractional) at which the line reaches the limit; ≥ the last run count, or null. */
  readonly projectedRunsAtLimit: number | null;
  /** Runs from the last inspection to the crossing; null with the crossing. */
  readonly runsToLimit: number | null;
  readonly limit?: 'min' | 'max';
  readonly reason?: TrendReason;
}

export const MIN_TREND_POINTS = 3;

function project(reason: TrendReason): TrendProjection {
  return { projectedRunsAtLimit: null, runsToLimit: null, reason };
}

/**
 * Projects the run count at which the fitted line reaches the limit. A single number is a limit on whichever
 * side of it the latest reading (or, without one, the line) sits at the last run (below → a max, above → a min).
 * Needs 3 points; only looks forward. The latest reading past a limit is "past the limit now", whatever the line
 * says; a line past a limit and heading back is "coming back toward the band", never a crossing in the past.
 * @example projectTrend(fitTrendLine(points), { max: 0.23 }) // { projectedRunsAtLimit: 61.7, runsToLimit: 13.7, limit: 'max' }
 */
export function projectTrend(
  fit: LineFit,
  limit: TrendLimit | undefined,
  latestReading?: LatestReading,
): TrendProjection {
  const latest = typeof latestReading === 'number' ? latestReading : latestReading?.value;
  const judgedPast = typeof latestReading === 'number' ? undefined : latestReading?.past;
  if (limit === undefined)
    return project({ code: 'no-limit', message: 'No limit given, so there is nothing to project to.' });
  const { lastRuns } = fit;
  const reference =
    latest ?? (fit.slope !== null && fit.intercept !== null ? fit.intercept + fit.slope * lastRuns : undefined);
  const band =
    typeof limit === 'number'
      ? reference === undefined || reference <= limit
        ? { max: limit }
        : { min: limit }
      : limit;
  if (band.min === undefined && band.max === undefined) {
    return project({ code: 'no-limit', message: 'The limit has neither a min nor a max.' });
  }
  // The reading is what the band judges: past a limit now is past it, however the line runs. Where the latest
  // inspection's verdict is given, it decides (judged at its graduation against the limit as published).
  if (latest !== undefined) {
    const side = judgedPast === undefined ? sidePassed(latest, band) : judgedPast ? nearestSide(latest, band) : null;
    const value = side ? band[side] : undefined;
    if (side && value !== undefined) {
      return project({
        code: 'past-limit-now',
        message: `The latest reading is past the ${side} (${value}) now, at run ${lastRuns}.`,
      });
    }
  }
  if (fit.count < MIN_TREND_POINTS) {
    const missing = MIN_TREND_POINTS - fit.count;
    const words =
      missing === 1 ? 'One more inspection gives' : `${missing === 2 ? 'Two' : missing} more inspections give`;
    return project({ code: 'too-few-points', message: `${words} a projection.` });
  }
  if (fit.slope === null || fit.intercept === null) {
    return project({
      code: 'no-run-spread',
      message: 'All inspections are at the same run count; a trend needs different run counts.',
    });
  }
  const { slope, intercept } = fit;
  const fittedNow = intercept + slope * lastRuns;
  for (const side of ['max', 'min'] as const) {
    const value = band[side];
    const isPast = value !== undefined && (side === 'max' ? fittedNow > value : fittedNow < value);
    if (!isPast) continue;
    const returning = side === 'max' ? slope < 0 : slope > 0;
    if (returning) {
      return project({
        code: 'returning',
        message: `The fitted line is past the ${side} (${value}) but heading back: coming back toward the band.`,
      });
    }
    return project({
      code: 'already-past-limit',
      message: `The fitted line is past the ${side} (${value}) at run ${lastRuns} and not heading back.`,
    });
  }
  if (slope === 0)
    return project({ code: 'flat', message: 'The trend is flat; at this rate the limit is never reached.' });
  const side = slope > 0 ? 'max' : 'min';
  const target = band[side];
  if (target === undefined) {
    return project({
      code: 'moving-away',
      message: `The trend is moving away from the ${side === 'max' ? 'min' : 'max'}.`,
    });
  }
  const crossing = (target - intercept) / slope;
  return { projectedRunsAtLimit: crossing, runsToLimit: crossing - lastRuns, limit: side };
}

/**
 * Runs left before the life limit (0 once reached).
 * @example computeRunsLeft(42, 50) // 8
 */
export function computeRunsLeft(runsSinceInstall: number, lifeLimitRuns: number): number {
  return Math.max(0, lifeLimitRuns - runsSinceInstall);
}

/**
 * The life limit in words: runs left, or runs over it — never a negative count.
 * @example lifeToText(67, 50) // '17 runs over the life limit'
 */
export function lifeToText(totalRuns: number, lifeLimitRuns: number): string {
  const left = lifeLimitRuns - totalRuns;
  if (left > 0) return `${left} run${left === 1 ? '' : 's'} left`;
  if (left === 0) return 'at the life limit';
  return `${-left} run${left === -1 ? '' : 's'} over the life limit`;
}
