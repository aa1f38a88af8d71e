import type { CompoundKind, ProcedureSection, StepRecords } from '../../lib/procedures/model';
import type { TorqueUnit } from '../../lib/units';

/**
 * The procedure editor's working copy: every field as typed (numbers stay text until saved), and a
 * local key per section and step for React and the sortable list. `toProcedureBody` turns it into the
 * body the API's schema checks; the server's 400 names any field at fault.
 */
export interface EditorStep {
  key: string;
  id?: string;
  title: string;
  instructions: string;
  caution: string;
  records: StepRecords | '';
  hasFasteners: boolean;
  count: string;
  description: string;
  torqueValue: string;
  torqueUnit: TorqueUnit;
  torqueSource: string;
  passes: string;
  sequence: boolean;
  compoundKind: CompoundKind | '';
  compoundNote: string;
}

export interface EditorSection {
  key: string;
  id?: string;
  title: string;
  steps: EditorStep[];
}

export interface EditorState {
  name: string;
  purpose: string;
  appliesTo: string;
  notes: string;
  sections: EditorSection[];
}

let counter = 0;
const nextKey = () => `k${(counter += 1)}`;

export function newStep(): EditorStep {
  return {
    key: nextKey(),
    title: '',
    instructions: '',
    caution: '',
    records: '',
    hasFasteners: false,
    count: '',
    description: '',
    torqueValue: '',
    torqueUnit: 'lbf-ft',
    torqueSource: '',
    passes: '100',
    sequence: false,
    compoundKind: '',
    compoundNote: '',
  };
}

export function newSection(): EditorSection {
  return { key: nextKey(), title: '', steps: [newStep()] };
}

/** The editor's copy of a stored version. */
export function sectionsToEditor(sections: readonly ProcedureSection[]): EditorSection[] {
  return sections.map((section) => ({
    key: nextKey(),
    id: section.id,
    title: section.title,
    steps: section.steps.map((step) => {
      const group = step.fasteners;
      return {
        ...newStep(),
        id: step.id,
        title: step.title,
        instructions: step.instructions ?? '',
        caution: step.caution ?? '',
        records: step.records ?? '',
        hasFasteners: Boolean(group),
        count: group ? String(group.count) : '',
        description: group?.description ?? '',
        torqueValue: group?.torque ? String(group.torque.value) : '',
        torqueUnit: group?.torque?.unit ?? 'lbf-ft',
        torqueSource: group?.torqueSource ?? '',
        passes: group ? group.passesPercent.join(', ') : '100',
        sequence: group?.sequence ?? false,
        compoundKind: group?.compound?.kind ?? '',
        compoundNote: group?.compound?.note ?? '',
      };
    }),
  }));
}

const numberOf = (text: string): number => (text.trim() === '' ? Number.NaN : Number(text.replace(',', '.')));
const optional = (text: string) => (text.trim() ? text.trim() : undefined);

/** The JSON body of POST /api/procedures or PUT /api/procedures/:id. */
export function toProcedureBody(state: EditorState): Record<string, unknown> {
  return {
    name: state.name.trim(),
    purpose: optional(state.purpose),
    appliesTo: optional(state.appliesTo),
    notes: optional(state.notes),
    sections: state.sections.map((section) => ({
      ...(section.id ? { id: section.id } : {}),
      title: section.title.trim(),
      steps: section.steps.map((step) => ({
        ...(step.id ? { id: step.id } : {}),
        title: step.title.trim(),
        instructions: optional(step.instructions),
        caution: optional(step.caution),
        records: step.records || undefined,
        fasteners: step.hasFasteners
          ? {
              count: numberOf(step.count),
              description: optional(step.description),
              torque: step.torqueValue.trim()
                ? { value: numberOf(step.torqueValue), unit: step.torqueUnit }
                : undefined,
              torqueSource: optional(step.torqueSource),
              passesPercent: step.passes
                .split(/[\s,/]+/)
                .filter(Boolean)
                .map(numberOf),
              sequence: step.sequence,
              compound: step.compoundKind ? { kind: step.compoundKind, note: optional(step.compoundNote) } : undefined,
            }
          : undefined,
      })),
    })),
  };
}
