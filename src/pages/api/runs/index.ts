import { z } from 'zod';
import { runCreateSchema } from '../../../lib/register/schemas';
import { toPage } from '../../../lib/paging';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, parseWith, readJson } from '../../../lib/server/http';
import { readListQuery } from '../../../lib/server/list-query';
import { createRun, listRuns } from '../../../lib/server/register/runs';
import { resolveBaseUrl } from '../../../lib/server/base-url';
import { afterRunsChanged } from '../../../lib/server/notices/after-runs';
import { readIdempotencyKey } from '../../../lib/server/idempotency';

export const GET = handle(async ({ locals, url }) => {
  const { team } = requireMember(locals);
  const query = readListQuery(url);
  const { carId } = parseWith(z.object({ carId: z.string().max(64).optional() }), {
    carId: url.searchParams.get('carId') ?? undefined,
  });
  return json(toPage(await listRuns(team.id, { ...query, carId }), query.offset, query.limit));
});

/** `{ carId, at, event?, round?, lane?, notes?, elapsedSeconds?, speedMph? }` → 201; with `Idempotency-Key` a repeat answers the same run (200). */
export const POST = handle(async ({ locals, request, url }) => {
  const access = requirePermission(locals, 'runs:record');
  const key = readIdempotencyKey(request, false);
  const { repeated, ...run } = await createRun(access, await readJson(request, runCreateSchema), new Date(), key);
  if (repeated) return json(run, 200);
  await afterRunsChanged(access.team.id, resolveBaseUrl(url));
  return json(run, 201);
});
