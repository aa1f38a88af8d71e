import { randomUUID } from 'node:crypto';
import { and, asc, desc, eq, inArray, type SQL } from 'drizzle-orm';
import { getDb, write } from '../../../db/client';
import {
  assemblies,
  checklistSteps,
  checklists,
  parts,
  procedures,
  procedureVersions,
  stepPhotos,
  users,
  type Checklist,
  type ChecklistStep,
} from '../../../db/schema';
import { listSteps } from '../../procedures/model';
import type { ChecklistListItem, ChecklistView, StepRecordView } from '../../procedures/views';
import { recordAudit } from '../audit';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';
import { requireTeamProcedure } from './procedures';
import { stepPhotoToView } from './step-photos';

/** The team's checklist; 404 for anyone else's, whether it exists or not. */
export async function requireTeamChecklist(teamId: string, checklistId: string): Promise<Checklist> {
  const db = await getDb();
  const row = await db
    .select()
    .from(checklists)
    .where(and(eq(checklists.id, checklistId), eq(checklists.teamId, teamId)))
    .get();
  if (!row) throw new HttpError(404, 'No such checklist in this team.');
  return row;
}

async function requireTeamRecord(teamId: string, kind: 'assembly' | 'gear-set', id: string): Promise<void> {
  const db = await getDb();
  const found =
    kind === 'assembly'
      ? await db
          .select({ id: assemblies.id })
          .from(assemblies)
          .where(and(eq(assemblies.id, id), eq(assemblies.teamId, teamId)))
          .get()
      : await db
          .select({ id: parts.id })
          .from(parts)
          .where(and(eq(parts.id, id), eq(parts.teamId, teamId), eq(parts.kind, 'gear-set')))
          .get();
  if (!found) throw new HttpError(404, `No such ${kind} in this team.`);
}

/** Starts a checklist on the procedure's current version, for an assembly or a gear set (or both). */
export async function startChecklist(
  access: TeamAccess,
  input: { procedureId: string; assemblyId?: string; gearSetId?: string },
  startedAt = new Date(),
): Promise<ChecklistView> {
  const procedure = await requireTeamProcedure(access.team.id, input.procedureId);
  if (input.assemblyId) await requireTeamRecord(access.team.id, 'assembly', input.assemblyId);
  if (input.gearSetId) await requireTeamRecord(access.team.id, 'gear-set', input.gearSetId);
  if (procedure.archivedAt)
    throw new HttpError(409, 'procedureId: this procedure is archived; bring it back or choose another.', {
      procedureId: 'archived',
    });
  const db = await getDb();
  const version = await db
    .select({ id: procedureVersions.id })
    .from(procedureVersions)
    .where(
      and(eq(procedureVersions.procedureId, procedure.id), eq(procedureVersions.version, procedure.currentVersion)),
    )
    .get();
  if (!version) throw new Error(`procedure ${procedure.id} has no version ${procedure.currentVersion}`);
  const id = randomUUID();
  await write(async (tx) => {
    const row = {
      id,
      teamId: access.team.id,
      procedureId: procedure.id,
      procedureVersionId: version.id,
      assemblyId: input.assemblyId ?? null,
      gearSetId: input.gearSetId ?? null,
      startedBy: access.user.id,
      startedAt,
    };
    await tx.insert(checklists).values(row);
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'create',
      recordType: 'checklist',
      recordId: id,
      after: row,
    });
  });
  return getChecklist(access.team.id, id);
}

export function stepRowToView(row: ChecklistStep, names: Map<string, string>): StepRecordView {
  return {
    stepId: row.stepId,
    status: row.status,
    reason: row.reason,
    torqueApplied: row.torqueApplied,
    boltsInOrder: row.boltsInOrder,
    orderDeviation: row.orderDeviation,
    value: row.value,
    valueUnit: row.valueUnit,
    note: row.note,
    by: { id: row.by, name: names.get(row.by) ?? 'former member' },
    at: row.at.toISOString(),
  };
}

async function readNames(ids: (string | null)[]): Promise<Map<string, string>> {
  const wanted = [...new Set(ids.filter((id): id is string => id !== null))];
  if (wanted.length === 0) return new Map();
  const db = await getDb();
  const rows = await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, wanted));
  return new Map(rows.map((row) => [row.id, row.name]));
}

