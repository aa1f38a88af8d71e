import { and, desc, eq, gt, inArray, lt } from 'drizzle-orm';
import { write, type Transaction } from '../../db/client';
import { limitAttempts as attempts } from '../../db/schema';
import { LONGEST_WINDOW_MS, retryAfterMs, type WindowLimit } from '../rate-limit';
import { HttpError } from './http';

/**
 * Attempt limits counted in the database (`limit_attempts`), so every server process on one database
 * shares them. An attempt is counted when it starts, inside the same write transaction as the check
 * (BEGIN IMMEDIATE on a file, so two processes cannot both pass the last free slot), and forgiven
 * when it succeeds: a burst of parallel guesses cannot all slip in before their failures are counted.
 */

/** One key counted against one limit, e.g. `{ kind: 'sign-in-account', key: email, max: 5, windowMs }`. */
export interface AttemptCount extends WindowLimit {
  /** The family of the limit; keys of different kinds never count against each other. */
  kind: string;
  key: string;
  /** false: only check this limit, count nothing against it (default true). */
  record?: boolean;
}

export interface AttemptVerdict {
  /** Seconds to wait before trying again; 0 when the attempt is allowed (and was counted). */
  retryAfterSeconds: number;
  /** The attempt succeeded: take back what it counted. */
  forgive: () => Promise<void>;
}

const NOTHING_TO_FORGIVE = async (): Promise<void> => {};

/**
 * Checks every limit and, when none is reached, counts one attempt against each (in one transaction).
 * When any is reached nothing is counted, so waiting out a refusal is never extended by it.
 */
export async function limitAttempts(counts: readonly AttemptCount[], now = Date.now()): Promise<AttemptVerdict> {
  const ids = await write((tx) => countAttemptsIn(tx, counts, now));
  if (ids.waitMs > 0) return { retryAfterSeconds: Math.ceil(ids.waitMs / 1000), forgive: NOTHING_TO_FORGIVE };
  return {
    retryAfterSeconds: 0,
    forgive: ids.ids.length
      ? () => write((tx) => tx.delete(attempts).where(inArray(attempts.id, ids.ids))).then(() => undefined)
      : NOTHING_TO_FORGIVE,
  };
}

/**
 * One limit on one key: the simple form for callers such as the password reset.
 * @example
 *   const attempt = await limitAttempt('password-reset-address', clientAddress, 5, 60 * 60_000);
 *   if (attempt.retryAfterSeconds > 0) throw tooManyAttempts(attempt.retryAfterSeconds);
 */
export function limitAttempt(kind: string, key: string, max: number, windowMs: number): Promise<AttemptVerdict> {
  return limitAttempts([{ kind, key, max, windowMs }]);
}

/** Forgets every attempt of a key (an account that signed in is no longer under suspicion). */
export async function clearAttempts(kind: string, key: string): Promise<void> {
  await write((tx) => tx.delete(attempts).where(and(eq(attempts.kind, kind), eq(attempts.key, key))));
}

/** The 429 answer for a limit reached, with Retry-After in seconds. */
export function tooManyAttempts(retryAfterSeconds: number, what = 'attempts'): HttpError {
  const minutes = Math.ceil(retryAfterSeconds / 60);
  return new HttpError(429, `Too many ${what}. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`, undefined, {
    'Retry-After': String(retryAfterSeconds),
  });
}

/** Counts one attempt against `limit` for `key`, or throws the 429 when the limit is reached. */
export async function requireAttemptAllowed(
  kind: string,
  key: string,
  limit: WindowLimit,
  what?: string,
): Promise<AttemptVerdict> {
  const verdict = await limitAttempt(kind, key, limit.max, limit.windowMs);
  if (verdict.retryAfterSeconds > 0) throw tooManyAttempts(verdict.retryAfterSeconds, what);
  return verdict;
}

/**
 * The check and count of `limitAttempts` inside a caller's own write transaction (a use-case that counts
 * an attempt together with what it writes): `waitMs` is 0 and `ids` the rows counted when allowed.
 */
export async function countAttemptsIn(
  tx: Transaction,
  counts: readonly AttemptCount[],
  now = Date.now(),
): Promise<{ waitMs: number; ids: number[] }> {
  let waitMs = 0;
  for (const count of counts) {
    const latest = await tx
      .select({ at: attempts.at })
      .from(attempts)
      .where(
        and(
          eq(attempts.kind, count.kind),
          eq(attempts.key, count.key),
          gt(attempts.at, new Date(now - count.windowMs)),
        ),
      )
      .orderBy(desc(attempts.at))
      .limit(count.max);
    waitMs = Math.max(
      waitMs,
      retryAfterMs(
        latest.map((row) => row.at.getTime()),
        count,
        now,
      ),
    );
  }
  if (waitMs > 0) return { waitMs, ids: [] };
  const recorded = counts.filter((count) => count.record !== false);
  const inserted = recorded.length
    ? await tx
        .insert(attempts)
        .values(recorded.map((count) => ({ kind: count.kind, key: count.key, at: new Date(now) })))
        .returning({ id: attempts.id })
    : [];
  // Keeps the table small; the index on `at` makes this cheap when there is nothing to delete.
  await tx.delete(attempts).where(lt(attempts.at, new Date(now - LONGEST_WINDOW_MS)));
  return { waitMs: 0, ids: inserted.map((row) => row.id) };
}
