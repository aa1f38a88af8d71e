import { describe, expect, it } from 'vitest';
import { verdictsToRows } from '../../../src/lib/charts/verdict-rows';

describe('verdictsToRows', () => {
  it('words each verdict with its value, limit and margin in the indicator’s digits', () => {
    const rows = verdictsToRows(
      [
        {
          measure: 'backlash-max-point',
          value: 0.009,
          verdict: 'near-limit',
          limit: 'max',
          limitValue: 0.009055,
          margin: 0.000055,
          unit: 'in',
        },
        {
          measure: 'runout-measured',
          value: 0.004,
          verdict: 'out-of-band',
          limit: 'max',
          limitValue: 0.003,
          margin: -0.001,
          unit: 'in',
        },
        {
          measure: 'pinion-preload-used',
          value: 10.000000002,
          verdict: 'in-band',
          limit: 'min',
          limitValue: 8.8507,
          margin: 1.1493,
          unit: 'lbf-in',
        },
        { measure: 'hub-left', value: 1, verdict: 'in-band', limit: 'min', limitValue: 1, margin: 1, unit: 'check' },
      ],
      1,
      '0.001in',
    );
    expect(rows[0]).toMatchObject({
      label: 'Backlash at the loosest point',
      valueText: '0.009 in',
      limitText: 'upper 0.009 in',
      marginText: '0.000 in inside',
      verdict: 'near-limit',
    });
    expect(rows[1]).toMatchObject({ label: 'Back-face runout, measured (TIR)', marginText: '0.001 in beyond' });
    expect(rows[2]).toMatchObject({ valueText: '10.0 lbf·in', limitText: 'lower 8.9 lbf·in' });
    expect(rows[3]).toMatchObject({ valueText: 'effort unchanged', marginText: '—' });
  });

  it('tells the runout estimated from the lash from the measured one', () => {
    const estimate = {
      measure: 'runout',
      value: 0.002,
      verdict: 'in-band',
      limit: 'max',
      limitValue: 0.003,
      margin: 0.001,
      unit: 'in',
    } as const;
    // Summaries are made on read, so 'runout' is always the estimate and 'runout-measured' the back face.
    expect(verdictsToRows([estimate], 0, '0.001in')[0]!.label).toBe('Runout estimated from the lash (TIR)');
    const measured = { ...estimate, measure: 'runout-measured' } as const;
    expect(verdictsToRows([measured], 0, '0.001in')[0]!.label).toBe('Back-face runout, measured (TIR)');
    // The limit as published: 0.003 in (S: Ford 1997), with what it was judged at.
    const row = verdictsToRows(
      [{ ...estimate, limitText: '0.003', judgedAt: 'judged at the 0.001 in graduation' }],
      0,
      '0.001in',
    )[0]!;
    expect(row.limitText).toBe('upper 0.003 in');
    expect(row.judgedAt).toBe('judged at the 0.001 in graduation');
  });
});
