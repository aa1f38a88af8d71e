// Descriptive statistics of one set of indicator readings, computed so large offsets cannot eat the digits.

/** Mean, extremes and sample standard deviation of a set of readings. */
export interface ReadingStatistics {
  readonly count: number;
  readonly mean: number;
  readonly min: number;
  readonly max: number;
  /** max − min: the "variation between points" the service manuals limit. */
  readonly spread: number;
  /** Sample standard deviation (n − 1). */
  readonly sd: number;
}

/**
 * Returns the arithmetic mean, shifted by the first value so 10000001-style data keeps its last digit.
 * @example computeMean([10000001, 10000003, 10000002]) // 10000002
 */
export function computeMean(values: readonly number[]): number {
  const n = values.length;
  if (n === 0) throw new RangeError('computeMean needs at least one value.');
  const shift = values[0] as number;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += (values[i] as number) - shift;
  return shift + sum / n;
}

/**
 * Summarises readings with a two-pass, corrected sum of squares (stable for NIST StRD NumAcc data).
 * @example summariseReadings([10000001, 10000003, 10000002]).sd // 1
 */
export function summariseReadings(readings: readonly number[]): ReadingStatistics {
  const n = readings.length;
  if (n < 2) throw new RangeError(`summariseReadings needs at least 2 readings, got ${n}.`);
  const mean = computeMean(readings);
  let min = Infinity;
  let max = -Infinity;
  let sumDev = 0;
  let sumSq = 0;
  for (let i = 0; i < n; i++) {
    const value = readings[i] as number;
    if (value < min) min = value;
    if (value > max) max = value;
    const dev = value - mean;
    sumDev += dev;
    sumSq += dev * dev;
  }
  // The (Σd)²/n term removes what rounding left in the mean (the "corrected two-pass" algorithm).
  const sumSquares = Math.max(0, sumSq - (sumDev * sumDev) / n);
  return { count: n, mean, min, max, spread: max - min, sd: Math.sqrt(sumSquares / (n - 1)) };
}
