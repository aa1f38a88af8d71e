import { MAX_PHOTO_BYTES, photoFieldsSchema, type PhotoSide } from '../photos/upload-rules';
import { bodyLimitFor } from './body-limits';
import { HttpError, parseWith, readBodyBytes, tooLargeFor } from './http';

export interface PhotoUpload {
  bytes: Uint8Array;
  side: PhotoSide;
}

const PHOTO_ROUTE = '/api/inspections/:id/photos';
const MAX_BODY_BYTES = bodyLimitFor(PHOTO_ROUTE);
const tooLarge = (headers?: Record<string, string>) => tooLargeFor(PHOTO_ROUTE, headers);

/**
 * Reads the multipart/form-data of a photo upload (`file`, `side`): 415 for another content type;
 * 413 when the declared Content-Length or the bytes actually streamed pass the limit (the count
 * stops reading there, so a chunked body without a length cannot get round it), or the file alone
 * does; 400 naming `file` or `side`. Only then does Node's own parser (undici) read the form.
 */
export async function readPhotoUpload(request: Request): Promise<PhotoUpload> {
  const type = request.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\s*;/i.test(type)) {
    throw new HttpError(
      415,
      'Send the photo as multipart/form-data, with the image in the field file and drive or coast in side.',
    );
  }
  const body = await readBodyBytes(request, MAX_BODY_BYTES, tooLarge);
  let form: FormData;
  try {
    form = await new Response(new Uint8Array(body.buffer as ArrayBuffer, body.byteOffset, body.byteLength), {
      headers: { 'content-type': type },
    }).formData();
  } catch {
    throw new HttpError(400, 'The body is not valid multipart/form-data; send it the way a browser form does.');
  }
  const file = form.get('file');
  if (file === null || typeof file === 'string')
    throw new HttpError(400, 'file: attach the photo as a file in the field file.', { file: 'missing' });
  if (file.size === 0) throw new HttpError(400, 'file: the file is empty.', { file: 'empty' });
  if (file.size > MAX_PHOTO_BYTES) throw tooLarge();
  const { side } = parseWith(photoFieldsSchema, { side: form.get('side') ?? undefined });
  return { bytes: new Uint8Array(await file.arrayBuffer()), side };
}
