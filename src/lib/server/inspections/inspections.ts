import { randomUUID } from 'node:crypto';
import { and, asc, eq } from 'drizzle-orm';
import { getDb, write } from '../../../db/client';
import { assemblies, inspections, parts, type Inspection, type Part } from '../../../db/schema';
import { dataToEntry, draftToData } from '../../inspections/record';
import { findMissingForSubmit, inspectionDraftSchema, type InspectionDraft } from '../../inspections/schemas';
import { summariseInspection, type ReaderUnits } from '../../inspections/summary';
import type { ToleranceProfile } from '../../analysis/tolerance';
import { zodIssuesToFields, zodIssuesToMessage } from '../../validation';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';
import { recordAudit } from '../audit';
import { requireChangeableInspection, requireTeamInspection } from './access';
import { getProfileVersion, profileForGearSet } from './profiles';
import { photoKeysOfInspection, removeObjects } from '../photos';
import type { InspectionView } from '../../inspections/views';

export type { InspectionView };

async function requireGearSet(teamId: string, gearSetId: string): Promise<Part> {
  const db = await getDb();
  const set = await db
    .select()
    .from(parts)
    .where(and(eq(parts.id, gearSetId), eq(parts.teamId, teamId)))
    .get();
  if (!set || set.kind !== 'gear-set')
    throw new HttpError(404, 'gearSetId: no such gear set in this team.', { gearSetId: 'unknown gear set' });
  return set;
}

async function requireAssembly(teamId: string, assemblyId: string | null | undefined): Promise<void> {
  if (!assemblyId) return;
  const db = await getDb();
  const row = await db
    .select({ id: assemblies.id })
    .from(assemblies)
    .where(and(eq(assemblies.id, assemblyId), eq(assemblies.teamId, teamId)))
    .get();
  if (!row) throw new HttpError(404, 'assemblyId: no such assembly in this team.', { assemblyId: 'unknown assembly' });
}

/** The profile values an inspection is judged by: the version kept at submission, else the set's current one. */
async function profileValuesFor(teamId: string, row: Inspection): Promise<ToleranceProfile> {
  if (row.profileVersionId) return (await getProfileVersion(teamId, row.profileVersionId)).values;
  return (await profileForGearSet(teamId, row.gearSetId)).values;
}

/** The geometry of a gear set that an inspection's summary reads. */
export type SetGeometry = Pick<
  Part,
  'ringTeeth' | 'pinionTeeth' | 'pressureAngleDeg' | 'cutMethod' | 'spiralAngleDeg' | 'runoutK'
>;

/**
 * The inspection as the API answers it, from what was already read: the row, its set's geometry and
 * the profile values it is judged by. Pure; read models call it for many rows at once.
 */
export function rowToInspectionView(
  row: Inspection,
  units: ReaderUnits,
  geometry: SetGeometry,
  values: ToleranceProfile,
): InspectionView {
  const data = row.data;
  return {
    id: row.id,
    gearSetId: row.gearSetId,
    assemblyId: row.assemblyId,
    status: row.status,
    inspectedAt: row.inspectedAt.toISOString(),
    runsAtInspection: row.runsAtInspection,
    technicianId: row.technicianId,
    createdBy: row.createdBy,
    submittedAt: row.submittedAt?.toISOString() ?? null,
    profileVersionId: row.profileVersionId,
    revision: row.revision,
    updatedAt: row.updatedAt.toISOString(),
    ...dataToEntry(data),
    canonical: data,
    summary: summariseInspection(
      data,
      values,
      {
        ringTeeth: geometry.ringTeeth,
        pinionTeeth: geometry.pinionTeeth,
        pressureAngleDeg: geometry.pressureAngleDeg,
        cutMethod: geometry.cutMethod,
        spiralAngleDeg: geometry.spiralAngleDeg,
        runoutK: geometry.runoutK,
      },
      units,
    ),
  };
}

