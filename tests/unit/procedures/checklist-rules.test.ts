import { describe, expect, it } from 'vitest';
import {
  checkChangeAgainstStep,
  isLaterChange,
  isStepDeviation,
  listOpenSteps,
} from '../../../src/lib/procedures/checklist-rules';
import type { ProcedureSection, ProcedureStep } from '../../../src/lib/procedures/model';
import { stepChangeSchema } from '../../../src/lib/procedures/schemas';

const ringBolts: ProcedureStep = {
  id: 'ring',
  title: 'Ring gear bolts',
  fasteners: {
    count: 5,
    torque: { value: 50, unit: 'lbf-ft' },
    torqueSource: 'test',
    passesPercent: [30, 70, 100],
    sequence: true,
  },
};
const drain: ProcedureStep = { id: 'drain', title: 'Drain the oil' };
const change = (body: unknown) => stepChangeSchema.parse(body);

describe('checklist rules', () => {
  it('marks bolts tapped out of the engine’s order as a deviation (5 bolts: 1, 3, 5, 2, 4)', () => {
    expect(isStepDeviation(ringBolts, [1, 3, 5, 2, 4])).toBe(false);
    expect(isStepDeviation(ringBolts, [1, 2, 3, 4, 5])).toBe(true);
    expect(isStepDeviation(drain, [1, 2, 3])).toBe(false);
  });

  it('refuses what a step cannot take, naming the field', () => {
    expect(checkChangeAgainstStep(ringBolts, change({ status: 'done', boltsInOrder: [1, 3, 5, 2] }))).toHaveProperty(
      'boltsInOrder',
    );
    expect(
      checkChangeAgainstStep(
        ringBolts,
        change({ status: 'done', torqueApplied: [{ pass: 4, value: 1, unit: 'N-m' }] }),
      ),
    ).toHaveProperty('torqueApplied');
    expect(checkChangeAgainstStep(drain, change({ status: 'done', boltsInOrder: [1, 2, 3] }))).toHaveProperty(
      'boltsInOrder',
    );
    expect(checkChangeAgainstStep(drain, change({ status: 'done', value: 1, valueUnit: 'mm' }))).toHaveProperty(
      'value',
    );
    expect(checkChangeAgainstStep(ringBolts, change({ status: 'done', boltsInOrder: [1, 3, 5, 2, 4] }))).toEqual({});
  });

  it('keeps the change made later on its device, whichever arrives last', () => {
    const earlier = new Date('2026-06-01T10:00:00Z');
    const later = new Date('2026-06-01T10:01:00Z');
    expect(isLaterChange(later, earlier)).toBe(true);
    expect(isLaterChange(earlier, later)).toBe(false);
    expect(isLaterChange(earlier, null)).toBe(true);
  });

  it('names the open steps in order, with their sections', () => {
    const sections: ProcedureSection[] = [
      { id: 's1', title: 'Teardown', steps: [drain] },
      { id: 's2', title: 'Set-up', steps: [ringBolts] },
    ];
    expect(listOpenSteps(sections, new Set(['drain']))).toEqual([{ id: 'ring', title: 'Set-up › Ring gear bolts' }]);
  });
});
