import { describe, expect, it } from 'vitest';
import { summariseBacklash } from '../../../src/lib/analysis/backlash';
import { fitFirstHarmonic } from '../../../src/lib/analysis/harmonic-fit';
import {
  amplitudeToEccentricity,
  amplitudeToRunout,
  computeRunoutFactor,
  DEFAULT_PRESSURE_ANGLE_DEG,
  DEFAULT_PRESSURE_ANGLE_SOURCE,
} from '../../../src/lib/analysis/runout';
import { createRandom, pickBetween, pickInteger } from '../../helpers/seeded-random';

const DEG = Math.PI / 180;

describe('computeRunoutFactor', () => {
  it('gives δ2 = 76.29° and k ≈ 0.707 for 41:10 teeth at 20°', () => {
    // TRADE.md (D): bevel/hypoid extension, worked example for 41:10
    const { k, deltaDeg } = computeRunoutFactor({ ringTeeth: 41, pinionTeeth: 10, pressureAngleDeg: 20 });
    expect(deltaDeg).toBeCloseTo(76.29, 2);
    expect(k).toBeCloseTo(0.707, 3);
  });

  it('uses 20° when no pressure angle is given, a default marked M', () => {
    // M: the 20° default is from memory (TRADE.md worked example); checked here only as the default in use
    expect(DEFAULT_PRESSURE_ANGLE_DEG).toBe(20);
    expect(DEFAULT_PRESSURE_ANGLE_SOURCE.key).toBe('M');
    // Worked by hand with 20°: sin(atan(41/10)) = 4.1 / √17.81 = 0.9715202, tan 20° = 0.3639702,
    // k = 2 × 0.9715202 × 0.3639702 = 0.7072090 (TRADE.md, D).
    expect(computeRunoutFactor({ ringTeeth: 41, pinionTeeth: 10 }).k).toBeCloseTo(0.707209, 6);
  });

  it('reduces to the spur factor 2·tan α as the pitch angle approaches 90°', () => {
    // Elements of Metric Gear Technology §14 (S): j = 2·Δa·tan α, the δ2 = 90° limit of k = 2·sin δ2·tan αn (D)
    const { k, deltaDeg } = computeRunoutFactor({ ringTeeth: 1e7, pinionTeeth: 1, pressureAngleDeg: 25 });
    expect(deltaDeg).toBeCloseTo(90, 4);
    expect(k).toBeCloseTo(2 * Math.tan(25 * DEG), 12);
  });

  it('follows 2·sin δ2·tan αn for random tooth counts and angles', () => {
    // TRADE.md (D): k = 2·sin δ2·tan αn with tan δ2 = ringTeeth / pinionTeeth
    const random = createRandom(2);
    for (let trial = 0; trial < 100; trial++) {
      const ringTeeth = pickInteger(random, 20, 60);
      const pinionTeeth = pickInteger(random, 5, 15);
      const alpha = pickBetween(random, 10, 30);
      const { k, deltaDeg } = computeRunoutFactor({ ringTeeth, pinionTeeth, pressureAngleDeg: alpha });
      expect(Math.tan(deltaDeg * DEG)).toBeCloseTo(ringTeeth / pinionTeeth, 10);
      expect(k / (2 * Math.tan(alpha * DEG))).toBeCloseTo(Math.sin(deltaDeg * DEG), 14);
    }
  });

  it('refuses non-positive tooth counts and impossible pressure angles', () => {
    expect(() => computeRunoutFactor({ ringTeeth: 0, pinionTeeth: 10 })).toThrow(RangeError);
    expect(() => computeRunoutFactor({ ringTeeth: 41, pinionTeeth: 10, pressureAngleDeg: 90 })).toThrow(RangeError);
  });
});

