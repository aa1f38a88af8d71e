import { requireMember } from '../../../../lib/server/guard';
import { handle } from '../../../../lib/server/http';
import { stepPhotoResponse } from '../../../../lib/server/procedures/step-photos';

/** A step's photo (JPEG, re-encoded, no metadata) for members of its team. */
export const GET = handle(async ({ locals, params }) =>
  stepPhotoResponse(requireMember(locals).team.id, params.id ?? '', 'full'),
);
