import { linearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { DEFAULT_PROFILE } from '../../../src/lib/analysis/tolerance';
import {
  analyseGearSet,
  conditionToDamage,
  type AnalysedInspection,
  type GearSetAnalysisInput,
} from '../../../src/lib/inspections/gear-set-analysis';
import type { InspectionData } from '../../../src/lib/inspections/record';
import { summariseInspection, type GearGeometry } from '../../../src/lib/inspections/summary';

// Everything here is in mm on a 0.01 mm indicator unless a case says otherwise (invented demo figures).
// Limits as TRADE.md gives them: backlash 0.13–0.23 mm, variation between points 0.05 mm (S: GM 1996).
const LIMITS = { backlashMin: 0.13, backlashMax: 0.23, maxSpread: 0.05 };
const NO_GEOMETRY: GearGeometry = { ringTeeth: null, pinionTeeth: null, pressureAngleDeg: null };
const MM_PER_IN = 25.4; // S: NIST SP 811, 2008, App. B

interface Sheet {
  readings: (number | null)[];
  resolution?: string;
  backFace?: number | null;
  condition?: Partial<InspectionData['condition']>;
  drive?: { along: number; up: number } | null;
  geometry?: GearGeometry;
}

/** Four readings around the ring gear with the given mean and spread: [m + s/2, m, m − s/2, m]. */
function around(mean: number, spread: number): number[] {
  return [mean + spread / 2, mean, mean - spread / 2, mean];
}

function dataOf(sheet: Sheet): InspectionData {
  return {
    entry: { unit: 'mm', resolution: sheet.resolution ?? '0.01mm', torqueUnit: 'N-m' },
    runsChangeReason: null,
    backlashMm: sheet.readings,
    runoutMm: { backFace: sheet.backFace ?? null, radial: null },
    pinion: { shimsMm: [], depthChangeMm: null, marking: null },
    carrierShimsMm: { left: null, right: null },
    preload: {
      pinionNm: null,
      bearings: 'used',
      hubLeft: { unchanged: null, torqueNm: null },
      hubRight: { unchanged: null, torqueNm: null },
    },
    patterns: { drive: sheet.drive ?? null, coast: null },
    condition: { teeth: [], splines: 'none', bearings: 'none', seals: 'none', ...sheet.condition },
    notes: null,
  };
}

/** A submitted inspection as the server hands it over: the record and its summary in mm and N·m. */
function inspection(id: string, inspectedAt: string, runs: number, sheet: Sheet): AnalysedInspection {
  const data = dataOf(sheet);
  return {
    id,
    inspectedAt,
    runsAtInspection: runs,
    data,
    summary: summariseInspection(data, DEFAULT_PROFILE, sheet.geometry ?? NO_GEOMETRY, {
      lengthUnit: 'mm',
      torqueUnit: 'N-m',
    }),
  };
}

function input(inspections: AnalysedInspection[], overrides: Partial<GearSetAnalysisInput> = {}): GearSetAnalysisInput {
  return {
    inspections,
    limits: LIMITS,
    totalRuns: 20,
    runsSinceInstall: 20,
    lifeLimitRuns: 50, // CP: a set often replaced after roughly 50 runs
    serviceIntervalRuns: 8,
    ...overrides,
  };
}

describe('analyseGearSet with no inspections or one', () => {
  it('has no latest, previous, change or recommendation before the first inspection', () => {
    const analysis = analyseGearSet(input([], { totalRuns: 3, runsSinceInstall: 3 }));
    expect(analysis.inspectionCount).toBe(0);
    expect(analysis.latest).toBeNull();
    expect(analysis.previous).toBeNull();
    expect(analysis.change).toBeNull();
    expect(analysis.recommendation).toBeNull();
    expect(analysis.life).toEqual({
      totalRuns: 3,
      runsSinceInstall: 3,
      lifeLimitRuns: 50,
      runsLeft: 50 - 3,
      runsOver: 0,
      text: '47 runs left',
    });
  });

  it('still lays out every trend, empty: the points and spread saying how many inspections a projection needs', () => {
    const analysis = analyseGearSet(input([]));
    expect(analysis.trends.map((t) => t.measure)).toEqual([
      'backlash-mean',
      'spread',
      'backlash-min-point',
      'backlash-max-point',
    ]);
    for (const trend of analysis.trends) {
      expect(trend.points).toEqual([]);
      expect(trend.fit).toMatchObject({ count: 0, slope: null, intercept: null });
      expect(trend.projection.projectedRunsAtLimit).toBeNull();
      // The band is for the points, not the mean: the mean is never projected (issue 16).
      expect(trend.projection.reason?.code).toBe(
        trend.measure === 'backlash-mean' ? 'mean-not-projected' : 'too-few-points',
      );
    }
  });

  it('takes a single inspection as the latest, with nothing to compare it to', () => {
    const only = inspection('i1', '2026-04-01T10:00:00Z', 6, { readings: around(0.18, 0.02) });
    const analysis = analyseGearSet(input([only]));
    expect(analysis.inspectionCount).toBe(1);
    expect(analysis.latest?.id).toBe('i1');
    expect(analysis.previous).toBeNull();
    expect(analysis.change).toBeNull();
    expect(analysis.trends[0]?.points).toHaveLength(1);
    expect(analysis.trends[0]?.points[0]?.runs).toBe(6);
    expect(analysis.trends[0]?.points[0]?.value).toBeCloseTo(0.18, 12);
    expect(analysis.trends[0]?.projection.reason?.code).toBe('mean-not-projected');
    expect(analysis.trends[2]?.projection.reason?.code).toBe('too-few-points');
    expect(analysis.recommendation).not.toBeNull();
  });
});

describe('analyseGearSet: order and which inspections count', () => {
  it('orders the inspections by runs, whatever order they come in', () => {
    const analysis = analyseGearSet(
      input([
        inspection('c', '2026-04-20T10:00:00Z', 20, { readings: around(0.18, 0.02) }),
        inspection('a', '2026-04-01T10:00:00Z', 0, { readings: around(0.16, 0.02) }),
        inspection('b', '2026-04-10T10:00:00Z', 10, { readings: around(0.17, 0.02) }),
      ]),
    );
    expect(analysis.latest?.id).toBe('c');
    expect(analysis.previous?.id).toBe('b');
    expect(analysis.trends[0]?.points.map((p) => [p.inspectionId, p.runs])).toEqual([
      ['a', 0],
      ['b', 10],
      ['c', 20],
    ]);
  });

  it('breaks a tie in runs by the time of the inspection', () => {
    const analysis = analyseGearSet(
      input([
        inspection('later', '2026-04-02T08:00:00Z', 10, { readings: around(0.18, 0.02) }),
        inspection('earlier', '2026-04-01T17:00:00Z', 10, { readings: around(0.17, 0.02) }),
      ]),
    );
    expect(analysis.latest?.id).toBe('later');
    expect(analysis.previous?.id).toBe('earlier');
  });

  it('leaves an inspection with a position unread out of the latest, the change and the trends', () => {
    const analysis = analyseGearSet(
      input([
        inspection('a', '2026-04-01T10:00:00Z', 0, { readings: around(0.16, 0.02) }),
        inspection('b', '2026-04-10T10:00:00Z', 10, { readings: around(0.17, 0.02) }),
        inspection('partial', '2026-04-20T10:00:00Z', 20, { readings: [0.18, null, 0.17, 0.18] }),
      ]),
    );
    expect(analysis.latest?.id).toBe('b');
    expect(analysis.previous?.id).toBe('a');
    expect(analysis.trends.map((t) => t.points.map((p) => p.inspectionId))).toEqual([
      ['a', 'b'],
      ['a', 'b'],
      ['a', 'b'],
      ['a', 'b'],
    ]);
    // It is still one of the set's inspections.
    expect(analysis.inspectionCount).toBe(3);
  });
});

describe('analyseGearSet: the change against the previous inspection', () => {
  const previous = inspection('prev', '2026-04-01T10:00:00Z', 10, {
    readings: [0.18, 0.17, 0.16, 0.17],
    backFace: 0.02,
  });
  const latest = inspection('last', '2026-04-15T10:00:00Z', 20, { readings: [0.21, 0.2, 0.19, 0.2], backFace: 0.03 });

  it('compares min, max, mean, spread, once-per-turn amplitude and measured runout, worked out by hand', () => {
    const change = analyseGearSet(input([previous, latest])).change!;
    expect(change.map((c) => c.measure)).toEqual(['min', 'max', 'mean', 'spread', 'amplitude', 'tir']);
    // Previous: min 0.16, max 0.18, mean (0.18+0.17+0.16+0.17)/4 = 0.17, spread 0.02, amplitude ½·(0.18−0.16) = 0.01.
    // Latest:   min 0.19, max 0.21, mean 0.20, spread 0.02, amplitude 0.01 (S: ISO 4291:1985 Annex F, a = (2/N)ΣR·cos θ).
    const expected: Record<string, [number, number]> = {
      min: [0.16, 0.19],
      max: [0.18, 0.21],
      mean: [(0.18 + 0.17 + 0.16 + 0.17) / 4, (0.21 + 0.2 + 0.19 + 0.2) / 4],
      spread: [0.18 - 0.16, 0.21 - 0.19],
      amplitude: [(0.18 - 0.16) / 2, (0.21 - 0.19) / 2],
      tir: [0.02, 0.03],
    };
    for (const c of change) {
      const [before, after] = expected[c.measure]!;
      expect(c.previous).toBeCloseTo(before, 12);
      expect(c.current).toBeCloseTo(after, 12);
      expect(c.delta).toBeCloseTo(after - before, 12);
    }
  });

  it('flags a change over two graduations of the indicator and not one under', () => {
    const change = analyseGearSet(input([previous, latest])).change!;
    // A difference of two readings carries ± two graduations: 2 × 0.01 mm = 0.02 mm (CP, TRADE.md Units / engine README).
    for (const c of change) expect(c.threshold).toBeCloseTo(2 * 0.01, 12);
    expect(Object.fromEntries(change.map((c) => [c.measure, c.flagged]))).toEqual({
      min: true, // +0.03 > 0.02
      max: true,
      mean: true,
      spread: false, // 0
      amplitude: false, // 0
      tir: false, // +0.01 < 0.02
    });
  });

  it('sets the threshold by the coarser of the two indicators', () => {
    const thou = inspection('prev', '2026-04-01T10:00:00Z', 10, {
      readings: [0.18, 0.17, 0.16, 0.17],
      resolution: '0.001in',
    });
    const change = analyseGearSet(input([thou, latest])).change!;
    // 0.001 in = 0.0254 mm (S: NIST SP 811, 2008, App. B), coarser than 0.01 mm: 2 × 0.0254 = 0.0508 mm,
    // so the +0.03 mm that was flagged on two 0.01 mm readings is within the doubt now.
    for (const c of change) expect(c.threshold).toBeCloseTo(2 * 0.001 * MM_PER_IN, 12);
    expect(change.some((c) => c.flagged)).toBe(false);
  });

  it('compares the measured runout, not the estimate from the fit, and leaves it out when it was not measured', () => {
    const geometry: GearGeometry = { ringTeeth: 41, pinionTeeth: 10, pressureAngleDeg: 20 };
    const measured = analyseGearSet(
      input([
        inspection('p', '2026-04-01T10:00:00Z', 10, { readings: [0.18, 0.17, 0.16, 0.17], backFace: 0.02, geometry }),
        inspection('l', '2026-04-15T10:00:00Z', 20, { readings: [0.21, 0.2, 0.19, 0.2], backFace: 0.03, geometry }),
      ]),
    ).change!;
    const tir = measured.find((c) => c.measure === 'tir');
    expect(tir?.previous).toBe(0.02);
    expect(tir?.current).toBe(0.03);
    const unmeasured = analyseGearSet(
      input([
        inspection('p', '2026-04-01T10:00:00Z', 10, { readings: [0.18, 0.17, 0.16, 0.17], geometry }),
        inspection('l', '2026-04-15T10:00:00Z', 20, { readings: [0.21, 0.2, 0.19, 0.2], geometry }),
      ]),
    ).change!;
    expect(unmeasured.map((c) => c.measure)).not.toContain('tir');
  });

  it('gives no change when an inspection’s indicator is not one it knows', () => {
    const odd = inspection('prev', '2026-04-01T10:00:00Z', 10, { readings: around(0.17, 0.02), resolution: '0.05mm' });
    const analysis = analyseGearSet(input([odd, latest]));
    expect(analysis.previous?.id).toBe('prev');
    expect(analysis.change).toBeNull();
  });
});

describe('analyseGearSet: the trends of mean backlash and spread', () => {
  const three = [
    inspection('a', '2026-04-01T10:00:00Z', 0, { readings: around(0.16, 0.02) }),
    inspection('b', '2026-04-10T10:00:00Z', 10, { readings: around(0.17, 0.03) }),
    inspection('c', '2026-04-20T10:00:00Z', 20, { readings: around(0.18, 0.04) }),
  ];

  it('plots each inspection’s mean and spread against its runs', () => {
    const [mean, spread] = analyseGearSet(input(three)).trends;
    expect(mean?.points.map((p) => p.runs)).toEqual([0, 10, 20]);
    [0.16, 0.17, 0.18].forEach((v, i) => expect(mean?.points[i]?.value).toBeCloseTo(v, 12));
    [0.02, 0.03, 0.04].forEach((v, i) => expect(spread?.points[i]?.value).toBeCloseTo(v, 12));
  });

  it('fits each line by least squares, as an independent regression does', () => {
    const [mean, spread] = analyseGearSet(input(three)).trends;
    // Independent: simple-statistics' linearRegression on the same points; by hand x̄ = 10, Sxx = 200,
    // Sxy = 0.2, so slope 0.001 per run with intercepts 0.16 and 0.02.
    const meanLine = linearRegression([
      [0, 0.16],
      [10, 0.17],
      [20, 0.18],
    ]);
    const spreadLine = linearRegression([
      [0, 0.02],
      [10, 0.03],
      [20, 0.04],
    ]);
    expect(mean?.fit.slope).toBeCloseTo(meanLine.m, 12);
    expect(mean?.fit.intercept).toBeCloseTo(meanLine.b, 12);
    expect(mean?.fit.slope).toBeCloseTo(0.001, 12);
    expect(spread?.fit.slope).toBeCloseTo(spreadLine.m, 12);
    expect(spread?.fit.intercept).toBeCloseTo(spreadLine.b, 12);
    expect(mean?.fit.count).toBe(3);
  });

  it('projects the points and the spread to their limits, never the mean', () => {
    const [mean, spread, tightest, loosest] = analyseGearSet(input(three)).trends;
    expect(mean?.limits).toEqual({ min: 0.13, max: 0.23 }); // S: GM 1996
    expect(spread?.limits).toEqual({ max: 0.05 }); // S: GM 1996
    // The mean reaches 0.23 at run 70, but the band is for the points (GM 1996: "at the minimum point").
    expect(mean?.projection).toMatchObject({ projectedRunsAtLimit: null, reason: { code: 'mean-not-projected' } });
    // Loosest: 0.17, 0.185, 0.20 → 0.17 + 0.0015·r = 0.23 at r = 40, 20 runs after the last inspection
    expect(loosest?.projection.limit).toBe('max');
    expect(loosest?.projection.projectedRunsAtLimit).toBeCloseTo((0.23 - 0.17) / 0.0015, 6);
    expect(loosest?.projection.runsToLimit).toBeCloseTo(40 - 20, 6);
    // Tightest: 0.15, 0.155, 0.16 → rising toward the max too, 0.15 + 0.0005·r = 0.23 at r = 160
    expect(tightest?.projection.projectedRunsAtLimit).toBeCloseTo((0.23 - 0.15) / 0.0005, 6);
    // 0.02 + 0.001·r = 0.05 at r = 30, 10 runs after 20
    expect(spread?.projection.projectedRunsAtLimit).toBeCloseTo((0.05 - 0.02) / 0.001, 6);
    expect(spread?.projection.runsToLimit).toBeCloseTo(30 - 20, 6);
  });

  it('projects to the limits it is given (the current profile), in their unit', () => {
    const wide = { backlashMin: 0.1, backlashMax: 0.3, maxSpread: 0.08 }; // an invented team profile
    const [mean, spread, , loosest] = analyseGearSet(input(three, { limits: wide })).trends;
    expect(mean?.limits).toEqual({ min: 0.1, max: 0.3 });
    expect(loosest?.projection.projectedRunsAtLimit).toBeCloseTo((0.3 - 0.17) / 0.0015, 6);
    expect(spread?.projection.projectedRunsAtLimit).toBeCloseTo((0.08 - 0.02) / 0.001, 6);
  });

  it('projects a backlash that is closing up toward the min of the band', () => {
    const closing = [
      inspection('a', '2026-04-01T10:00:00Z', 0, { readings: around(0.2, 0.02) }),
      inspection('b', '2026-04-10T10:00:00Z', 4, { readings: around(0.18, 0.02) }),
      inspection('c', '2026-04-20T10:00:00Z', 8, { readings: around(0.16, 0.02) }),
    ];
    const [, , tightest, loosest] = analyseGearSet(input(closing)).trends;
    // Tightest 0.19, 0.17, 0.15: slope −0.005 per run; 0.19 − 0.005·r = 0.13 at r = 12
    expect(tightest?.projection.limit).toBe('min');
    expect(tightest?.projection.projectedRunsAtLimit).toBeCloseTo((0.19 - 0.13) / 0.005, 6);
    // Loosest 0.21, 0.19, 0.17 heads for the same min, later: r = 16
    expect(loosest?.projection.projectedRunsAtLimit).toBeCloseTo((0.21 - 0.13) / 0.005, 6);
  });
});

describe('analyseGearSet: life and the recommendation', () => {
  const steady = [
    inspection('a', '2026-04-01T10:00:00Z', 0, { readings: around(0.18, 0.02) }),
    inspection('b', '2026-04-10T10:00:00Z', 10, { readings: around(0.18, 0.02) }),
  ];

  it('counts the runs left against the life limit from the total runs', () => {
    // CP: roughly 50 runs for a set
    expect(analyseGearSet(input(steady, { totalRuns: 38, runsSinceInstall: 12 })).life).toEqual({
      totalRuns: 38,
      runsSinceInstall: 12,
      lifeLimitRuns: 50,
      runsLeft: 50 - 38,
      runsOver: 0,
      text: '12 runs left',
    });
    // Runs left never go negative: 67 runs on a 50-run life is "17 runs over the life limit".
    expect(analyseGearSet(input(steady, { totalRuns: 67 })).life).toMatchObject({
      runsLeft: 0,
      runsOver: 17,
      text: '17 runs over the life limit',
    });
    expect(analyseGearSet(input(steady, { lifeLimitRuns: null })).life.runsLeft).toBeNull();
  });

  it('keeps a set whose every check is well inside and whose life is far off', () => {
    const recommendation = analyseGearSet(input(steady, { totalRuns: 10 })).recommendation!;
    expect(recommendation.action).toBe('keep');
    expect(recommendation.reasons.map((r) => r.code)).toEqual(['all-clear']);
  });

  it('retires a set whose total runs reach the life limit, however few since it was installed', () => {
    const recommendation = analyseGearSet(input(steady, { totalRuns: 50, runsSinceInstall: 4 })).recommendation!;
    expect(recommendation.action).toBe('retire');
    expect(recommendation.reasons[0]?.code).toBe('life-reached');
  });

  it('warns when the life limit falls before the next service', () => {
    // 50 − 45 = 5 runs left, within a service interval of 8
    const recommendation = analyseGearSet(input(steady, { totalRuns: 45 })).recommendation!;
    expect(recommendation.action).toBe('watch');
    expect(recommendation.reasons.map((r) => r.code)).toContain('life-before-next-service');
  });

  it('reads no life reason when the set has no life limit', () => {
    const recommendation = analyseGearSet(input(steady, { totalRuns: 500, lifeLimitRuns: null })).recommendation!;
    expect(recommendation.reasons.map((r) => r.code)).toEqual(['all-clear']);
  });

  it('reads the damage of the latest inspection, not of an earlier one', () => {
    const severe = { teeth: [{ finding: 'spalling', severity: 'severe' as const }] };
    const earlierDamage = analyseGearSet(
      input([
        inspection('a', '2026-04-01T10:00:00Z', 0, { readings: around(0.18, 0.02), condition: severe }),
        inspection('b', '2026-04-10T10:00:00Z', 10, { readings: around(0.18, 0.02) }),
      ]),
    ).recommendation!;
    expect(earlierDamage.action).toBe('keep');
    const latestDamage = analyseGearSet(
      input([
        inspection('a', '2026-04-01T10:00:00Z', 0, { readings: around(0.18, 0.02) }),
        inspection('b', '2026-04-10T10:00:00Z', 10, { readings: around(0.18, 0.02), condition: severe }),
      ]),
    ).recommendation!;
    expect(latestDamage.action).toBe('retire');
    expect(latestDamage.reasons[0]?.code).toBe('damage-severe-teeth');
  });

  it('reads the latest inspection’s verdicts: backlash far out of band calls for setting up again', () => {
    const recommendation = analyseGearSet(
      input([
        inspection('a', '2026-04-01T10:00:00Z', 0, { readings: around(0.18, 0.02) }),
        // 0.36–0.40 mm, far over 0.23 mm (S: GM 1996)
        inspection('b', '2026-04-10T10:00:00Z', 10, { readings: [0.4, 0.38, 0.36, 0.38] }),
      ]),
    ).recommendation!;
    expect(recommendation.action).toBe('re-shim');
    expect(recommendation.reasons.map((r) => r.code)).toContain('backlash-min-point-out-of-band');
  });

  it('reads the latest inspection’s contact pattern', () => {
    const recommendation = analyseGearSet(
      input([
        inspection('a', '2026-04-01T10:00:00Z', 0, { readings: around(0.18, 0.02) }),
        // Well toward the heel: outside the usual 0.3–0.7 region (CP); 1 = heel (S: GM service manual, 9-1/2 in axle)
        inspection('b', '2026-04-10T10:00:00Z', 10, { readings: around(0.18, 0.02), drive: { along: 0.95, up: 0.5 } }),
      ]),
    ).recommendation!;
    expect(recommendation.action).toBe('re-shim');
    expect(recommendation.reasons.map((r) => r.code)).toContain('pattern-drive-heel');
  });

  it('passes the point trends to the recommendation: a tightest point closing on the min means shims now', () => {
    const recommendation = analyseGearSet(
      input(
        [
          inspection('a', '2026-04-01T10:00:00Z', 0, { readings: around(0.2, 0.02) }),
          inspection('b', '2026-04-10T10:00:00Z', 4, { readings: around(0.18, 0.02) }),
          inspection('c', '2026-04-20T10:00:00Z', 8, { readings: around(0.16, 0.02) }),
        ],
        { totalRuns: 8 },
      ),
    ).recommendation!;
    // The tightest point crosses the min at run 12 (see the trend case above): 4 runs after the last inspection,
    // within the interval of 8. The mean alone never makes a reason.
    expect(recommendation.action).toBe('re-shim');
    const codes = recommendation.reasons.map((r) => r.code);
    expect(codes).toContain('backlash-min-point-limit-before-next-service');
    expect(codes).not.toContain('backlash-mean-limit-before-next-service');
  });

  it('passes the spread trend too: a spread opening up within the interval is one to watch', () => {
    const recommendation = analyseGearSet(
      input(
        [
          inspection('a', '2026-04-01T10:00:00Z', 0, { readings: around(0.18, 0.01) }),
          inspection('b', '2026-04-10T10:00:00Z', 2, { readings: around(0.18, 0.02) }),
          inspection('c', '2026-04-20T10:00:00Z', 4, { readings: around(0.18, 0.03) }),
        ],
        { totalRuns: 4 },
      ),
    ).recommendation!;
    // 0.01 + 0.005·r = 0.05 (S: GM 1996) at r = 8: 4 runs after the last inspection, within 8
    expect(recommendation.action).toBe('watch');
    expect(recommendation.reasons.map((r) => r.code)).toEqual(['spread-limit-before-next-service']);
  });
});

describe('conditionToDamage', () => {
  it('gives no findings for a sheet with no damage', () => {
    expect(conditionToDamage({ teeth: [], splines: 'none', bearings: 'none', seals: 'none' })).toEqual([]);
  });

  it('lists each tooth finding with its name, then the bearings, splines and seals', () => {
    expect(
      conditionToDamage({
        teeth: [
          { finding: 'pitting', severity: 'light' },
          { finding: 'scoring', severity: 'none' },
          { finding: 'chipped', severity: 'severe' },
        ],
        splines: 'moderate',
        bearings: 'light',
        seals: 'severe',
      }),
    ).toEqual([
      { area: 'teeth', severity: 'light', note: 'pitting' },
      { area: 'teeth', severity: 'severe', note: 'chipped' },
      { area: 'bearing', severity: 'light' },
      { area: 'other', severity: 'moderate', note: 'splines' },
      { area: 'other', severity: 'severe', note: 'seals' },
    ]);
  });
});

describe('analyseGearSet: an inch inspection on the printed limits, read in mm (issue 16)', () => {
  it('is not "past the limit now": the trend takes the verdict judged at the inch dial', () => {
    // 0.005 / 0.006 / 0.007 / 0.006 in on a 0.001 in dial: 0.005 in and 0.002 in sit on GM's printed inch
    // figures (S: GM 1996), though 0.127 mm is under the printed 0.13 mm (× 25.4, NIST SP 811).
    const data: InspectionData = {
      ...dataOf({ readings: [0.005, 0.006, 0.007, 0.006].map((inch) => inch * MM_PER_IN) }),
      entry: { unit: 'in', resolution: '0.001in', torqueUnit: 'lbf-in' },
    };
    const only: AnalysedInspection = {
      id: 'inch',
      inspectedAt: '2026-04-01T10:00:00Z',
      runsAtInspection: 0,
      data,
      summary: summariseInspection(data, DEFAULT_PROFILE, NO_GEOMETRY, { lengthUnit: 'mm', torqueUnit: 'N-m' }),
    };
    const analysis = analyseGearSet(input([only], { totalRuns: 0, runsSinceInstall: 0 }));
    for (const trend of analysis.trends) expect(trend.projection.reason?.code).not.toBe('past-limit-now');
    expect(['keep', 'watch']).toContain(analysis.recommendation!.action);
    // A reading truly past the printed limit is past now: 0.004 in at the tightest point.
    const past: InspectionData = {
      ...data,
      backlashMm: [0.004, 0.006, 0.007, 0.006].map((inch) => inch * MM_PER_IN),
    };
    const out = analyseGearSet(
      input([
        {
          ...only,
          data: past,
          summary: summariseInspection(past, DEFAULT_PROFILE, NO_GEOMETRY, { lengthUnit: 'mm', torqueUnit: 'N-m' }),
        },
      ]),
    );
    expect(out.trends.find((t) => t.measure === 'backlash-min-point')?.projection.reason?.code).toBe('past-limit-now');
  });
});