/** The inspection as the API answers it: what was typed, the canonical record, and the summary in the reader's units. */
export async function toInspectionView(
  teamId: string,
  row: Inspection,
  units: ReaderUnits,
  gearSet?: Part,
  profile?: ToleranceProfile,
): Promise<InspectionView> {
  const set = gearSet ?? (await requireGearSet(teamId, row.gearSetId));
  const values = profile ?? (await profileValuesFor(teamId, row));
  return rowToInspectionView(row, units, set, values);
}

const readerUnitsOf = (access: TeamAccess): ReaderUnits => ({
  lengthUnit: access.user.lengthUnit,
  torqueUnit: access.user.torqueUnit,
});

/**
 * Creates a draft. With an idempotency key, a repeat answers the draft the first request made
 * (`repeated: true`), so a retry over a poor connection never makes two.
 */
export async function createInspection(
  access: TeamAccess,
  draft: InspectionDraft,
  idempotencyKey: string | null,
): Promise<{ view: InspectionView; repeated: boolean }> {
  const teamId = access.team.id;
  if (idempotencyKey) {
    const db = await getDb();
    const existing = await db
      .select()
      .from(inspections)
      .where(and(eq(inspections.teamId, teamId), eq(inspections.idempotencyKey, idempotencyKey)))
      .get();
    if (existing) return { view: await toInspectionView(teamId, existing, readerUnitsOf(access)), repeated: true };
  }
  const set = await requireGearSet(teamId, draft.gearSetId);
  await requireAssembly(teamId, draft.assemblyId);
  const id = randomUUID();
  const now = new Date();
  const row = await write(async (tx) => {
    if (idempotencyKey) {
      const raced = await tx
        .select()
        .from(inspections)
        .where(and(eq(inspections.teamId, teamId), eq(inspections.idempotencyKey, idempotencyKey)))
        .get();
      if (raced) return { row: raced, repeated: true };
    }
    const [created] = await tx
      .insert(inspections)
      .values({
        id,
        teamId,
        gearSetId: set.id,
        assemblyId: draft.assemblyId ?? null,
        inspectedAt: new Date(draft.inspectedAt),
        runsAtInspection: draft.runsAtInspection,
        data: draftToData(draft),
        technicianId: draft.technicianId ?? access.user.id,
        createdBy: access.user.id,
        idempotencyKey,
        updatedAt: now,
      })
      .returning();
    if (!created) throw new Error('insert returned no row');
    await recordAudit(tx, {
      teamId,
      actorId: access.user.id,
      action: 'create',
      recordType: 'inspection',
      recordId: id,
    });
    return { row: created, repeated: false };
  });
  return { view: await toInspectionView(teamId, row.row, readerUnitsOf(access), set), repeated: row.repeated };
}

function rowToDraftInput(row: Inspection): Record<string, unknown> {
  return {
    gearSetId: row.gearSetId,
    assemblyId: row.assemblyId,
    inspectedAt: row.inspectedAt.toISOString(),
    runsAtInspection: row.runsAtInspection,
    technicianId: row.technicianId,
    ...dataToEntry(row.data),
  };
}

/** Merges a partial change into the inspection and validates the whole; submitted ones keep before and after in the audit trail. */
export async function updateInspection(
  access: TeamAccess,
  inspectionId: string,
  patch: Record<string, unknown>,
): Promise<InspectionView> {
  const row = await requireChangeableInspection(access, inspectionId);
  const merged = { ...rowToDraftInput(row), ...patch, gearSetId: row.gearSetId };
  const parsed = inspectionDraftSchema.safeParse(merged);
  if (!parsed.success)
    throw new HttpError(400, zodIssuesToMessage(parsed.error, 'body'), zodIssuesToFields(parsed.error));
  const draft = parsed.data;
  if (row.status === 'submitted') {
    const missing = findMissingForSubmit(draft);
    if (missing.length)
      throw new HttpError(
        422,
        `${missing[0]!.path.join('.')}: ${missing[0]!.message}`,
        Object.fromEntries(missing.map((m) => [m.path.join('.'), m.message])),
      );
  }
  await requireAssembly(access.team.id, draft.assemblyId);
  const updated = await write(async (tx) => {
    const [after] = await tx
      .update(inspections)
      .set({
        assemblyId: draft.assemblyId ?? null,
        inspectedAt: new Date(draft.inspectedAt),
        runsAtInspection: draft.runsAtInspection,
        technicianId: draft.technicianId ?? row.technicianId,
        data: draftToData(draft),
        revision: row.revision + 1,
        updatedAt: new Date(),
      })
      .where(eq(inspections.id, row.id))
      .returning();
    if (!after) throw new Error('update returned no row');
    if (row.status === 'submitted') {
      await recordAudit(tx, {
        teamId: access.team.id,
        actorId: access.user.id,
        action: 'update',
        recordType: 'inspection',
        recordId: row.id,
        before: rowToDraftInput(row),
        after: rowToDraftInput(after),
      });
    }
    return after;
  });
  return toInspectionView(access.team.id, updated, readerUnitsOf(access));
}

