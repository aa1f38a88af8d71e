// Least-squares once-per-turn (first-harmonic) fit of equally spaced readings.
// Source: ISO 4291:1985 Annex F (TRADE.md, S), least-squares reference circle. For N ≥ 3 equally spaced
// angles the basis {1, cos θ, sin θ} is orthogonal, so the closed form below IS the least-squares solution;
// for even N the Nyquist term cos(Nθ/2) is orthogonal to it too and lands in the residuals.

import { computeMean } from './statistics';

/** The fitted m + a·cos θ + b·sin θ, with θ = 0 at position 1 and increasing with the position number. */
export interface HarmonicFit {
  readonly a: number;
  readonly b: number;
  /** √(a² + b²): half the once-per-turn peak-to-peak. */
  readonly amplitude: number;
  /** Angle of the loosest point, degrees in [0, 360); null when the fit has no once-per-turn part. */
  readonly loosestAngleDeg: number | null;
  /** Loosest + 180°, in [0, 360); null with the loosest angle. */
  readonly tightestAngleDeg: number | null;
  /** Reading − fitted value, per position. */
  readonly residuals: number[];
}

export const MIN_POSITIONS = 3;
export const MAX_POSITIONS = 24;

interface TrigTable {
  readonly cos: Float64Array;
  readonly sin: Float64Array;
}

// One table per N, built once: the fit runs per request, the angles never change.
const TRIG_TABLES: (TrigTable | undefined)[] = [];

function getTrigTable(n: number): TrigTable {
  const cached = TRIG_TABLES[n];
  if (cached) return cached;
  const cos = new Float64Array(n);
  const sin = new Float64Array(n);
  const QUARTER_COS = [1, 0, -1, 0];
  const QUARTER_SIN = [0, 1, 0, -1];
  for (let k = 0; k < n; k++) {
    // Quarter turns get exact 0/±1, so four readings 90° apart give a = (R1 − R3)/2 with no 6e-17 noise.
    if ((4 * k) % n === 0) {
      const quarter = (4 * k) / n;
      cos[k] = QUARTER_COS[quarter] as number;
      sin[k] = QUARTER_SIN[quarter] as number;
    } else {
      const theta = (2 * Math.PI * k) / n;
      cos[k] = Math.cos(theta);
      sin[k] = Math.sin(theta);
    }
  }
  const table = { cos, sin };
  TRIG_TABLES[n] = table;
  return table;
}

/** Returns the angle of position k (1-based) of n equally spaced positions, in degrees. */
export function positionToAngleDeg(position: number, count: number): number {
  return (360 * (position - 1)) / count;
}

// Below this share of the largest reading the phase is rounding noise, not a loosest point.
const ZERO_AMPLITUDE_SHARE = 1e-12;

/**
 * Fits m + a·cos θ + b·sin θ to readings at θk = 2π(k − 1)/N: a = (2/N)ΣR cos θ, b = (2/N)ΣR sin θ.
 * @example fitFirstHarmonic([0.2, 0.1, 0.0, 0.1]) // a 0.1, b 0, amplitude 0.1, loosest 0°, tightest 180°
 */
export function fitFirstHarmonic(readings: readonly number[], mean: number = computeMean(readings)): HarmonicFit {
  const n = readings.length;
  if (n < MIN_POSITIONS) throw new RangeError(`The fit needs at least ${MIN_POSITIONS} readings, got ${n}.`);
  const { cos, sin } = getTrigTable(n);
  let sumCos = 0;
  let sumSin = 0;
  let largest = 0;
  // Centred sums: identical in exact arithmetic (Σcos θ = Σsin θ = 0), but equal readings give exactly 0.
  for (let k = 0; k < n; k++) {
    const value = readings[k] as number;
    const dev = value - mean;
    sumCos += dev * (cos[k] as number);
    sumSin += dev * (sin[k] as number);
    if (Math.abs(value) > largest) largest = Math.abs(value);
  }
  const a = (2 / n) * sumCos;
  const b = (2 / n) * sumSin;
  const amplitude = Math.hypot(a, b);
  const residuals = new Array<number>(n);
  for (let k = 0; k < n; k++) {
    residuals[k] = (readings[k] as number) - (mean + a * (cos[k] as number) + b * (sin[k] as number));
  }
  if (amplitude <= ZERO_AMPLITUDE_SHARE * largest) {
    return { a, b, amplitude, loosestAngleDeg: null, tightestAngleDeg: null, residuals };
  }
  const loosest = normaliseDegrees((Math.atan2(b, a) * 180) / Math.PI);
  return { a, b, amplitude, loosestAngleDeg: loosest, tightestAngleDeg: normaliseDegrees(loosest + 180), residuals };
}

/**
 * Normalises an angle in degrees to [0, 360).
 * @example normaliseDegrees(-90) // 270
 */
export function normaliseDegrees(degrees: number): number {
  const wrapped = degrees % 360;
  const positive = wrapped < 0 ? wrapped + 360 : wrapped;
  // -1e-15 % 360 + 360 rounds to exactly 360; keep the half-open interval.
  return positive >= 360 ? 0 : positive;
}
