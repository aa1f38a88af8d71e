import { z } from 'zod';
import { inspectionDraftSchema } from '../../../lib/inspections/schemas';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, parseWith, readJson } from '../../../lib/server/http';
import { readIdempotencyKey } from '../../../lib/server/idempotency';
import { createInspection } from '../../../lib/server/inspections/inspections';
import { readInspectionList } from '../../../lib/server/inspections/read-inspection-list';
import { readListQuery } from '../../../lib/server/list-query';

const filterSchema = z.object({
  gearSetId: z.string().max(64).optional(),
  status: z.enum(['draft', 'submitted'], { error: 'status: draft or submitted.' }).optional(),
});

/** Inspections of the team (or one gear set), oldest first. */
export const GET = handle(async ({ locals, url }) => {
  const access = requireMember(locals);
  const filter = parseWith(filterSchema, {
    gearSetId: url.searchParams.get('gearSetId') ?? undefined,
    status: url.searchParams.get('status') ?? undefined,
  });
  // Filtered, ordered and paged in SQL: the order is a stored column.
  return json(await readInspectionList(access, filter, readListQuery(url)));
});

/** Creates a draft; with `Idempotency-Key`, a repeat answers the same draft (200). */
export const POST = handle(async ({ locals, request }) => {
  const access = requirePermission(locals, 'inspections:record');
  const key = readIdempotencyKey(request, false);
  const draft = await readJson(request, inspectionDraftSchema);
  const { view, repeated } = await createInspection(access, draft, key);
  return json(view, repeated ? 200 : 201);
});
