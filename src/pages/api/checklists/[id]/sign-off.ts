import { signOffSchema } from '../../../../lib/procedures/schemas';
import { requirePermission } from '../../../../lib/server/guard';
import { handle, json, readJson } from '../../../../lib/server/http';
import { signOffChecklist } from '../../../../lib/server/procedures/checklist-steps';
import { getChecklist } from '../../../../lib/server/procedures/checklists';

/**
 * `{ note? }`: a crew chief or owner signs a completed checklist off. Where the team requires a second
 * factor, the guard refuses anyone without one, as for decisions.
 */
export const POST = handle(async ({ locals, params, request }) => {
  const access = requirePermission(locals, 'checklists:sign-off');
  const { note } = await readJson(request, signOffSchema);
  await signOffChecklist(access, params.id ?? '', note);
  return json(await getChecklist(access.team.id, params.id ?? ''));
});
