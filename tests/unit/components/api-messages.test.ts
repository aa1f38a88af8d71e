import { describe, expect, it } from 'vitest';
import { fieldMessage, problemToSummary } from '../../../src/components/shared/api';

describe('messages from the API on a form', () => {
  it('puts the schema’s own message beside its field', () => {
    const problem = {
      status: 400,
      message: 'elapsedSeconds: Elapsed time must be a number. (1 more field to fix)',
      fields: { elapsedSeconds: 'Elapsed time must be a number.', speedMph: 'Speed must be more than 0.' },
    };
    expect(fieldMessage(problem, 'elapsedSeconds')).toBe('Elapsed time must be a number.');
    expect(fieldMessage(problem, 'speedMph')).toBe('Speed must be more than 0.');
    expect(fieldMessage(problem, 'notes')).toBeUndefined();
    expect(problemToSummary(problem)).toBe('2 fields need fixing; see the messages beside them.');
  });

  it('prefers the longer sentence of a conflict over its short field note', () => {
    const problem = {
      status: 409,
      message: 'serial: the team already has a gear-set with serial GS-1.',
      fields: { serial: 'already used' },
    };
    expect(fieldMessage(problem, 'serial')).toBe('The team already has a gear-set with serial GS-1.');
    expect(problemToSummary(problem)).toBe('The team already has a gear-set with serial GS-1.');
  });

  it('keeps a message that names no field as it is', () => {
    const problem = {
      status: 409,
      message: 'It is already installed in assembly RE-01 (Ember rear end) since 2026-05-12 08:00; remove it first.',
      fields: { partId: 'installed in assembly RE-01 (Ember rear end)' },
    };
    expect(problemToSummary(problem)).toBe(problem.message);
  });
});
