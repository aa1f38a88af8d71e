import { describe, expect, it } from 'vitest';
import { decisionToView, latestDecisions, reinspectionText } from '../../../src/lib/reviews/latest-decision';

const row = (gearSetId: string, day: number, decision: 'keep' | 'reshim' | 'retire' = 'keep') => ({
  reviewId: `r-${gearSetId}-${day}`,
  gearSetId,
  decision,
  reason: 'why',
  decidedAt: new Date(Date.UTC(2026, 4, day)),
  decidedByName: 'Sam',
  reinspectAtRuns: decision === 'retire' ? null : 49,
});

describe('a set’s latest decision', () => {
  it('is the one decided last, whatever order the rows come in', () => {
    const latest = latestDecisions([row('a', 3), row('a', 9, 'reshim'), row('a', 5), row('b', 1)]);
    expect(latest.get('a')?.decision).toBe('reshim');
    expect(latest.get('b')?.reviewId).toBe('r-b-1');
  });

  it('counts down to its re-inspection point, then says it is due', () => {
    expect(reinspectionText(49, 43)).toEqual({ text: 're-inspect due in 6 runs (at 49)', due: false });
    expect(reinspectionText(49, 48)).toEqual({ text: 're-inspect due in 1 run (at 49)', due: false });
    expect(reinspectionText(49, 49)).toEqual({ text: 're-inspection due now (at 49)', due: true });
    expect(reinspectionText(49, 51)).toEqual({ text: 're-inspection due now (at 49; 2 runs past it)', due: true });
    expect(reinspectionText(null, 51)).toEqual({ text: null, due: false });
  });

  it('names the decision in words, and a retired set has no re-inspection point', () => {
    expect(decisionToView(row('a', 2, 'reshim'), 40)).toMatchObject({
      label: 'Re-shim and re-inspect',
      by: 'Sam',
      dueText: 're-inspect due in 9 runs (at 49)',
    });
    expect(decisionToView(row('a', 2, 'retire'), 60)).toMatchObject({ label: 'Retire', dueText: null, due: false });
  });
});
