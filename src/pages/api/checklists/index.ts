import { z } from 'zod';
import { checklistStartSchema } from '../../../lib/procedures/schemas';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, parseWith, readJson } from '../../../lib/server/http';
import { pageOfList, readListQuery } from '../../../lib/server/list-query';
import { listChecklists, startChecklist } from '../../../lib/server/procedures/checklists';

const filterSchema = z.object({
  assemblyId: z.string().max(64).optional(),
  gearSetId: z.string().max(64).optional(),
  procedureId: z.string().max(64).optional(),
  status: z
    .enum(['in-progress', 'completed', 'signed-off'], { error: 'status: in-progress, completed or signed-off.' })
    .optional(),
});

/** The team's checklists, newest first (any member); `?assemblyId=&gearSetId=&procedureId=&status=`. */
export const GET = handle(async ({ locals, url }) => {
  const { team } = requireMember(locals);
  const filter = parseWith(filterSchema, Object.fromEntries(url.searchParams));
  return json(pageOfList(await listChecklists(team.id, filter), readListQuery(url)));
});

/** `{ procedureId, assemblyId?, gearSetId? }` (at least one of the two) → 201 (technician and up). */
export const POST = handle(async ({ locals, request }) => {
  const access = requirePermission(locals, 'checklists:record');
  const input = await readJson(request, checklistStartSchema);
  return json(await startChecklist(access, input), 201);
});
