import { and, eq, isNotNull, isNull } from 'drizzle-orm';
import { getDb, write } from '../../../db/client';
import { parts, partNotices, reviews } from '../../../db/schema';
import { reachedThresholds } from '../../notices/thresholds';
import { DECISION_LABELS } from '../../reviews/schemas';
import { readTeamSettings } from '../register/team-settings';
import { countRunsForParts } from '../register/run-counts';
import { queueNotice } from './notices';

/**
 * After runs are logged: announce each gear set that reached "near limit" or "life reached" — once
 * per set and threshold, however many runs follow, and only the one that applies (a set that went past
 * both at once is told it reached its limit, not also that it is near it) — and each re-inspection that
 * fell due.
 */
export async function announceRunThresholds(teamId: string, baseUrl: string): Promise<number> {
  const db = await getDb();
  const [sets, counts, settings, announced, due] = await Promise.all([
    db
      .select()
      .from(parts)
      .where(and(eq(parts.teamId, teamId), eq(parts.kind, 'gear-set'))),
    countRunsForParts(teamId),
    readTeamSettings(teamId),
    db
      .select({ partId: partNotices.partId, threshold: partNotices.threshold })
      .from(partNotices)
      .where(eq(partNotices.teamId, teamId)),
    db
      .select()
      .from(reviews)
      .where(and(eq(reviews.teamId, teamId), isNotNull(reviews.reinspectAtRuns), isNull(reviews.reminderQueuedAt))),
  ]);
  const seen = new Set(announced.map((a) => `${a.partId}:${a.threshold}`));
  const work: {
    partId: string;
    serial: string;
    threshold: 'near-limit' | 'life-reached';
    runs: number;
    limit: number;
    /** Recorded as announced without a message: a set that reached its limit is past being near it. */
    silent: boolean;
  }[] = [];
  for (const set of sets) {
    if (set.status === 'retired' || set.status === 'scrapped') continue;
    const runs = counts.get(set.id)?.totalRuns ?? 0;
    const reached = reachedThresholds(runs, set.lifeLimitRuns, settings.nearShare);
    for (const threshold of reached) {
      if (seen.has(`${set.id}:${threshold}`)) continue;
      const silent = threshold === 'near-limit' && reached.includes('life-reached');
      work.push({ partId: set.id, serial: set.serial, threshold, runs, limit: set.lifeLimitRuns!, silent });
    }
  }
  const reminders = due.filter((r) => (counts.get(r.gearSetId)?.totalRuns ?? 0) >= r.reinspectAtRuns!);
  if (!work.length && !reminders.length) return 0;
  return write(async (tx) => {
    let queued = 0;
    for (const item of work) {
      // The primary key makes a second announcement impossible even if two requests race here.
      const inserted = await tx
        .insert(partNotices)
        .values({ partId: item.partId, threshold: item.threshold, teamId })
        .onConflictDoNothing()
        .returning();
      if (!inserted.length || item.silent) continue;
      const reached = item.threshold === 'life-reached';
      queued += await queueNotice(tx, {
        teamId,
        baseUrl,
        to: 'team',
        kind: item.threshold,
        subject: reached
          ? `Gear set ${item.serial} has reached its life limit`
          : `Gear set ${item.serial} is near its life limit`,
        facts: [
          `Gear set: ${item.serial}`,
          `Runs: ${item.runs} of a ${item.limit}-run life limit`,
          reached ? 'It is due for replacement under the team’s limit.' : `Runs left: ${item.limit - item.runs}`,
        ],
        link: `${baseUrl}/gear-sets/${item.partId}`,
      });
    }
    for (const review of reminders) {
      const set = sets.find((s) => s.id === review.gearSetId);
      await tx
        .update(reviews)
        .set({ reminderQueuedAt: new Date() })
        .where(and(eq(reviews.id, review.id), isNull(reviews.reminderQueuedAt)));
      queued += await queueNotice(tx, {
        teamId,
        baseUrl,
        to: 'team',
        kind: 'reinspect-due',
        subject: `Re-inspection due for gear set ${set?.serial ?? ''}`,
        facts: [
          `Gear set: ${set?.serial ?? review.gearSetId}`,
          `Decision: ${review.decision ? DECISION_LABELS[review.decision] : 'none recorded'} — re-inspect after ${review.reinspectAfterRuns} runs`,
          `Runs now: ${counts.get(review.gearSetId)?.totalRuns ?? 0} (due at ${review.reinspectAtRuns})`,
        ],
        link: `${baseUrl}/inspections/new?gearSetId=${review.gearSetId}`,
      });
    }
    return queued;
  });
}
