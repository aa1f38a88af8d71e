import type { TorqueUnit } from '../units';

/**
 * A procedure as stored in one version: ordered sections of ordered steps. Ids are kept from version
 * to version when the editor sends them, so a photo or a checklist's record of a step keeps its step.
 */

export const COMPOUND_KINDS = ['thread-locker', 'sealant', 'lubricant', 'other'] as const;
export type CompoundKind = (typeof COMPOUND_KINDS)[number];

export const STEP_RECORDS = ['turning-torque', 'backlash', 'runout', 'note'] as const;
export type StepRecords = (typeof STEP_RECORDS)[number];

export interface Torque {
  value: number;
  unit: TorqueUnit;
}

export interface Compound {
  kind: CompoundKind;
  note?: string;
}

/** A group of fasteners tightened together: its figure, passes and, for a bolt circle, the cross order. */
export interface FastenerGroup {
  count: number;
  description?: string;
  torque?: Torque;
  torqueSource?: string;
  /** Rising percentages of the figure, ending at 100. */
  passesPercent: number[];
  /** Whether the engine's cross tightening order applies (3–36 bolts). */
  sequence: boolean;
  compound?: Compound;
}

export interface ProcedureStep {
  id: string;
  title: string;
  instructions?: string;
  caution?: string;
  fasteners?: FastenerGroup;
  records?: StepRecords;
}

export interface ProcedureSection {
  id: string;
  title: string;
  steps: ProcedureStep[];
}

/** Every step of a version, in order, with the section it sits in. */
export function listSteps(sections: readonly ProcedureSection[]): { section: ProcedureSection; step: ProcedureStep }[] {
  return sections.flatMap((section) => section.steps.map((step) => ({ section, step })));
}

/** The step with this id in these sections, or undefined. */
export function findStep(sections: readonly ProcedureSection[], stepId: string): ProcedureStep | undefined {
  return listSteps(sections).find(({ step }) => step.id === stepId)?.step;
}

/** A torque applied on one pass, as the technician entered it. */
export interface AppliedTorque {
  pass: number;
  value: number;
  unit: TorqueUnit;
}
