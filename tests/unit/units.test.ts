import { describe, expect, it } from 'vitest';
import {
  decimalsForResolution,
  findResolution,
  formatLength,
  INDICATOR_RESOLUTIONS,
  readLengthEntry,
  lengthToMm,
  mmToLength,
  NM_PER_LBFFT,
  NM_PER_LBFIN,
  nmToTorque,
  torqueToNm,
  torqueUnitToLabel,
} from '../../src/lib/units';
import type { IndicatorResolution, IndicatorResolutionId, LengthUnit, TorqueUnit } from '../../src/lib/units';
import { createRandom, pickBetween } from '../helpers/seeded-random';

function resolution(id: IndicatorResolutionId): IndicatorResolution {
  const found = findResolution(id);
  if (!found) throw new Error(`no resolution ${id}`);
  return found;
}

describe('length conversion', () => {
  it('makes one inch exactly 25.4 mm', () => {
    // NIST SP 811 (2008) App. B
    expect(lengthToMm(1, 'in')).toBe(25.4);
    expect(mmToLength(25.4, 'in')).toBe(1);
  });

  it('leaves millimetres unchanged', () => {
    expect(lengthToMm(0.13, 'mm')).toBe(0.13);
    expect(mmToLength(0.13, 'mm')).toBe(0.13);
  });

  it('keeps the printed inch figures apart from the converted mm figures: they are rounded, not equal', () => {
    // TRADE.md (Units): "0.005 in is 0.127 mm" — 1 in = 25.4 mm exactly (NIST SP 811 (2008) App. B)
    expect(lengthToMm(0.005, 'in')).toBeCloseTo(0.127, 15);
    // TRADE.md (S: GM 1996) prints 0.13 mm beside 0.005 in: 0.13 mm is 0.005118… in, a tenth of a thou more,
    // which an inch dial at 0.0001 in tells apart (NIST SP 811: 0.13 / 25.4).
    expect(Math.abs(mmToLength(0.13, 'in') - 0.005)).toBeGreaterThan(0.0001);
    // (S: both GM manuals) 0.05 mm beside 0.002 in: 0.001969 in, below the printed inch figure.
    expect(mmToLength(0.05, 'in')).toBeLessThan(0.002);
    // (S: Ford 1997) 0.076 mm beside 0.003 in: 0.003 in is 0.0762 mm.
    expect(lengthToMm(0.003, 'in')).toBeCloseTo(0.0762, 15);
  });

  it('round-trips random lengths both ways to 1e-15 relative', () => {
    const random = createRandom(811);
    for (let i = 0; i < 500; i++) {
      const value = pickBetween(random, 0, 10);
      for (const unit of ['in', 'mm'] as LengthUnit[]) {
        expect(mmToLength(lengthToMm(value, unit), unit)).toBeCloseTo(value, 14);
        expect(lengthToMm(mmToLength(value, unit), unit)).toBeCloseTo(value, 14);
      }
    }
  });
});

describe('torque conversion', () => {
  it('uses the exact NIST factors for lbf·in and lbf·ft', () => {
    // NIST SP 811 (2008) App. B
    expect(torqueToNm(1, 'lbf-in')).toBe(0.1129848290276167);
    // eslint-disable-next-line no-loss-of-precision -- the figure as NIST SP 811 prints it
    expect(torqueToNm(1, 'lbf-ft')).toBe(1.3558179483314004);
    expect(torqueToNm(2.5, 'N-m')).toBe(2.5);
  });

  it('derives lbf·in from 1 lbf = 4.4482216152605 N and 1 in = 0.0254 m, and lbf·ft as twelve of them', () => {
    // NIST SP 811 (2008) App. B
    expect(NM_PER_LBFIN).toBeCloseTo(4.4482216152605 * 0.0254, 15);
    expect(NM_PER_LBFFT).toBeCloseTo(12 * NM_PER_LBFIN, 15);
  });

  it('agrees with the preload figures GM prints in both units', () => {
    // TRADE.md (S: GM, 7-1/2 in axle): new 2.7–3.6 N·m (24–32 lbf·in)
    expect(torqueToNm(24, 'lbf-in')).toBeCloseTo(2.7, 1);
    expect(torqueToNm(32, 'lbf-in')).toBeCloseTo(3.6, 1);
    // TRADE.md (S: GM, 8-1/2 and 9-1/2 in axles): new 2.3–2.8 N·m (20–25 lbf·in), used 1.1–1.7 N·m (10–15 lbf·in)
    expect(torqueToNm(20, 'lbf-in')).toBeCloseTo(2.3, 1);
    expect(torqueToNm(25, 'lbf-in')).toBeCloseTo(2.8, 1);
    expect(torqueToNm(10, 'lbf-in')).toBeCloseTo(1.1, 1);
    expect(torqueToNm(15, 'lbf-in')).toBeCloseTo(1.7, 1);
  });

  it('puts the 40–50 ft·lbf pattern-check torque at about 54–68 N·m', () => {
    // TRADE.md (S: GM service manual, 9-1/2 in axle)
    expect(Math.round(torqueToNm(40, 'lbf-ft'))).toBe(54);
    expect(Math.round(torqueToNm(50, 'lbf-ft'))).toBe(68);
  });

  it('round-trips random torques in every unit', () => {
    const random = createRandom(4448);
    for (let i = 0; i < 300; i++) {
      const value = pickBetween(random, 0, 500);
      for (const unit of ['N-m', 'lbf-in', 'lbf-ft'] as TorqueUnit[]) {
        expect(nmToTorque(torqueToNm(value, unit), unit)).toBeCloseTo(value, 11);
        expect(torqueToNm(nmToTorque(value, unit), unit)).toBeCloseTo(value, 11);
      }
    }
  });

  it('labels torque units with the middle dot for display', () => {
    expect(torqueUnitToLabel('lbf-in')).toBe('lbf·in');
    expect(torqueUnitToLabel('lbf-ft')).toBe('lbf·ft');
    expect(torqueUnitToLabel('N-m')).toBe('N·m');
  });
});