/** Submits a draft, keeping the profile version it is judged by; submitting it again answers the same inspection. */
export async function submitInspection(access: TeamAccess, inspectionId: string): Promise<InspectionView> {
  const existing = await requireTeamInspection(access.team.id, inspectionId);
  if (existing.status === 'submitted') return toInspectionView(access.team.id, existing, readerUnitsOf(access));
  const row = await requireChangeableInspection(access, inspectionId);
  const missing = findMissingForSubmit({ readings: row.data.backlashMm });
  if (missing.length)
    throw new HttpError(
      422,
      `${missing[0]!.path.join('.')}: ${missing[0]!.message}`,
      Object.fromEntries(missing.map((m) => [m.path.join('.'), m.message])),
    );
  const profile = await profileForGearSet(access.team.id, row.gearSetId);
  const submitted = await write(async (tx) => {
    const [after] = await tx
      .update(inspections)
      .set({
        status: 'submitted',
        submittedAt: new Date(),
        submittedBy: access.user.id,
        profileVersionId: profile.versionId,
        updatedAt: new Date(),
      })
      .where(and(eq(inspections.id, row.id), eq(inspections.status, 'draft')))
      .returning();
    const final = after ?? (await tx.select().from(inspections).where(eq(inspections.id, row.id)).get())!;
    if (after)
      await recordAudit(tx, {
        teamId: access.team.id,
        actorId: access.user.id,
        action: 'submit',
        recordType: 'inspection',
        recordId: row.id,
        after: { profileVersionId: profile.versionId },
      });
    return final;
  });
  return toInspectionView(access.team.id, submitted, readerUnitsOf(access), undefined, profile.values);
}

/** Deletes a draft (its author or a crew chief); a submitted inspection is never deleted. */
export async function deleteDraft(access: TeamAccess, inspectionId: string): Promise<void> {
  const row = await requireChangeableInspection(access, inspectionId);
  if (row.status === 'submitted') throw new HttpError(409, 'A submitted inspection is kept; edit it instead.');
  const photoKeys = await write(async (tx) => {
    const keys = await photoKeysOfInspection(tx, row.id, access.team.id);
    await tx.delete(inspections).where(eq(inspections.id, row.id));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'delete',
      recordType: 'inspection',
      recordId: row.id,
      before: rowToDraftInput(row),
    });
    return keys;
  });
  // The rows went with the draft (cascade); the stored images go once that has committed.
  await removeObjects(photoKeys);
}

/** A gear set's inspections, oldest first. */
export async function listInspectionRows(teamId: string, gearSetId?: string): Promise<Inspection[]> {
  const db = await getDb();
  const where = gearSetId
    ? and(eq(inspections.teamId, teamId), eq(inspections.gearSetId, gearSetId))
    : eq(inspections.teamId, teamId);
  return db.select().from(inspections).where(where).orderBy(asc(inspections.inspectedAt), asc(inspections.createdAt));
}

export async function getInspection(access: TeamAccess, inspectionId: string): Promise<InspectionView> {
  return toInspectionView(
    access.team.id,
    await requireTeamInspection(access.team.id, inspectionId),
    readerUnitsOf(access),
  );
}

export { readerUnitsOf };
