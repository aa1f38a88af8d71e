import { requireMember } from '../../../../lib/server/guard';
import { handle } from '../../../../lib/server/http';
import { photoResponse } from '../../../../lib/server/photo-response';

/** The stored photo (JPEG, longest side at most 2560 px, no metadata) for members of its team. */
export const GET = handle(async ({ locals, params }) =>
  photoResponse(requireMember(locals).team.id, params.id ?? '', 'full'),
);
