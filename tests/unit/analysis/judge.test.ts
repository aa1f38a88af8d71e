import { describe, expect, it } from 'vitest';
import { judgeBacklash, judgeRange } from '../../../src/lib/analysis/judge';
import { DEFAULT_PROFILE } from '../../../src/lib/analysis/tolerance';

// Band 0.13–0.23 mm: TRADE.md (S: GM light-truck service manual, 8-5/8 in ring gear axle, 1996); near share 0.10 (CP).
const BAND = { min: 0.13, max: 0.23 };

describe('judgeRange', () => {
  it('calls a value in the middle of the band in-band with a positive margin to the nearer limit', () => {
    const verdict = judgeRange(0.2, BAND, 0.1);
    expect(verdict).toMatchObject({ verdict: 'in-band', limit: 'max', limitValue: 0.23 });
    expect(verdict.margin).toBeCloseTo(0.03, 15);
  });

  it('calls a value within a tenth of the band width of a limit near-limit', () => {
    expect(judgeRange(0.135, BAND, 0.1)).toMatchObject({ verdict: 'near-limit', limit: 'min' });
    expect(judgeRange(0.225, BAND, 0.1)).toMatchObject({ verdict: 'near-limit', limit: 'max' });
    expect(judgeRange(0.145, BAND, 0.1).verdict).toBe('in-band');
  });

  it('counts the edge of the near zone as near, despite float noise in 0.13 + 0.1 × 0.1', () => {
    expect(judgeRange(0.13 + 0.1 * (0.23 - 0.13), BAND, 0.1).verdict).toBe('near-limit');
  });

  it('treats the limits as inclusive: a value on a limit is near-limit with zero margin', () => {
    expect(judgeRange(0.13, BAND, 0.1)).toMatchObject({ verdict: 'near-limit', limit: 'min', margin: 0 });
    expect(judgeRange(0.23, BAND, 0.1)).toMatchObject({ verdict: 'near-limit', limit: 'max', margin: 0 });
  });

  it('calls a value outside the band out-of-band with a negative margin to the broken limit', () => {
    const low = judgeRange(0.12, BAND, 0.1);
    expect(low).toMatchObject({ verdict: 'out-of-band', limit: 'min', limitValue: 0.13 });
    expect(low.margin).toBeCloseTo(-0.01, 15);
    expect(judgeRange(0.25, BAND, 0.1)).toMatchObject({ verdict: 'out-of-band', limit: 'max' });
  });

  it('uses a share of the limit itself as the near zone for a one-sided max', () => {
    // Variation limit 0.05 mm: TRADE.md (S: both GM manuals above)
    expect(judgeRange(0.044, { max: 0.05 }, 0.1).verdict).toBe('in-band');
    expect(judgeRange(0.046, { max: 0.05 }, 0.1).verdict).toBe('near-limit');
    expect(judgeRange(0.051, { max: 0.05 }, 0.1)).toMatchObject({ verdict: 'out-of-band', limit: 'max' });
  });

  it('judges a one-sided min the same way', () => {
    expect(judgeRange(2.8, { min: 2.7 }, 0.1)).toMatchObject({ verdict: 'near-limit', limit: 'min' });
    expect(judgeRange(3.5, { min: 2.7 }, 0.1).verdict).toBe('in-band');
  });

  it('refuses a missing limit, a min above the max and a non-finite value', () => {
    expect(() => judgeRange(0.1, {} as { max: number }, 0.1)).toThrow(RangeError);
    expect(() => judgeRange(0.1, { min: 0.3, max: 0.2 }, 0.1)).toThrow(RangeError);
    expect(() => judgeRange(Number.NaN, BAND, 0.1)).toThrow(RangeError);
  });
});

describe('judgeBacklash', () => {
  const summary = { min: 0.12, max: 0.2, spread: 0.08, runoutEstimate: { k: 0.707, deltaDeg: 76.29, tir: 0.1 } };

  it('judges the tightest reading against the band, as GM specifies backlash at the minimum point', () => {
    // TRADE.md (S: GM light-truck service manual, 8-5/8 in ring gear axle, 1996): "at the minimum point"
    const [minPoint] = judgeBacklash(summary, DEFAULT_PROFILE);
    expect(minPoint).toMatchObject({
      measure: 'backlash-min-point',
      value: 0.12,
      verdict: 'out-of-band',
      limit: 'min',
    });
  });

  it('judges the loosest reading, the spread and the runout estimate, in that order', () => {
    const verdicts = judgeBacklash(summary, DEFAULT_PROFILE);
    expect(verdicts.map((v) => [v.measure, v.verdict])).toEqual([
      ['backlash-min-point', 'out-of-band'],
      ['backlash-max-point', 'in-band'],
      ['spread', 'out-of-band'],
      ['runout', 'out-of-band'],
    ]);
  });

  it('judges only the limits it is given', () => {
    const verdicts = judgeBacklash({ ...summary, runoutEstimate: undefined }, { maxSpread: 0.1, runoutMax: 0.076 });
    expect(verdicts.map((v) => v.measure)).toEqual(['spread']);
  });

  it('works in inches against the inch band as GM prints it', () => {
    // TRADE.md (S: GM light-truck service manual, 8-5/8 in ring gear axle, 1996): 0.005–0.009 in at the minimum
    // point, variation within 0.002 in — the printed inch figures, not 0.13 / 25.4 = 0.00512 in.
    const inchBand = { backlashMin: 0.005, backlashMax: 0.009, maxSpread: 0.002 };
    const onTheLimits = judgeBacklash({ min: 0.005, max: 0.007, spread: 0.002 }, inchBand);
    expect(onTheLimits.map((v) => v.verdict)).toEqual(['near-limit', 'in-band', 'near-limit']);
    const beyond = judgeBacklash({ min: 0.004, max: 0.008, spread: 0.004 }, inchBand);
    expect(beyond.map((v) => v.verdict)).toEqual(['out-of-band', 'in-band', 'out-of-band']);
  });
});
