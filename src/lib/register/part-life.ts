/**
 * How a part stands against its life limit, in words the screens show beside the numbers. Every
 * state has a word, so nothing depends on colour alone.
 */
export type LifeState = 'no-limit' | 'ok' | 'due' | 'at-limit' | 'over';

export const LIFE_STATE_LABELS: Record<LifeState, string> = {
  'no-limit': 'no limit set',
  ok: 'within its life',
  due: 'due soon',
  'at-limit': 'at the limit',
  over: 'over the limit',
};

/**
 * The state of a part from its runs left; `dueWithin` is the team's service interval in runs.
 * @example lifeStateOf(5, 8) // 'due'
 */
export function lifeStateOf(runsLeft: number | null, dueWithin: number): LifeState {
  if (runsLeft === null) return 'no-limit';
  if (runsLeft < 0) return 'over';
  if (runsLeft === 0) return 'at-limit';
  if (runsLeft <= dueWithin) return 'due';
  return 'ok';
}

const runs = (n: number) => `${n} run${n === 1 ? '' : 's'}`;

/**
 * The whole life in one line.
 * @example lifeToText(38, 50) // '38 of 50 runs — 12 left'
 * @example lifeToText(53, 50) // '53 of 50 runs — 3 over the limit'
 */
export function lifeToText(totalRuns: number, lifeLimitRuns: number | null): string {
  if (lifeLimitRuns === null) return `${runs(totalRuns)} — no life limit set`;
  const left = lifeLimitRuns - totalRuns;
  const head = `${totalRuns} of ${lifeLimitRuns} runs`;
  if (left > 0) return `${head} — ${left} left`;
  if (left === 0) return `${head} — at the limit`;
  return `${head} — ${-left} over the limit`;
}

/**
 * Runs left as a table cell says it.
 * @example runsLeftToText(-3) // '3 over'
 */
export function runsLeftToText(runsLeft: number | null): string {
  if (runsLeft === null) return '—';
  return runsLeft < 0 ? `${-runsLeft} over` : String(runsLeft);
}
