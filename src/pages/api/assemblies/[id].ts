import { assemblyUpdateSchema } from '../../../lib/register/schemas';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { deleteAssembly, getAssembly, updateAssembly } from '../../../lib/server/register/assemblies';

export const GET = handle(async ({ locals, params }) => {
  const { team } = requireMember(locals);
  return json(await getAssembly(team.id, params.id ?? ''));
});

export const PATCH = handle(async ({ locals, params, request }) => {
  const access = requirePermission(locals, 'parts:edit');
  return json(await updateAssembly(access, params.id ?? '', await readJson(request, assemblyUpdateSchema)));
});

export const DELETE = handle(async ({ locals, params }) => {
  await deleteAssembly(requirePermission(locals, 'parts:edit'), params.id ?? '');
  return new Response(null, { status: 204 });
});
