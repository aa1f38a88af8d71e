// The analysis engine's public face: the three functions the /api/analysis endpoints serve, plus the parts.
// Pure: no database, clock or I/O. Inputs are the validated bodies from ./schemas.

import { summariseBacklash } from './backlash';
import { judgeBacklash } from './judge';
import { computeTighteningSequence } from './tightening-sequence';
import { fitTrendLine, projectTrend } from './trend';
import type { RunoutEstimate } from './backlash';
import type { HarmonicFit } from './harmonic-fit';
import type { MeasureVerdict } from './judge';
import type { BacklashRequest, TrendRequest } from './schemas';
import type { ReadingStatistics } from './statistics';
import type { TrendReason } from './trend';

/** Response of POST /api/analysis/backlash; every length in the request's unit. */
export interface BacklashAnalysis extends ReadingStatistics {
  readonly unit: 'in' | 'mm';
  readonly harmonic: HarmonicFit;
  readonly runoutEstimate?: RunoutEstimate;
  readonly verdicts?: MeasureVerdict[];
}

/**
 * Analyses one set of backlash readings. Every step is linear in length (the factor k is a ratio), so working
 * in the request's unit gives the same numbers as working in mm and converting back, without the round trip.
 * @example analyseBacklash({ unit: 'in', readings: [0.008, 0.006, 0.004, 0.006] }).harmonic.amplitude // 0.002
 */
export function analyseBacklash(request: BacklashRequest): BacklashAnalysis {
  const { unit, readings, profile, ringTeeth, pinionTeeth, pressureAngleDeg } = request;
  const geometry =
    ringTeeth !== undefined && pinionTeeth !== undefined ? { ringTeeth, pinionTeeth, pressureAngleDeg } : undefined;
  const summary = summariseBacklash(readings, geometry);
  const analysis: BacklashAnalysis = {
    unit,
    count: summary.count,
    mean: summary.mean,
    min: summary.min,
    max: summary.max,
    spread: summary.spread,
    sd: summary.sd,
    harmonic: summary.harmonic,
    ...(summary.runoutEstimate && { runoutEstimate: summary.runoutEstimate }),
    ...(profile && {
      verdicts: judgeBacklash(summary, {
        backlashMin: profile.min,
        backlashMax: profile.max,
        maxSpread: profile.maxSpread,
      }),
    }),
  };
  return analysis;
}

/** Response of POST /api/analysis/trend. */
export interface TrendAnalysis {
  readonly slope: number | null;
  readonly intercept: number | null;
  readonly r2: number | null;
  readonly projectedRunsAtLimit: number | null;
  readonly reason?: TrendReason;
}

/**
 * Fits the trend and projects where it meets the limit.
 * @example analyseTrend({ points, limit: { max: 0.23 } }) // { slope, intercept, r2, projectedRunsAtLimit: 61.7 }
 */
export function analyseTrend(request: TrendRequest): TrendAnalysis {
  const fit = fitTrendLine(request.points);
  const projection = projectTrend(fit, request.limit);
  const base = {
    slope: fit.slope,
    intercept: fit.intercept,
    r2: fit.r2,
    projectedRunsAtLimit: projection.projectedRunsAtLimit,
  };
  return projection.reason ? { ...base, reason: projection.reason } : base;
}

/** Response of GET /api/analysis/tightening-sequence. */
export interface TighteningSequence {
  readonly bolts: number;
  readonly sequence: readonly number[];
}

/**
 * Cross tightening order for `bolts` bolts numbered clockwise from 1.
 * @example tighteningSequence(4) // { bolts: 4, sequence: [1, 3, 2, 4] }
 */
export function tighteningSequence(bolts: number): TighteningSequence {
  return { bolts, sequence: computeTighteningSequence(bolts) };
}

export * from './backlash';
export * from './compare';
export * from './contact-pattern';
export * from './harmonic-fit';
export * from './judge';
export * from './recommendation';
export * from './runout';
export * from './schemas';
export * from './statistics';
export * from './tightening-sequence';
export * from './tolerance';
export * from './trend';
