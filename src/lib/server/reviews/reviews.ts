import { randomUUID } from 'node:crypto';
import { and, desc, eq } from 'drizzle-orm';
import type { z } from 'zod';
import { getDb, write } from '../../../db/client';
import {
  inspectionPhotos,
  installationEvents,
  memberships,
  parts,
  reviewComments,
  reviews,
  users,
  type Review,
} from '../../../db/schema';
import { DECISION_LABELS, type decisionSchema } from '../../reviews/schemas';
import type { ReviewView } from '../../reviews/views';
import { findMentions, mentionMatches } from '../../notices/compose';
import type { TeamAccess } from '../guard';
import { PART_STATUS_LABELS } from '../../register/kinds';
import { HttpError } from '../http';
import { recordAudit } from '../audit';
import { analyseStoredGearSet } from '../inspections/gear-set-analysis';
import { findLocation } from '../register/locations';
import { getPart } from '../register/parts';
import { queueNotice } from '../notices/notices';
import type { ReviewDetail } from '../../reviews/views';
import { readReview, reviewToView } from './read-review';

const UNIT_PAIRS = [
  { lengthUnit: 'mm', torqueUnit: 'N-m' },
  { lengthUnit: 'mm', torqueUnit: 'lbf-in' },
  { lengthUnit: 'in', torqueUnit: 'lbf-in' },
  { lengthUnit: 'in', torqueUnit: 'N-m' },
] as const;

/**
 * The evidence as it stood when the review opened, kept for every pair of reader units so a
 * decision reads later exactly as it was made, in whichever units the reader chose.
 */
async function takeSnapshot(teamId: string, gearSetId: string) {
  const gearSet = await getPart(teamId, gearSetId);
  const analyses: Record<string, unknown> = {};
  for (const units of UNIT_PAIRS)
    analyses[`${units.lengthUnit}|${units.torqueUnit}`] = await analyseStoredGearSet(teamId, gearSetId, units);
  const latestId = (analyses['mm|N-m'] as { latest: { id: string } | null }).latest?.id;
  const db = await getDb();
  const photos = latestId
    ? (
        await db
          .select()
          .from(inspectionPhotos)
          .where(and(eq(inspectionPhotos.teamId, teamId), eq(inspectionPhotos.inspectionId, latestId)))
      ).map((p) => ({
        id: p.id,
        side: p.side,
        url: `/api/photos/${p.id}`,
        thumbnailUrl: `/api/photos/${p.id}/thumbnail`,
      }))
    : [];
  return { takenAt: new Date().toISOString(), gearSet, analyses, photos };
}

export type { ReviewView };

async function requireReview(teamId: string, reviewId: string): Promise<Review> {
  const db = await getDb();
  const row = await db
    .select()
    .from(reviews)
    .where(and(eq(reviews.id, reviewId), eq(reviews.teamId, teamId)))
    .get();
  if (!row) throw new HttpError(404, 'No such review in this team.');
  return row;
}

/** Opens a review of a gear set with a snapshot of the evidence; the set goes under review. */
export async function openReview(access: TeamAccess, gearSetId: string, baseUrl: string): Promise<ReviewView> {
  const db = await getDb();
  const set = await db
    .select()
    .from(parts)
    .where(and(eq(parts.id, gearSetId), eq(parts.teamId, access.team.id)))
    .get();
  if (!set || set.kind !== 'gear-set')
    throw new HttpError(404, 'gearSetId: no such gear set in this team.', { gearSetId: 'unknown gear set' });
  const open = await db
    .select({ id: reviews.id })
    .from(reviews)
    .where(and(eq(reviews.teamId, access.team.id), eq(reviews.gearSetId, gearSetId), eq(reviews.status, 'open')))
    .get();
  if (open)
    throw new HttpError(409, `gearSetId: this set already has an open review (${open.id}); comment there.`, {
      gearSetId: 'review already open',
    });
  if (set.status === 'retired' || set.status === 'scrapped')
    throw new HttpError(409, `gearSetId: the set is ${set.status}; there is nothing left to decide.`, {
      gearSetId: set.status,
    });
  const snapshot = await takeSnapshot(access.team.id, gearSetId);
  const id = randomUUID();
  const row = await write(async (tx) => {
    const [created] = await tx
      .insert(reviews)
      .values({ id, teamId: access.team.id, gearSetId, snapshot, openedBy: access.user.id, statusBefore: set.status })
      .returning();
    await tx.update(parts).set({ status: 'under-review' }).where(eq(parts.id, gearSetId));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'open',
      recordType: 'review',
      recordId: id,
      after: { gearSetId },
    });
    const recommendation = (
      snapshot.analyses['mm|N-m'] as { recommendation: { action: string; reasons: { message: string }[] } | null }
    ).recommendation;
    await queueNotice(tx, {
      teamId: access.team.id,
      baseUrl,
      to: 'team',
      except: access.user.id,
      kind: 'review-opened',
      subject: `${access.user.name} opened a review of gear set ${set.serial}`,
      facts: [
        `Gear set: ${set.serial}`,
        `Runs: ${snapshot.gearSet.totalRuns}${set.lifeLimitRuns ? ` of ${set.lifeLimitRuns}` : ''}`,
        `Lashline suggests: ${recommendation?.action ?? 'no inspection yet'}`,
        ...(recommendation?.reasons.slice(0, 4).map((r) => `• ${r.message}`) ?? []),
      ],
      link: `${baseUrl}/reviews/${id}`,
    });
    return created!;
  });
  return reviewToView(row);
}

