import { and, desc, eq } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { auditEvents, users } from '../../db/schema';

export interface AuditEntryView {
  id: string;
  at: string;
  actorId: string | null;
  actorName: string | null;
  action: string;
  recordType: string;
  recordId: string;
  before: unknown;
  after: unknown;
}

/** The team's audit trail, newest first, optionally for one record type or one record. */
export async function listAuditTrail(
  teamId: string,
  filter: { recordType?: string; recordId?: string; offset: number; limit: number },
): Promise<AuditEntryView[]> {
  const db = await getDb();
  const rows = await db
    .select({ event: auditEvents, actorName: users.name })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(
      and(
        eq(auditEvents.teamId, teamId),
        filter.recordType ? eq(auditEvents.recordType, filter.recordType) : undefined,
        filter.recordId ? eq(auditEvents.recordId, filter.recordId) : undefined,
      ),
    )
    .orderBy(desc(auditEvents.at), desc(auditEvents.id))
    .limit(filter.limit + 1)
    .offset(filter.offset);
  return rows.map(({ event, actorName }) => ({
    id: event.id,
    at: event.at.toISOString(),
    actorId: event.actorId,
    actorName,
    action: event.action,
    recordType: event.recordType,
    recordId: event.recordId,
    before: event.before,
    after: event.after,
  }));
}
