import { procedureSchema } from '../../../lib/procedures/schemas';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { pageOfList, readListQuery } from '../../../lib/server/list-query';
import { createProcedure, listProcedures } from '../../../lib/server/procedures/procedures';

/** The team's procedures by name (any member); `?archived=1` includes archived ones. */
export const GET = handle(async ({ locals, url }) => {
  const { team } = requireMember(locals);
  const items = await listProcedures(team.id, url.searchParams.get('archived') === '1');
  return json(pageOfList(items, readListQuery(url)));
});

/** A new procedure, version 1 (crew chief or owner) → 201 with an id for every section and step. */
export const POST = handle(async ({ locals, request }) => {
  const access = requirePermission(locals, 'procedures:edit');
  const input = await readJson(request, procedureSchema);
  return json(await createProcedure(access, input), 201);
});
