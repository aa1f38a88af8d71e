import type { TorqueUnit } from '../units';
import { EXAMPLE_FIGURE_NOTICE, THREAD_LOCKER_CAUTION } from './cautions';
import { formatTorque, groupToPassTorques, groupToSequence, type PassTorque } from './fasteners';
import { instructionsToHtml } from './markdown';
import type { ProcedureSection, StepRecords } from './model';

/**
 * A step as the reading view, the checklist runner and the printed sheet show it, computed on the
 * server: instructions already rendered, the cautions it carries (its own, and the thread-locker
 * caution whenever its compound is one), the figure and passes in the reader's unit.
 */
export interface StepDisplay {
  id: string;
  number: string;
  title: string;
  instructionsHtml: string;
  cautions: string[];
  records: StepRecords | null;
  fasteners: {
    count: number;
    description: string | null;
    figure: string | null;
    figureUnit: TorqueUnit | null;
    source: string | null;
    example: boolean;
    passes: PassTorque[];
    sequence: number[] | null;
    compound: string | null;
  } | null;
}

export interface SectionDisplay {
  id: string;
  title: string;
  steps: StepDisplay[];
}

const COMPOUND_LABELS = {
  'thread-locker': 'Thread-locker',
  sealant: 'Sealant',
  lubricant: 'Lubricant',
  other: 'Compound',
} as const;

/** The sections of a version ready to show, torques in `unit`; `example` marks invented demo figures. */
export function sectionsToDisplay(
  sections: readonly ProcedureSection[],
  unit: TorqueUnit,
  example = false,
): SectionDisplay[] {
  return sections.map((section, s) => ({
    id: section.id,
    title: section.title,
    steps: section.steps.map((step, i) => {
      const group = step.fasteners;
      const cautions = [step.caution, group?.compound?.kind === 'thread-locker' ? THREAD_LOCKER_CAUTION : undefined];
      return {
        id: step.id,
        number: `${s + 1}.${i + 1}`,
        title: step.title,
        instructionsHtml: instructionsToHtml(step.instructions),
        cautions: cautions.filter((c): c is string => Boolean(c)),
        records: step.records ?? null,
        fasteners: group
          ? {
              count: group.count,
              description: group.description ?? null,
              figure: group.torque
                ? `${formatTorque(group.torque.value, group.torque.unit)}${
                    group.torque.unit === unit
                      ? ''
                      : ` (${formatTorque(groupToPassTorques(group, unit).at(-1)!.value!, unit)})`
                  }${example ? ` — ${EXAMPLE_FIGURE_NOTICE}` : ''}`
                : null,
              figureUnit: group.torque?.unit ?? null,
              source: group.torqueSource ?? null,
              example,
              passes: groupToPassTorques(group, unit),
              sequence: groupToSequence(group) ? [...groupToSequence(group)!] : null,
              compound: group.compound
                ? `${COMPOUND_LABELS[group.compound.kind]}${group.compound.note ? `: ${group.compound.note}` : ''}`
                : null,
            }
          : null,
      };
    }),
  }));
}
