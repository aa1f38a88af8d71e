import { randomUUID } from 'node:crypto';
import { auditEvents } from '../../db/schema';
import type { Transaction } from '../../db/client';

export interface AuditEntry {
  teamId: string | null;
  actorId: string | null;
  action: string;
  recordType: string;
  recordId: string;
  before?: unknown;
  after?: unknown;
}

/** Adds one row to the audit trail inside the caller's transaction, so the change and its record land together. */
export async function recordAudit(tx: Transaction, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvents).values({
    id: randomUUID(),
    teamId: entry.teamId,
    actorId: entry.actorId,
    action: entry.action,
    recordType: entry.recordType,
    recordId: entry.recordId,
    before: entry.before ?? null,
    after: entry.after ?? null,
  });
}
