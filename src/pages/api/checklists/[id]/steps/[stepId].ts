import { stepChangeSchema } from '../../../../../lib/procedures/schemas';
import { requirePermission } from '../../../../../lib/server/guard';
import { handle, json, readJson } from '../../../../../lib/server/http';
import { readIdempotencyKey } from '../../../../../lib/server/idempotency';
import { changeChecklistStep } from '../../../../../lib/server/procedures/checklist-steps';

/**
 * One step done or skipped, with its torques, bolts, value and note (technician and up). With an
 * Idempotency-Key a change sent twice is stored once; of two changes to one step the later stays.
 */
export const PATCH = handle(async ({ locals, params, request }) => {
  const access = requirePermission(locals, 'checklists:record');
  const key = readIdempotencyKey(request, false);
  const change = await readJson(request, stepChangeSchema);
  return json(await changeChecklistStep(access, params.id ?? '', params.stepId ?? '', change, key));
});
