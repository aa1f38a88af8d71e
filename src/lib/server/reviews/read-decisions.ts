import { and, eq, isNotNull } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { reviews, users } from '../../../db/schema';
import {
  decisionToView,
  latestDecisions,
  type DecisionRow,
  type LatestDecisionView,
} from '../../reviews/latest-decision';

/**
 * Each gear set's latest decision, in one query for the whole team (or for one set): the board, the gear
 * set page and the part page show it beside the set's state.
 */
export async function readLatestDecisions(teamId: string, gearSetId?: string): Promise<Map<string, DecisionRow>> {
  const db = await getDb();
  const conditions = [eq(reviews.teamId, teamId), eq(reviews.status, 'decided'), isNotNull(reviews.decision)];
  if (gearSetId) conditions.push(eq(reviews.gearSetId, gearSetId));
  const rows = await db
    .select({
      reviewId: reviews.id,
      gearSetId: reviews.gearSetId,
      decision: reviews.decision,
      reason: reviews.reason,
      decidedAt: reviews.decidedAt,
      decidedByName: users.name,
      reinspectAtRuns: reviews.reinspectAtRuns,
    })
    .from(reviews)
    .leftJoin(users, eq(users.id, reviews.decidedBy))
    .where(and(...conditions));
  return latestDecisions(
    rows
      .filter((row): row is typeof row & { decision: DecisionRow['decision']; decidedAt: Date } =>
        Boolean(row.decision && row.decidedAt),
      )
      .map((row) => ({ ...row, decidedByName: row.decidedByName ?? null })),
  );
}

/** The view of a set's latest decision from what `readLatestDecisions` read, or null when there is none. */
export function decisionOf(
  decisions: ReadonlyMap<string, DecisionRow>,
  gearSetId: string,
  runsNow: number,
): LatestDecisionView | null {
  const row = decisions.get(gearSetId);
  return row ? decisionToView(row, runsNow) : null;
}
