import { archiveSchema } from '../../../../lib/procedures/schemas';
import { requirePermission } from '../../../../lib/server/guard';
import { handle, json, readJson } from '../../../../lib/server/http';
import { setProcedureArchived } from '../../../../lib/server/procedures/procedures';

/** `{ archived: true | false }` (crew chief or owner): an archived procedure starts no new checklist. */
export const POST = handle(async ({ locals, params, request }) => {
  const access = requirePermission(locals, 'procedures:edit');
  const { archived } = await readJson(request, archiveSchema);
  return json(await setProcedureArchived(access, params.id ?? '', archived));
});
