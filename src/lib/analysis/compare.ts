// Change since the previous inspection, flagged only when it is larger than two readings' worth of doubt.
// Each reading carries ± one graduation, so a difference of two readings carries ± two; anything within that
// could be the indicator, not the gear set (CP: no published source). The coarser indicator of the two
// inspections sets the step.

import type { BacklashSummary } from './backlash';

/** Named measures of one inspection (same unit throughout) and the indicator graduation in that unit. */
export interface InspectionMeasures {
  readonly measures: Readonly<Record<string, number | undefined>>;
  readonly resolution: number;
}

/** Change of one measure between two inspections. */
export interface MeasureChange {
  readonly measure: string;
  readonly previous: number | null;
  readonly current: number | null;
  /** current − previous; null when either inspection lacks the measure. */
  readonly delta: number | null;
  /** 2 × the coarser resolution: |delta| must exceed this to count. */
  readonly threshold: number;
  readonly flagged: boolean;
}

// A delta equal to the threshold is not flagged, even if subtraction left it one ulp above.
const RELATIVE_TOLERANCE = 1e-9;

/**
 * Compares every measure of the current inspection with the previous one (measures of either, in order seen).
 * @example compareInspections({ measures: { min: 0.15 }, resolution: 0.01 }, { measures: { min: 0.18 }, resolution: 0.01 })
 *   // [{ measure: 'min', delta: 0.03, threshold: 0.02, flagged: true, … }]
 */
export function compareInspections(previous: InspectionMeasures, current: InspectionMeasures): MeasureChange[] {
  if (!(previous.resolution > 0 && current.resolution > 0)) throw new RangeError('Resolutions must be positive.');
  const threshold = 2 * Math.max(previous.resolution, current.resolution);
  const limit = threshold * (1 + RELATIVE_TOLERANCE);
  const names = new Set([...Object.keys(current.measures), ...Object.keys(previous.measures)]);
  const changes: MeasureChange[] = [];
  for (const measure of names) {
    const before = previous.measures[measure];
    const after = current.measures[measure];
    if (before === undefined && after === undefined) continue;
    const bothKnown = before !== undefined && after !== undefined;
    const delta = bothKnown ? after - before : null;
    changes.push({
      measure,
      previous: before ?? null,
      current: after ?? null,
      delta,
      threshold,
      flagged: delta !== null && Math.abs(delta) > limit,
    });
  }
  return changes;
}

/**
 * Picks the comparable measures out of a backlash summary (readings' unit).
 * @example summaryToMeasures(summary) // { min, max, mean, spread, amplitude, tir? }
 */
export function summaryToMeasures(summary: BacklashSummary): Record<string, number | undefined> {
  return {
    min: summary.min,
    max: summary.max,
    mean: summary.mean,
    spread: summary.spread,
    amplitude: summary.harmonic.amplitude,
    tir: summary.runoutEstimate?.tir,
  };
}
