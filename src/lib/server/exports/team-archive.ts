import { randomUUID } from 'node:crypto';
import { eq, inArray } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, write } from '../../../db/client';
import * as t from '../../../db/schema';
import type { TeamAccess } from '../guard';
import { IMPORTED_ACCOUNT_HASH, type PublicUser } from '../accounts';
import { HttpError } from '../http';
import { recordAudit } from '../audit';
import { resolveTeamSettings } from '../../register/team-settings';

/**
 * The whole team as one JSON document, for backup and for leaving, and its import into another
 * Lashline (an empty one, or one where the team does not exist yet). Photos' bytes are not in it —
 * only their records. People come back as the importer (owner) plus accounts that exist already
 * or are made without a password, keeping every record's author; the owner invites them again.
 */
export const ARCHIVE_FORMAT = 'lashline-team-archive';
export const ARCHIVE_VERSION = 1;

const TABLES = {
  cars: t.cars,
  assemblies: t.assemblies,
  parts: t.parts,
  installationEvents: t.installationEvents,
  runs: t.runs,
  toleranceProfileVersions: t.toleranceProfileVersions,
  inspections: t.inspections,
  inspectionPhotos: t.inspectionPhotos,
  reviews: t.reviews,
  reviewComments: t.reviewComments,
  auditEvents: t.auditEvents,
} as const;
type TableName = keyof typeof TABLES;
const ORDER = Object.keys(TABLES) as TableName[];

// Columns holding a person's id, per table, to map onto the importing database's accounts.
const PERSON_COLUMNS: Partial<Record<TableName, string[]>> = {
  installationEvents: ['actorId'],
  runs: ['recordedBy'],
  toleranceProfileVersions: ['createdBy'],
  inspections: ['technicianId', 'createdBy', 'submittedBy'],
  inspectionPhotos: ['createdBy'],
  reviews: ['openedBy', 'decidedBy'],
  reviewComments: ['authorId'],
  auditEvents: ['actorId'],
};
const DATE_COLUMNS = ['createdAt', 'at', 'inspectedAt', 'submittedAt', 'updatedAt', 'decidedAt', 'reminderQueuedAt'];

/** The team as an archive document. */
export async function exportTeamArchive(teamId: string): Promise<Record<string, unknown>> {
  const db = await getDb();
  const team = await db.select().from(t.teams).where(eq(t.teams.id, teamId)).get();
  const people = await db
    .select({ id: t.users.id, email: t.users.email, name: t.users.name, role: t.memberships.role })
    .from(t.memberships)
    .innerJoin(t.users, eq(t.users.id, t.memberships.userId))
    .where(eq(t.memberships.teamId, teamId));
  const settings = await db.select().from(t.teamSettings).where(eq(t.teamSettings.teamId, teamId)).get();
  const archive: Record<string, unknown> = {
    format: ARCHIVE_FORMAT,
    version: ARCHIVE_VERSION,
    exportedAt: new Date().toISOString(),
    team,
    settings: settings?.values ?? null,
    people,
  };
  // Authors who have left the team still sign their records.
  const authors = new Set<string>();
  for (const name of ORDER) {
    const table = TABLES[name];
    const rows = await db.select().from(table).where(eq(table.teamId, teamId));
    for (const row of rows)
      for (const column of PERSON_COLUMNS[name] ?? [])
        if ((row as Record<string, unknown>)[column]) authors.add((row as unknown as Record<string, string>)[column]!);
    archive[name] = rows;
  }
  const known = new Set(people.map((p) => p.id));
  const former = [...authors].filter((id) => !known.has(id));
  archive.formerPeople = former.length
    ? await db
        .select({ id: t.users.id, email: t.users.email, name: t.users.name })
        .from(t.users)
        .where(inArray(t.users.id, former))
    : [];
  return archive;
}

const personSchema = z.object({ id: z.string(), email: z.string(), name: z.string() });
export const archiveSchema = z
  .object({
    format: z.literal(ARCHIVE_FORMAT, { error: `format: not a Lashline team archive (expected "${ARCHIVE_FORMAT}").` }),
    version: z.literal(ARCHIVE_VERSION, { error: `version: this Lashline reads archive version ${ARCHIVE_VERSION}.` }),
    team: z.object({ id: z.string().min(1), name: z.string().min(1) }),
    settings: z.unknown().nullable(),
    people: z.array(personSchema.extend({ role: z.string() })),
    formerPeople: z.array(personSchema).default([]),
    ...Object.fromEntries(
      ORDER.map((name) => [name, z.array(z.record(z.string(), z.unknown()), { error: `${name}: a list of records.` })]),
    ),
  })
  .passthrough();

function revive(row: Record<string, unknown>): Record<string, unknown> {
  const copy: Record<string, unknown> = { ...row };
  for (const column of DATE_COLUMNS) if (typeof copy[column] === 'string') copy[column] = new Date(copy[column]);
  return copy;
}

/** Imports an archive as a new team owned by the importer; 409 when the team is already here. */
export async function importTeamArchive(
  importer: PublicUser,
  archive: z.infer<typeof archiveSchema>,
): Promise<{ teamId: string; counts: Record<string, number> }> {
  const db = await getDb();
  if (await db.select({ id: t.teams.id }).from(t.teams).where(eq(t.teams.id, archive.team.id)).get()) {
    throw new HttpError(409, 'team: this team is already in this Lashline; nothing was imported.', {
      team: 'already here',
    });
  }
  const teamId = archive.team.id;
  const counts: Record<string, number> = {};
  await write(async (tx) => {
    const personMap = new Map<string, string>();
    for (const person of [...archive.people, ...archive.formerPeople]) {
      if (personMap.has(person.id)) continue;
      const existing = await tx
        .select({ id: t.users.id })
        .from(t.users)
        .where(eq(t.users.email, person.email.toLowerCase()))
        .get();
      if (existing) personMap.set(person.id, existing.id);
      else {
        const id = randomUUID();
        await tx
          .insert(t.users)
          .values({ id, email: person.email.toLowerCase(), name: person.name, passwordHash: IMPORTED_ACCOUNT_HASH });
        personMap.set(person.id, id);
      }
    }
    await tx.insert(t.teams).values({ id: teamId, name: archive.team.name });
    await tx.insert(t.memberships).values({ teamId, userId: importer.id, role: 'owner' });
    if (archive.settings)
      await tx.insert(t.teamSettings).values({ teamId, values: resolveTeamSettings(archive.settings) });
    for (const name of ORDER) {
      const rows = (archive[name] as Record<string, unknown>[]).map((row) => {
        const copy = revive(row);
        copy.teamId = teamId;
        for (const column of PERSON_COLUMNS[name] ?? [])
          if (typeof copy[column] === 'string') copy[column] = personMap.get(copy[column]) ?? null;
        if (name === 'reviewComments')
          copy.mentions = ((copy.mentions as string[]) ?? []).map((id) => personMap.get(id) ?? id);
        return copy;
      });
      counts[name] = rows.length;
      for (let i = 0; i < rows.length; i += 200) await tx.insert(TABLES[name]).values(rows.slice(i, i + 200) as never);
    }
    await tx.update(t.users).set({ currentTeamId: teamId }).where(eq(t.users.id, importer.id));
    await recordAudit(tx, {
      teamId,
      actorId: importer.id,
      action: 'import',
      recordType: 'team',
      recordId: teamId,
      after: counts,
    });
  });
  return { teamId, counts };
}

export type { TeamAccess };
