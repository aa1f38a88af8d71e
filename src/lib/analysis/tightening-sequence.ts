// Cross (star) tightening order for a circle of N bolts, numbered 1..N clockwise.

export const MIN_BOLTS = 3;
export const MAX_BOLTS = 36;

function reverseBits(value: number, bits: number): number {
  let reversed = 0;
  for (let i = 0; i < bits; i++) reversed = (reversed << 1) | ((value >> i) & 1);
  return reversed;
}

function buildSequence(bolts: number): number[] {
  let pairs = 0;
  let odd = bolts;
  while (odd % 2 === 0) {
    odd /= 2;
    pairs++;
  }
  const crossSize = bolts / odd;
  // Near-opposite step for the odd part; ⌊m/2⌋ is coprime with odd m, so every offset comes up once.
  const step = Math.floor(odd / 2);
  const sequence: number[] = [];
  for (let q = 0; q < odd; q++) {
    const offset = (q * step) % odd;
    for (let r = 0; r < crossSize; r++) sequence.push(1 + offset + odd * reverseBits(r, pairs));
  }
  return sequence;
}

const CACHE: (readonly number[] | undefined)[] = [];

/**
 * Returns the cross tightening order. Write N = 2^p · m with m odd. The 2^p bolts spaced N/2^p apart form a
 * cross, tightened in bit-reversal order (each bolt opposite the last, then a quarter turn round); the m
 * crosses are taken in star order, offset q·⌊m/2⌋ mod m bolts (the next cross as near opposite as an odd
 * count allows). This is mixed-radix digit reversal: for N a power of two it is exactly bit reversal, and it
 * gives the legacy ASME PCC-1 orders for 4, 8, 12 and 16 bolts (TRADE.md, M); 5 bolts give the star 1-3-5-2-4.
 * @example computeTighteningSequence(12) // [1, 7, 4, 10, 2, 8, 5, 11, 3, 9, 6, 12]
 */
export function computeTighteningSequence(bolts: number): readonly number[] {
  if (!Number.isInteger(bolts) || bolts < MIN_BOLTS || bolts > MAX_BOLTS) {
    throw new RangeError(`Bolt count must be a whole number from ${MIN_BOLTS} to ${MAX_BOLTS}, got ${bolts}.`);
  }
  const cached = CACHE[bolts];
  if (cached) return cached;
  const sequence = Object.freeze(buildSequence(bolts));
  CACHE[bolts] = sequence;
  return sequence;
}
