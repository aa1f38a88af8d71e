// Deterministic pseudo-random numbers for property-style tests (mulberry32), so a failure reproduces.

/** Returns a generator of uniform numbers in [0, 1) for the given seed. */
export function createRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Returns a uniform number in [low, high). */
export function pickBetween(random: () => number, low: number, high: number): number {
  return low + (high - low) * random();
}

/** Returns a whole number in [low, high]. */
export function pickInteger(random: () => number, low: number, high: number): number {
  return low + Math.floor(random() * (high - low + 1));
}