/** A checklist with the version it follows, every step's record and its photos. */
export async function getChecklist(teamId: string, checklistId: string): Promise<ChecklistView> {
  const checklist = await requireTeamChecklist(teamId, checklistId);
  const db = await getDb();
  const [version, procedure, steps, photos, assembly, gearSet] = await Promise.all([
    db.select().from(procedureVersions).where(eq(procedureVersions.id, checklist.procedureVersionId)).get(),
    db.select().from(procedures).where(eq(procedures.id, checklist.procedureId)).get(),
    db.select().from(checklistSteps).where(eq(checklistSteps.checklistId, checklistId)),
    db
      .select()
      .from(stepPhotos)
      .where(and(eq(stepPhotos.checklistId, checklistId), eq(stepPhotos.teamId, teamId)))
      .orderBy(asc(stepPhotos.createdAt)),
    checklist.assemblyId
      ? db.select().from(assemblies).where(eq(assemblies.id, checklist.assemblyId)).get()
      : Promise.resolve(undefined),
    checklist.gearSetId
      ? db.select().from(parts).where(eq(parts.id, checklist.gearSetId)).get()
      : Promise.resolve(undefined),
  ]);
  if (!version || !procedure) throw new Error(`checklist ${checklistId} lost its procedure version`);
  const names = await readNames([checklist.startedBy, checklist.signedOffBy, ...steps.map((s) => s.by)]);
  const name = (id: string) => ({ id, name: names.get(id) ?? 'former member' });
  return {
    id: checklist.id,
    status: checklist.status,
    procedure: { id: procedure.id, name: version.name, version: version.version, example: procedure.example },
    sections: version.sections,
    assembly: assembly ? { id: assembly.id, serial: assembly.serial, name: assembly.name } : null,
    gearSet: gearSet ? { id: gearSet.id, serial: gearSet.serial } : null,
    startedBy: name(checklist.startedBy),
    startedAt: checklist.startedAt.toISOString(),
    completedAt: checklist.completedAt?.toISOString() ?? null,
    signedOff:
      checklist.signedOffBy && checklist.signedOffAt
        ? { by: name(checklist.signedOffBy), at: checklist.signedOffAt.toISOString(), note: checklist.signOffNote }
        : null,
    steps: Object.fromEntries(steps.map((row) => [row.stepId, stepRowToView(row, names)])),
    photos: photos.map(stepPhotoToView),
  };
}

/** The team's checklists, newest first, filtered by assembly, gear set, procedure or status. */
export async function listChecklists(
  teamId: string,
  filter: { assemblyId?: string; gearSetId?: string; procedureId?: string; status?: Checklist['status'] } = {},
): Promise<ChecklistListItem[]> {
  const db = await getDb();
  const where: SQL[] = [eq(checklists.teamId, teamId)];
  if (filter.assemblyId) where.push(eq(checklists.assemblyId, filter.assemblyId));
  if (filter.gearSetId) where.push(eq(checklists.gearSetId, filter.gearSetId));
  if (filter.procedureId) where.push(eq(checklists.procedureId, filter.procedureId));
  if (filter.status) where.push(eq(checklists.status, filter.status));
  const rows = await db
    .select({ checklist: checklists, version: procedureVersions })
    .from(checklists)
    .innerJoin(procedureVersions, eq(procedureVersions.id, checklists.procedureVersionId))
    .where(and(...where))
    .orderBy(desc(checklists.startedAt));
  const ids = rows.map((row) => row.checklist.id);
  const recorded =
    ids.length === 0
      ? []
      : await db
          .select({ checklistId: checklistSteps.checklistId, stepId: checklistSteps.stepId })
          .from(checklistSteps)
          .where(inArray(checklistSteps.checklistId, ids));
  const counts = new Map<string, number>();
  for (const row of recorded) counts.set(row.checklistId, (counts.get(row.checklistId) ?? 0) + 1);
  return rows.map(({ checklist, version }) => ({
    id: checklist.id,
    status: checklist.status,
    procedureId: checklist.procedureId,
    procedureName: version.name,
    version: version.version,
    assemblyId: checklist.assemblyId,
    gearSetId: checklist.gearSetId,
    startedAt: checklist.startedAt.toISOString(),
    completedAt: checklist.completedAt?.toISOString() ?? null,
    signedOffAt: checklist.signedOffAt?.toISOString() ?? null,
    stepsRecorded: counts.get(checklist.id) ?? 0,
    stepsTotal: listSteps(version.sections).length,
  }));
}
