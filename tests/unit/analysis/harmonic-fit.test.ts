import { describe, expect, it } from 'vitest';
import { fitFirstHarmonic, normaliseDegrees, positionToAngleDeg } from '../../../src/lib/analysis/harmonic-fit';
import { createRandom, pickBetween, pickInteger } from '../../helpers/seeded-random';

const TWO_PI = 2 * Math.PI;

function buildReadings(n: number, m: number, a: number, b: number): number[] {
  return Array.from({ length: n }, (_, k) => m + a * Math.cos((TWO_PI * k) / n) + b * Math.sin((TWO_PI * k) / n));
}

// Independent least squares: normal equations (XᵀX)β = Xᵀy, Gaussian elimination with partial pivoting.
function solveNormalEquations(readings: readonly number[]): [number, number, number] {
  const n = readings.length;
  const rows = readings.map((_, k) => [1, Math.cos((TWO_PI * k) / n), Math.sin((TWO_PI * k) / n)]);
  const matrix = [0, 1, 2].map((i) => [0, 1, 2].map((j) => rows.reduce((s, row) => s + row[i]! * row[j]!, 0)));
  const rhs = [0, 1, 2].map((i) => rows.reduce((s, row, k) => s + row[i]! * readings[k]!, 0));
  for (let col = 0; col < 3; col++) {
    let pivot = col;
    for (let r = col + 1; r < 3; r++) if (Math.abs(matrix[r]![col]!) > Math.abs(matrix[pivot]![col]!)) pivot = r;
    [matrix[col], matrix[pivot]] = [matrix[pivot]!, matrix[col]!];
    [rhs[col], rhs[pivot]] = [rhs[pivot]!, rhs[col]!];
    for (let r = col + 1; r < 3; r++) {
      const factor = matrix[r]![col]! / matrix[col]![col]!;
      for (let c = col; c < 3; c++) matrix[r]![c]! -= factor * matrix[col]![c]!;
      rhs[r]! -= factor * rhs[col]!;
    }
  }
  const beta = [0, 0, 0];
  for (let r = 2; r >= 0; r--) {
    let sum = rhs[r]!;
    for (let c = r + 1; c < 3; c++) sum -= matrix[r]![c]! * beta[c]!;
    beta[r] = sum / matrix[r]![r]!;
  }
  return beta as [number, number, number];
}

