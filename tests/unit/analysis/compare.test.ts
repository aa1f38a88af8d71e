import { describe, expect, it } from 'vitest';
import { summariseBacklash } from '../../../src/lib/analysis/backlash';
import { compareInspections, summaryToMeasures } from '../../../src/lib/analysis/compare';

// 0.001 in = 0.0254 mm: NIST SP 811 (2008) App. B
const THOU = 0.0254;

describe('compareInspections', () => {
  // The rule: a change counts only beyond twice the coarser graduation (CP: each reading carries ± one graduation).
  it('leaves a change of exactly two graduations unflagged and flags three, on a 0.001 in dial', () => {
    const change = (before: number, after: number) =>
      compareInspections(
        { measures: { min: before }, resolution: 0.001 },
        { measures: { min: after }, resolution: 0.001 },
      )[0]!;
    expect(change(0.006, 0.008)).toMatchObject({ threshold: 0.002, flagged: false }); // two graduations (CP)
    expect(change(0.006, 0.009).flagged).toBe(true); // three graduations (CP)
    expect(change(0.009, 0.006).flagged).toBe(true);
    // On a 0.01 mm dial: 0.16 → 0.18 mm is two graduations, 0.16 → 0.19 mm three (CP).
    const mm = (before: number, after: number) =>
      compareInspections(
        { measures: { min: before }, resolution: 0.01 },
        { measures: { min: after }, resolution: 0.01 },
      )[0]!.flagged;
    expect(mm(0.16, 0.18)).toBe(false);
    expect(mm(0.16, 0.19)).toBe(true);
  });

  it('does not flag a change of exactly two graduations, even when subtraction leaves it an ulp above', () => {
    // 0.1524 − 0.1016 evaluates to 0.05080000000000001 > 0.0508
    const [change] = compareInspections(
      { measures: { min: 0.1016 }, resolution: THOU },
      { measures: { min: 0.1524 }, resolution: THOU },
    );
    expect(change).toMatchObject({ measure: 'min', threshold: 2 * THOU, flagged: false });
    expect(change?.delta).toBeCloseTo(0.0508, 15);
  });

  it('flags a change of more than two graduations in either direction', () => {
    // 0.1778 − 0.1016 = 0.0762 mm = 3 thou > 2 thou (NIST SP 811; the rule is CP).
    const changes = compareInspections(
      { measures: { min: 0.1016, max: 0.2 }, resolution: THOU },
      { measures: { min: 0.1778, max: 0.1 }, resolution: THOU },
    );
    expect(changes.map((c) => [c.measure, c.flagged])).toEqual([
      ['min', true],
      ['max', true],
    ]);
  });

  it('uses the coarser of the two resolutions', () => {
    // The coarser dial bounds what both resolve (CP).
    const [change] = compareInspections(
      { measures: { min: 0.15 }, resolution: 0.002 },
      { measures: { min: 0.165 }, resolution: 0.01 },
    );
    expect(change).toMatchObject({ threshold: 0.02, flagged: false });
    const [finer] = compareInspections(
      { measures: { min: 0.15 }, resolution: 0.002 },
      { measures: { min: 0.165 }, resolution: 0.002 },
    );
    expect(finer?.flagged).toBe(true);
  });

  it('lists a measure only one inspection has with no delta and no flag', () => {
    // Nothing to subtract, nothing to flag (CP).
    const changes = compareInspections(
      { measures: { spread: 0.03 }, resolution: 0.01 },
      { measures: { tir: 0.2, empty: undefined }, resolution: 0.01 },
    );
    expect(changes).toEqual([
      { measure: 'tir', previous: null, current: 0.2, delta: null, threshold: 0.02, flagged: false },
      { measure: 'spread', previous: 0.03, current: null, delta: null, threshold: 0.02, flagged: false },
    ]);
  });

  it('refuses a resolution that is not positive', () => {
    // A graduation is positive (CP).
    expect(() => compareInspections({ measures: {}, resolution: 0 }, { measures: {}, resolution: 0.01 })).toThrow(
      RangeError,
    );
  });
});

describe('summaryToMeasures', () => {
  it('takes min, max, mean, spread, amplitude and runout from a backlash summary', () => {
    // The same figures as the summary, worked by hand on the readings written here (D).
    const measures = summaryToMeasures(summariseBacklash([0.2, 0.15, 0.1, 0.15], { ringTeeth: 41, pinionTeeth: 10 }));
    expect(Object.keys(measures)).toEqual(['min', 'max', 'mean', 'spread', 'amplitude', 'tir']);
    expect(measures.amplitude).toBeCloseTo(0.05, 15);
    expect(measures.tir).toBeGreaterThan(0);
  });
});
