import { eq, inArray } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import * as t from '../../../db/schema';
import { ARCHIVE_TABLES, type ArchiveTable } from '../../exports/archive-import';
import { withoutStorageKeys } from '../../exports/archive-json';
import { choosePhotosWithin } from '../../exports/archive-photos';
import { bodyLimitFor } from '../body-limits';
import { getObjectStorage } from '../storage';

/**
 * The whole team as one JSON document, for backup and for leaving; team-import.ts reads it back as
 * a new team. Photos travel as their bytes (base64) while the document stays within the import's
 * size limit; the rest are left out, counted and listed with the address each can be downloaded from.
 * No storage key is ever in it.
 */
export const ARCHIVE_FORMAT = 'lashline-team-archive';
export const ARCHIVE_VERSION = 1;
/** The one size limit of an archive: the import's body cap, by the API and by the Team data form. */
export const ARCHIVE_MAX_BYTES = bodyLimitFor('/api/imports/team');

export const ARCHIVE_SOURCES = {
  cars: t.cars,
  assemblies: t.assemblies,
  toleranceProfileVersions: t.toleranceProfileVersions,
  parts: t.parts,
  installationEvents: t.installationEvents,
  runs: t.runs,
  inspections: t.inspections,
  inspectionPhotos: t.inspectionPhotos,
  reviews: t.reviews,
  reviewComments: t.reviewComments,
  auditEvents: t.auditEvents,
} as const satisfies Record<ArchiveTable, unknown>;

// Columns holding a person's id, per table: their people travel with the archive.
const PERSON_COLUMNS: Partial<Record<ArchiveTable, string[]>> = {
  installationEvents: ['actorId'],
  runs: ['recordedBy'],
  toleranceProfileVersions: ['createdBy'],
  inspections: ['technicianId', 'createdBy', 'submittedBy'],
  inspectionPhotos: ['createdBy'],
  reviews: ['openedBy', 'decidedBy'],
  reviewComments: ['authorId', 'mentions'],
  auditEvents: ['actorId'],
};

type Row = Record<string, unknown>;

/** The team as an archive document, as JSON text. */
export async function exportTeamArchive(teamId: string): Promise<string> {
  const db = await getDb();
  const team = await db
    .select({ id: t.teams.id, name: t.teams.name })
    .from(t.teams)
    .where(eq(t.teams.id, teamId))
    .get();
  const people = await db
    .select({ id: t.users.id, email: t.users.email, name: t.users.name, role: t.memberships.role })
    .from(t.memberships)
    .innerJoin(t.users, eq(t.users.id, t.memberships.userId))
    .where(eq(t.memberships.teamId, teamId));
  const settings = await db.select().from(t.teamSettings).where(eq(t.teamSettings.teamId, teamId)).get();
  const archive: Row = {
    format: ARCHIVE_FORMAT,
    version: ARCHIVE_VERSION,
    exportedAt: new Date().toISOString(),
    team,
    settings: settings?.values ?? null,
    people,
  };
  // Authors who have left the team still sign their records.
  const authors = new Set<string>();
  const keys = new Map<string, string>();
  for (const name of ARCHIVE_TABLES) {
    const table = ARCHIVE_SOURCES[name];
    const rows = (await db.select().from(table).where(eq(table.teamId, teamId))) as Row[];
    for (const row of rows)
      for (const column of PERSON_COLUMNS[name] ?? [])
        for (const id of [row[column]].flat()) if (typeof id === 'string') authors.add(id);
    archive[name] = rows.map((row) => {
      if (name === 'inspectionPhotos') keys.set(row.id as string, row.storageKey as string);
      return withoutStorageKeys(row);
    });
  }
  const known = new Set(people.map((p) => p.id));
  const former = [...authors].filter((id) => !known.has(id));
  archive.formerPeople = former.length
    ? await db
        .select({ id: t.users.id, email: t.users.email, name: t.users.name })
        .from(t.users)
        .where(inArray(t.users.id, former))
    : [];
  return addPhotoBytes(archive, keys);
}

/**
 * Puts each photo's bytes into its row, oldest first, while the document stays within the size limit;
 * the photos left out are counted and listed, each with the address it downloads from.
 */
async function addPhotoBytes(archive: Row, keys: Map<string, string>): Promise<string> {
  const photos = archive.inspectionPhotos as Row[];
  const storage = await getObjectStorage();
  // Room for the list of photos left out: about 120 bytes each.
  const base = Buffer.byteLength(JSON.stringify(archive)) + 200 + photos.length * 120;
  const fits = choosePhotosWithin(
    base,
    photos.map((photo) => Number(photo.bytes) || 0),
    ARCHIVE_MAX_BYTES,
  );
  const leftOut: { id: string; inspectionId: string; url: string }[] = [];
  for (const [index, photo] of photos.entries()) {
    const id = photo.id as string;
    const key = keys.get(id);
    const object = fits[index] && key ? await storage.get(key) : null;
    const bytes = object ? Buffer.from(await new Response(object.body).arrayBuffer()) : null;
    // The stored size decided the fit; a copy that differs from it is left out rather than overrun the limit.
    if (bytes && bytes.byteLength === Number(photo.bytes)) photo.image = bytes.toString('base64');
    else leftOut.push({ id, inspectionId: photo.inspectionId as string, url: `/api/photos/${id}` });
  }
  archive.photosLeftOut = {
    count: leftOut.length,
    why: leftOut.length
      ? `These photos would take the archive past its ${ARCHIVE_MAX_BYTES / (1024 * 1024)} MB limit (or their image is missing); download each from its address.`
      : null,
    photos: leftOut,
  };
  return JSON.stringify(archive);
}
