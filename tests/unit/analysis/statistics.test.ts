import { sampleStandardDeviation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { computeMean, summariseReadings } from '../../../src/lib/analysis/statistics';
import { createRandom, pickBetween, pickInteger } from '../../helpers/seeded-random';

describe('summariseReadings', () => {
  it('reproduces the certified mean and sample SD of NumAcc1 exactly', () => {
    // NIST StRD NumAcc1: 10000001, 10000003, 10000002 → mean 10000002, SD 1
    const summary = summariseReadings([10000001, 10000003, 10000002]);
    expect(summary.mean).toBe(10000002);
    expect(summary.sd).toBe(1);
  });

  it('keeps the SD when the same data sits on an offset of 1e9, where a one-pass formula fails', () => {
    // D: shift invariance of the SD, on NIST StRD NumAcc1 moved by 1e9 (x² ≈ 1e18 exceeds the 53-bit mantissa)
    const summary = summariseReadings([1e9 + 1, 1e9 + 3, 1e9 + 2]);
    expect(summary.mean).toBe(1e9 + 2);
    expect(summary.sd).toBe(1);
  });

  it('gives min, max, spread and count', () => {
    // Worked by hand on the readings written here (D: definitions only).
    expect(summariseReadings([0.15, 0.18, 0.14, 0.17])).toMatchObject({ count: 4, min: 0.14, max: 0.18 });
    expect(summariseReadings([0.15, 0.18, 0.14, 0.17]).spread).toBeCloseTo(0.04, 15);
  });

  it('agrees with simple-statistics on random readings', () => {
    // Independent implementation: simple-statistics (sample SD with n − 1, as NIST StRD certifies).
    const random = createRandom(1);
    for (let trial = 0; trial < 200; trial++) {
      const readings = Array.from({ length: pickInteger(random, 2, 24) }, () => pickBetween(random, 0.05, 0.3));
      const summary = summariseReadings(readings);
      expect(summary.sd).toBeCloseTo(sampleStandardDeviation(readings), 14);
      expect(summary.mean).toBeCloseTo(readings.reduce((sum, r) => sum + r, 0) / readings.length, 15);
    }
  });

  it('refuses fewer than two readings', () => {
    // A sample SD needs n ≥ 2 (NIST StRD definition).
    expect(() => summariseReadings([0.1])).toThrow(RangeError);
    expect(() => computeMean([])).toThrow(RangeError);
  });
});
