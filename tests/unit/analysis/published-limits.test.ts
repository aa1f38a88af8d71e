import { describe, expect, it } from 'vitest';
import { judgeInspection, type InspectionReadings } from '../../../src/lib/analysis/judge-inspection';
import { halfLastDigit, torqueLimitIn } from '../../../src/lib/analysis/published-limits';
import { DEFAULT_PROFILE, withCanonicalFigures } from '../../../src/lib/analysis/tolerance';
import type { LengthUnit } from '../../../src/lib/units';

// The default bands as TRADE.md prints them, typed here from TRADE.md (not read from the code's defaults).
// S: GM light-truck service manual, 8-5/8 in ring gear axle, 1996 — 0.13–0.23 mm (0.005–0.009 in) at the minimum point
// S: both GM manuals — variation within 0.05 mm (0.002 in)
// S: Ford light-truck service manual, 1997 — flange runout 0.076 mm (0.003 in)
// S: GM, 7-1/2 in axle — pinion new 2.7–3.6 N·m (24–32 lbf·in), used 1.0–1.4 N·m (8–12 lbf·in)
const LENGTH_LIMITS = [
  { measure: 'backlash-min-point', side: 'min', printed: { mm: 0.13, in: 0.005 } },
  { measure: 'backlash-max-point', side: 'max', printed: { mm: 0.23, in: 0.009 } },
  { measure: 'spread', side: 'max', printed: { mm: 0.05, in: 0.002 } },
  { measure: 'runout-measured', side: 'max', printed: { mm: 0.076, in: 0.003 } },
] as const;
const TORQUE_LIMITS = [
  { bearings: 'new', side: 'min', printed: { 'N-m': '2.7', 'lbf-in': '24' } },
  { bearings: 'new', side: 'max', printed: { 'N-m': '3.6', 'lbf-in': '32' } },
  { bearings: 'used', side: 'min', printed: { 'N-m': '1.0', 'lbf-in': '8' } },
  { bearings: 'used', side: 'max', printed: { 'N-m': '1.4', 'lbf-in': '12' } },
] as const;
// TRADE.md (Units): the graduations of the dials in use.
const GRADUATIONS: Readonly<Record<LengthUnit, readonly number[]>> = { in: [0.001, 0.0005, 0.0001], mm: [0.01, 0.002] };

/** The readings that put one measure at `value`, the others well inside (in the unit named). */
function readingsFor(measure: string, value: number, unit: LengthUnit): InspectionReadings {
  const mid = unit === 'in' ? 0.007 : 0.18; // inside 0.005–0.009 in and 0.13–0.23 mm
  switch (measure) {
    case 'backlash-min-point':
      return { backlash: { min: value, max: Math.max(value, mid) } };
    case 'backlash-max-point':
      return { backlash: { min: Math.min(value, mid), max: value } };
    case 'spread':
      return { backlash: { min: mid, max: mid, spread: value } };
    default:
      return { backFaceRunout: value };
  }
}

function verdictOf(measure: string, readings: InspectionReadings, unit: LengthUnit, graduation: number) {
  const verdicts = judgeInspection(readings, DEFAULT_PROFILE, { unit, torqueUnit: 'lbf-in', graduation });
  return verdicts.find((v) => v.measure === measure)!.verdict;
}

