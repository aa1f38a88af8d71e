import { describe, expect, it } from 'vitest';
import {
  decimalsForResolution,
  findResolution,
  formatLength,
  INDICATOR_RESOLUTIONS,
  interpretIndicatorEntry,
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

  it('matches the inch figures the GM and Ford manuals print beside their mm figures', () => {
    // TRADE.md (S: GM light-truck service manual, 8-5/8 in ring gear axle, 1996): 0.13–0.23 mm (0.005–0.009 in)
    expect(mmToLength(0.13, 'in')).toBeCloseTo(0.005, 3);
    expect(mmToLength(0.23, 'in')).toBeCloseTo(0.009, 3);
    // TRADE.md (S: both GM manuals): 0.05 mm (0.002 in); (S: Ford light-truck service manual, 1997): 0.076 mm (0.003 in)
    expect(mmToLength(0.05, 'in')).toBeCloseTo(0.002, 3);
    expect(mmToLength(0.076, 'in')).toBeCloseTo(0.003, 4);
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

  it.each([
    ['0.001in', 'in', 3],
    ['0.0005in', 'in', 4],
    ['0.0001in', 'in', 4],
    ['0.01mm', 'mm', 2],
    ['0.002mm', 'mm', 3],
    ['0.001in', 'mm', 3],
    ['0.0005in', 'mm', 3],
    ['0.0001in', 'mm', 4],
    ['0.01mm', 'in', 5],
    ['0.002mm', 'in', 6],
  ] as const)('shows a %s reading in %s with %i decimals', (id, unit, decimals) => {
    expect(decimalsForResolution(resolution(id), unit)).toBe(decimals);
  });

  it('never shows a coarser place than the graduation, nor more than one digit past its leading digit', () => {
    for (const r of INDICATOR_RESOLUTIONS) {
      for (const unit of ['in', 'mm'] as LengthUnit[]) {
        const step = mmToLength(r.mm, unit);
        const decimals = decimalsForResolution(r, unit);
        expect(10 ** -decimals).toBeLessThanOrEqual(step * (1 + 1e-9));
        expect(10 ** -(decimals - 2)).toBeGreaterThan(step);
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

  it('shows 0.003 in in mm with three decimals, so it compares with the 0.076 mm Ford limit', () => {
    // TRADE.md (S: Ford light-truck service manual, 1997): 0.076 mm (0.003 in)
    expect(formatLength(lengthToMm(0.003, 'in'), 'mm', resolution('0.001in'))).toBe('0.076');
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

describe('the thousandths entry rule', () => {
  it('reads a whole number in inches as thousandths', () => {
    const entry = interpretIndicatorEntry('10', 'in');
    expect(entry).toMatchObject({ ok: true, value: 0.01, interpretedAs: 'thousandths' });
    expect(entry.text).toBe('10 read as thousandths: 0.010 in');
  });

  it('takes a value with a decimal point as typed', () => {
    expect(interpretIndicatorEntry('0.010', 'in')).toMatchObject({ ok: true, value: 0.01, interpretedAs: 'as-typed' });
    expect(interpretIndicatorEntry('.008', 'in')).toMatchObject({ ok: true, value: 0.008, interpretedAs: 'as-typed' });
    expect(interpretIndicatorEntry('10.', 'in')).toMatchObject({ ok: true, value: 10, interpretedAs: 'as-typed' });
  });

  it('reads a whole number in millimetres as hundredths', () => {
    expect(interpretIndicatorEntry('13', 'mm')).toMatchObject({ ok: true, value: 0.13, interpretedAs: 'hundredths' });
    expect(interpretIndicatorEntry('0.13', 'mm')).toMatchObject({ ok: true, value: 0.13, interpretedAs: 'as-typed' });
  });

  it('keeps zero as zero and trims spaces', () => {
    expect(interpretIndicatorEntry('0', 'in')).toMatchObject({ ok: true, value: 0, interpretedAs: 'as-typed' });
    expect(interpretIndicatorEntry('  8 ', 'in')).toMatchObject({ ok: true, value: 0.008, input: '8' });
  });

  it('accepts a decimal comma', () => {
    expect(interpretIndicatorEntry('0,13', 'mm')).toMatchObject({ ok: true, value: 0.13, interpretedAs: 'as-typed' });
  });

  it('rejects empty, non-numeric and negative entries with a code', () => {
    expect(interpretIndicatorEntry('  ', 'in')).toMatchObject({ ok: false, code: 'empty' });
    for (const text of ['abc', '1e-3', '0.01.2', '0x10', '1 0']) {
      expect(interpretIndicatorEntry(text, 'in')).toMatchObject({ ok: false, code: 'not-a-number' });
    }
    expect(interpretIndicatorEntry('-5', 'mm')).toMatchObject({ ok: false, code: 'negative' });
  });
});
