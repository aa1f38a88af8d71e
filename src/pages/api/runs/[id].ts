import { runUpdateSchema } from '../../../lib/register/schemas';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { deleteRun, getRun, updateRun } from '../../../lib/server/register/runs';
import { resolveBaseUrl } from '../../../lib/server/base-url';
import { afterRunsChanged } from '../../../lib/server/notices/after-runs';

export const GET = handle(async ({ locals, params }) => {
  const { team } = requireMember(locals);
  return json(await getRun(team.id, params.id ?? ''));
});

/** Crew chief or owner; every count the run touched follows. */
export const PATCH = handle(async ({ locals, params, request, url }) => {
  const access = requirePermission(locals, 'runs:edit');
  const run = await updateRun(access, params.id ?? '', await readJson(request, runUpdateSchema));
  await afterRunsChanged(access.team.id, resolveBaseUrl(url));
  return json(run);
});

/** Crew chief or owner; a technician only a run they logged within the last 24 hours. */
export const DELETE = handle(async ({ locals, params }) => {
  await deleteRun(requirePermission(locals, 'runs:record'), params.id ?? '');
  return new Response(null, { status: 204 });
});