describe('the walk over every default band, in each unit it is published in', () => {
  for (const { measure, side, printed } of LENGTH_LIMITS) {
    for (const unit of ['in', 'mm'] as const) {
      for (const graduation of GRADUATIONS[unit]) {
        it(`${measure}: ${printed[unit]} ${unit} is within and one ${graduation} ${unit} graduation beyond is out`, () => {
          const at = printed[unit];
          const beyond = side === 'min' ? at - graduation : at + graduation;
          expect(verdictOf(measure, readingsFor(measure, at, unit), unit, graduation)).not.toBe('out-of-band');
          expect(verdictOf(measure, readingsFor(measure, beyond, unit), unit, graduation)).toBe('out-of-band');
        });
      }
    }
  }

  for (const { bearings, side, printed } of TORQUE_LIMITS) {
    for (const torqueUnit of ['N-m', 'lbf-in'] as const) {
      it(`pinion torque, ${bearings} bearings: ${printed[torqueUnit]} ${torqueUnit} is within, one last digit beyond is out`, () => {
        const figure = printed[torqueUnit];
        const at = Number(figure);
        // One unit in the last printed digit: '1.0' → 0.1, '8' → 1.
        const digit = figure.includes('.') ? 10 ** -(figure.length - figure.indexOf('.') - 1) : 1;
        const beyond = side === 'min' ? at - digit : at + digit;
        const judge = (value: number) =>
          judgeInspection({ pinionTorque: { value, bearings } }, DEFAULT_PROFILE, {
            unit: 'in',
            torqueUnit,
            graduation: 0.001,
          })[0]!.verdict;
        expect(judge(at)).not.toBe('out-of-band');
        expect(judge(beyond)).toBe('out-of-band');
      });
    }
  }
});

describe('a limit printed only in the other unit', () => {
  // A team types its own limits in mm only: 0.13 mm = 0.005118 in (NIST SP 811: 0.13 / 25.4).
  const mmOnly = withCanonicalFigures({
    ...DEFAULT_PROFILE,
    published: { ...DEFAULT_PROFILE.published!, backlashMin: { mm: '0.13' } },
  });
  const judgeMin = (value: number, graduation: number) =>
    judgeInspection({ backlash: { min: value, max: 0.007 } }, mmOnly, {
      unit: 'in',
      torqueUnit: 'lbf-in',
      graduation,
    })[0]!.verdict;

  it('allows half the indicator graduation before calling an inch reading out (CP)', () => {
    // 0.005118 − 0.005 = 0.000118 in, within half of 0.001 in; 0.004 is 0.001118 in short: out.
    expect(judgeMin(0.005, 0.001)).toBe('near-limit');
    expect(judgeMin(0.004, 0.001)).toBe('out-of-band');
    // On a 0.0001 in dial half a graduation is 0.00005 in: 0.005 in is then 0.000118 in short, out.
    expect(judgeMin(0.005, 0.0001)).toBe('out-of-band');
    expect(judgeMin(0.0051, 0.0001)).toBe('near-limit');
  });

  it('allows half a unit in the last printed digit of a torque (CP)', () => {
    expect(halfLastDigit('1.0')).toBe(0.05);
    expect(halfLastDigit('12')).toBe(0.5);
    // 1.0 N·m printed alone, read in lbf·in: 1.0 / 0.1129848290276167 = 8.8507 lbf·in, allowance
    // 0.05 / 0.1129848290276167 = 0.4425 lbf·in (NIST SP 811).
    const limit = torqueLimitIn({ 'N-m': '1.0' }, 'lbf-in');
    expect(limit.value).toBeCloseTo(8.8507, 4);
    expect(limit.allowance).toBeCloseTo(0.4425, 4);
  });
});

describe('the inch inspection of issue 16', () => {
  it('judges 0.005–0.007 in, 0.003 in runout and 8 lbf·in used on the printed limits as within', () => {
    // Every figure on a printed limit (TRADE.md: GM 1996, GM manuals, Ford 1997, GM 7-1/2 in axle).
    const verdicts = judgeInspection(
      {
        backlash: { min: 0.005, max: 0.007, spread: 0.002 },
        backFaceRunout: 0.003,
        pinionTorque: { value: 8, bearings: 'used' },
      },
      DEFAULT_PROFILE,
      { unit: 'in', torqueUnit: 'lbf-in', graduation: 0.001 },
    );
    expect(verdicts.map((v) => [v.measure, v.verdict])).toEqual([
      ['backlash-min-point', 'near-limit'],
      ['backlash-max-point', 'in-band'],
      ['spread', 'near-limit'],
      ['runout-measured', 'near-limit'],
      ['pinion-preload-used', 'near-limit'],
    ]);
  });
});
