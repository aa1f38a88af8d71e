import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, write } from '../../../db/client';
import * as t from '../../../db/schema';
import { ARCHIVE_TABLES, planArchiveImport, type ImportProblem } from '../../exports/archive-import';
import { resolveTeamSettings } from '../../register/team-settings';
import { IMPORTED_ACCOUNT_HASH, type PublicUser } from '../accounts';
import { recordAudit } from '../audit';
import { HttpError } from '../http';
import { encodePhoto } from '../photo-image';
import { removeObjects } from '../photos';
import { getObjectStorage } from '../storage';
import { ARCHIVE_FORMAT, ARCHIVE_SOURCES, ARCHIVE_VERSION } from './team-archive';

/**
 * Reads a team archive back as a new team owned by the importer, in one transaction. Nothing in the
 * archive is taken as it stands: rows get new ids and sequence numbers, references must point inside
 * the archive, each row passes the API's schema (archive-import.ts), and photos come as bytes that are
 * re-encoded like an upload. People come back as the importer (owner) plus accounts that exist already
 * or are made without a password, keeping every record's author; the owner invites them again.
 */

const personSchema = z.object({
  id: z.string().min(1).max(64),
  email: z.email({ error: 'an e-mail address' }).max(254),
  name: z.string().trim().min(1).max(120),
});
const rowsSchema = (name: string) =>
  z.array(z.record(z.string(), z.unknown()), { error: `${name}: a list of records.` }).default([]);

export const archiveSchema = z.object({
  format: z.literal(ARCHIVE_FORMAT, { error: `format: not a Lashline team archive (expected "${ARCHIVE_FORMAT}").` }),
  version: z.literal(ARCHIVE_VERSION, { error: `version: this Lashline reads archive version ${ARCHIVE_VERSION}.` }),
  team: z.object({ name: z.string().trim().min(1, 'team.name: the team’s name.').max(80) }),
  settings: z.unknown().nullable().default(null),
  people: z.array(personSchema.extend({ role: z.string().max(40).optional() })).max(10_000),
  formerPeople: z.array(personSchema).max(10_000).default([]),
  ...Object.fromEntries(ARCHIVE_TABLES.map((name) => [name, rowsSchema(name)])),
}) as unknown as z.ZodType<ArchiveDocument>;

export type ArchiveDocument = {
  team: { name: string };
  settings: unknown;
  people: z.infer<typeof personSchema>[];
  formerPeople: z.infer<typeof personSchema>[];
} & Record<(typeof ARCHIVE_TABLES)[number], Record<string, unknown>[]>;

export interface ImportResult {
  teamId: string;
  counts: Record<string, number>;
  /** Photo rows that came without their bytes (left out of the export), so not imported. */
  photosWithoutBytes: number;
}

const MAX_LISTED_PROBLEMS = 50;

function problemsToError(problems: ImportProblem[]): HttpError {
  const first = problems[0]!;
  const more = problems.length - 1;
  return new HttpError(
    422,
    `${first.table}[${first.row}].${first.field}: ${first.message}${more ? ` (${more} more)` : ''}; nothing was imported.`,
    Object.fromEntries(
      problems.slice(0, MAX_LISTED_PROBLEMS).map((p) => [`${p.table}.${p.row}.${p.field}`, p.message]),
    ),
  );
}

/** Imports an archive as a new team owned by the importer; 422 naming table, row and field, with nothing written. */
export async function importTeamArchive(importer: PublicUser, archive: ArchiveDocument): Promise<ImportResult> {
  const db = await getDb();
  const teamId = randomUUID();
  const people = new Map<string, string>();
  const newAccounts: { id: string; email: string; name: string }[] = [];
  for (const person of [...archive.people, ...archive.formerPeople]) {
    if (people.has(person.id)) continue;
    const email = person.email.toLowerCase();
    const existing =
      newAccounts.find((account) => account.email === email) ??
      (await db.select({ id: t.users.id }).from(t.users).where(eq(t.users.email, email)).get());
    if (existing) people.set(person.id, existing.id);
    else {
      const account = { id: randomUUID(), email, name: person.name };
      newAccounts.push(account);
      people.set(person.id, account.id);
    }
  }
  const planned = planArchiveImport(archive, { teamId, people, newId: randomUUID, now: new Date() });
  if (!planned.ok) throw problemsToError(planned.problems);
  const { rows, photos, photosWithoutBytes } = planned.plan;

  // Photos are re-encoded and stored first, and removed again if the transaction fails.
  const storage = await getObjectStorage();
  const stored: string[] = [];
  const photoRows: Record<string, unknown>[] = [];
  try {
    for (const [index, photo] of photos.entries()) {
      const encoded = await encodePhoto(photo.image).catch((error: unknown) => {
        if (error instanceof HttpError)
          throw problemsToError([
            { table: 'inspectionPhotos', row: index, field: 'image', message: error.message.replace(/^file: /, '') },
          ]);
        throw error;
      });
      const storageKey = `${randomUUID()}.jpg`;
      const thumbnailKey = `${randomUUID()}.jpg`;
      await storage.put(storageKey, encoded.full.bytes, encoded.full.contentType);
      stored.push(storageKey);
      await storage.put(thumbnailKey, encoded.thumbnail.bytes, encoded.thumbnail.contentType);
      stored.push(thumbnailKey);
      photoRows.push({
        ...photo.row,
        storageKey,
        thumbnailKey,
        contentType: encoded.full.contentType,
        width: encoded.full.width,
        height: encoded.full.height,
        bytes: encoded.full.bytes.byteLength,
      });
    }
    const counts: Record<string, number> = {};
    await write(async (tx) => {
      for (const account of newAccounts)
        await tx.insert(t.users).values({ ...account, passwordHash: IMPORTED_ACCOUNT_HASH });
      await tx.insert(t.teams).values({ id: teamId, name: archive.team.name });
      await tx.insert(t.memberships).values({ teamId, userId: importer.id, role: 'owner' });
      if (archive.settings)
        await tx.insert(t.teamSettings).values({ teamId, values: resolveTeamSettings(archive.settings) });
      for (const name of ARCHIVE_TABLES) {
        const values = name === 'inspectionPhotos' ? photoRows : rows[name];
        counts[name] = values.length;
        for (let i = 0; i < values.length; i += 200)
          await tx.insert(ARCHIVE_SOURCES[name]).values(values.slice(i, i + 200) as never);
      }
      await tx.update(t.users).set({ currentTeamId: teamId }).where(eq(t.users.id, importer.id));
      await recordAudit(tx, {
        teamId,
        actorId: importer.id,
        action: 'import',
        recordType: 'team',
        recordId: teamId,
        after: { ...counts, photosWithoutBytes },
      });
    });
    return { teamId, counts, photosWithoutBytes };
  } catch (error) {
    await removeObjects(stored);
    throw error;
  }
}
