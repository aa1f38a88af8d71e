import { fitTrendLine, projectTrend } from '../../src/lib/analysis';
import type { ChartInspection, ChartTrend, GearSetChartInput } from '../../src/lib/charts/gear-set-input';

/**
 * Chart inputs made the way the server makes them: the trend fitted and projected by the real engine.
 * Lengths in inches on a 0.001 in indicator unless a case says otherwise (invented figures).
 */
export interface Reading {
  runs: number;
  mean: number;
  spread?: number;
  runout?: number | null;
  estimate?: number | null;
  preload?: { value: number; bearings: 'new' | 'used' } | null;
  resolution?: ChartInspection['resolution'];
}

const BAND = { min: 0.005, max: 0.009 };
const MAX_SPREAD = 0.002;

function trendOf(points: { runs: number; value: number }[], limits: { min?: number; max?: number }): ChartTrend | null {
  if (points.length === 0) return null;
  const fit = fitTrendLine(points);
  return { fit, limits, projection: projectTrend(fit, limits, points.at(-1)!.value) };
}

/** The mean as the server answers it: drawn with its fit, never projected (the band is for the points). */
function meanTrendOf(
  points: { runs: number; value: number }[],
  limits: { min?: number; max?: number },
): ChartTrend | null {
  if (points.length === 0) return null;
  const reason = { code: 'mean-not-projected' as const, message: 'The mean is not projected.' };
  return { fit: fitTrendLine(points), limits, projection: { projectedRunsAtLimit: null, runsToLimit: null, reason } };
}

export function makeInput(readings: Reading[], options: { lifeLimitRuns?: number | null } = {}): GearSetChartInput {
  const inspections: ChartInspection[] = readings.map((r, i) => {
    const spread = r.spread ?? 0.001;
    return {
      id: `insp-${i + 1}`,
      inspectedAt: `2026-0${Math.min(9, i + 1)}-15T16:00:00.000Z`,
      runs: r.runs,
      resolution: r.resolution ?? '0.001in',
      backlash: { mean: r.mean, min: r.mean - spread / 2, max: r.mean + spread / 2, spread },
      runoutTir: r.runout === undefined ? 0.001 : r.runout,
      runoutEstimate: r.estimate ?? null,
      preload: r.preload === undefined ? { value: i === 0 ? 26 : 10, bearings: i === 0 ? 'new' : 'used' } : r.preload,
      worst: 'in-band',
    };
  });
  const lifeLimitRuns = options.lifeLimitRuns === undefined ? 50 : options.lifeLimitRuns;
  const lastRuns = Math.max(0, ...readings.map((r) => r.runs));
  return {
    gearSetId: 'set-1',
    unit: 'in',
    torqueUnit: 'lbf-in',
    inspections,
    trends: {
      backlashMean: meanTrendOf(
        inspections.map((i) => ({ runs: i.runs, value: i.backlash!.mean })),
        BAND,
      ),
      backlashMin: trendOf(
        inspections.map((i) => ({ runs: i.runs, value: i.backlash!.min })),
        BAND,
      ),
      backlashMax: trendOf(
        inspections.map((i) => ({ runs: i.runs, value: i.backlash!.max })),
        BAND,
      ),
      spread: trendOf(
        inspections.map((i) => ({ runs: i.runs, value: i.backlash!.spread })),
        { max: MAX_SPREAD },
      ),
    },
    life: {
      totalRuns: lastRuns,
      runsSinceInstall: lastRuns,
      lifeLimitRuns,
      runsLeft: lifeLimitRuns === null ? null : lifeLimitRuns - lastRuns,
    },
    limits: {
      backlash: BAND,
      maxSpread: MAX_SPREAD,
      runoutMax: 0.003,
      preloadNew: { min: 24, max: 32 },
      preloadUsed: { min: 8, max: 12 },
    },
  };
}

/** GS-4101's story in short: drifting loose about 0.00005 in a run. */
export const RISING: Reading[] = [
  { runs: 0, mean: 0.0065 },
  { runs: 10, mean: 0.007 },
  { runs: 20, mean: 0.0075 },
  { runs: 30, mean: 0.008 },
];

/** Tightening up: the line heads for the lower limit. */
export const FALLING: Reading[] = [
  { runs: 0, mean: 0.0085 },
  { runs: 10, mean: 0.0075 },
  { runs: 20, mean: 0.0065 },
];
