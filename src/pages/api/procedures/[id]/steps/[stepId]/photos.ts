import { requirePermission } from '../../../../../../lib/server/guard';
import { handle, json } from '../../../../../../lib/server/http';
import { requireProcedureStep } from '../../../../../../lib/server/procedures/diagrams';
import { addStepPhoto, readStepPhotoFile } from '../../../../../../lib/server/procedures/step-photos';

/** multipart/form-data with the image in `file` (JPEG, PNG or WebP, at most 15 MB) → 201; crew chief or owner. */
export const POST = handle(async ({ locals, params, request, url }) => {
  const access = requirePermission(locals, 'procedures:edit');
  const procedureId = params.id ?? '';
  const stepId = params.stepId ?? '';
  await requireProcedureStep(access.team.id, procedureId, stepId);
  const bytes = await readStepPhotoFile(request, url.pathname);
  return json(await addStepPhoto(access, { procedureId }, stepId, bytes), 201);
});
