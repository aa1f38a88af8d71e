import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { write } from '../../../db/client';
import { checklistStepChanges, checklistSteps, checklists, procedureVersions, users } from '../../../db/schema';
import {
  checkChangeAgainstStep,
  isLaterChange,
  isStepDeviation,
  listOpenSteps,
} from '../../procedures/checklist-rules';
import { findStep } from '../../procedures/model';
import type { StepChange } from '../../procedures/schemas';
import type { StepRecordView } from '../../procedures/views';
import { roleCan } from '../../roles';
import { recordAudit } from '../audit';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';
import { requireTeamChecklist, stepRowToView } from './checklists';

export interface StepChangeAnswer {
  /** The step as stored now (the later of two changes wins). */
  step: StepRecordView;
  /** False when a change made later on another device was already stored; the audit trail keeps this one too. */
  applied: boolean;
  /** True when this Idempotency-Key was seen before and nothing new was written. */
  replayed: boolean;
  checklistStatus: string;
}

/**
 * Records one step of a checklist. A change sent twice with one Idempotency-Key is stored once; of
 * two changes to a step, the one made later on its device stays, and both are in the audit trail.
 * After sign-off only a crew chief or owner changes a step, with before and after in the audit trail.
 */
export async function changeChecklistStep(
  access: TeamAccess,
  checklistId: string,
  stepId: string,
  change: StepChange,
  idempotencyKey: string | null,
  now = new Date(),
): Promise<StepChangeAnswer> {
  await requireTeamChecklist(access.team.id, checklistId);
  return write(async (tx) => {
    const checklist = await tx.select().from(checklists).where(eq(checklists.id, checklistId)).get();
    if (!checklist) throw new HttpError(404, 'No such checklist in this team.');
    const names = new Map<string, string>();
    const readStep = async () => {
      const row = await tx
        .select({ step: checklistSteps, name: users.name })
        .from(checklistSteps)
        .innerJoin(users, eq(users.id, checklistSteps.by))
        .where(and(eq(checklistSteps.checklistId, checklistId), eq(checklistSteps.stepId, stepId)))
        .get();
      if (row) names.set(row.step.by, row.name);
      return row?.step;
    };
    if (idempotencyKey) {
      const seen = await tx
        .select()
        .from(checklistStepChanges)
        .where(
          and(eq(checklistStepChanges.teamId, access.team.id), eq(checklistStepChanges.idempotencyKey, idempotencyKey)),
        )
        .get();
      if (seen) {
        if (seen.checklistId !== checklistId || seen.stepId !== stepId)
          throw new HttpError(409, 'Idempotency-Key: this key was already used for another step; send a new one.', {
            'Idempotency-Key': 'used for another step',
          });
        const current = await readStep();
        if (!current) throw new Error('a stored change without its step');
        return {
          step: stepRowToView(current, names),
          applied: seen.applied,
          replayed: true,
          checklistStatus: checklist.status,
        };
      }
    }
    if (checklist.status === 'signed-off' && !roleCan(access.team.role, 'checklists:sign-off'))
      throw new HttpError(403, 'This checklist is signed off: only a crew chief or owner can change it now.');
    const version = await tx
      .select()
      .from(procedureVersions)
      .where(eq(procedureVersions.id, checklist.procedureVersionId))
      .get();
    const step = version && findStep(version.sections, stepId);
    if (!step)
      throw new HttpError(400, 'stepId: this step is not part of the procedure version this checklist follows.', {
        stepId: 'not in this checklist',
      });
    const fields = checkChangeAgainstStep(step, change);
    const firstField = Object.keys(fields)[0];
    if (firstField) throw new HttpError(400, fields[firstField]!, fields);

    // A device clock ahead of the server cannot make a change win for ever.
    const at = change.at ? new Date(Math.min(Date.parse(change.at), now.getTime())) : now;
    const before = await readStep();
    const applied = isLaterChange(at, before?.at ?? null);
    const values = {
      status: change.status,
      reason: change.reason ?? null,
      torqueApplied: change.torqueApplied ?? null,
      boltsInOrder: change.boltsInOrder ?? null,
      orderDeviation: isStepDeviation(step, change.boltsInOrder),
      value: change.value ?? null,
      valueUnit: change.valueUnit ?? null,
      note: change.note ?? null,
      by: access.user.id,
      at,
      receivedAt: now,
    };
    await tx.insert(checklistStepChanges).values({
      id: randomUUID(),
      teamId: access.team.id,
      checklistId,
      stepId,
      idempotencyKey,
      body: change,
      applied,
      by: access.user.id,
    });
    if (applied)
      await tx
        .insert(checklistSteps)
        .values({ checklistId, stepId, teamId: access.team.id, ...values })
        .onConflictDoUpdate({ target: [checklistSteps.checklistId, checklistSteps.stepId], set: values });
    // A completed checklist whose step changes stays completed: every step still has a record.
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: applied
        ? checklist.status === 'signed-off'
          ? 'step-change-after-sign-off'
          : 'step-change'
        : 'step-change-superseded',
      recordType: 'checklist',
      recordId: checklistId,
      before: before ?? null,
      after: { stepId, ...values },
    });
    const current = await readStep();
    if (!current) throw new Error('the step was not stored');
    return { step: stepRowToView(current, names), applied, replayed: false, checklistStatus: checklist.status };
  });
}

