import { requirePermission } from '../../../lib/server/guard';
import { handle, json } from '../../../lib/server/http';
import { listOutbox } from '../../../lib/server/outbox';

/** The team's outgoing mail, newest first, with its delivery state (owners). */
export const GET = handle(async ({ locals }) => {
  const { team } = requirePermission(locals, 'outbox:read');
  const rows = await listOutbox(team.id, 200);
  const items = rows.map((row) => ({
    id: row.id,
    to: row.toAddress,
    subject: row.subject,
    status: row.status,
    attempts: row.attempts,
    lastError: row.lastError,
    nextAttemptAt: row.nextAttemptAt.toISOString(),
    sentAt: row.sentAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
  }));
  return json({ items, nextCursor: null });
});
