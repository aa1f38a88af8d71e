import { randomUUID } from 'node:crypto';
import { and, asc, eq } from 'drizzle-orm';
import { getDb, write, type Transaction } from '../../db/client';
import { inspectionPhotos, type Inspection, type InspectionPhoto } from '../../db/schema';
import type { PhotoSide } from '../photos/upload-rules';
import { recordAudit } from './audit';
import type { TeamAccess } from './guard';
import { HttpError } from './http';
import { requirePhotoWriter, requireTeamInspection } from './inspections/access';
import { encodePhoto } from './photo-image';
import { getObjectStorage, type StoredObject } from './storage';
import type { PhotoView } from '../inspections/views';

/**
 * The photos of an inspection's contact patterns: re-encoded by photo-image.ts, their bytes in the
 * object storage, one inspection_photos row each. The bytes are stored before the row and removed
 * again if the row cannot be written, so a row always has its bytes; deleting removes the row
 * first, so a failure there leaves at worst an unreferenced object, never a row without bytes.
 */

export type { PhotoView };

export interface CreatedPhotoView extends PhotoView {
  contentType: string;
}

/** A stored photo row as the API answers it. */
export function photoToView(photo: InspectionPhoto): PhotoView {
  return {
    id: photo.id,
    side: photo.side,
    url: `/api/photos/${photo.id}`,
    thumbnailUrl: `/api/photos/${photo.id}/thumbnail`,
    width: photo.width,
    height: photo.height,
    createdAt: photo.createdAt.toISOString(),
  };
}

/**
 * Re-encodes and stores an uploaded photo. `inspection` comes from requirePhotoWriter, which the
 * route calls before reading the body, so nobody who may not write uploads 15 MB first.
 */
export async function addPhoto(
  access: TeamAccess,
  inspection: Pick<Inspection, 'id'>,
  upload: { bytes: Uint8Array; side: PhotoSide },
): Promise<CreatedPhotoView> {
  const photo = await storeEncodedPhoto(upload.bytes, async (tx, encoded) => {
    const [row] = await tx
      .insert(inspectionPhotos)
      .values({
        id: randomUUID(),
        teamId: access.team.id,
        inspectionId: inspection.id,
        side: upload.side,
        ...encoded,
        createdBy: access.user.id,
      })
      .returning();
    if (!row) throw new Error('insert returned no row');
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'create',
      recordType: 'inspection-photo',
      recordId: row.id,
      after: row,
    });
    return row;
  });
  return { ...photoToView(photo), contentType: photo.contentType };
}

/** What a photo row keeps of its re-encoded image and where its bytes are. */
export interface EncodedPhotoColumns {
  storageKey: string;
  thumbnailKey: string;
  contentType: string;
  width: number;
  height: number;
  bytes: number;
}

/**
 * The one pipeline for every uploaded photo (inspections, procedure and checklist steps): re-encodes
 * the bytes, stores the image and its thumbnail, then writes the caller's row (and its audit entry) in
 * one transaction. The bytes go before the row and are removed again if the row cannot be written, so a
 * row always has its bytes.
 */
export async function storeEncodedPhoto<Row>(
  bytes: Uint8Array,
  writeRow: (tx: Transaction, encoded: EncodedPhotoColumns) => Promise<Row>,
): Promise<Row> {
  const { full, thumbnail } = await encodePhoto(bytes);
  const storage = await getObjectStorage();
  const storageKey = `${randomUUID()}.jpg`;
  const thumbnailKey = `${randomUUID()}.jpg`;
  const stored: string[] = [];
  try {
    await storage.put(storageKey, full.bytes, full.contentType);
    stored.push(storageKey);
    await storage.put(thumbnailKey, thumbnail.bytes, thumbnail.contentType);
    stored.push(thumbnailKey);
    return await write((tx) =>
      writeRow(tx, {
        storageKey,
        thumbnailKey,
        contentType: full.contentType,
        width: full.width,
        height: full.height,
        bytes: full.bytes.byteLength,
      }),
    );
  } catch (error) {
    await removeObjects(stored);
    throw error;
  }
}

/** The inspection's photos, oldest first (any member of its team). */
export async function listPhotos(teamId: string, inspectionId: string): Promise<PhotoView[]> {
  await requireTeamInspection(teamId, inspectionId);
  const db = await getDb();
  const rows = await db
    .select()
    .from(inspectionPhotos)
    .where(and(eq(inspectionPhotos.inspectionId, inspectionId), eq(inspectionPhotos.teamId, teamId)))
    .orderBy(asc(inspectionPhotos.createdAt), asc(inspectionPhotos.id));
  return rows.map(photoToView);
}

/** The stored bytes of one of the team's photos (404 for anyone else's, or a missing object). */
export async function readPhoto(teamId: string, photoId: string, variant: 'full' | 'thumbnail'): Promise<StoredObject> {
  const db = await getDb();
  const photo = await db
    .select()
    .from(inspectionPhotos)
    .where(and(eq(inspectionPhotos.id, photoId), eq(inspectionPhotos.teamId, teamId)))
    .get();
  if (!photo) throw new HttpError(404, 'No such photo in this team.');
  const object = await (await getObjectStorage()).get(variant === 'full' ? photo.storageKey : photo.thumbnailKey);
  if (!object) {
    console.error(`[lashline] photo ${photo.id}: its ${variant} object is missing from storage`);
    throw new HttpError(404, 'This photo’s image is missing from storage.');
  }
  return object;
}

/** Removes a photo: the row (audited) first, then its two objects. */
export async function deletePhoto(access: TeamAccess, inspectionId: string, photoId: string): Promise<void> {
  await requirePhotoWriter(access, inspectionId);
  const removed = await write(async (tx) => {
    const where = and(
      eq(inspectionPhotos.id, photoId),
      eq(inspectionPhotos.inspectionId, inspectionId),
      eq(inspectionPhotos.teamId, access.team.id),
    );
    const before = await tx.select().from(inspectionPhotos).where(where).get();
    if (!before) throw new HttpError(404, 'No such photo on this inspection.');
    await tx.delete(inspectionPhotos).where(eq(inspectionPhotos.id, photoId));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'delete',
      recordType: 'inspection-photo',
      recordId: photoId,
      before,
    });
    return before;
  });
  await removeObjects([removed.storageKey, removed.thumbnailKey]);
}

/**
 * Deletes stored objects, logging (not throwing) a failure: by then the row is gone or was never
 * written, and the answer must not depend on cleaning up.
 */
export async function removeObjects(keys: string[]): Promise<void> {
  if (keys.length === 0) return;
  const storage = await getObjectStorage();
  const results = await Promise.allSettled(keys.map((key) => storage.delete(key)));
  results.forEach((result, i) => {
    if (result.status === 'rejected')
      console.error(`[lashline] could not remove stored object ${keys[i]}`, result.reason);
  });
}

/**
 * The storage keys of an inspection's photos, read inside the transaction that deletes it (its rows
 * go by cascade); pass them to removeObjects() once that transaction has committed.
 */
export async function photoKeysOfInspection(tx: Transaction, inspectionId: string, teamId: string): Promise<string[]> {
  const rows = await tx
    .select({ storageKey: inspectionPhotos.storageKey, thumbnailKey: inspectionPhotos.thumbnailKey })
    .from(inspectionPhotos)
    .where(and(eq(inspectionPhotos.teamId, teamId), eq(inspectionPhotos.inspectionId, inspectionId)));
  return rows.flatMap((row) => [row.storageKey, row.thumbnailKey]);
}
