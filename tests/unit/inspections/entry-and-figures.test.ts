import { describe, expect, it } from 'vitest';
import { DEFAULT_PROFILE } from '../../../src/lib/analysis/tolerance';
import { parseDecimalText, parseIndicatorText } from '../../../src/lib/inspections/entry-text';
import { computeLiveFigures, judgePreload, preloadBandIn } from '../../../src/lib/inspections/live-figures';
import {
  resizeReadings,
  sheetToPatchBody,
  valueToEntryText,
  createBlankSheet,
} from '../../../src/lib/inspections/sheet-values';

describe('reading what was typed', () => {
  it('applies the thousandths rule and says how it read the entry', () => {
    expect(parseIndicatorText('10', 'in', '0.001in')).toEqual({ value: 0.01, note: 'read as 0.010 in (thousandths)' });
    expect(parseIndicatorText('13', 'mm', '0.01mm')).toEqual({ value: 0.13, note: 'read as 0.13 mm (hundredths)' });
    expect(parseIndicatorText('0.008', 'in', '0.001in')).toEqual({ value: 0.008, note: 'read as 0.008 in' });
  });

  it('never shows more digits than the indicator reads, and says when the entry had more', () => {
    expect(parseIndicatorText('0.0083', 'in', '0.001in').note).toBe(
      'read as 0.008 in — finer than a 0.001 in indicator reads',
    );
    expect(parseIndicatorText('0.0085', 'in', '0.0005in').note).toBe('read as 0.0085 in');
  });

  it('explains an entry that is not a reading', () => {
    expect(parseIndicatorText('-3', 'in', '0.001in')).toMatchObject({
      value: null,
      error: expect.stringContaining('negative'),
    });
    expect(parseIndicatorText('abc', 'in', '0.001in')).toMatchObject({
      value: null,
      error: expect.stringContaining('not a number'),
    });
    expect(parseIndicatorText('  ', 'in', '0.001in')).toEqual({ value: null });
  });

  it('takes plain numbers as typed, with a comma as the decimal mark', () => {
    expect(parseDecimalText('0,030')).toEqual({ value: 0.03 });
    expect(parseDecimalText('-0.004', { signed: true })).toEqual({ value: -0.004 });
    expect(parseDecimalText('-0.004')).toMatchObject({ value: null });
    expect(parseDecimalText('12.5', { whole: true })).toMatchObject({ value: null });
  });

  it('starts a stored value with the digits the indicator shows', () => {
    expect(valueToEntryText(0.01, 3)).toBe('0.010');
    expect(valueToEntryText(0.0123, 3)).toBe('0.0123');
    expect(valueToEntryText(null, 3)).toBe('');
  });
});

describe('the live figures', () => {
  it('gives figures so far from the positions read, without a fit', () => {
    const f = computeLiveFigures([0.008, null, 0.006, null], 'in', DEFAULT_PROFILE);
    expect(f).toMatchObject({ readCount: 2, total: 4, complete: false, min: 0.006, max: 0.008, harmonic: null });
    expect(f.mean).toBeCloseTo(0.007, 12);
    expect(f.spread).toBeCloseTo(0.002, 12);
  });

  it('judges in the entry unit with the server’s judgeBacklash', () => {
    // 0.13–0.23 mm at the minimum point (S: GM 1996) = 0.00512–0.00906 in; spread ≤ 0.05 mm (S: GM 1996).
    const f = computeLiveFigures([0.008, 0.007, 0.006, 0.007], 'in', DEFAULT_PROFILE, {
      ringTeeth: 41,
      pinionTeeth: 10,
    });
    expect(f.complete).toBe(true);
    expect(f.verdicts.map((v) => [v.measure, v.verdict])).toEqual([
      ['backlash-min-point', 'in-band'],
      ['backlash-max-point', 'in-band'],
      ['spread', 'out-of-band'],
      ['runout', expect.any(String)],
    ]);
    expect(f.harmonic!.tightestAngleDeg).toBe(180);
    // k for 41:10 at 20° ≈ 0.707 (TRADE.md, D): TIR = 2C / k with C = 0.001 in.
    expect(f.runoutEstimate!.tir).toBeCloseTo(0.002 / 0.7072, 4);
  });

  it('gives the pinion preload band in the chosen torque unit', () => {
    // Used bearings 1.0–1.4 N·m (S: GM, 7-1/2 in axle); 1 lbf·in = 0.1129848290276167 N·m (NIST SP 811).
    const band = preloadBandIn(DEFAULT_PROFILE, 'used', 'lbf-in');
    expect(band.min).toBeCloseTo(1.0 / 0.1129848290276167, 9);
    expect(band.max).toBeCloseTo(1.4 / 0.1129848290276167, 9);
    expect(judgePreload(10, 'used', 'lbf-in', DEFAULT_PROFILE).verdict).toBe('in-band');
    expect(judgePreload(20, 'used', 'lbf-in', DEFAULT_PROFILE).verdict).toBe('out-of-band');
  });
});

describe('the sheet values', () => {
  it('keeps readings already typed when the number of positions changes', () => {
    expect(resizeReadings([0.008, 0.007], 4)).toEqual([0.008, 0.007, null, null]);
    expect(resizeReadings([0.008, 0.007, 0.006], 2)).toEqual([0.008, 0.007]);
  });

  it('sends a patch without the gear set, which never changes', () => {
    const sheet = createBlankSheet({
      gearSetId: 'gs1',
      positions: 3,
      unit: 'in',
      torqueUnit: 'lbf-in',
      technicianId: 'u1',
      inspectedAt: '2026-06-01T10:00:00.000Z',
    });
    expect(sheetToPatchBody(sheet)).not.toHaveProperty('gearSetId');
    expect(sheetToPatchBody(sheet)).toMatchObject({ readings: [null, null, null] });
  });
});
