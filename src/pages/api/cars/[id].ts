import { carUpdateSchema } from '../../../lib/register/schemas';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { deleteCar, getCar, updateCar } from '../../../lib/server/register/cars';

export const GET = handle(async ({ locals, params }) => {
  const { team } = requireMember(locals);
  return json(await getCar(team.id, params.id ?? ''));
});

export const PATCH = handle(async ({ locals, params, request }) => {
  const access = requirePermission(locals, 'parts:edit');
  return json(await updateCar(access, params.id ?? '', await readJson(request, carUpdateSchema)));
});

export const DELETE = handle(async ({ locals, params }) => {
  await deleteCar(requirePermission(locals, 'parts:edit'), params.id ?? '');
  return new Response(null, { status: 204 });
});
