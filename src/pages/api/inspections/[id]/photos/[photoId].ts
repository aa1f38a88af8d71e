import { requireMember } from '../../../../../lib/server/guard';
import { handle } from '../../../../../lib/server/http';
import { deletePhoto } from '../../../../../lib/server/photos';

/** Removes the photo and its stored images (the inspection's author, a crew chief or the owner). */
export const DELETE = handle(async ({ locals, params }) => {
  await deletePhoto(requireMember(locals), params.id ?? '', params.photoId ?? '');
  return new Response(null, { status: 204 });
});
