import { carCreateSchema } from '../../../lib/register/schemas';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { pageOfList, readListQuery } from '../../../lib/server/list-query';
import { createCar, listCars } from '../../../lib/server/register/cars';

export const GET = handle(async ({ locals, url }) => {
  const { team } = requireMember(locals);
  return json(pageOfList(await listCars(team.id), readListQuery(url)));
});

export const POST = handle(async ({ locals, request }) => {
  const access = requirePermission(locals, 'parts:edit');
  return json(await createCar(access, await readJson(request, carCreateSchema)), 201);
});