describe('fitFirstHarmonic', () => {
  it('finds the loosest point at position 1 for four readings 0.2, 0.1, 0.0, 0.1', () => {
    // Worked by hand (ISO 4291:1985 Annex F, as TRADE.md reproduces it, S): a = (2/4)·(0.2 − 0.0) = 0.1, b = 0.
    const fit = fitFirstHarmonic([0.2, 0.1, 0.0, 0.1]);
    expect(fit.a).toBeCloseTo(0.1, 15);
    expect(fit.b).toBe(0);
    expect(fit.amplitude).toBeCloseTo(0.1, 15);
    expect(fit.loosestAngleDeg).toBe(0);
    expect(fit.tightestAngleDeg).toBe(180);
  });

  it('recovers m + a·cos θ + b·sin θ to 1e-9 for random a, b, m and every N from 3 to 24', () => {
    // TRADE.md (S: ISO 4291:1985 Annex F): a = (2/N)ΣR cos θ, b = (2/N)ΣR sin θ
    const random = createRandom(4291);
    for (let n = 3; n <= 24; n++) {
      for (let trial = 0; trial < 20; trial++) {
        const m = pickBetween(random, 0.05, 0.3);
        const a = pickBetween(random, -0.05, 0.05);
        const b = pickBetween(random, -0.05, 0.05);
        const fit = fitFirstHarmonic(buildReadings(n, m, a, b));
        expect(Math.abs(fit.a - a)).toBeLessThan(1e-9);
        expect(Math.abs(fit.b - b)).toBeLessThan(1e-9);
        expect(Math.abs(fit.amplitude - Math.hypot(a, b))).toBeLessThan(1e-9);
        for (const residual of fit.residuals) expect(Math.abs(residual)).toBeLessThan(1e-9);
      }
    }
  });

  it('equals the brute-force normal-equations least-squares solution on noisy readings', () => {
    // Independent computation written here: the normal equations of the least-squares fit (ISO 4291 Annex F, S).
    const random = createRandom(1985);
    for (let n = 3; n <= 24; n++) {
      const readings = Array.from({ length: n }, () => pickBetween(random, 0.1, 0.25));
      const [m, a, b] = solveNormalEquations(readings);
      const fit = fitFirstHarmonic(readings);
      expect(fit.a).toBeCloseTo(a, 12);
      expect(fit.b).toBeCloseTo(b, 12);
      fit.residuals.forEach((residual, k) => {
        const fitted = m + a * Math.cos((TWO_PI * k) / n) + b * Math.sin((TWO_PI * k) / n);
        expect(residual).toBeCloseTo(readings[k]! - fitted, 12);
      });
    }
  });

  it('leaves residuals orthogonal to 1, cos θ and sin θ, as a least-squares fit must', () => {
    // A property of any least-squares fit (ISO 4291 Annex F, S): residuals orthogonal to each fitted function.
    const random = createRandom(7);
    for (const n of [4, 5, 8, 11, 24]) {
      const readings = Array.from({ length: n }, () => pickBetween(random, 0.1, 0.25));
      const { residuals } = fitFirstHarmonic(readings);
      const dot = (f: (k: number) => number) => residuals.reduce((s, r, k) => s + r * f(k), 0);
      expect(Math.abs(dot(() => 1))).toBeLessThan(1e-14);
      expect(Math.abs(dot((k) => Math.cos((TWO_PI * k) / n)))).toBeLessThan(1e-14);
      expect(Math.abs(dot((k) => Math.sin((TWO_PI * k) / n)))).toBeLessThan(1e-14);
    }
  });

  it('fits any three readings exactly, leaving zero residuals', () => {
    // Three readings, three unknowns (m, a, b): the fit is exact (ISO 4291 Annex F, S; D).
    const fit = fitFirstHarmonic([0.21, 0.13, 0.17]);
    for (const residual of fit.residuals) expect(Math.abs(residual)).toBeLessThan(1e-15);
  });

  it('puts the even-N Nyquist pattern wholly into the residuals', () => {
    // For even N, cos(Nθ/2) = (−1)^k is orthogonal to the first harmonic.
    const fit = fitFirstHarmonic([0.2, 0.1, 0.2, 0.1, 0.2, 0.1]);
    expect(fit.amplitude).toBeLessThan(1e-15);
    expect(fit.residuals.map((r) => Math.round(r * 1e6) / 1e6)).toEqual([0.05, -0.05, 0.05, -0.05, 0.05, -0.05]);
  });

  it('measures the loosest angle from position 1 in the direction positions are numbered', () => {
    // Lashline convention, position 1 at 0°, angles growing with the position number (CP).
    const loosestAtThirdOfEight = [0.15, 0.17, 0.2, 0.17, 0.15, 0.13, 0.1, 0.13];
    const fit = fitFirstHarmonic(loosestAtThirdOfEight);
    expect(fit.loosestAngleDeg).toBeCloseTo(90, 9);
    expect(fit.tightestAngleDeg).toBeCloseTo(270, 9);
    expect(positionToAngleDeg(3, 8)).toBe(90);
  });

  it('keeps angles in [0, 360) when the loosest point is at a negative atan2 angle', () => {
    // Lashline convention: angles in [0°, 360°) (CP).
    const fit = fitFirstHarmonic(buildReadings(12, 0.15, 0, -0.02));
    expect(fit.loosestAngleDeg).toBeCloseTo(270, 9);
    expect(fit.tightestAngleDeg).toBeCloseTo(90, 9);
  });

  it('reports no loosest angle when every reading is the same', () => {
    // No once-per-turn part, no direction (CP: the README decision on angles).
    const fit = fitFirstHarmonic([0.15, 0.15, 0.15, 0.15, 0.15]);
    expect(fit.amplitude).toBe(0);
    expect(fit.loosestAngleDeg).toBeNull();
    expect(fit.tightestAngleDeg).toBeNull();
  });

  it('refuses fewer than three readings', () => {
    // TRADE.md: the fit needs N ≥ 3 (S, ISO 4291 Annex F as reproduced).
    expect(() => fitFirstHarmonic([0.1, 0.2])).toThrow(RangeError);
  });

  it('recovers a random phase for random N', () => {
    // Independent: readings built from a known phase with cos(θ − φ) written here (ISO 4291 Annex F, S).
    const random = createRandom(360);
    for (let trial = 0; trial < 100; trial++) {
      const n = pickInteger(random, 3, 24);
      const phase = pickBetween(random, 0, 360);
      const amplitude = pickBetween(random, 0.001, 0.05);
      const phaseRad = (phase * Math.PI) / 180;
      const fit = fitFirstHarmonic(
        buildReadings(n, 0.15, amplitude * Math.cos(phaseRad), amplitude * Math.sin(phaseRad)),
      );
      const error = Math.abs(normaliseDegrees((fit.loosestAngleDeg as number) - phase + 180) - 180);
      expect(error).toBeLessThan(1e-9);
    }
  });
});

describe('normaliseDegrees', () => {
  it('wraps negative and overlarge angles into [0, 360)', () => {
    // Lashline convention: angles in [0°, 360°) (CP).
    expect(normaliseDegrees(-90)).toBe(270);
    expect(normaliseDegrees(540)).toBe(180);
    expect(normaliseDegrees(360)).toBe(0);
    expect(normaliseDegrees(-1e-15)).toBeLessThan(360);
  });
});
