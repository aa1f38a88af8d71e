import { describe, expect, it } from 'vitest';
import { summariseBacklash } from '../../../src/lib/analysis';
import {
  findPreviousInspection,
  pickComparePair,
  shapeComparison,
  type ComparableInspection,
} from '../../../src/lib/charts/comparison';

function inspection(
  id: string,
  runs: number,
  readings: number[],
  options: { resolution?: string; step?: number; tir?: number | null; torque?: number; status?: string } = {},
): ComparableInspection {
  return {
    id,
    status: options.status ?? 'submitted',
    inspectedAt: `2026-06-${String(10 + runs).padStart(2, '0')}T16:00:00.000Z`,
    runsAtInspection: runs,
    resolution: options.resolution ?? '0.001in',
    readings,
    unit: 'in',
    canonical: { preload: { pinionNm: 1.13, bearings: 'used' } },
    summary: {
      unit: 'in',
      torqueUnit: 'lbf-in',
      resolution: options.step ?? 0.001,
      backlash: summariseBacklash(readings),
      runoutTir: options.tir === undefined ? 0.001 : options.tir,
      verdicts:
        options.torque === undefined ? [] : [{ measure: 'pinion-preload-used', value: options.torque, unit: 'lbf-in' }],
    },
  };
}

describe('shapeComparison', () => {
  it('flags only changes larger than two graduations of the coarser indicator', () => {
    const before = inspection('a', 10, [0.006, 0.006, 0.006, 0.006], { resolution: '0.0005in', step: 0.0005 });
    const after = inspection('b', 20, [0.009, 0.007, 0.007, 0.007], { tir: 0.004 });
    const rows = new Map(shapeComparison(before, after).rows.map((r) => [r.measure, r]));
    // Threshold 2 × 0.001 in (the coarser): max +0.003 and TIR +0.003 are flagged; mean +0.0015 and spread +0.002 (equal) are not.
    expect(rows.get('max')).toMatchObject({ flagged: true, deltaText: '+0.003 in' });
    expect(rows.get('mean')!.flagged).toBe(false);
    expect(rows.get('min')).toMatchObject({ flagged: false, beforeText: '0.0060 in', afterText: '0.007 in' });
    expect(rows.get('tir')).toMatchObject({ flagged: true, label: 'Runout, TIR (back face, measured)' });
    const shape = shapeComparison(before, after);
    expect(shape.thresholdText).toBe('0.002 in');
    expect(shape.flaggedCount).toBe(2);
  });

  it('does not flag a change equal to the threshold', () => {
    const rows = shapeComparison(
      inspection('a', 0, [0.006, 0.006, 0.006]),
      inspection('b', 5, [0.008, 0.008, 0.008]),
    ).rows;
    expect(rows.find((r) => r.measure === 'mean')).toMatchObject({ flagged: false, deltaText: '+0.002 in' });
  });

  it('writes a fall with a true minus and adds the torque without judging it', () => {
    const shape = shapeComparison(
      inspection('a', 0, [0.009, 0.009, 0.009], { torque: 26 }),
      inspection('b', 5, [0.006, 0.006, 0.006], { torque: 10 }),
    );
    expect(shape.rows.find((r) => r.measure === 'mean')!.deltaText).toBe('−0.003 in');
    expect(shape.rows.at(-1)).toMatchObject({ measure: 'pinion-preload', deltaText: '−16.0 lbf·in', flagged: false });
  });
});

describe('choosing inspections', () => {
  const list = [
    inspection('c', 30, [0.008, 0.008, 0.008]),
    inspection('a', 10, [0.007, 0.007, 0.007]),
    inspection('d', 35, [0.008, 0.008, 0.008], { status: 'draft' }),
    inspection('b', 20, [0.0075, 0.0075, 0.0075]),
  ];

  it('defaults to the latest and the one before', () => {
    const pair = pickComparePair(list, null, null);
    expect([pair.before!.id, pair.after!.id]).toEqual(['b', 'c']);
    expect(pair.defaulted).toBe(false);
  });

  it('takes any two of the set, older on the left', () => {
    const pair = pickComparePair(list, 'c', 'a');
    expect([pair.before!.id, pair.after!.id]).toEqual(['a', 'c']);
  });

  it('falls back to the default for a draft, an unknown id or the same one twice', () => {
    for (const [a, b] of [
      ['a', 'd'],
      ['a', 'zzz'],
      ['a', 'a'],
    ] as const) {
      const pair = pickComparePair(list, a, b);
      expect([pair.before!.id, pair.after!.id, pair.defaulted]).toEqual(['b', 'c', true]);
    }
  });

  it('has nothing to compare with fewer than two submitted', () => {
    const pair = pickComparePair([list[0]!], null, null);
    expect(pair.before).toBeNull();
    expect(pair.after!.id).toBe('c');
  });

  it('finds the previous inspection in run order, and none for the first', () => {
    expect(findPreviousInspection(list, 'c')!.id).toBe('b');
    expect(findPreviousInspection(list, 'a')).toBeNull();
    expect(findPreviousInspection(list, 'd')!.id).toBe('c');
  });
});
