// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import ChangeTable from '../../../../src/components/charts/ChangeTable';
import VerdictTable from '../../../../src/components/charts/VerdictTable';
import { ActionMark, VerdictMark } from '../../../../src/components/charts/marks';
import type { ComparisonShape } from '../../../../src/lib/charts/comparison';

afterEach(cleanup);

const comparison: ComparisonShape = {
  before: { id: 'a', title: '28 Sep 2026, run 37' },
  after: { id: 'b', title: '26 Oct 2026, run 44' },
  unit: 'in',
  thresholdText: '0.002 in',
  rows: [
    {
      measure: 'mean',
      label: 'Mean backlash',
      beforeText: '0.008 in',
      afterText: '0.009 in',
      deltaText: '+0.001 in',
      delta: 0.001,
      flagged: false,
      note: 'Within 0.002 in: the indicator could account for it.',
    },
    {
      measure: 'max',
      label: 'Loosest reading (max)',
      beforeText: '0.008 in',
      afterText: '0.011 in',
      deltaText: '+0.003 in',
      delta: 0.003,
      flagged: true,
      note: 'Changed by more than 0.002 in: more than the indicator explains.',
    },
  ],
  flaggedCount: 1,
  summary: '1 of 2 figures changed by more than 0.002 in: loosest reading (max).',
};

describe('ChangeTable', () => {
  it('says when there is nothing to compare with', () => {
    render(<ChangeTable comparison={null} />);
    expect(screen.getByTestId('change-table-empty').textContent).toMatch(/first inspection/);
  });

  it('marks only the flagged change, in words and a shape, not colour alone', () => {
    render(<ChangeTable comparison={comparison} />);
    const rows = within(screen.getByTestId('change-table')).getAllByRole('row').slice(1);
    expect(rows[0]!.getAttribute('data-flagged')).toBe('false');
    expect(rows[0]!.textContent).not.toContain('changed');
    expect(rows[1]!.getAttribute('data-flagged')).toBe('true');
    expect(rows[1]!.textContent).toContain('+0.003 inchanged');
    expect(rows[1]!.querySelector('svg')).not.toBeNull();
    expect(rows[1]!.textContent).toContain('more than the indicator explains');
    expect(screen.getByRole('link', { name: '28 Sep 2026, run 37' }).getAttribute('href')).toBe('/inspections/a');
  });
});

describe('VerdictTable', () => {
  it('says when there is nothing to judge', () => {
    render(<VerdictTable verdicts={[]} engineCount={0} resolution="0.001in" />);
    expect(screen.getByTestId('verdict-table-empty')).toBeTruthy();
  });

  it('writes each verdict as a word beside its value and limit', () => {
    render(
      <VerdictTable
        verdicts={[
          {
            measure: 'spread',
            value: 0.003,
            verdict: 'out-of-band',
            limit: 'max',
            limitValue: 0.002,
            margin: -0.001,
            unit: 'in',
          },
        ]}
        engineCount={1}
        resolution="0.001in"
      />,
    );
    const row = within(screen.getByTestId('verdict-table')).getAllByRole('row')[1]!;
    expect(within(row).getByRole('rowheader').textContent).toBe('Spread');
    expect(row.textContent).toContain('0.003 in');
    expect(row.textContent).toContain('upper 0.002 in');
    expect(row.textContent).toContain('0.001 in beyond');
    expect(row.textContent).toContain('Out of band');
  });
});

describe('marks', () => {
  it('give every verdict and action a word', () => {
    render(
      <>
        <VerdictMark verdict="near-limit" />
        <ActionMark action="re-shim" withHint />
        <ActionMark action={null} />
      </>,
    );
    expect(screen.getByText('Near a limit')).toBeTruthy();
    expect(screen.getByText(/Re-shim/).textContent).toBe('Re-shim — set it up again');
    expect(screen.getByText('no inspection yet')).toBeTruthy();
  });
});
