import { randomUUID } from 'node:crypto';
import { and, desc, eq } from 'drizzle-orm';
import type { z } from 'zod';
import { getDb, write } from '../../../db/client';
import { parts, reviews } from '../../../db/schema';
import { DECISION_LABELS, type decisionSchema } from '../../reviews/schemas';
import type { ReviewView } from '../../reviews/views';
import { recordAudit } from '../audit';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';
import { decideReview } from './reviews';

/**
 * Corrects a set's latest decision: a crew chief records a new one, with its reason, that supersedes it.
 * The new decision is a review of its own on the same evidence, so both stay in the history; the set's
 * state, its re-inspection point and the notices follow the new one (a retired set comes back only this
 * way). Only the set's latest decision can be corrected, and not while the set has an open review.
 */
export async function correctDecision(
  access: TeamAccess,
  reviewId: string,
  input: z.infer<typeof decisionSchema>,
  baseUrl: string,
): Promise<ReviewView> {
  const db = await getDb();
  const old = await db
    .select()
    .from(reviews)
    .where(and(eq(reviews.id, reviewId), eq(reviews.teamId, access.team.id)))
    .get();
  if (!old) throw new HttpError(404, 'No such review in this team.');
  if (old.status !== 'decided' || !old.decision || !old.decidedAt)
    throw new HttpError(409, 'This review is not decided yet: record its decision instead.');
  const forSet = await db
    .select({ id: reviews.id, status: reviews.status })
    .from(reviews)
    .where(and(eq(reviews.teamId, access.team.id), eq(reviews.gearSetId, old.gearSetId)))
    .orderBy(desc(reviews.decidedAt));
  if (forSet.some((r) => r.status === 'open'))
    throw new HttpError(409, 'The set has an open review: decide there instead of correcting this one.');
  if (forSet[0]?.id !== old.id)
    throw new HttpError(409, 'A later decision on this set exists: correct that one instead.');

  const newId = randomUUID();
  const supersedes = `Supersedes the decision of ${old.decidedAt.toISOString().slice(0, 10)} (${DECISION_LABELS[old.decision]}).`;
  await write(async (tx) => {
    const set = await tx
      .select({ status: parts.status })
      .from(parts)
      .where(and(eq(parts.id, old.gearSetId), eq(parts.teamId, access.team.id)))
      .get();
    if (!set) throw new HttpError(404, 'No such gear set in this team.');
    await tx.insert(reviews).values({
      id: newId,
      teamId: access.team.id,
      gearSetId: old.gearSetId,
      status: 'open',
      snapshot: old.snapshot,
      openedBy: access.user.id,
      statusBefore: set.status,
    });
    // The old decision's re-inspection point gives way to the new one's: no reminder is ever sent for it.
    await tx.update(reviews).set({ reminderQueuedAt: new Date() }).where(eq(reviews.id, old.id));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'supersede',
      recordType: 'review',
      recordId: old.id,
      after: { supersededBy: newId },
    });
  });
  try {
    return await decideReview(
      access,
      newId,
      { ...input, notes: input.notes ? `${input.notes}\n${supersedes}` : supersedes },
      baseUrl,
    );
  } catch (error) {
    // Nothing half-written: the correction's review goes again if its decision could not be recorded.
    await write((tx) => tx.delete(reviews).where(and(eq(reviews.id, newId), eq(reviews.status, 'open'))));
    throw error;
  }
}
