import { linearRegression, rSquared } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { computeRunsLeft, fitTrendLine, lifeToText, projectTrend } from '../../../src/lib/analysis/trend';
import type { TrendPoint } from '../../../src/lib/analysis/trend';
import { createRandom, pickBetween, pickInteger } from '../../helpers/seeded-random';

// NIST StRD Norris, as listed in TRADE.md: pairs "y x".
const NORRIS_YX = [
  [0.1, 0.2],
  [338.8, 337.4],
  [118.1, 118.2],
  [888.0, 884.6],
  [9.2, 10.1],
  [228.1, 226.5],
  [668.5, 666.3],
  [998.5, 996.3],
  [449.1, 448.6],
  [778.9, 777.0],
  [559.2, 558.2],
  [0.3, 0.4],
  [0.1, 0.6],
  [778.1, 775.5],
  [668.8, 666.9],
  [339.3, 338.0],
  [448.9, 447.5],
  [10.8, 11.6],
  [557.7, 556.0],
  [228.3, 228.1],
  [998.0, 995.8],
  [888.8, 887.6],
  [119.6, 120.2],
  [0.3, 0.3],
  [0.6, 0.3],
  [557.6, 556.8],
  [339.3, 339.1],
  [888.0, 887.2],
  [998.5, 999.0],
  [778.9, 779.0],
  [10.2, 11.1],
  [117.6, 118.3],
  [228.9, 229.2],
  [668.4, 669.1],
  [449.2, 448.9],
  [0.2, 0.5],
] as const;
const NORRIS: TrendPoint[] = NORRIS_YX.map(([value, runs]) => ({ runs, value }));

function expectSignificantDigits(actual: number | null, certified: number, digits: number): void {
  expect(actual).not.toBeNull();
  expect(Math.abs((actual as number) - certified) / Math.abs(certified)).toBeLessThan(10 ** -digits);
}

function line(intercept: number, slope: number, runs: number[]): TrendPoint[] {
  return runs.map((r) => ({ runs: r, value: intercept + slope * r }));
}

describe('fitTrendLine', () => {
  it('reproduces the certified Norris intercept, slope, residual SD and R² to 12 significant digits', () => {
    // NIST StRD Norris: certified values
    const fit = fitTrendLine(NORRIS);
    expect(fit.count).toBe(36);
    expectSignificantDigits(fit.intercept, -0.262323073774029, 12);
    expectSignificantDigits(fit.slope, 1.00211681802045, 12);
    expectSignificantDigits(fit.residualSd, 0.884796396144373, 12);
    expectSignificantDigits(fit.r2, 0.999993745883712, 12);
  });

  it('agrees with simple-statistics on random data', () => {
    // Independent implementation: simple-statistics linearRegression and rSquared.
    const random = createRandom(36);
    for (let trial = 0; trial < 100; trial++) {
      const points = Array.from({ length: pickInteger(random, 3, 40) }, () => ({
        runs: pickInteger(random, 0, 120),
        value: pickBetween(random, 0.1, 0.3),
      }));
      const pairs = points.map((p) => [p.runs, p.value]);
      const reference = linearRegression(pairs);
      const fit = fitTrendLine(points);
      if (fit.slope === null) continue;
      expect(fit.slope).toBeCloseTo(reference.m, 12);
      expect(fit.intercept).toBeCloseTo(reference.b, 10);
      expect(fit.r2).toBeCloseTo(
        rSquared(pairs, (x) => reference.b + reference.m * x),
        10,
      );
    }
  });

  it('fits two points exactly, with no residual SD left to estimate', () => {
    // Two points define the line; n − 2 = 0 leaves no residual SD (NIST StRD definition of residual SD).
    const fit = fitTrendLine(line(0.15, 0.001, [10, 30]));
    expect(fit.slope).toBeCloseTo(0.001, 15);
    expect(fit.intercept).toBeCloseTo(0.15, 15);
    expect(fit.r2).toBe(1);
    expect(fit.residualSd).toBeNull();
  });

  it('has no slope when every point is at the same run count, and no R² when values never change', () => {
    // Sxx = 0 (no run spread) and Syy = 0 (no change): both undefined (D, from the OLS formulas).
    expect(
      fitTrendLine([
        { runs: 5, value: 0.1 },
        { runs: 5, value: 0.2 },
      ]).slope,
    ).toBeNull();
    const flat = fitTrendLine(line(0.15, 0, [0, 10, 20]));
    expect(flat.slope).toBe(0);
    expect(flat.r2).toBeNull();
  });

  it('starts projections from the largest run count, whatever the order of points', () => {
    // Projections look forward from the last inspection (CP, the README decision on trends).
    expect(fitTrendLine(line(0.1, 0.001, [30, 10, 20])).lastRuns).toBe(30);
  });
});