describe('recovering eccentricity and runout from the fit', () => {
  it('recovers e and φ to 1e-9 from readings built with j(θ) = j0 + 2e·tan α·cos(θ − φ)', () => {
    // TRADE.md (D), from Elements of Metric Gear Technology §14
    const random = createRandom(14);
    for (let trial = 0; trial < 200; trial++) {
      const n = pickInteger(random, 3, 24);
      const j0 = pickBetween(random, 0.1, 0.25);
      const e = pickBetween(random, 0.001, 0.05);
      const phi = pickBetween(random, 0, 360);
      const alpha = pickBetween(random, 14.5, 25);
      const readings = Array.from(
        { length: n },
        (_, k) => j0 + 2 * e * Math.tan(alpha * DEG) * Math.cos((2 * Math.PI * k) / n - phi * DEG),
      );
      const fit = fitFirstHarmonic(readings);
      expect(Math.abs(amplitudeToEccentricity(fit.amplitude, alpha) - e)).toBeLessThan(1e-9);
      const phaseError = Math.abs((((fit.loosestAngleDeg as number) - phi + 540) % 360) - 180);
      expect(phaseError).toBeLessThan(1e-9);
    }
  });

  it('recovers a back-face runout Ra from readings with peak-to-peak k·Ra', () => {
    // TRADE.md (D): bevel/hypoid extension, lash peak-to-peak ≈ k·Ra
    const geometry = { ringTeeth: 41, pinionTeeth: 10, pressureAngleDeg: 20 };
    // k written out here, not taken from the code: 2·sin δ2·tan αn with tan δ2 = 41/10 (TRADE.md, D).
    const k = 2 * Math.sin(Math.atan2(41, 10)) * Math.tan(20 * DEG);
    const runout = 0.05;
    const readings = Array.from(
      { length: 8 },
      (_, i) => 0.18 + ((k * runout) / 2) * Math.cos((2 * Math.PI * i) / 8 - 1),
    );
    const estimate = summariseBacklash(readings, geometry).runoutEstimate;
    expect(estimate?.tir).toBeCloseTo(runout, 12);
    expect(estimate?.k).toBeCloseTo(0.707209, 6);
  });

  it('takes k in the transverse plane for a spiral angle: a 45° spiral gives 1/cos 45° ≈ 1.414 × k', () => {
    // Elements of Metric Gear Technology: transverse j_t = 2·Δa·tan αt (§14) with tan αt = tan αn / cos β (helical
    // relation, M); so k = 2·sin δ2·tan αn / cos βm (D). 0.7072090 / cos 45° = 1.0001445, worked by hand.
    const factor = computeRunoutFactor({ ringTeeth: 41, pinionTeeth: 10, spiralAngleDeg: 45 });
    expect(factor).toMatchObject({ basis: 'spiral-angle' });
    expect(factor.k).toBeCloseTo(1.0001445, 6);
    // The same lash (peak-to-peak 0.1) read as runout: 0.1414 without the spiral angle, 0.09999 with it — the
    // straight-tooth k overstates by about 40 %.
    expect(amplitudeToRunout(0.05, factor.k)).toBeCloseTo(0.0999856, 6);
  });

  it('uses a typed k as typed, and says which k it used', () => {
    const typed = computeRunoutFactor({ ringTeeth: 41, pinionTeeth: 10, runoutK: 0.65 });
    expect(typed).toMatchObject({ k: 0.65, basis: 'typed' });
    const estimate = summariseBacklash([0.2, 0.15, 0.1, 0.15], { ringTeeth: 41, pinionTeeth: 10, runoutK: 0.65 });
    // 2C / k = 0.1 / 0.65 = 0.153846
    expect(estimate.runoutEstimate?.tir).toBeCloseTo(0.153846, 6);
    expect(estimate.runoutEstimate?.kText).toBe('k = 0.650, typed in for this set');
    expect(() => computeRunoutFactor({ ringTeeth: 41, pinionTeeth: 10, runoutK: 0 })).toThrow(RangeError);
  });

  it('converts amplitude to runout as 2C / k', () => {
    expect(amplitudeToRunout(0.035, 0.7)).toBeCloseTo(0.1, 15);
  });
});
