import { randomUUID } from 'node:crypto';
import { auditEvents } from '../../db/schema';
import type { Transaction } from '../../db/client';
import { withoutStorageKeys } from '../exports/archive-json';

export interface AuditEntry {
  teamId: string | null;
  actorId: string | null;
  action: string;
  recordType: string;
  recordId: string;
  before?: unknown;
  after?: unknown;
}

/**
 * Adds one row to the audit trail inside the caller's transaction, so the change and its record land
 * together; storage keys are taken out of `before` and `after`.
 */
export async function recordAudit(tx: Transaction, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvents).values({
    id: randomUUID(),
    teamId: entry.teamId,
    actorId: entry.actorId,
    action: entry.action,
    recordType: entry.recordType,
    recordId: entry.recordId,
    // A photo row's storage keys stay out of the trail (anyone who reads it could otherwise name them).
    before: withoutStorageKeys(entry.before ?? null),
    after: withoutStorageKeys(entry.after ?? null),
  });
}