describe('projectTrend', () => {
  const rising = fitTrendLine(line(0.1, 0.002, [0, 10, 20]));

  it('projects the run at which a rising line reaches the band max', () => {
    // 0.1 + 0.002·x = 0.23 → x = 65
    const projection = projectTrend(rising, { min: 0.05, max: 0.23 });
    expect(projection.limit).toBe('max');
    expect(projection.projectedRunsAtLimit).toBeCloseTo(65, 10);
    expect(projection.runsToLimit).toBeCloseTo(45, 10);
  });

  it('reads a bare number above the line as a max and below it as a min', () => {
    // 0.3 − 0.002·x = 0.13 → x = 85, worked by hand; the side rule is Lashline’s (CP).
    expect(projectTrend(rising, 0.23)).toMatchObject({ limit: 'max' });
    const falling = fitTrendLine(line(0.3, -0.002, [0, 10, 20]));
    const projection = projectTrend(falling, 0.13);
    expect(projection.limit).toBe('min');
    expect(projection.projectedRunsAtLimit).toBeCloseTo(85, 10);
  });

  it('gives no crossing when the line moves away from the only limit', () => {
    // A rising line never meets a min below it (D, worked by hand).
    expect(projectTrend(rising, { min: 0.05 })).toMatchObject({
      projectedRunsAtLimit: null,
      reason: { code: 'moving-away' },
    });
  });

  it('gives no crossing for a flat trend', () => {
    // Slope 0 never meets a limit (D).
    expect(projectTrend(fitTrendLine(line(0.15, 0, [0, 10, 20])), { max: 0.23 }).reason?.code).toBe('flat');
  });

  it('says when the fitted line is past the limit and not heading back, never when it "passed" it', () => {
    // 0.1 + 0.002·20 = 0.14 is past 0.12 and rising (worked by hand); the wording is Lashline’s (CP).
    const projection = projectTrend(rising, { max: 0.12 });
    expect(projection.projectedRunsAtLimit).toBeNull();
    expect(projection.reason?.code).toBe('already-past-limit');
    expect(projection.reason?.message).not.toContain('before the last inspection');
  });
});

describe('projectTrend: the four cases of issue 16', () => {
  // Invented points in mm against the 0.13–0.23 mm band (S: GM 1996).
  const band = { min: 0.13, max: 0.23 };
  const rising = fitTrendLine(line(0.1, 0.002, [0, 10, 20]));

  it('calls the latest reading past a limit "past the limit now", whatever the fitted line says', () => {
    // The line (0.20, 0.21, 0.18 → fitted 0.1933 at run 20) is inside the band; the latest reading 0.24 is not.
    const points = [
      { runs: 0, value: 0.2 },
      { runs: 10, value: 0.21 },
      { runs: 20, value: 0.24 },
    ];
    const fit = fitTrendLine([...points.slice(0, 2), { runs: 20, value: 0.18 }]);
    expect(projectTrend(fit, band, 0.24).reason?.code).toBe('past-limit-now');
    // With only two inspections too: the reading is past now, a projection or not.
    expect(projectTrend(fitTrendLine(points.slice(0, 2)), band, 0.24).reason?.message).toContain(
      'past the max (0.23) now',
    );
  });

  it('says a line above the max and falling is coming back toward the band', () => {
    // 0.30, 0.28, 0.26: above 0.23 and falling; the latest reading 0.22 is back inside.
    const fit = fitTrendLine(line(0.3, -0.002, [0, 10, 20]));
    const projection = projectTrend(fit, band, 0.22);
    expect(projection.reason?.code).toBe('returning');
    expect(projection.reason?.message).toContain('coming back toward the band');
    expect(projection.reason?.message).not.toContain('passed');
  });

  it('says a line below the min and rising is coming back toward the band', () => {
    // 0.08 + 0.002·20 = 0.12 < 0.13 (S: GM 1996), rising (worked by hand); wording CP.
    const fit = fitTrendLine(line(0.08, 0.002, [0, 10, 20])); // 0.08, 0.10, 0.12 — latest reading 0.135 inside
    expect(projectTrend(fit, band, 0.135).reason?.code).toBe('returning');
  });

  it('projects each point toward whichever limit it is approaching', () => {
    // Tightest point closing up: 0.19, 0.17, 0.15 → the min. Loosest opening: 0.20, 0.21, 0.22 → the max.
    const tight = projectTrend(fitTrendLine(line(0.19, -0.002, [0, 10, 20])), band, 0.15);
    expect(tight).toMatchObject({ limit: 'min' });
    expect(tight.projectedRunsAtLimit).toBeCloseTo(30, 9); // 0.19 − 0.002·r = 0.13 → r = 30
    const loose = projectTrend(fitTrendLine(line(0.2, 0.001, [0, 10, 20])), band, 0.22);
    expect(loose).toMatchObject({ limit: 'max' });
    expect(loose.projectedRunsAtLimit).toBeCloseTo(30, 9); // 0.20 + 0.001·r = 0.23 → r = 30
  });

  it('says how many more inspections a projection needs', () => {
    // Three points for a projection (CP, the README decision on trends).
    expect(projectTrend(fitTrendLine(line(0.1, 0, [0])), 0.23).reason).toEqual({
      code: 'too-few-points',
      message: 'Two more inspections give a projection.',
    });
    expect(projectTrend(fitTrendLine(line(0.1, 0.01, [0, 5])), 0.23).reason?.message).toBe(
      'One more inspection gives a projection.',
    );
  });

  it('says when all inspections are at one run count, or no limit is given', () => {
    // Sxx = 0 gives no slope (D); no limit, nothing to project to (CP).
    const sameRuns = fitTrendLine([0.1, 0.12, 0.14].map((value) => ({ runs: 7, value })));
    expect(projectTrend(sameRuns, 0.23).reason?.code).toBe('no-run-spread');
    expect(projectTrend(rising, undefined).reason?.code).toBe('no-limit');
    expect(projectTrend(rising, {}).reason?.code).toBe('no-limit');
  });
});

describe('computeRunsLeft', () => {
  it('counts runs left to the life limit and stops at zero', () => {
    // 50-run life: TRADE.md (CP)
    expect(computeRunsLeft(42, 50)).toBe(8);
    expect(computeRunsLeft(55, 50)).toBe(0);
  });

  it('says the runs over the life limit instead of a negative count', () => {
    // 50-run life: TRADE.md (CP); 67 − 50 = 17
    expect(lifeToText(67, 50)).toBe('17 runs over the life limit');
    expect(lifeToText(51, 50)).toBe('1 run over the life limit');
    expect(lifeToText(50, 50)).toBe('at the life limit');
    expect(lifeToText(42, 50)).toBe('8 runs left');
  });
});
