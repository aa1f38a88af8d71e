import { requirePermission } from '../../../../lib/server/guard';
import { handle, json } from '../../../../lib/server/http';
import { completeChecklist } from '../../../../lib/server/procedures/checklist-steps';
import { getChecklist } from '../../../../lib/server/procedures/checklists';

/** Complete: every step done or skipped, else 409 naming the open steps (technician and up). */
export const POST = handle(async ({ locals, params }) => {
  const access = requirePermission(locals, 'checklists:record');
  await completeChecklist(access, params.id ?? '');
  return json(await getChecklist(access.team.id, params.id ?? ''));
});
