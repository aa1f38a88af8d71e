import { describe, expect, it } from 'vitest';
import { summariseBacklash } from '../../../src/lib/analysis/backlash';

describe('summariseBacklash', () => {
  it('combines statistics and the once-per-turn fit for four readings 90° apart', () => {
    // Four points 90° apart: TRADE.md (S: Honda S2000 service manual, rear differential)
    const summary = summariseBacklash([0.2, 0.15, 0.1, 0.15]);
    expect(summary).toMatchObject({ count: 4, min: 0.1, max: 0.2 });
    expect(summary.mean).toBeCloseTo(0.15, 15);
    expect(summary.spread).toBeCloseTo(0.1, 15);
    expect(summary.harmonic.amplitude).toBeCloseTo(0.05, 15);
    expect(summary.harmonic.loosestAngleDeg).toBe(0);
    expect(summary.runoutEstimate).toBeUndefined();
  });

  it('adds a runout estimate only when the tooth counts are given', () => {
    const summary = summariseBacklash([0.2, 0.15, 0.1, 0.15], { ringTeeth: 41, pinionTeeth: 10 });
    // Worked by hand: C = 0.05; δ2 = atan(41/10), αn = 20° (M) → k = 2·sin δ2·tan αn = 0.7072090 (TRADE.md, D);
    // TIR = 2C / k = 0.1 / 0.7072090 = 0.1414009.
    expect(summary.runoutEstimate?.tir).toBeCloseTo(0.1414009, 6);
    expect(summary.runoutEstimate).toMatchObject({ kBasis: 'tooth-counts' });
    expect(summary.runoutEstimate?.kText).toContain('k = 0.707');
  });

  it('refuses fewer than 3 or more than 24 readings', () => {
    expect(() => summariseBacklash([0.1, 0.2])).toThrow(RangeError);
    expect(() => summariseBacklash(Array.from({ length: 25 }, () => 0.1))).toThrow(RangeError);
  });
});
