import { describe, expect, it } from 'vitest';
import { reachedThresholds } from '../../../src/lib/notices/thresholds';

// A 50-run life is the common-practice default for a gear set (CP); a near share of 0.1 is Lashline's
// default (CP). So "near" starts when 0.1 × 50 = 5 runs or fewer are left, i.e. at 45 runs.
const LIFE = 50; // CP
const NEAR = 0.1; // CP

describe('reachedThresholds', () => {
  it('reaches nothing while more runs are left than the near share of the limit', () => {
    expect(reachedThresholds(0, LIFE, NEAR)).toEqual([]);
    expect(reachedThresholds(30, LIFE, NEAR)).toEqual([]);
  });

  it('is not near the limit one run before the near zone (6 left of 50 with a 10 % share)', () => {
    expect(reachedThresholds(44, LIFE, NEAR)).toEqual([]);
  });

  it('is near the limit with exactly the near share of the limit left (5 of 50)', () => {
    expect(reachedThresholds(45, LIFE, NEAR)).toEqual(['near-limit']);
  });

  it('stays near the limit until the last run before it', () => {
    expect(reachedThresholds(49, LIFE, NEAR)).toEqual(['near-limit']);
  });

  it('reaches the life at exactly the limit, and is near it too, in that order', () => {
    expect(reachedThresholds(50, LIFE, NEAR)).toEqual(['near-limit', 'life-reached']);
  });

  it('keeps both once past the limit', () => {
    expect(reachedThresholds(51, LIFE, NEAR)).toEqual(['near-limit', 'life-reached']);
    expect(reachedThresholds(500, LIFE, NEAR)).toEqual(['near-limit', 'life-reached']);
  });

  it('scales the near zone with the limit and the share', () => {
    // 0.2 × 100 = 20 runs: near from 80, not at 79 (invented team settings)
    expect(reachedThresholds(79, 100, 0.2)).toEqual([]);
    expect(reachedThresholds(80, 100, 0.2)).toEqual(['near-limit']);
    // 0.5 × 40 = 20 runs (0.5 is the highest share the team settings take): near from 20, not at 19
    expect(reachedThresholds(19, 40, 0.5)).toEqual([]);
    expect(reachedThresholds(20, 40, 0.5)).toEqual(['near-limit']);
  });

  it('with a near share of 0 gives no warning before the limit itself', () => {
    expect(reachedThresholds(49, LIFE, 0)).toEqual([]);
    expect(reachedThresholds(50, LIFE, 0)).toEqual(['near-limit', 'life-reached']);
  });

  it('reaches nothing for a set with no life limit, however many runs', () => {
    expect(reachedThresholds(0, null, NEAR)).toEqual([]);
    expect(reachedThresholds(10_000, null, NEAR)).toEqual([]);
  });

  it('reaches nothing for a limit of 0 or below, which is no limit at all', () => {
    expect(reachedThresholds(10, 0, NEAR)).toEqual([]);
    expect(reachedThresholds(10, -5, NEAR)).toEqual([]);
  });

  it('handles a one-run limit: the first run reaches it', () => {
    expect(reachedThresholds(1, 1, 0)).toEqual(['near-limit', 'life-reached']);
    expect(reachedThresholds(0, 1, 0)).toEqual([]);
  });

  it('does not call 8 runs left of 100 near with a 7 % share (7 % of 100 is 7 runs)', () => {
    expect(reachedThresholds(92, 100, 0.07)).toEqual([]);
    expect(reachedThresholds(93, 100, 0.07)).toEqual(['near-limit']);
  });

  it('keeps the near zone within the share when the share of the limit is not a whole number of runs', () => {
    // 15 % of 50 is 7.5 runs: 7 runs left is within it, 8 is not.
    expect(reachedThresholds(42, 50, 0.15)).toEqual([]);
    expect(reachedThresholds(43, 50, 0.15)).toEqual(['near-limit']);
  });
});
