import { findStep } from '../../../../../../lib/procedures/model';
import { roleCan } from '../../../../../../lib/roles';
import { requirePermission } from '../../../../../../lib/server/guard';
import { HttpError, handle, json } from '../../../../../../lib/server/http';
import { getChecklist } from '../../../../../../lib/server/procedures/checklists';
import { addStepPhoto, readStepPhotoFile } from '../../../../../../lib/server/procedures/step-photos';

/** multipart/form-data with the image in `file` → 201 (technician and up; after sign-off crew chief or owner). */
export const POST = handle(async ({ locals, params, request, url }) => {
  const access = requirePermission(locals, 'checklists:record');
  const checklist = await getChecklist(access.team.id, params.id ?? '');
  const stepId = params.stepId ?? '';
  if (!findStep(checklist.sections, stepId)) throw new HttpError(404, 'No such step in this checklist.');
  if (checklist.status === 'signed-off' && !roleCan(access.team.role, 'checklists:sign-off'))
    throw new HttpError(403, 'This checklist is signed off: only a crew chief or owner can change it now.');
  const bytes = await readStepPhotoFile(request, url.pathname);
  return json(await addStepPhoto(access, { checklistId: checklist.id }, stepId, bytes), 201);
});
