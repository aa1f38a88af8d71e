import { assemblyCreateSchema } from '../../../lib/register/schemas';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { pageOfList, readListQuery } from '../../../lib/server/list-query';
import { createAssembly, listAssemblies } from '../../../lib/server/register/assemblies';

export const GET = handle(async ({ locals, url }) => {
  const { team } = requireMember(locals);
  return json(pageOfList(await listAssemblies(team.id), readListQuery(url)));
});

export const POST = handle(async ({ locals, request }) => {
  const access = requirePermission(locals, 'parts:edit');
  return json(await createAssembly(access, await readJson(request, assemblyCreateSchema)), 201);
});
