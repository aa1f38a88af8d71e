import { randomUUID } from 'node:crypto';
import { and, asc, desc, eq, inArray, lte } from 'drizzle-orm';
import { getDb, write, type Transaction } from '../../db/client';
import { outbox } from '../../db/schema';
import { sendMail } from './mailer';

/**
 * The outbox: a message is written in the same transaction as the change that causes it, and a
 * worker in the server process sends it afterwards, retrying with backoff. The request never waits
 * for the mail server, and a mail server that is down loses nothing. Several server processes may
 * share one database: a worker first claims the messages it will send, in one conditional update that
 * moves their next attempt past a lease, so no other worker sees them as due; a claim whose worker died
 * falls due again when its lease runs out. Each message carries a Message-ID made from its row, the same
 * on every attempt, so a receiver can drop a repeat.
 */

export interface OutgoingMessage {
  teamId: string | null;
  to: string;
  subject: string;
  text: string;
}

const MAX_ATTEMPTS = 12;
const POLL_MS = 2000;
const CLAIM_BATCH = 20;
/** Longer than the mailer's connection, greeting and socket timeouts together (10 + 10 + 20 s). */
export const CLAIM_LEASE_MS = 60_000;

/** Backoff after the n-th failed attempt: 5 s, 10 s, 20 s … capped at one hour. */
export function retryDelayMs(attempts: number): number {
  return Math.min(5000 * 2 ** Math.max(0, attempts - 1), 3_600_000);
}

/** Queues a message inside the caller's transaction. */
export async function queueMessage(tx: Transaction, message: OutgoingMessage): Promise<void> {
  await tx.insert(outbox).values({
    id: randomUUID(),
    teamId: message.teamId,
    toAddress: message.to,
    subject: message.subject,
    textBody: message.text,
    nextAttemptAt: new Date(),
  });
  kickOutbox();
}

let sending = false;
let timer: NodeJS.Timeout | undefined;

/**
 * Claims up to a batch of due messages for this worker: one conditional UPDATE (inside `write()`'s
 * BEGIN IMMEDIATE, so no other process's claim interleaves) moves their next attempt to the end of the
 * lease and answers the rows it moved. Another worker's claim is not due, so it is never taken twice.
 */
export async function claimDueMessages(now = new Date()): Promise<(typeof outbox.$inferSelect)[]> {
  const leaseEnd = new Date(now.getTime() + CLAIM_LEASE_MS);
  return write(async (tx) => {
    const due = tx
      .select({ id: outbox.id })
      .from(outbox)
      .where(and(eq(outbox.status, 'queued'), lte(outbox.nextAttemptAt, now)))
      .orderBy(asc(outbox.nextAttemptAt))
      .limit(CLAIM_BATCH);
    return tx
      .update(outbox)
      .set({ nextAttemptAt: leaseEnd })
      .where(and(inArray(outbox.id, due), eq(outbox.status, 'queued'), lte(outbox.nextAttemptAt, now)))
      .returning();
  });
}

/** The Message-ID of an outbox row: the same on every attempt, so a repeat can be recognised. */
export function messageIdFor(id: string): string {
  return `<${id}@outbox.lashline>`;
}

/** Sends every message that is due, one at a time; safe to call often. */
export async function deliverDueMessages(now = new Date()): Promise<number> {
  if (sending) return 0;
  sending = true;
  let delivered = 0;
  try {
    const due = await claimDueMessages(now);
    for (const message of due) {
      try {
        await sendMail({
          to: message.toAddress,
          subject: message.subject,
          text: message.textBody,
          messageId: messageIdFor(message.id),
        });
        await write((tx) =>
          tx
            .update(outbox)
            .set({ status: 'sent', sentAt: new Date(), attempts: message.attempts + 1 })
            .where(eq(outbox.id, message.id)),
        );
        delivered += 1;
      } catch (error) {
        const attempts = message.attempts + 1;
        await write((tx) =>
          tx
            .update(outbox)
            .set({
              attempts,
              status: attempts >= MAX_ATTEMPTS ? 'failed' : 'queued',
              lastError: String((error as Error).message ?? error).slice(0, 500),
              nextAttemptAt: new Date(Date.now() + retryDelayMs(attempts)),
            })
            .where(eq(outbox.id, message.id)),
        );
      }
    }
  } finally {
    sending = false;
  }
  return delivered;
}

/**
 * Asks the worker to look at the outbox soon (after the current transaction has committed). Only a
 * process whose worker runs sends: a command-line step (the demo seed in `npm start`'s prepare) leaves
 * what it queued to the server, so it opens no mail connection and exits when its work is done.
 */
export function kickOutbox(): void {
  if (!timer) return;
  setTimeout(() => void deliverDueMessages().catch(() => undefined), 50).unref();
}

/** Starts the background worker once per process. */
export function startOutboxWorker(): void {
  if (timer) return;
  timer = setInterval(() => void deliverDueMessages().catch(() => undefined), POLL_MS);
  timer.unref();
}

/** The newest messages of a team, for its owners. */
export async function listOutbox(teamId: string, limit = 100): Promise<(typeof outbox.$inferSelect)[]> {
  const db = await getDb();
  return db.select().from(outbox).where(eq(outbox.teamId, teamId)).orderBy(desc(outbox.createdAt)).limit(limit);
}
