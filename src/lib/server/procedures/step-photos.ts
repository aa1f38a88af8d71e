import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { stepPhotos, type StepPhoto } from '../../../db/schema';
import { MAX_PHOTO_BYTES } from '../../photos/upload-rules';
import type { StepPhotoView } from '../../procedures/views';
import { recordAudit } from '../audit';
import { bodyLimitFor } from '../body-limits';
import type { TeamAccess } from '../guard';
import { HttpError, readBodyBytes, tooLargeFor } from '../http';
import { storeEncodedPhoto } from '../photos';
import { getObjectStorage, type StoredObject } from '../storage';

/**
 * Photos and diagrams of steps: the inspection photos' pipeline (sniffed, decoded, re-encoded to
 * JPEG without metadata by photo-image.ts, bytes in the object storage before the row).
 */

export function stepPhotoToView(photo: StepPhoto): StepPhotoView {
  return {
    id: photo.id,
    stepId: photo.stepId,
    url: `/api/step-photos/${photo.id}`,
    thumbnailUrl: `/api/step-photos/${photo.id}/thumbnail`,
    width: photo.width,
    height: photo.height,
  };
}

/** Reads the image in the form field `file` of a multipart body: 415, 413 and 400 as for inspection photos. */
export async function readStepPhotoFile(request: Request, pathname: string): Promise<Uint8Array> {
  const type = request.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\s*;/i.test(type))
    throw new HttpError(415, 'Send the photo as multipart/form-data, with the image in the field file.');
  const body = await readBodyBytes(request, bodyLimitFor(pathname), (headers) => tooLargeFor(pathname, headers));
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
  if (file.size > MAX_PHOTO_BYTES) throw tooLargeFor(pathname);
  return new Uint8Array(await file.arrayBuffer());
}

/** Re-encodes and stores a step's photo, for a procedure's step or a checklist's step. */
export async function addStepPhoto(
  access: TeamAccess,
  owner: { procedureId: string } | { checklistId: string },
  stepId: string,
  bytes: Uint8Array,
): Promise<StepPhotoView> {
  const photo = await storeEncodedPhoto(bytes, async (tx, encoded) => {
    const [row] = await tx
      .insert(stepPhotos)
      .values({
        id: randomUUID(),
        teamId: access.team.id,
        procedureId: 'procedureId' in owner ? owner.procedureId : null,
        checklistId: 'checklistId' in owner ? owner.checklistId : null,
        stepId,
        ...encoded,
        createdBy: access.user.id,
      })
      .returning();
    if (!row) throw new Error('insert returned no row');
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'create',
      recordType: 'step-photo',
      recordId: row.id,
      after: row,
    });
    return row;
  });
  return stepPhotoToView(photo);
}

/** The stored bytes of one of the team's step photos (404 for anyone else's). */
export async function readStepPhoto(
  teamId: string,
  photoId: string,
  variant: 'full' | 'thumbnail',
): Promise<StoredObject> {
  const db = await getDb();
  const photo = await db
    .select()
    .from(stepPhotos)
    .where(and(eq(stepPhotos.id, photoId), eq(stepPhotos.teamId, teamId)))
    .get();
  if (!photo) throw new HttpError(404, 'No such photo in this team.');
  const object = await (await getObjectStorage()).get(variant === 'full' ? photo.storageKey : photo.thumbnailKey);
  if (!object) throw new HttpError(404, 'This photo’s image is missing from storage.');
  return object;
}

/** The image response for GET /api/step-photos/:id(/thumbnail). */
export async function stepPhotoResponse(
  teamId: string,
  photoId: string,
  variant: 'full' | 'thumbnail',
): Promise<Response> {
  const object = await readStepPhoto(teamId, photoId, variant);
  return new Response(object.body, {
    status: 200,
    headers: {
      'Content-Type': object.contentType,
      'Content-Disposition': `inline; filename="lashline-step-photo-${photoId}${variant === 'thumbnail' ? '-thumbnail' : ''}.jpg"`,
      'Cache-Control': 'private, max-age=86400, immutable',
      'X-Content-Type-Options': 'nosniff',
      ...(object.size === undefined ? {} : { 'Content-Length': String(object.size) }),
    },
  });
}
