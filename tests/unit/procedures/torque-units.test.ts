import { describe, expect, it } from 'vitest';
import {
  convertTorque,
  formatTorque,
  groupToPassTorques,
  isBoltPermutation,
} from '../../../src/lib/procedures/fasteners';

// NIST SP 811 (2008), Appendix B (exact from 1 in = 25.4 mm, 1 lb = 0.45359237 kg, g = 9.80665 m/s²):
// 1 lbf·ft = 1.3558179483314004 N·m, 1 lbf·in = 0.1129848290276167 N·m (TRADE.md, Units).
// eslint-disable-next-line no-loss-of-precision -- every digit NIST prints, as units.ts keeps it
const NIST_SP_811_NM_PER_LBFFT = 1.3558179483314004;
const NIST_SP_811_NM_PER_LBFIN = 0.1129848290276167;

describe('torque conversions (NIST SP 811, 2008, App. B)', () => {
  it('converts lbf·ft to N·m and back', () => {
    expect(convertTorque({ value: 1, unit: 'lbf-ft' }, 'N-m').value).toBeCloseTo(NIST_SP_811_NM_PER_LBFFT, 15);
    expect(convertTorque({ value: 100, unit: 'lbf-ft' }, 'N-m').value).toBeCloseTo(135.58179483314004, 12);
    expect(convertTorque({ value: NIST_SP_811_NM_PER_LBFFT, unit: 'N-m' }, 'lbf-ft').value).toBeCloseTo(1, 15);
    expect(convertTorque({ value: 135.58179483314004, unit: 'N-m' }, 'lbf-ft').value).toBeCloseTo(100, 12);
  });

  it('converts lbf·in to N·m and back', () => {
    expect(convertTorque({ value: 1, unit: 'lbf-in' }, 'N-m').value).toBeCloseTo(NIST_SP_811_NM_PER_LBFIN, 15);
    expect(convertTorque({ value: 24, unit: 'lbf-in' }, 'N-m').value).toBeCloseTo(2.7116358966628, 12);
    expect(convertTorque({ value: 2.7116358966628, unit: 'N-m' }, 'lbf-in').value).toBeCloseTo(24, 11);
  });

  it('converts lbf·ft to lbf·in (12 in to the foot) both ways', () => {
    expect(convertTorque({ value: 10, unit: 'lbf-ft' }, 'lbf-in').value).toBeCloseTo(120, 11);
    expect(convertTorque({ value: 120, unit: 'lbf-in' }, 'lbf-ft').value).toBeCloseTo(10, 11);
  });

  it('shows passes as torques in the reader’s unit', () => {
    const group = {
      count: 10,
      torque: { value: 100, unit: 'lbf-ft' as const },
      torqueSource: 'part maker’s sheet',
      passesPercent: [30, 70, 100],
      sequence: true,
    };
    expect(groupToPassTorques(group, 'lbf-ft').map((p) => p.value)).toEqual([30, 70, 100]);
    const nm = groupToPassTorques(group, 'N-m').map((p) => p.value!);
    expect(nm[2]).toBeCloseTo(100 * NIST_SP_811_NM_PER_LBFFT, 12);
    expect(nm[0]).toBeCloseTo(30 * NIST_SP_811_NM_PER_LBFFT, 12);
    expect(formatTorque(nm[2]!, 'N-m')).toBe('136 N·m');
    expect(formatTorque(nm[0]!, 'N-m')).toBe('40.7 N·m');
  });

  it('knows a permutation of 1…N from anything else', () => {
    expect(isBoltPermutation([1, 3, 5, 2, 4], 5)).toBe(true);
    expect(isBoltPermutation([1, 3, 5, 2], 5)).toBe(false);
    expect(isBoltPermutation([1, 3, 5, 2, 2], 5)).toBe(false);
    expect(isBoltPermutation([0, 1, 2, 3, 4], 5)).toBe(false);
  });
});
