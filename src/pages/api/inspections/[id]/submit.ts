import { requirePermission } from '../../../../lib/server/guard';
import { handle, json } from '../../../../lib/server/http';
import { readIdempotencyKey } from '../../../../lib/server/idempotency';
import { submitInspection } from '../../../../lib/server/inspections/inspections';

/** Submits a draft. Sent with `Idempotency-Key`; a repeat answers the same inspection. */
export const POST = handle(async ({ locals, params, request }) => {
  const access = requirePermission(locals, 'inspections:record');
  readIdempotencyKey(request, true);
  return json(await submitInspection(access, params.id ?? ''));
});