export async function listReviews(
  teamId: string,
  filter: { status?: 'open' | 'decided'; gearSetId?: string },
): Promise<ReviewView[]> {
  const db = await getDb();
  // Filtered in SQL: a team's reviews grow with every season.
  const conditions = [eq(reviews.teamId, teamId)];
  if (filter.status) conditions.push(eq(reviews.status, filter.status));
  if (filter.gearSetId) conditions.push(eq(reviews.gearSetId, filter.gearSetId));
  const rows = await db
    .select()
    .from(reviews)
    .where(and(...conditions))
    .orderBy(desc(reviews.createdAt));
  return rows.map(reviewToView);
}

/** A review with its snapshot (in the reader's units) and its comments: the review page's read model. */
export async function getReview(access: TeamAccess, reviewId: string): Promise<ReviewDetail> {
  return readReview(access, reviewId);
}

/** Adds a comment; each member it mentions hears of it. */
export async function addComment(access: TeamAccess, reviewId: string, body: string, baseUrl: string) {
  const review = await requireReview(access.team.id, reviewId);
  const db = await getDb();
  const members = await db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, access.team.id));
  const mentions = findMentions(body);
  const mentioned = members.filter(
    (m) => m.id !== access.user.id && mentions.some((mention) => mentionMatches(mention, m)),
  );
  const set = await db
    .select({ serial: parts.serial })
    .from(parts)
    .where(and(eq(parts.id, review.gearSetId), eq(parts.teamId, access.team.id)))
    .get();
  const id = randomUUID();
  await write(async (tx) => {
    await tx.insert(reviewComments).values({
      id,
      teamId: access.team.id,
      reviewId,
      authorId: access.user.id,
      body,
      mentions: mentioned.map((m) => m.id),
    });
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'comment',
      recordType: 'review',
      recordId: reviewId,
      after: { commentId: id },
    });
    if (mentioned.length) {
      await queueNotice(tx, {
        teamId: access.team.id,
        baseUrl,
        to: mentioned.map((m) => m.id),
        kind: 'mention',
        subject: `${access.user.name} mentioned you in the review of gear set ${set?.serial ?? ''}`,
        facts: [`Gear set: ${set?.serial ?? review.gearSetId}`, '', ...body.split('\n').map((line) => `> ${line}`)],
        link: `${baseUrl}/reviews/${reviewId}`,
      });
    }
  });
  return { id, reviewId, body, authorId: access.user.id, mentions: mentioned.map((m) => m.id) };
}

/**
 * Records the decision (crew chief or owner). The set's status follows: kept or re-shimmed sets go
 * back to service (or the shelf), a retired set is taken out of its assembly and leaves the board.
 */
export async function decideReview(
  access: TeamAccess,
  reviewId: string,
  input: z.infer<typeof decisionSchema>,
  baseUrl: string,
): Promise<ReviewView> {
  const review = await requireReview(access.team.id, reviewId);
  if (review.status !== 'open')
    throw new HttpError(409, 'This review is already decided; open a new one to decide again.');
  const set = await getPart(access.team.id, review.gearSetId);
  const now = new Date();
  const updated = await write(async (tx) => {
    const where = await findLocation(tx, 'part', review.gearSetId, access.team.id);
    let status: 'in-service' | 'spare' | 'retired' = where ? 'in-service' : 'spare';
    if (input.decision === 'retire') {
      status = 'retired';
      if (where)
        await tx.insert(installationEvents).values({
          id: randomUUID(),
          teamId: access.team.id,
          action: 'remove',
          subjectType: 'part',
          subjectId: review.gearSetId,
          targetType: where.targetType,
          targetId: where.targetId,
          at: now,
          actorId: access.user.id,
          notes: 'Retired by review decision',
        });
    }
    await tx.update(parts).set({ status }).where(eq(parts.id, review.gearSetId));
    const [row] = await tx
      .update(reviews)
      .set({
        status: 'decided',
        decision: input.decision,
        reason: input.reason,
        notes: input.notes ?? null,
        reinspectAfterRuns: input.reinspectAfterRuns ?? null,
        reinspectAtRuns: input.reinspectAfterRuns ? set.totalRuns + input.reinspectAfterRuns : null,
        runsAtDecision: set.totalRuns,
        decidedBy: access.user.id,
        decidedAt: now,
      })
      .where(and(eq(reviews.id, reviewId), eq(reviews.status, 'open')))
      .returning();
    if (!row) throw new HttpError(409, 'This review was decided a moment ago by someone else.');
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'decide',
      recordType: 'review',
      recordId: reviewId,
      before: { status: set.status },
      after: { decision: input.decision, reason: input.reason, status },
    });
    await queueNotice(tx, {
      teamId: access.team.id,
      baseUrl,
      to: 'team',
      except: access.user.id,
      kind: 'decision-made',
      subject: `Decision on gear set ${set.serial}: ${DECISION_LABELS[input.decision]}`,
      facts: [
        `Gear set: ${set.serial}${set.ratioLabel ? ` (${set.ratioLabel})` : ''}`,
        `Decision: ${DECISION_LABELS[input.decision]}, by ${access.user.name}`,
        `Reason: ${input.reason}`,
        ...(input.notes ? [`Notes: ${input.notes}`] : []),
        `Runs at the decision: ${set.totalRuns}${set.lifeLimitRuns ? ` of a ${set.lifeLimitRuns}-run life limit` : ''}`,
        ...(input.reinspectAfterRuns
          ? [`Re-inspect after ${input.reinspectAfterRuns} more runs (at ${set.totalRuns + input.reinspectAfterRuns}).`]
          : []),
        `The set is now: ${PART_STATUS_LABELS[status].toLowerCase()}`,
      ],
      link: `${baseUrl}/reviews/${reviewId}`,
    });
    return row;
  });
  return reviewToView(updated);
}
