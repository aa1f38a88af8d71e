import { requireMember } from '../../../../lib/server/guard';
import { handle } from '../../../../lib/server/http';
import { photoResponse } from '../../../../lib/server/photo-response';

/** The photo's thumbnail (JPEG, longest side at most 320 px) for members of its team. */
export const GET = handle(async ({ locals, params }) =>
  photoResponse(requireMember(locals).team.id, params.id ?? '', 'thumbnail'),
);
