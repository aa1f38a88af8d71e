import { requirePermission } from '../../../../lib/server/guard';
import { handle, json } from '../../../../lib/server/http';
import { duplicateProcedure } from '../../../../lib/server/procedures/procedures';

/** A copy of the current version as a new procedure (crew chief or owner) → 201. */
export const POST = handle(async ({ locals, params }) => {
  const access = requirePermission(locals, 'procedures:edit');
  return json(await duplicateProcedure(access, params.id ?? ''), 201);
});
