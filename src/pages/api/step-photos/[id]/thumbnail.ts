import { requireMember } from '../../../../lib/server/guard';
import { handle } from '../../../../lib/server/http';
import { stepPhotoResponse } from '../../../../lib/server/procedures/step-photos';

/** A step photo's thumbnail for members of its team. */
export const GET = handle(async ({ locals, params }) =>
  stepPhotoResponse(requireMember(locals).team.id, params.id ?? '', 'thumbnail'),
);
