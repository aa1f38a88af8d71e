/**
 * Which life thresholds a gear set has reached: "near-limit" once its runs left fall within the
 * team's near share of the limit, "life-reached" at the limit.
 * @example reachedThresholds(45, 50, 0.1) // ['near-limit']
 */
export function reachedThresholds(
  totalRuns: number,
  lifeLimitRuns: number | null,
  nearShare: number,
): ('near-limit' | 'life-reached')[] {
  if (lifeLimitRuns === null || lifeLimitRuns <= 0) return [];
  const reached: ('near-limit' | 'life-reached')[] = [];
  // Runs left within the share, compared as numbers (a 7 % share of 100 is 7 runs, not the 7.000000000000001
  // that rounding up would make 8).
  if (lifeLimitRuns - totalRuns <= nearShare * lifeLimitRuns + 1e-9) reached.push('near-limit');
  if (totalRuns >= lifeLimitRuns) reached.push('life-reached');
  return reached;
}
