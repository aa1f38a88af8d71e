import { z } from 'zod';
import { runCreateSchema } from '../../../lib/register/schemas';
import { toPage } from '../../../lib/paging';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, parseWith, readJson } from '../../../lib/server/http';
import { readListQuery } from '../../../lib/server/list-query';
import { createRun, listRuns } from '../../../lib/server/register/runs';

export const GET = handle(async ({ locals, url }) => {
  const { team } = requireMember(locals);
  const query = readListQuery(url);
  const { carId } = parseWith(z.object({ carId: z.string().max(64).optional() }), { carId: url.searchParams.get('carId') ?? undefined });
  return json(toPage(await listRuns(team.id, { ...query, carId }), query.offset, query.limit));
});

/** `{ carId, at, event?, round?, lane?, notes?, elapsedSeconds?, speedMph? }` → 201. */
export const POST = handle(async ({ locals, request }) => {
  const access = requirePermission(locals, 'runs:record');
  return json(await createRun(access, await readJson(request, runCreateSchema)), 201);
});
