import { photoIdToFileName } from '../photos/upload-rules';
import { readPhoto } from './photos';

// A photo's bytes never change under its id (a new upload gets a new id), so the browser may keep
// it for a day; `private` keeps shared caches from storing what only the team may see.
const CACHE_CONTROL = 'private, max-age=86400, immutable';

/** The image response for GET /api/photos/:id and /api/photos/:id/thumbnail. */
export async function photoResponse(teamId: string, photoId: string, variant: 'full' | 'thumbnail'): Promise<Response> {
  const object = await readPhoto(teamId, photoId, variant);
  return new Response(object.body, {
    status: 200,
    headers: {
      'Content-Type': object.contentType,
      'Content-Disposition': `inline; filename="${photoIdToFileName(photoId, variant)}"`,
      'Cache-Control': CACHE_CONTROL,
      'X-Content-Type-Options': 'nosniff',
      ...(object.size === undefined ? {} : { 'Content-Length': String(object.size) }),
    },
  });
}
