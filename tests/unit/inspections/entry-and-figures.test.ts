import { describe, expect, it } from 'vitest';
import { DEFAULT_PROFILE } from '../../../src/lib/analysis/tolerance';
import { parseDecimalText, parseIndicatorText, parseLengthText } from '../../../src/lib/inspections/entry-text';
import { computeLiveFigures, judgeMeasuredRunout, judgePreload } from '../../../src/lib/inspections/live-figures';
import { summariseInspection } from '../../../src/lib/inspections/summary';
import {
  resizeReadings,
  sheetToPatchBody,
  valueToEntryText,
  createBlankSheet,
} from '../../../src/lib/inspections/sheet-values';

describe('reading what was typed', () => {
  it('applies the entry rule and shows the value as read', () => {
    expect(parseIndicatorText('10', 'in', '0.001in')).toEqual({ value: 0.01, note: '= 0.01 in' });
    expect(parseIndicatorText('13', 'mm', '0.01mm')).toEqual({ value: 0.13, note: '= 0.13 mm' });
    expect(parseIndicatorText('0.008', 'in', '0.001in')).toEqual({ value: 0.008, note: '= 0.008 in' });
    // A half-thousandth dial read as "8.5" (CP): 0.0085 in, never 8.5 in refused.
    expect(parseIndicatorText('8.5', 'in', '0.0005in')).toEqual({ value: 0.0085, note: '= 0.0085 in' });
  });

  it('reads shims and the depth change by the same rule, against their own limits', () => {
    // A shim typed "25" on an inch sheet is 0.025 in (the sheet once showed "Total: 28.000 in").
    expect(parseLengthText('25', 'in', '0.001in', 'shim')).toEqual({ value: 0.025, note: '= 0.025 in' });
    expect(parseLengthText('-4', 'in', '0.001in', 'depth-change')).toEqual({ value: -0.004, note: '= -0.004 in' });
    // Refused in the entry unit: 5 mm = 0.1969 in (NIST SP 811: 5 / 25.4)
    expect(parseLengthText('300', 'in', '0.001in', 'shim').error).toBe(
      '"300" is over 0.1969 in, even read as thousandths.',
    );
  });

  it('says when the entry has more digits than the indicator reads', () => {
    expect(parseIndicatorText('0.0083', 'in', '0.001in').note).toBe(
      '= 0.0083 in — finer than a 0.001 in indicator reads',
    );
    expect(parseIndicatorText('0.0085', 'in', '0.0005in').note).toBe('= 0.0085 in');
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

  it('judges in the entry unit against the printed inch limits, the runout estimate included', () => {
    // 0.005–0.009 in at the minimum point and 0.002 in variation (S: GM 1996); 0.003 in runout (S: Ford 1997).
    const f = computeLiveFigures(
      [0.008, 0.007, 0.006, 0.007],
      'in',
      DEFAULT_PROFILE,
      { ringTeeth: 41, pinionTeeth: 10 },
      '0.001in',
    );
    expect(f.complete).toBe(true);
    expect(f.harmonic!.tightestAngleDeg).toBe(180);
    // Independent: C = (0.008 − 0.006) / 2 = 0.001 in; δ2 = atan(41/10) = 76.29°, αn = 20° (M),
    // sin δ2 = 4.1 / √(1 + 4.1²) = 0.971520, tan αn = 0.363970,
    // k = 2·sin δ2·tan αn = 0.707209 (TRADE.md, D); TIR = 2C / k = 0.0028280 in.
    expect(f.runoutEstimate!.tir).toBeCloseTo(0.002828, 6);
    // Spread 0.002 in on the printed 0.002 in: within; TIR 0.00283 in under 0.003 in but within 10 % of it (CP).
    expect(f.verdicts.map((v) => [v.measure, v.verdict])).toEqual([
      ['backlash-min-point', 'in-band'],
      ['backlash-max-point', 'in-band'],
      ['spread', 'near-limit'],
      ['runout', 'near-limit'],
    ]);
  });

  it('calls the runout estimate out when the once-per-turn part is large', () => {
    // 0.010 / 0.007 / 0.004 / 0.007 in: C = 0.003 in, TIR = 0.006 / 0.707209 = 0.0084841 in, over 0.003 in (S: Ford 1997)
    const f = computeLiveFigures([0.01, 0.007, 0.004, 0.007], 'in', DEFAULT_PROFILE, {
      ringTeeth: 41,
      pinionTeeth: 10,
    });
    expect(f.runoutEstimate!.tir).toBeCloseTo(0.0084841, 6);
    expect(f.verdicts.find((v) => v.measure === 'runout')?.verdict).toBe('out-of-band');
  });

  it('judges the pinion preload against the band printed in the chosen torque unit', () => {
    // Used bearings 8–12 lbf·in beside 1.0–1.4 N·m (S: GM, 7-1/2 in axle): 8 lbf·in is on the printed limit.
    const basis = { unit: 'in' as const, torqueUnit: 'lbf-in' as const, resolution: '0.001in' };
    expect(judgePreload(8, 'used', basis, DEFAULT_PROFILE)?.verdict).toBe('near-limit');
    expect(judgePreload(10, 'used', basis, DEFAULT_PROFILE)?.verdict).toBe('in-band');
    expect(judgePreload(7, 'used', basis, DEFAULT_PROFILE)?.verdict).toBe('out-of-band');
    expect(judgePreload(20, 'used', basis, DEFAULT_PROFILE)?.verdict).toBe('out-of-band');
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

describe('the same verdicts live and saved', () => {
  it('judges the same measures with the same verdicts while typing as the saved summary keeps', () => {
    // An inch sheet (invented figures): readings, back-face runout and used-bearing torque, with tooth counts so
    // the runout estimate is judged too. Stored as the sheet stores them: × 25.4 and × 0.1129848290276167 (NIST).
    const readings = [0.009, 0.006, 0.005, 0.007];
    const basis = { unit: 'in' as const, torqueUnit: 'lbf-in' as const, resolution: '0.001in' };
    const geometry = { ringTeeth: 41, pinionTeeth: 10, pressureAngleDeg: 20 };
    const live = [
      ...computeLiveFigures(readings, 'in', DEFAULT_PROFILE, geometry, '0.001in').verdicts,
      judgeMeasuredRunout(0.004, basis, DEFAULT_PROFILE)!,
      judgePreload(13, 'used', basis, DEFAULT_PROFILE)!,
    ];
    const saved = summariseInspection(
      {
        entry: { unit: 'in', resolution: '0.001in', torqueUnit: 'lbf-in' },
        runsChangeReason: null,
        backlashMm: readings.map((r) => r * 25.4),
        runoutMm: { backFace: 0.004 * 25.4, radial: null },
        pinion: { shimsMm: [], depthChangeMm: null, marking: null },
        carrierShimsMm: { left: null, right: null },
        preload: {
          pinionNm: 13 * 0.1129848290276167,
          bearings: 'used',
          hubLeft: { unchanged: null, torqueNm: null },
          hubRight: { unchanged: null, torqueNm: null },
        },
        patterns: { drive: null, coast: null },
        condition: { teeth: [], splines: 'none', bearings: 'none', seals: 'none' },
        notes: null,
      },
      DEFAULT_PROFILE,
      geometry,
      { lengthUnit: 'in', torqueUnit: 'lbf-in' },
    ).verdicts;
    const pairs = (list: readonly { measure: string; verdict: string }[]) => list.map((v) => [v.measure, v.verdict]);
    expect(pairs(saved)).toEqual(pairs(live));
    // Spread 0.004 in over 0.002 in (S: GM 1996), runout 0.004 in over 0.003 in (S: Ford 1997), 13 lbf·in over
    // 12 lbf·in (S: GM, 7-1/2 in axle): each out, live and saved alike.
    expect(
      pairs(saved)
        .filter(([, v]) => v === 'out-of-band')
        .map(([m]) => m),
    ).toEqual(['spread', 'runout', 'runout-measured', 'pinion-preload-used']);
  });
});
