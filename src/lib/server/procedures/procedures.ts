import { randomUUID } from 'node:crypto';
import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import { getDb, write } from '../../../db/client';
import { procedures, procedureVersions, stepPhotos, type Procedure, type ProcedureVersion } from '../../../db/schema';
import type { ProcedureSection, ProcedureStep } from '../../procedures/model';
import type { ProcedureListItem, ProcedureView } from '../../procedures/views';
import { recordAudit } from '../audit';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';
import { stepPhotoToView } from './step-photos';

/**
 * Procedures: every save writes a new version (never changing an old one), so a checklist keeps
 * the version it followed. Sections and steps keep the ids the editor sends and get new ones otherwise.
 */

/** What a version holds, as the schema reads it from a body or as a copy of another version. */
export interface ProcedureContent {
  name: string;
  purpose?: string | undefined;
  appliesTo?: string | undefined;
  notes?: string | undefined;
  sections: {
    id?: string | undefined;
    title: string;
    steps: (Omit<ProcedureStep, 'id'> & { id?: string | undefined })[];
  }[];
}

function withIds(sections: ProcedureContent['sections']): ProcedureSection[] {
  return sections.map((section) => ({
    id: section.id ?? randomUUID(),
    title: section.title,
    steps: section.steps.map((step) => ({ ...step, id: step.id ?? randomUUID() })),
  }));
}

/** The team's procedure; 404 for anyone else's, whether it exists or not. */
export async function requireTeamProcedure(teamId: string, procedureId: string): Promise<Procedure> {
  const db = await getDb();
  const row = await db
    .select()
    .from(procedures)
    .where(and(eq(procedures.id, procedureId), eq(procedures.teamId, teamId)))
    .get();
  if (!row) throw new HttpError(404, 'No such procedure in this team.');
  return row;
}

async function readVersion(procedureId: string, version: number): Promise<ProcedureVersion> {
  const db = await getDb();
  const row = await db
    .select()
    .from(procedureVersions)
    .where(and(eq(procedureVersions.procedureId, procedureId), eq(procedureVersions.version, version)))
    .get();
  if (!row) throw new HttpError(404, `version: this procedure has no version ${version}.`, { version: 'not found' });
  return row;
}

/** One version of a procedure (the current one unless `version` is given), with its step photos. */
export async function getProcedure(teamId: string, procedureId: string, version?: number): Promise<ProcedureView> {
  const procedure = await requireTeamProcedure(teamId, procedureId);
  const row = await readVersion(procedureId, version ?? procedure.currentVersion);
  const db = await getDb();
  const photos = await db
    .select()
    .from(stepPhotos)
    .where(and(eq(stepPhotos.procedureId, procedureId), eq(stepPhotos.teamId, teamId)))
    .orderBy(asc(stepPhotos.createdAt));
  return {
    id: procedure.id,
    version: row.version,
    currentVersion: procedure.currentVersion,
    name: row.name,
    purpose: row.purpose,
    appliesTo: row.appliesTo,
    notes: row.notes,
    sections: row.sections,
    archived: procedure.archivedAt !== null,
    example: procedure.example,
    versionCreatedAt: row.createdAt.toISOString(),
    updatedAt: procedure.updatedAt.toISOString(),
    photos: photos.map(stepPhotoToView),
  };
}

/** The team's procedures, current versions, by name; archived ones only when asked. */
export async function listProcedures(teamId: string, includeArchived = false): Promise<ProcedureListItem[]> {
  const db = await getDb();
  const rows = await db
    .select({ procedure: procedures, version: procedureVersions })
    .from(procedures)
    .innerJoin(
      procedureVersions,
      and(eq(procedureVersions.procedureId, procedures.id), eq(procedureVersions.version, procedures.currentVersion)),
    )
    .where(eq(procedures.teamId, teamId))
    .orderBy(asc(procedureVersions.name));
  return rows
    .filter((row) => includeArchived || row.procedure.archivedAt === null)
    .map(({ procedure, version }) => ({
      id: procedure.id,
      name: version.name,
      purpose: version.purpose,
      appliesTo: version.appliesTo,
      version: version.version,
      archived: procedure.archivedAt !== null,
      updatedAt: procedure.updatedAt.toISOString(),
    }));
}

/** The version numbers of a procedure, newest first. */
export async function listVersions(
  teamId: string,
  procedureId: string,
): Promise<{ version: number; createdAt: string }[]> {
  await requireTeamProcedure(teamId, procedureId);
  const db = await getDb();
  const rows = await db
    .select({ version: procedureVersions.version, createdAt: procedureVersions.createdAt })
    .from(procedureVersions)
    .where(eq(procedureVersions.procedureId, procedureId))
    .orderBy(desc(procedureVersions.version));
  return rows.map((row) => ({ version: row.version, createdAt: row.createdAt.toISOString() }));
}

