import { and, desc, eq } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { installationEvents, users } from '../../db/schema';
import { describeTarget } from './register/locations';

/**
 * A part's installation history for its page, newest first: the rows GET /api/installations?subjectId=
 * answers, with each place named and who recorded it. Reads only; the history is append-only.
 */
export interface HistoryEntry {
  id: string;
  action: 'install' | 'remove';
  targetLabel: string;
  at: string;
  actorName: string | null;
  notes: string | null;
}

export async function listPartHistory(teamId: string, partId: string): Promise<HistoryEntry[]> {
  const db = await getDb();
  const rows = await db
    .select({ event: installationEvents, actorName: users.name })
    .from(installationEvents)
    .leftJoin(users, eq(users.id, installationEvents.actorId))
    .where(
      and(
        eq(installationEvents.teamId, teamId),
        eq(installationEvents.subjectType, 'part'),
        eq(installationEvents.subjectId, partId),
      ),
    )
    .orderBy(desc(installationEvents.seq));
  const labels = new Map<string, string>();
  const entries: HistoryEntry[] = [];
  for (const { event, actorName } of rows) {
    const key = `${event.targetType}:${event.targetId}`;
    if (!labels.has(key)) labels.set(key, await describeTarget(db, event.targetType, event.targetId, teamId));
    entries.push({
      id: event.id,
      action: event.action,
      targetLabel: labels.get(key)!,
      at: event.at.toISOString(),
      actorName,
      notes: event.notes,
    });
  }
  return entries;
}
