import { mentionNote, mentionNoteText } from '../../reviews/mention-notes';
import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { memberships, reviewComments, reviews, users, type Review } from '../../../db/schema';
import { DECISION_LABELS } from '../../reviews/schemas';
import type { ReviewDetail, ReviewPageView, ReviewView } from '../../reviews/views';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';
import { readTeamSettings } from '../register/team-settings';

/** A stored review row as the API answers it (without its snapshot and comments). */
export function reviewToView(row: Review): ReviewView {
  return {
    id: row.id,
    gearSetId: row.gearSetId,
    status: row.status,
    openedBy: row.openedBy,
    openedAt: row.createdAt.toISOString(),
    decision: row.decision,
    decisionLabel: row.decision ? DECISION_LABELS[row.decision] : null,
    reason: row.reason,
    notes: row.notes,
    reinspectAfterRuns: row.reinspectAfterRuns,
    reinspectAtRuns: row.reinspectAtRuns,
    runsAtDecision: row.runsAtDecision,
    decidedBy: row.decidedBy,
    decidedAt: row.decidedAt?.toISOString() ?? null,
  };
}
/** What a stored snapshot holds: the evidence in every pair of reader units. */
interface StoredSnapshot {
  takenAt: string;
  gearSet: ReviewDetail['snapshot']['gearSet'];
  analyses: Record<string, unknown>;
  photos: ReviewDetail['snapshot']['photos'];
}

/**
 * A review with its snapshot in the reader's units and its comments, in three queries however many
 * comments or reviews there are; both filter by the team. 404 for an unknown review or another team's.
 */
export async function readReview(access: TeamAccess, reviewId: string): Promise<ReviewDetail> {
  const teamId = access.team.id;
  const db = await getDb();
  const [row, comments, members] = await Promise.all([
    db
      .select()
      .from(reviews)
      .where(and(eq(reviews.id, reviewId), eq(reviews.teamId, teamId)))
      .get(),
    db
      .select({
        id: reviewComments.id,
        body: reviewComments.body,
        authorId: reviewComments.authorId,
        authorName: users.name,
        mentions: reviewComments.mentions,
        createdAt: reviewComments.createdAt,
      })
      .from(reviewComments)
      .innerJoin(users, eq(users.id, reviewComments.authorId))
      .where(and(eq(reviewComments.reviewId, reviewId), eq(reviewComments.teamId, teamId)))
      .orderBy(asc(reviewComments.createdAt)),
    // The team's members, to say under each comment who its mentions reached and which reached nobody.
    db
      .select({ id: users.id, name: users.name, email: users.email })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.teamId, teamId)),
  ]);
  if (!row) throw new HttpError(404, 'No such review in this team.');
  const snapshot = row.snapshot as StoredSnapshot;
  return {
    ...reviewToView(row),
    snapshot: {
      takenAt: snapshot.takenAt,
      gearSet: snapshot.gearSet,
      photos: snapshot.photos,
      analysis: snapshot.analyses[`${access.user.lengthUnit}|${access.user.torqueUnit}`],
    },
    comments: comments.map((c) => ({
      ...c,
      createdAt: c.createdAt.toISOString(),
      mentionNote: mentionNoteText(mentionNote(c.body, c.mentions ?? [], members)),
    })),
  };
}

/** The review page in three queries: the review, its comments and the team's retirement reasons. */
export async function readReviewPage(access: TeamAccess, reviewId: string): Promise<ReviewPageView> {
  const [review, settings] = await Promise.all([readReview(access, reviewId), readTeamSettings(access.team.id)]);
  return { review, retirementReasons: settings.retirementReasons };
}
