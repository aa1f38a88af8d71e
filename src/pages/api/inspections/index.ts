import { z } from 'zod';
import { inspectionDraftSchema } from '../../../lib/inspections/schemas';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, parseWith, readJson } from '../../../lib/server/http';
import { readIdempotencyKey } from '../../../lib/server/idempotency';
import {
  createInspection,
  listInspectionRows,
  readerUnitsOf,
  toInspectionView,
} from '../../../lib/server/inspections/inspections';
import { pageOfList, readListQuery } from '../../../lib/server/list-query';

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
  const rows = (await listInspectionRows(access.team.id, filter.gearSetId)).filter(
    (r) => !filter.status || r.status === filter.status,
  );
  const page = pageOfList(rows, readListQuery(url));
  const items = await Promise.all(
    page.items.map((row) => toInspectionView(access.team.id, row, readerUnitsOf(access))),
  );
  return json({ items, nextCursor: page.nextCursor });
});

/** Creates a draft; with `Idempotency-Key`, a repeat answers the same draft (200). */
export const POST = handle(async ({ locals, request }) => {
  const access = requirePermission(locals, 'inspections:record');
  const key = readIdempotencyKey(request, false);
  const draft = await readJson(request, inspectionDraftSchema);
  const { view, repeated } = await createInspection(access, draft, key);
  return json(view, repeated ? 200 : 201);
});
