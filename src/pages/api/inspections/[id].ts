import { inspectionPatchSchema } from '../../../lib/inspections/schemas';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { deleteDraft, getInspection, updateInspection } from '../../../lib/server/inspections/inspections';

export const GET = handle(async ({ locals, params }) =>
  json(await getInspection(requireMember(locals), params.id ?? '')),
);

/** A partial change, merged and validated whole: own drafts for technicians, anything for crew chiefs. */
export const PATCH = handle(async ({ locals, params, request }) => {
  const access = requirePermission(locals, 'inspections:record');
  const patch = await readJson(request, inspectionPatchSchema);
  return json(await updateInspection(access, params.id ?? '', patch));
});

export const DELETE = handle(async ({ locals, params }) => {
  await deleteDraft(requirePermission(locals, 'inspections:record'), params.id ?? '');
  return new Response(null, { status: 204 });
});
