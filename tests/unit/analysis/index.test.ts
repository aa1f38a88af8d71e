import { describe, expect, it } from 'vitest';
import { analyseBacklash, analyseTrend, backlashRequestSchema, tighteningSequence } from '../../../src/lib/analysis';
import type { BacklashRequest } from '../../../src/lib/analysis';
import { lengthToMm } from '../../../src/lib/units';

describe('analyseBacklash', () => {
  it('returns exactly the API fields, without runout or verdicts when neither is asked for', () => {
    const analysis = analyseBacklash({ unit: 'in', readings: [0.008, 0.006, 0.004, 0.006] });
    expect(Object.keys(analysis)).toEqual(['unit', 'count', 'mean', 'min', 'max', 'spread', 'sd', 'harmonic']);
    expect(Object.keys(analysis.harmonic).sort()).toEqual(
      ['a', 'amplitude', 'b', 'loosestAngleDeg', 'residuals', 'tightestAngleDeg'].sort(),
    );
    expect(analysis).toMatchObject({ unit: 'in', count: 4, min: 0.004, max: 0.008 });
    expect(analysis.harmonic.amplitude).toBeCloseTo(0.002, 15);
    expect(analysis.harmonic.loosestAngleDeg).toBe(0);
  });

  it('adds the runout estimate and the verdicts when tooth counts and a profile are given', () => {
    // 41:10 → k ≈ 0.707: TRADE.md (D); band 0.005–0.009 in: TRADE.md (S: GM light-truck service manual, 8-5/8 in ring gear axle, 1996)
    const analysis = analyseBacklash({
      unit: 'in',
      readings: [0.008, 0.006, 0.004, 0.006],
      profile: { min: 0.005, max: 0.009, maxSpread: 0.002 },
      ringTeeth: 41,
      pinionTeeth: 10,
    });
    expect(analysis.runoutEstimate?.k).toBeCloseTo(0.707, 3);
    // C = 0.002 in; k = 2·sin(atan(41/10))·tan 20° = 0.7072090 worked by hand (TRADE.md, D): TIR = 0.004 / k.
    expect(analysis.runoutEstimate?.tir).toBeCloseTo(0.005656, 6);
    expect(analysis.verdicts?.map((v) => [v.measure, v.verdict])).toEqual([
      ['backlash-min-point', 'out-of-band'],
      ['backlash-max-point', 'in-band'],
      ['spread', 'out-of-band'],
    ]);
    expect(analysis.verdicts?.[0]?.limitValue).toBe(0.005);
  });

  it('gives the same answer in inches as in millimetres, converted', () => {
    // NIST SP 811 (2008) App. B: 1 in = 25.4 mm
    const inches: BacklashRequest = {
      unit: 'in',
      readings: [0.0081, 0.0062, 0.0049, 0.0058, 0.0071],
      profile: { min: 0.005, max: 0.009, maxSpread: 0.002 },
      ringTeeth: 37,
      pinionTeeth: 9,
      pressureAngleDeg: 22.5,
    };
    const millimetres: BacklashRequest = {
      ...inches,
      unit: 'mm',
      readings: inches.readings.map((r) => lengthToMm(r, 'in')),
      profile: { min: 0.127, max: 0.2286, maxSpread: 0.0508 },
    };
    const a = analyseBacklash(inches);
    const b = analyseBacklash(millimetres);
    for (const key of ['mean', 'min', 'max', 'spread', 'sd'] as const)
      expect(lengthToMm(a[key], 'in')).toBeCloseTo(b[key], 13);
    expect(lengthToMm(a.harmonic.amplitude, 'in')).toBeCloseTo(b.harmonic.amplitude, 13);
    expect(a.harmonic.loosestAngleDeg).toBeCloseTo(b.harmonic.loosestAngleDeg as number, 9);
    expect(lengthToMm(a.runoutEstimate!.tir, 'in')).toBeCloseTo(b.runoutEstimate!.tir, 13);
    expect(a.verdicts?.map((v) => v.verdict)).toEqual(b.verdicts?.map((v) => v.verdict));
  });

  it('accepts what backlashRequestSchema produces', () => {
    const request = backlashRequestSchema.parse({ unit: 'mm', readings: [0.15, 0.16, 0.17] });
    expect(analyseBacklash(request).count).toBe(3);
  });
});

describe('analyseTrend', () => {
  it('returns slope, intercept, R² and the projected run count', () => {
    const points = [0, 10, 20].map((runs) => ({ runs, value: 0.1 + 0.002 * runs }));
    const analysis = analyseTrend({ points, limit: { max: 0.23 } });
    expect(Object.keys(analysis)).toEqual(['slope', 'intercept', 'r2', 'projectedRunsAtLimit']);
    expect(analysis.projectedRunsAtLimit).toBeCloseTo(65, 10);
  });

  it('adds the reason when there is no projection', () => {
    const analysis = analyseTrend({ points: [{ runs: 3, value: 0.15 }], limit: 0.23 });
    expect(analysis).toEqual({
      slope: null,
      intercept: null,
      r2: null,
      projectedRunsAtLimit: null,
      reason: { code: 'too-few-points', message: 'Two more inspections give a projection.' },
    });
  });
});

describe('tighteningSequence', () => {
  it('returns the bolt count beside its order', () => {
    // TRADE.md "Legacy cross sequences (M, ASME PCC-1 2019)"
    expect(tighteningSequence(4)).toEqual({ bolts: 4, sequence: [1, 3, 2, 4] });
  });
});
