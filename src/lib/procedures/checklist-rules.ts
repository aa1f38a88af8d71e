import { groupToSequence, isBoltPermutation, isOrderDeviation } from './fasteners';
import { listSteps, type ProcedureSection, type ProcedureStep } from './model';
import type { StepChange } from './schemas';

/**
 * The rules of a checklist that need no database: what a step accepts, whether bolts left the
 * engine's order, which change of two wins, and which steps are still open.
 */

export const CHECKLIST_STATUSES = ['in-progress', 'completed', 'signed-off'] as const;
export type ChecklistStatus = (typeof CHECKLIST_STATUSES)[number];

/** The fields of a change this step cannot take, each with what to fix; empty when it fits. */
export function checkChangeAgainstStep(step: ProcedureStep, change: StepChange): Record<string, string> {
  const errors: Record<string, string> = {};
  const group = step.fasteners;
  if (change.torqueApplied?.length) {
    if (!group) errors.torqueApplied = 'torqueApplied: this step has no fastener group.';
    else {
      const beyond = change.torqueApplied.find((applied) => applied.pass > group.passesPercent.length);
      if (beyond)
        errors.torqueApplied = `torqueApplied: pass ${beyond.pass} does not exist; this group has ${group.passesPercent.length}.`;
    }
  }
  if (change.boltsInOrder) {
    if (!group?.sequence) errors.boltsInOrder = 'boltsInOrder: this step has no tightening order.';
    else if (!isBoltPermutation(change.boltsInOrder, group.count))
      errors.boltsInOrder = `boltsInOrder: every bolt from 1 to ${group.count} once, in the order they were tightened.`;
  }
  if (change.value !== undefined && !step.records)
    errors.value = 'value: this step records nothing; put what you saw in note.';
  return errors;
}

/** Whether bolts tapped in this order left the engine's order for the step (false without an order). */
export function isStepDeviation(step: ProcedureStep, boltsInOrder: readonly number[] | undefined | null): boolean {
  const group = step.fasteners;
  if (!group || !boltsInOrder?.length) return false;
  const sequence = groupToSequence(group);
  return sequence !== null && isOrderDeviation(boltsInOrder, sequence);
}

/**
 * Two tablets changing one step: the change made later on its device wins, whichever arrives last;
 * the audit trail keeps both. A tie goes to the one that arrives last.
 * @example isLaterChange(new Date('2026-06-01T10:00Z'), new Date('2026-06-01T09:59Z')) // true
 */
export function isLaterChange(incomingAt: Date, storedAt: Date | null): boolean {
  return storedAt === null || incomingAt.getTime() >= storedAt.getTime();
}

/** The steps with no record yet, in order, as "section › step" titles with their ids. */
export function listOpenSteps(
  sections: readonly ProcedureSection[],
  recorded: ReadonlySet<string>,
): { id: string; title: string }[] {
  return listSteps(sections)
    .filter(({ step }) => !recorded.has(step.id))
    .map(({ section, step }) => ({ id: step.id, title: `${section.title} › ${step.title}` }));
}
