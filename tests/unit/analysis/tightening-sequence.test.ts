import { describe, expect, it } from 'vitest';
import { computeTighteningSequence } from '../../../src/lib/analysis/tightening-sequence';

// Independent bit reversal by reversing the binary digits as text.
function bitReversalOrder(bolts: number): number[] {
  const bits = Math.log2(bolts);
  return Array.from(
    { length: bolts },
    (_, i) => 1 + parseInt(i.toString(2).padStart(bits, '0').split('').reverse().join(''), 2),
  );
}

describe('computeTighteningSequence', () => {
  it.each([
    [4, [1, 3, 2, 4]],
    [8, [1, 5, 3, 7, 2, 6, 4, 8]],
    [12, [1, 7, 4, 10, 2, 8, 5, 11, 3, 9, 6, 12]],
    [16, [1, 9, 5, 13, 3, 11, 7, 15, 2, 10, 6, 14, 4, 12, 8, 16]],
  ])('gives the legacy cross sequence for %i bolts', (bolts, expected) => {
    // TRADE.md "Legacy cross sequences (M, ASME PCC-1 2019)"
    expect(computeTighteningSequence(bolts)).toEqual(expected);
  });

  it('is exactly bit-reversal order for every power of two', () => {
    // D: bit reversal, checked against an independent implementation (not only the M table above)
    for (const bolts of [4, 8, 16, 32]) expect(computeTighteningSequence(bolts)).toEqual(bitReversalOrder(bolts));
  });

  it('tightens each bolt exactly once for every count from 3 to 36', () => {
    for (let bolts = 3; bolts <= 36; bolts++) {
      const sequence = computeTighteningSequence(bolts);
      expect([...sequence].sort((a, b) => a - b)).toEqual(Array.from({ length: bolts }, (_, i) => i + 1));
    }
  });

  it('follows every bolt of an even circle with the one directly opposite', () => {
    for (let bolts = 4; bolts <= 36; bolts += 2) {
      const sequence = computeTighteningSequence(bolts);
      for (let i = 0; i < bolts; i += 2) expect(sequence[i + 1]! - sequence[i]!).toBe(bolts / 2);
    }
  });

  it('draws a star on an odd circle, stepping as near opposite as the count allows', () => {
    // D: star polygon {5/2} and {7/3}
    expect(computeTighteningSequence(5)).toEqual([1, 3, 5, 2, 4]);
    expect(computeTighteningSequence(7)).toEqual([1, 4, 7, 3, 6, 2, 5]);
  });

  it('refuses fewer than 3, more than 36 or a fractional bolt count', () => {
    for (const bolts of [2, 37, 3.5, Number.NaN]) expect(() => computeTighteningSequence(bolts)).toThrow(RangeError);
  });

  it('hands out a frozen order, so one caller cannot change another caller’s sequence', () => {
    const sequence = computeTighteningSequence(6);
    expect(Object.isFrozen(sequence)).toBe(true);
    // No published 6-bolt order (TRADE.md lists 4, 8, 12, 16): checked against the cross pattern itself (CP, "a
    // cross (star) sequence"): every bolt once, each bolt followed by the one opposite it (3 positions round).
    expect([...sequence].sort((a, b) => a - b)).toEqual([1, 2, 3, 4, 5, 6]);
    for (let i = 0; i < 6; i += 2) expect(Math.abs(sequence[i]! - sequence[i + 1]!)).toBe(3);
  });
});
