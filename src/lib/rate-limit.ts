/**
 * Attempt limits: how many attempts a key may make inside a sliding window. Pure: the caller passes
 * the times it counted and the time now, so tests need no clock or database. The counting itself is
 * in `lib/server/attempt-limits.ts`, on the database, so every server process shares it.
 */
export interface WindowLimit {
  /** Attempts allowed inside the window; the next one is refused until the oldest leaves it. */
  max: number;
  windowMs: number;
}

/**
 * Milliseconds until one more attempt is allowed (0 when it is allowed now), given the times of the
 * latest attempts inside the window (at most `max` of them are needed, in any order).
 * @example retryAfterMs([0, 1000, 2000], { max: 3, windowMs: 60_000 }, 2500) // 57_500
 */
export function retryAfterMs(attemptTimes: readonly number[], limit: WindowLimit, now: number): number {
  const recent = attemptTimes.filter((at) => at > now - limit.windowMs);
  if (recent.length < limit.max) return 0;
  const newest = [...recent].sort((a, b) => b - a).slice(0, limit.max);
  const oldestCounted = newest[newest.length - 1] ?? now;
  return Math.max(1, oldestCounted + limit.windowMs - now);
}

const FIFTEEN_MINUTES = 15 * 60_000;

// OWASP's Authentication Cheat Sheet asks for a limit on failed attempts per account without naming
// numbers; these are ours. Every limit counts in the database (limit_attempts), shared by all processes.
/** Failed sign-ins per account (its e-mail). */
export const SIGN_IN_ACCOUNT_LIMIT: WindowLimit = { max: 5, windowMs: FIFTEEN_MINUTES };
/** Failed sign-ins per client address, across accounts. */
export const SIGN_IN_ADDRESS_LIMIT: WindowLimit = { max: 20, windowMs: FIFTEEN_MINUTES };
/** Wrong second-factor codes per account, at sign-in and when turning the factor off. */
export const SECOND_FACTOR_CODE_LIMIT: WindowLimit = { max: 5, windowMs: FIFTEEN_MINUTES };
/** Wrong codes while confirming a new second factor, per account. */
export const SECOND_FACTOR_CONFIRM_LIMIT: WindowLimit = { max: 5, windowMs: FIFTEEN_MINUTES };
/** Wrong passwords re-entered by a signed-in person (password change, turning the second factor off). */
export const PASSWORD_RECHECK_LIMIT: WindowLimit = { max: 5, windowMs: FIFTEEN_MINUTES };

/** The longest window of any limit: attempts older than this are deleted. */
export const LONGEST_WINDOW_MS = 24 * 60 * 60_000;
