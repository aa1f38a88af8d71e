import { and, eq, inArray } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { outbox } from '../../db/schema';
import { listCaughtMail, type CaughtMail } from './mail-catcher';

const OUTBOX_MESSAGE_ID = /^<?([0-9a-f-]{36})@outbox\.lashline>?$/i;

/**
 * The caught mail a team's owner may read on a built server: only messages the outbox queued for that
 * team. Mail that belongs to no team (address verification, password reset) and mail of other teams
 * is never listed; a message whose Message-ID names no outbox row is left out too.
 */
export async function listTeamCaughtMail(teamId: string): Promise<CaughtMail[]> {
  const caught = listCaughtMail();
  const rowIds = new Map<string, CaughtMail[]>();
  for (const message of caught) {
    const rowId = OUTBOX_MESSAGE_ID.exec(message.messageId.trim())?.[1]?.toLowerCase();
    if (rowId) rowIds.set(rowId, [...(rowIds.get(rowId) ?? []), message]);
  }
  if (rowIds.size === 0) return [];
  const db = await getDb();
  const ours = new Set<string>();
  const ids = [...rowIds.keys()];
  // SQLite takes a bounded number of parameters: ask in slices (the catcher keeps at most 200 messages).
  for (let start = 0; start < ids.length; start += 100) {
    const rows = await db
      .select({ id: outbox.id })
      .from(outbox)
      .where(and(inArray(outbox.id, ids.slice(start, start + 100)), eq(outbox.teamId, teamId)));
    for (const row of rows) ours.add(row.id.toLowerCase());
  }
  return caught.filter((message) => {
    const rowId = OUTBOX_MESSAGE_ID.exec(message.messageId.trim())?.[1]?.toLowerCase();
    return rowId !== undefined && ours.has(rowId);
  });
}
