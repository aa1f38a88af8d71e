// Backlash readings around the ring gear → statistics, once-per-turn fit and, with tooth counts, a runout estimate.

import { fitFirstHarmonic, MAX_POSITIONS, MIN_POSITIONS } from './harmonic-fit';
import { amplitudeToRunout, computeRunoutFactor, runoutFactorToText, type RunoutFactorBasis } from './runout';
import { summariseReadings } from './statistics';
import type { HarmonicFit } from './harmonic-fit';
import type { GearGeometry } from './runout';
import type { ReadingStatistics } from './statistics';

/** Runout estimated from the once-per-turn part of the lash. */
export interface RunoutEstimate {
  readonly k: number;
  readonly deltaDeg: number;
  /** Which k was used: from the tooth counts alone, with the spiral angle, or typed in. */
  readonly kBasis: RunoutFactorBasis;
  /** The k in words, for the screen: "k = 0.707, from the tooth counts and the pressure angle …". */
  readonly kText: string;
  /** Estimated back-face runout (total indicated), same unit as the readings. */
  readonly tir: number;
}

/** Everything computed from one set of backlash readings, in the readings' unit. */
export interface BacklashSummary extends ReadingStatistics {
  readonly harmonic: HarmonicFit;
  readonly runoutEstimate?: RunoutEstimate;
}

/**
 * Summarises N equally spaced backlash readings (position 1 at 0°), 3 ≤ N ≤ 24.
 * Every quantity is linear in length, so the summary is in whatever unit the readings are in.
 * @example summariseBacklash([0.2, 0.1, 0.0, 0.1]).harmonic.loosestAngleDeg // 0
 */
export function summariseBacklash(readings: readonly number[], geometry?: GearGeometry): BacklashSummary {
  const n = readings.length;
  if (n < MIN_POSITIONS || n > MAX_POSITIONS) {
    throw new RangeError(`Backlash needs ${MIN_POSITIONS} to ${MAX_POSITIONS} readings, got ${n}.`);
  }
  const statistics = summariseReadings(readings);
  const harmonic = fitFirstHarmonic(readings, statistics.mean);
  if (!geometry) return { ...statistics, harmonic };
  const factor = computeRunoutFactor(geometry);
  const { k, deltaDeg, basis } = factor;
  const kText = runoutFactorToText(factor, geometry.spiralAngleDeg);
  return {
    ...statistics,
    harmonic,
    runoutEstimate: { k, deltaDeg, kBasis: basis, kText, tir: amplitudeToRunout(harmonic.amplitude, k) },
  };
}
