import { randomBytes } from 'node:crypto';
import { eq, lt } from 'drizzle-orm';
import { write } from '../../db/client';
import { sessions } from '../../db/schema';
import { readEnvironment } from '../../environment';

/**
 * One row per signed-in device. Its id rides inside the encrypted session cookie; the row is what
 * makes the cookie good: sign-out deletes it (that device only), and a session unused for the idle
 * time (SESSION_IDLE_HOURS, 12 by default) or older than the cookie's 14 days answers as signed out.
 */

/** The longest a session lives, idle or not (the cookie's own maxAge, in auth.config.ts). */
export const SESSION_MAX_AGE_SECONDS = 14 * 24 * 60 * 60;

// The last-seen time moves at most this often, so a busy session costs one write a minute, not one per request.
const TOUCH_EVERY_MS = 60_000;

/** How long a session may go without a request. */
export function sessionIdleMs(): number {
  return readEnvironment().SESSION_IDLE_HOURS * 60 * 60_000;
}

/** Starts a session for a person who just signed in; returns its id for the cookie. */
export async function startSession(userId: string, now = new Date()): Promise<string> {
  const id = randomBytes(32).toString('base64url');
  await write(async (tx) => {
    await tx.insert(sessions).values({ id, userId, lastSeenAt: now });
    // Sessions that can no longer be used (anyone's) are deleted here rather than by a timer; one row per
    // device keeps the table small enough to scan.
    await tx.delete(sessions).where(lt(sessions.lastSeenAt, new Date(now.getTime() - sessionIdleMs())));
  });
  return id;
}

/** Ends one session (sign-out on one device). */
export async function endSession(id: string): Promise<void> {
  await write((tx) => tx.delete(sessions).where(eq(sessions.id, id)));
}

/** Whether a session found in the database may still be used at `now`. */
export function isSessionLive(row: { createdAt: Date; lastSeenAt: Date }, now: number): boolean {
  return (
    now - row.lastSeenAt.getTime() <= sessionIdleMs() && now - row.createdAt.getTime() <= SESSION_MAX_AGE_SECONDS * 1000
  );
}

/** Moves the session's last-seen time on, at most once a minute. */
export async function touchSession(row: { id: string; lastSeenAt: Date }, now: number): Promise<void> {
  if (now - row.lastSeenAt.getTime() < TOUCH_EVERY_MS) return;
  await write((tx) =>
    tx
      .update(sessions)
      .set({ lastSeenAt: new Date(now) })
      .where(eq(sessions.id, row.id)),
  );
}
