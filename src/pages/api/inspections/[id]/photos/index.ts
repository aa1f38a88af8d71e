import { requireMember } from '../../../../../lib/server/guard';
import { handle, json } from '../../../../../lib/server/http';
import { requirePhotoWriter } from '../../../../../lib/server/inspections/access';
import { readPhotoUpload } from '../../../../../lib/server/photo-upload';
import { addPhoto, listPhotos } from '../../../../../lib/server/photos';

/** The inspection's photos (any member of its team). */
export const GET = handle(async ({ locals, params }) => {
  const { team } = requireMember(locals);
  return json({ items: await listPhotos(team.id, params.id ?? ''), nextCursor: null });
});

/** multipart/form-data: `file` (JPEG, PNG or WebP, at most 15 MB) and `side` (drive | coast) → 201. */
export const POST = handle(async ({ locals, params, request }) => {
  const access = requireMember(locals);
  const inspection = await requirePhotoWriter(access, params.id ?? '');
  const upload = await readPhotoUpload(request);
  return json(await addPhoto(access, inspection, upload), 201);
});