describe('indicator resolutions', () => {
  it('lists the five graduations TRADE.md names, with exact mm sizes', () => {
    // TRADE.md (Units): 0.001 in, 0.0005 in, 0.0001 in, 0.01 mm, 0.002 mm; NIST SP 811 (2008) App. B for the mm
    expect(INDICATOR_RESOLUTIONS.map((r) => r.id)).toEqual(['0.001in', '0.0005in', '0.0001in', '0.01mm', '0.002mm']);
    for (const r of INDICATOR_RESOLUTIONS) expect(r.mm).toBeCloseTo(lengthToMm(r.step, r.unit), 15);
    expect(resolution('0.001in').mm).toBe(0.0254);
  });

  it('returns undefined for an unknown resolution id', () => {
    expect(findResolution('0.1in')).toBeUndefined();
  });

  // TRADE.md (Units, CP): d decimals where 10^-d is the largest power of ten not above the graduation in the
  // reader's unit. Each row works the graduation out by hand (NIST SP 811: 1 in = 25.4 mm) and names that power.
  it.each([
    ['0.001in', 'in', 3], //   0.001 in            → 0.001
    ['0.0005in', 'in', 4], //  0.0005 in           → 0.0001
    ['0.0001in', 'in', 4], //  0.0001 in           → 0.0001
    ['0.01mm', 'mm', 2], //    0.01 mm             → 0.01
    ['0.002mm', 'mm', 3], //   0.002 mm            → 0.001
    ['0.001in', 'mm', 2], //   0.0254 mm           → 0.01
    ['0.0005in', 'mm', 2], //  0.0127 mm           → 0.01
    ['0.0001in', 'mm', 3], //  0.00254 mm          → 0.001
    ['0.01mm', 'in', 4], //    0.000394 in         → 0.0001 (TRADE.md's own example)
    ['0.002mm', 'in', 5], //   0.0000787 in        → 0.00001
  ] as const)('shows a %s reading in %s with %i decimals', (id, unit, decimals) => {
    expect(decimalsForResolution(resolution(id), unit)).toBe(decimals);
  });

  it('never shows a place finer than the graduation, nor a coarser place than its leading digit', () => {
    for (const r of INDICATOR_RESOLUTIONS) {
      for (const unit of ['in', 'mm'] as LengthUnit[]) {
        const step = mmToLength(r.mm, unit);
        const decimals = decimalsForResolution(r, unit);
        expect(10 ** -decimals).toBeLessThanOrEqual(step * (1 + 1e-9));
        expect(10 ** -(decimals - 1)).toBeGreaterThan(step);
      }
    }
  });

  it('keeps successive graduations distinct and in order once formatted', () => {
    for (const r of INDICATOR_RESOLUTIONS) {
      for (const unit of ['in', 'mm'] as LengthUnit[]) {
        const shown = Array.from({ length: 120 }, (_, k) => Number(formatLength(k * r.mm, unit, r)));
        for (let k = 1; k < shown.length; k++) expect(shown[k]).toBeGreaterThan(shown[k - 1] as number);
      }
    }
  });
});