function versionValues(input: ProcedureContent, sections: ProcedureSection[]) {
  return {
    name: input.name,
    purpose: input.purpose ?? null,
    appliesTo: input.appliesTo ?? null,
    notes: input.notes ?? null,
    sections,
  };
}

/** Writes a new procedure, version 1. */
export async function createProcedure(
  access: TeamAccess,
  input: ProcedureContent,
  options: { example?: boolean } = {},
): Promise<ProcedureView> {
  const id = randomUUID();
  const now = new Date();
  const sections = withIds(input.sections);
  await write(async (tx) => {
    await tx.insert(procedures).values({
      id,
      teamId: access.team.id,
      currentVersion: 1,
      example: options.example ?? false,
      createdBy: access.user.id,
      updatedAt: now,
    });
    const version = {
      id: randomUUID(),
      teamId: access.team.id,
      procedureId: id,
      version: 1,
      ...versionValues(input, sections),
    };
    await tx.insert(procedureVersions).values({ ...version, createdBy: access.user.id });
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'create',
      recordType: 'procedure',
      recordId: id,
      after: version,
    });
  });
  return getProcedure(access.team.id, id);
}

/** Saves a new version; the earlier ones stay as they were for the checklists that followed them. */
export async function updateProcedure(
  access: TeamAccess,
  procedureId: string,
  input: ProcedureContent,
): Promise<ProcedureView> {
  await requireTeamProcedure(access.team.id, procedureId);
  const sections = withIds(input.sections);
  await write(async (tx) => {
    const procedure = await tx.select().from(procedures).where(eq(procedures.id, procedureId)).get();
    if (!procedure) throw new HttpError(404, 'No such procedure in this team.');
    const before = await tx
      .select()
      .from(procedureVersions)
      .where(
        and(eq(procedureVersions.procedureId, procedureId), eq(procedureVersions.version, procedure.currentVersion)),
      )
      .get();
    const next = procedure.currentVersion + 1;
    const version = {
      id: randomUUID(),
      teamId: access.team.id,
      procedureId,
      version: next,
      ...versionValues(input, sections),
    };
    await tx.insert(procedureVersions).values({ ...version, createdBy: access.user.id });
    await tx
      .update(procedures)
      .set({ currentVersion: next, updatedAt: new Date() })
      .where(eq(procedures.id, procedureId));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'new-version',
      recordType: 'procedure',
      recordId: procedureId,
      before,
      after: version,
    });
  });
  return getProcedure(access.team.id, procedureId);
}

/** A copy of the current version as a new procedure ("… (copy)"), with new ids for its sections and steps. */
export async function duplicateProcedure(access: TeamAccess, procedureId: string): Promise<ProcedureView> {
  const source = await getProcedure(access.team.id, procedureId);
  const copyName = `${source.name} (copy)`.slice(0, 120);
  return createProcedure(access, {
    name: copyName,
    purpose: source.purpose ?? undefined,
    appliesTo: source.appliesTo ?? undefined,
    notes: source.notes ?? undefined,
    sections: source.sections.map((section) => ({
      title: section.title,
      steps: section.steps.map(({ id: _id, ...step }) => step),
    })),
  });
}

/** Archives (or brings back) a procedure: an archived one starts no new checklist. */
export async function setProcedureArchived(
  access: TeamAccess,
  procedureId: string,
  archived: boolean,
): Promise<ProcedureView> {
  const before = await requireTeamProcedure(access.team.id, procedureId);
  await write(async (tx) => {
    await tx
      .update(procedures)
      .set({ archivedAt: archived ? (before.archivedAt ?? new Date()) : null, updatedAt: new Date() })
      .where(eq(procedures.id, procedureId));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: archived ? 'archive' : 'unarchive',
      recordType: 'procedure',
      recordId: procedureId,
      before: { archivedAt: before.archivedAt },
      after: { archived },
    });
  });
  return getProcedure(access.team.id, procedureId);
}

/** Names of procedures by id, for lists that show checklists. */
export async function readProcedureNames(teamId: string, ids: string[]): Promise<Map<string, string>> {
  if (ids.length === 0) return new Map();
  const db = await getDb();
  const rows = await db
    .select({ id: procedures.id, name: procedureVersions.name })
    .from(procedures)
    .innerJoin(
      procedureVersions,
      and(eq(procedureVersions.procedureId, procedures.id), eq(procedureVersions.version, procedures.currentVersion)),
    )
    .where(and(eq(procedures.teamId, teamId), inArray(procedures.id, ids)));
  return new Map(rows.map((row) => [row.id, row.name]));
}
