// Deterministic pseudo-random numbers for property-style tests (mulberry32), so a failure reproduces.

/** Returns a generator of uniform numbers in [0, 1) for the given seed (the demo seed's own). */
export { seededRandom as createRandom } from '../../seed/random';

/** Returns a uniform number in [low, high). */
export function pickBetween(random: () => number, low: number, high: number): number {
  return low + (high - low) * random();
}

/** Returns a whole number in [low, high]. */
export function pickInteger(random: () => number, low: number, high: number): number {
  return low + Math.floor(random() * (high - low + 1));
}