describe('formatLength', () => {
  it('accepts a resolution id as stored with an inspection, and refuses an unknown one', () => {
    expect(formatLength(0.2032, 'in', '0.001in')).toBe('0.008');
    expect(() => formatLength(0.2032, 'in', 'x' as IndicatorResolutionId)).toThrow(RangeError);
  });

  it('shows a 0.008 in reading held in mm as 0.008 on a 0.001 in indicator', () => {
    expect(formatLength(lengthToMm(0.008, 'in'), 'in', resolution('0.001in'))).toBe('0.008');
  });

  it('shows an inch reading in mm with no more digits than the dial resolves', () => {
    // 0.003 in = 0.0762 mm (NIST SP 811); a 0.001 in dial is 0.0254 mm: 2 decimals; a 0.0001 in dial: 3 (CP rule)
    expect(formatLength(lengthToMm(0.003, 'in'), 'mm', resolution('0.001in'))).toBe('0.08');
    expect(formatLength(lengthToMm(0.003, 'in'), 'mm', resolution('0.0001in'))).toBe('0.076');
  });

  it('rounds halves away from zero without being thrown by float noise', () => {
    expect(formatLength(0.0127, 'in', resolution('0.0005in'))).toBe('0.0005');
    expect(formatLength(0.125, 'mm', resolution('0.01mm'))).toBe('0.13');
  });

  it('never shows negative zero and keeps the sign of real negatives', () => {
    expect(formatLength(-0.001, 'mm', resolution('0.01mm'))).toBe('0.00');
    expect(formatLength(-0.0254, 'in', resolution('0.001in'))).toBe('-0.001');
  });
});

describe('the entry rule for every length field', () => {
  // The sheet's limits: a reading at most 2.5 mm, a shim at most 5 mm, a depth change at most ±5 mm.
  const reading = { maxMm: 2.5 };
  const shim = { maxMm: 5 };
  const depth = { maxMm: 5, signed: true };

  it('takes a number within the field limit as typed and shows it as read', () => {
    expect(readLengthEntry('0.010', 'in', reading)).toMatchObject({ ok: true, value: 0.01, interpretedAs: 'as-typed' });
    expect(readLengthEntry('.008', 'in', reading)).toMatchObject({ ok: true, value: 0.008, text: '= 0.008 in' });
    expect(readLengthEntry('0,13', 'mm', reading)).toMatchObject({ ok: true, value: 0.13, text: '= 0.13 mm' });
    expect(readLengthEntry('0', 'in', reading)).toMatchObject({ ok: true, value: 0 });
  });

  it('reads a number above the limit as thousandths of an inch when that lands inside it', () => {
    // A half-thousandth dial read as "8.5 thou" (CP): 8.5 in is over 2.5 mm = 0.0984 in; 0.0085 in is inside.
    expect(readLengthEntry('8.5', 'in', reading)).toEqual({
      ok: true,
      value: 0.0085,
      interpretedAs: 'thousandths',
      input: '8.5',
      text: '= 0.0085 in',
    });
    expect(readLengthEntry('  10 ', 'in', reading)).toMatchObject({ value: 0.01, input: '10', text: '= 0.01 in' });
    // A shim "25" (thou) is 0.025 in, never 25 in.
    expect(readLengthEntry('25', 'in', shim)).toMatchObject({ ok: true, value: 0.025, text: '= 0.025 in' });
  });

  it('reads a number above the limit as hundredths of a millimetre on a metric sheet', () => {
    expect(readLengthEntry('13', 'mm', reading)).toMatchObject({ value: 0.13, interpretedAs: 'hundredths' });
    // Within the limit a metric number is taken as typed: 2 mm is a possible (if large) figure.
    expect(readLengthEntry('2', 'mm', reading)).toMatchObject({ value: 2, interpretedAs: 'as-typed' });
  });

  it('reads a signed depth change the same way', () => {
    expect(readLengthEntry('-4', 'in', depth)).toMatchObject({ ok: true, value: -0.004, interpretedAs: 'thousandths' });
    expect(readLengthEntry('-4', 'in', shim)).toMatchObject({ ok: false, code: 'negative' });
  });

  it('refuses a number too large even as thousandths, in the entry unit', () => {
    // 250 thou = 0.25 in, over 5 mm = 0.1969 in (NIST SP 811: 5 / 25.4)
    expect(readLengthEntry('250', 'in', shim)).toEqual({
      ok: false,
      code: 'too-large',
      input: '250',
      text: '"250" is over 0.1969 in, even read as thousandths.',
    });
    expect(readLengthEntry('600', 'mm', shim)).toMatchObject({ ok: false, text: expect.stringContaining('5 mm') });
  });

  it('rejects empty and non-numeric entries with a code', () => {
    expect(readLengthEntry('  ', 'in', reading)).toMatchObject({ ok: false, code: 'empty' });
    for (const text of ['abc', '1e-3', '0.01.2', '0x10', '1 0']) {
      expect(readLengthEntry(text, 'in', reading)).toMatchObject({ ok: false, code: 'not-a-number' });
    }
  });
});
