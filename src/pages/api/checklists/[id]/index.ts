import { requireMember } from '../../../../lib/server/guard';
import { handle, json } from '../../../../lib/server/http';
import { getChecklist } from '../../../../lib/server/procedures/checklists';

/** A checklist with its procedure version, every step's record and its photos (any member). */
export const GET = handle(async ({ locals, params }) =>
  json(await getChecklist(requireMember(locals).team.id, params.id ?? '')),
);