/** Marks a checklist complete: only when every step is done or skipped (409 naming the open ones). */
export async function completeChecklist(access: TeamAccess, checklistId: string, now = new Date()): Promise<void> {
  await requireTeamChecklist(access.team.id, checklistId);
  await write(async (tx) => {
    const checklist = await tx.select().from(checklists).where(eq(checklists.id, checklistId)).get();
    if (!checklist) throw new HttpError(404, 'No such checklist in this team.');
    if (checklist.status !== 'in-progress') return;
    const version = await tx
      .select()
      .from(procedureVersions)
      .where(eq(procedureVersions.id, checklist.procedureVersionId))
      .get();
    const recorded = await tx
      .select({ stepId: checklistSteps.stepId })
      .from(checklistSteps)
      .where(eq(checklistSteps.checklistId, checklistId));
    const open = listOpenSteps(version?.sections ?? [], new Set(recorded.map((row) => row.stepId)));
    if (open.length > 0)
      throw new HttpError(
        409,
        `Not every step is done or skipped yet; still open: ${open.map((step) => step.title).join('; ')}.`,
        Object.fromEntries(open.map((step) => [`steps.${step.id}`, `open: ${step.title}`])),
      );
    await tx
      .update(checklists)
      .set({ status: 'completed', completedAt: now, completedBy: access.user.id })
      .where(eq(checklists.id, checklistId));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'complete',
      recordType: 'checklist',
      recordId: checklistId,
      before: { status: checklist.status },
      after: { status: 'completed' },
    });
  });
}

/** Signs a completed checklist off (crew chief or owner; the guard asks for the team's second factor). */
export async function signOffChecklist(
  access: TeamAccess,
  checklistId: string,
  note: string | undefined,
  now = new Date(),
): Promise<void> {
  await requireTeamChecklist(access.team.id, checklistId);
  await write(async (tx) => {
    const checklist = await tx.select().from(checklists).where(eq(checklists.id, checklistId)).get();
    if (!checklist) throw new HttpError(404, 'No such checklist in this team.');
    if (checklist.status === 'in-progress')
      throw new HttpError(409, 'Complete the checklist first: every step done or skipped, then sign it off.');
    if (checklist.status === 'signed-off') throw new HttpError(409, 'This checklist is already signed off.');
    await tx
      .update(checklists)
      .set({ status: 'signed-off', signedOffAt: now, signedOffBy: access.user.id, signOffNote: note ?? null })
      .where(eq(checklists.id, checklistId));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'sign-off',
      recordType: 'checklist',
      recordId: checklistId,
      before: { status: checklist.status },
      after: { status: 'signed-off', note: note ?? null },
    });
  });
}
