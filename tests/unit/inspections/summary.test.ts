import { describe, expect, it } from 'vitest';
import { recommendAction } from '../../../src/lib/analysis/recommendation';
import { DEFAULT_PROFILE, type ToleranceProfile } from '../../../src/lib/analysis/tolerance';
import type { InspectionData } from '../../../src/lib/inspections/record';
import { summariseInspection, type GearGeometry, type ReaderUnits } from '../../../src/lib/inspections/summary';

// Written out here, not imported from src/lib/units.
const MM_PER_IN = 25.4; // S: NIST SP 811, 2008, App. B
const NM_PER_LBFIN = 0.1129848290276167; // S: NIST SP 811, 2008, App. B

// DEFAULT_PROFILE figures (mm, N·m) as TRADE.md gives them: backlash 0.13–0.23 mm (S: GM 1996), spread 0.05 mm
// (S: GM 1996), runout 0.076 mm (S: Ford 1997), pinion preload new 2.7–3.6, used 1.0–1.4 N·m (S: GM, 7-1/2 in axle).
const PROFILE: ToleranceProfile = DEFAULT_PROFILE;
const NO_GEOMETRY: GearGeometry = { ringTeeth: null, pinionTeeth: null, pressureAngleDeg: null };
const GEOMETRY_41_10: GearGeometry = { ringTeeth: 41, pinionTeeth: 10, pressureAngleDeg: 20 };
const IN_LBFIN: ReaderUnits = { lengthUnit: 'in', torqueUnit: 'lbf-in' };
const MM_NM: ReaderUnits = { lengthUnit: 'mm', torqueUnit: 'N-m' };

/** A stored record written out by hand in mm and N·m (invented demo figures). */
function record(overrides: Partial<InspectionData> = {}): InspectionData {
  return {
    entry: { unit: 'mm', resolution: '0.01mm', torqueUnit: 'N-m' },
    runsChangeReason: null,
    // Well inside every band: min 0.16, max 0.20 (band 0.13–0.23), spread 0.04 (limit 0.05).
    backlashMm: [0.2, 0.18, 0.16, 0.18],
    runoutMm: { backFace: null, radial: null },
    pinion: { shimsMm: [], depthChangeMm: null, marking: null },
    carrierShimsMm: { left: null, right: null },
    preload: {
      pinionNm: null,
      bearings: 'used',
      hubLeft: { unchanged: null, torqueNm: null },
      hubRight: { unchanged: null, torqueNm: null },
    },
    patterns: { drive: null, coast: null },
    condition: { teeth: [], splines: 'none', bearings: 'none', seals: 'none' },
    notes: null,
    ...overrides,
  };
}

const withPreload = (pinionNm: number, bearings: 'new' | 'used'): Partial<InspectionData> => ({
  preload: {
    pinionNm,
    bearings,
    hubLeft: { unchanged: null, torqueNm: null },
    hubRight: { unchanged: null, torqueNm: null },
  },
});

describe('summariseInspection: the backlash figures', () => {
  it('summarises four readings with the mean, extremes, spread and once-per-turn fit worked out by hand', () => {
    const summary = summariseInspection(record(), PROFILE, NO_GEOMETRY, MM_NM);
    expect(summary.complete).toBe(true);
    const b = summary.backlash!;
    expect(b.unit).toBe('mm');
    expect(b.count).toBe(4);
    expect(b.mean).toBeCloseTo((0.2 + 0.18 + 0.16 + 0.18) / 4, 12); // 0.18
    expect(b.min).toBe(0.16);
    expect(b.max).toBe(0.2);
    expect(b.spread).toBeCloseTo(0.2 - 0.16, 12);
    // Once-per-turn fit (S: ISO 4291:1985 Annex F, as TRADE.md gives it), θ = 0°, 90°, 180°, 270°:
    // a = (2/4)(0.20·1 + 0.18·0 + 0.16·(−1) + 0.18·0) = 0.02, b = (2/4)(0.18 − 0.18) = 0, loosest at 0°.
    expect(b.harmonic.a).toBeCloseTo(0.02, 12);
    expect(b.harmonic.b).toBeCloseTo(0, 12);
    expect(b.harmonic.amplitude).toBeCloseTo(0.02, 12);
    expect(b.harmonic.loosestAngleDeg).toBeCloseTo(0, 9);
    expect(b.runoutEstimate).toBeUndefined();
  });

  it('gives every length in inches for an inch reader, 25.4 mm to the inch', () => {
    const mm = summariseInspection(record(), PROFILE, NO_GEOMETRY, MM_NM).backlash!;
    const inch = summariseInspection(record(), PROFILE, NO_GEOMETRY, IN_LBFIN).backlash!;
    expect(inch.unit).toBe('in');
    // S: NIST SP 811, 2008, App. B — the figures above divided by 25.4
    expect(inch.mean).toBeCloseTo(0.18 / MM_PER_IN, 12);
    expect(inch.min).toBeCloseTo(0.16 / MM_PER_IN, 12);
    expect(inch.max).toBeCloseTo(0.2 / MM_PER_IN, 12);
    expect(inch.spread).toBeCloseTo(0.04 / MM_PER_IN, 12);
    expect(inch.harmonic.amplitude).toBeCloseTo(0.02 / MM_PER_IN, 12);
    expect(inch.sd * MM_PER_IN).toBeCloseTo(mm.sd, 12);
  });

  it('estimates runout from the once-per-turn part with k = 2·sin δ2·tan αn for a 41:10 set', () => {
    const b = summariseInspection(record(), PROFILE, GEOMETRY_41_10, MM_NM).backlash!;
    // D (TRADE.md, bevel/hypoid extension): δ2 = atan(41/10) ≈ 76.29°, k = 2·sin δ2·tan 20° ≈ 0.707,
    // lash peak-to-peak 2C ≈ k·Ra, so Ra = 2·0.02 / k.
    const delta = Math.atan(41 / 10);
    const k = 2 * Math.sin(delta) * Math.tan((20 * Math.PI) / 180);
    expect(k).toBeCloseTo(0.707, 3); // D: TRADE.md gives k ≈ 0.707 for 41:10 at 20°
    expect(b.runoutEstimate?.deltaDeg).toBeCloseTo(76.29, 2);
    expect(b.runoutEstimate?.k).toBeCloseTo(k, 12);
    expect(b.runoutEstimate?.tir).toBeCloseTo((2 * 0.02) / k, 12);
  });

  it('takes 20° when the set has tooth counts but no pressure angle', () => {
    const b = summariseInspection(
      record(),
      PROFILE,
      { ringTeeth: 41, pinionTeeth: 10, pressureAngleDeg: null },
      MM_NM,
    ).backlash!;
    // M: 20° is the worked example's angle in TRADE.md
    const k = 2 * Math.sin(Math.atan(41 / 10)) * Math.tan((20 * Math.PI) / 180);
    expect(b.runoutEstimate?.k).toBeCloseTo(k, 12);
    const steeper = summariseInspection(
      record(),
      PROFILE,
      { ringTeeth: 41, pinionTeeth: 10, pressureAngleDeg: 25 },
      MM_NM,
    ).backlash!;
    expect(steeper.runoutEstimate?.k).toBeCloseTo(
      2 * Math.sin(Math.atan(41 / 10)) * Math.tan((25 * Math.PI) / 180),
      12,
    );
  });

  it('estimates no runout without both tooth counts', () => {
    const b = summariseInspection(
      record(),
      PROFILE,
      { ringTeeth: 41, pinionTeeth: null, pressureAngleDeg: 20 },
      MM_NM,
    ).backlash!;
    expect(b.runoutEstimate).toBeUndefined();
  });

  it('gives no backlash figures and no backlash verdicts while a position is unread', () => {
    const summary = summariseInspection(
      record({ backlashMm: [0.2, null, 0.16, 0.18], runoutMm: { backFace: 0.02, radial: null } }),
      PROFILE,
      GEOMETRY_41_10,
      MM_NM,
    );
    expect(summary.complete).toBe(false);
    expect(summary.backlash).toBeNull();
    // What else was measured is still judged.
    expect(summary.verdicts.map((v) => v.measure)).toEqual(['runout-measured']);
  });

  it('gives no backlash figures for fewer than three readings, the fewest a once-per-turn fit takes', () => {
    // S: GM 1996 "three or four points"; TRADE.md: the fit needs N ≥ 3
    for (const readings of [[], [0.18], [0.18, 0.17]]) {
      const summary = summariseInspection(record({ backlashMm: readings }), PROFILE, NO_GEOMETRY, MM_NM);
      expect(summary.complete).toBe(false);
      expect(summary.backlash).toBeNull();
      expect(summary.verdicts).toEqual([]);
    }
    const three = summariseInspection(record({ backlashMm: [0.18, 0.17, 0.16] }), PROFILE, NO_GEOMETRY, MM_NM);
    expect(three.complete).toBe(true);
    expect(three.backlash?.count).toBe(3);
  });
});

describe('summariseInspection: which measures are judged, in which unit', () => {
  it('judges the tightest and loosest points and the spread, then measured runout, preload and each hub', () => {
    const summary = summariseInspection(
      record({
        runoutMm: { backFace: 0.02, radial: 0.01 },
        preload: {
          pinionNm: 1.2,
          bearings: 'used',
          hubLeft: { unchanged: true, torqueNm: 2 },
          hubRight: { unchanged: false, torqueNm: null },
        },
      }),
      PROFILE,
      GEOMETRY_41_10,
      IN_LBFIN,
    );
    expect(summary.verdicts.map((v) => [v.measure, v.unit])).toEqual([
      ['backlash-min-point', 'in'],
      ['backlash-max-point', 'in'],
      ['spread', 'in'],
      // The runout the lash suggests is judged once saved as it is while typing (issue 16).
      ['runout', 'in'],
      ['runout-measured', 'in'],
      ['pinion-preload-used', 'lbf-in'],
      ['hub-left', 'check'],
      ['hub-right', 'check'],
    ]);
  });

  it('judges readings well inside every band as in band', () => {
    const summary = summariseInspection(
      record({ runoutMm: { backFace: 0.02, radial: null }, ...withPreload(1.2, 'used') }),
      PROFILE,
      NO_GEOMETRY,
      MM_NM,
    );
    // min 0.16 (0.03 inside 0.13), max 0.20 (0.03 inside 0.23), spread 0.04 vs 0.05 (S: GM 1996);
    // runout 0.02 vs 0.076 (S: Ford 1997); 1.2 N·m inside 1.0–1.4 (S: GM, 7-1/2 in axle)
    expect(summary.verdicts.map((v) => v.verdict)).toEqual(['in-band', 'in-band', 'in-band', 'in-band', 'in-band']);
  });

  it('judges backlash well past the band as out of band against its max', () => {
    // 0.36–0.40 mm is far over 0.23 mm (S: GM 1996)
    const summary = summariseInspection(record({ backlashMm: [0.4, 0.38, 0.36, 0.38] }), PROFILE, NO_GEOMETRY, MM_NM);
    const [tight, loose] = summary.verdicts;
    expect(tight).toMatchObject({ measure: 'backlash-min-point', verdict: 'out-of-band', limit: 'max' });
    expect(tight?.value).toBe(0.36);
    expect(tight?.margin).toBeCloseTo(0.23 - 0.36, 12);
    expect(loose).toMatchObject({ measure: 'backlash-max-point', verdict: 'out-of-band', limit: 'max' });
  });

  it('judges a spread well over its limit as out of band', () => {
    // 0.12 mm between points against 0.05 mm (S: GM 1996); min and max themselves stay inside 0.13–0.23
    const summary = summariseInspection(record({ backlashMm: [0.22, 0.16, 0.1, 0.16] }), PROFILE, NO_GEOMETRY, MM_NM);
    const spread = summary.verdicts.find((v) => v.measure === 'spread');
    expect(spread).toMatchObject({ verdict: 'out-of-band', limit: 'max' });
    expect(spread?.value).toBeCloseTo(0.12, 12);
    expect(spread?.limitValue).toBe(0.05);
  });

  it('gives the backlash limits in the reader’s unit beside the value', () => {
    const summary = summariseInspection(record(), PROFILE, NO_GEOMETRY, IN_LBFIN);
    const [tight, loose, spread] = summary.verdicts;
    // Both points sit 0.03 mm inside, equally far from each limit; each verdict names a limit of the band, as
    // GM prints it in inches: 0.005–0.009 in, spread 0.002 in (S: GM 1996) — never 0.13 / 25.4 = 0.0051.
    for (const v of [tight, loose]) {
      expect([0.005, 0.009]).toContain(v!.limitValue);
      expect(['0.005', '0.009']).toContain(v!.limitText);
    }
    expect(tight?.value).toBeCloseTo(0.16 / MM_PER_IN, 12);
    expect(loose?.value).toBeCloseTo(0.2 / MM_PER_IN, 12);
    expect(spread).toMatchObject({ limitValue: 0.002, limitText: '0.002' });
    // Judged in mm, where it was read: 0.01 mm inside 0.05 mm, shown in inches (÷ 25.4, S: NIST SP 811)
    expect(spread?.margin).toBeCloseTo((0.05 - 0.04) / MM_PER_IN, 12);
    expect(spread?.judgedAt).toBe('judged at the 0.01 mm graduation');
  });

  it('judges measured back-face runout against the runout limit in the reader’s unit', () => {
    const summary = summariseInspection(
      record({ runoutMm: { backFace: 0.02, radial: null } }),
      PROFILE,
      NO_GEOMETRY,
      IN_LBFIN,
    );
    const runout = summary.verdicts.find((v) => String(v.measure) === 'runout-measured');
    expect(runout).toMatchObject({ verdict: 'in-band', limit: 'max', unit: 'in' });
    expect(runout?.value).toBeCloseTo(0.02 / MM_PER_IN, 12); // ÷ 25.4, S: NIST SP 811, 2008, App. B
    // Ford prints 0.003 in beside 0.076 mm (S: Ford 1997): the inch reader sees the inch figure as printed.
    expect(runout).toMatchObject({ limitValue: 0.003, limitText: '0.003' });
    expect(summary.runoutTir).toBeCloseTo(0.02 / MM_PER_IN, 12);
  });

  it('judges measured runout well over the limit as out of band', () => {
    const summary = summariseInspection(
      record({ runoutMm: { backFace: 0.2, radial: null } }),
      PROFILE,
      NO_GEOMETRY,
      MM_NM,
    );
    // 0.2 mm against 0.076 mm (S: Ford 1997)
    expect(summary.verdicts.find((v) => String(v.measure) === 'runout-measured')).toMatchObject({
      verdict: 'out-of-band',
      limitValue: 0.076,
    });
  });

  it('judges pinion preload against the new-bearing band for new bearings, in lbf·in for an lbf·in reader', () => {
    // 3.1 N·m inside 2.7–3.6 N·m (S: GM, 7-1/2 in axle); ÷ 0.1129848290276167 (S: NIST SP 811, 2008, App. B)
    const summary = summariseInspection(record(withPreload(3.1, 'new')), PROFILE, NO_GEOMETRY, IN_LBFIN);
    const preload = summary.verdicts.find((v) => v.measure.startsWith('pinion-preload'));
    expect(preload).toMatchObject({ measure: 'pinion-preload-new', verdict: 'in-band', unit: 'lbf-in' });
    expect(preload?.value).toBeCloseTo(3.1 / NM_PER_LBFIN, 10);
    // GM prints the new band as 24–32 lbf·in beside 2.7–3.6 N·m (S: GM, 7-1/2 in axle): shown as printed.
    expect([24, 32]).toContain(preload!.limitValue);
    expect(['24', '32']).toContain(preload!.limitText);
    expect(summary.torqueUnit).toBe('lbf-in');
  });

  it('judges the same torque by the band of the bearings it was read on', () => {
    // 3.1 N·m is inside the new band 2.7–3.6 but far over the used band 1.0–1.4 (S: GM, 7-1/2 in axle)
    const used = summariseInspection(record(withPreload(3.1, 'used')), PROFILE, NO_GEOMETRY, MM_NM);
    expect(used.verdicts.find((v) => v.measure.startsWith('pinion-preload'))).toMatchObject({
      measure: 'pinion-preload-used',
      verdict: 'out-of-band',
      limit: 'max',
      limitValue: 1.4,
      unit: 'N-m',
    });
  });

  it('judges each hub check that was answered as a yes/no, and skips one left unanswered', () => {
    const hubs = (left: boolean | null, right: boolean | null) =>
      summariseInspection(
        record({
          preload: {
            pinionNm: null,
            bearings: 'used',
            hubLeft: { unchanged: left, torqueNm: null },
            hubRight: { unchanged: right, torqueNm: null },
          },
        }),
        PROFILE,
        NO_GEOMETRY,
        MM_NM,
      ).verdicts.filter((v) => v.measure.startsWith('hub-'));
    // CP: effort unchanged between medium and full nut torque on a solid spacer
    expect(hubs(true, false)).toMatchObject([
      { measure: 'hub-left', value: 1, verdict: 'in-band', limit: 'min', limitValue: 1, margin: 1, unit: 'check' },
      {
        measure: 'hub-right',
        value: 0,
        verdict: 'out-of-band',
        limit: 'min',
        limitValue: 1,
        margin: -1,
        unit: 'check',
      },
    ]);
    expect(hubs(null, true).map((v) => v.measure)).toEqual(['hub-right']);
    expect(hubs(null, null)).toEqual([]);
  });

  it('leaves the hub checks out when the profile does not ask for them', () => {
    const summary = summariseInspection(
      record({
        preload: {
          pinionNm: null,
          bearings: 'used',
          hubLeft: { unchanged: false, torqueNm: null },
          hubRight: { unchanged: false, torqueNm: null },
        },
      }),
      { ...PROFILE, hubPreloadCheck: false },
      NO_GEOMETRY,
      MM_NM,
    );
    expect(summary.verdicts.some((v) => v.measure.startsWith('hub-'))).toBe(false);
  });

  it('judges by the profile it is given, not by the default figures', () => {
    // A team profile with a wider band (invented): 0.30–0.50 mm. 0.36–0.40 mm is then well inside it.
    const wide: ToleranceProfile = { ...PROFILE, backlashMin: 0.3, backlashMax: 0.5, maxSpread: 0.1 };
    const summary = summariseInspection(record({ backlashMm: [0.4, 0.38, 0.36, 0.38] }), wide, NO_GEOMETRY, MM_NM);
    expect(summary.verdicts.map((v) => v.verdict)).toEqual(['in-band', 'in-band', 'in-band']);
  });

  // Fixed with issue 16: every measure is judged by one function with the profile's own near share.
  it('counts a point near its limit by the profile’s own near share', () => {
    // nearShare 0.4 of the 0.13–0.23 mm band (S: GM 1996) is a 0.04 mm zone; 0.16 mm lies 0.03 mm above 0.13,
    // inside that zone (and well outside the 0.01 mm zone of a 0.1 share).
    const summary = summariseInspection(record(), { ...PROFILE, nearShare: 0.4 }, NO_GEOMETRY, MM_NM);
    expect(summary.verdicts.find((v) => v.measure === 'backlash-min-point')?.verdict).toBe('near-limit');
  });
});

describe('summariseInspection: patterns, resolution, shims and runout', () => {
  it('reads the drive pattern before the coast pattern and leaves out one not recorded', () => {
    const both = summariseInspection(
      record({ patterns: { drive: { along: 0.5, up: 0.5 }, coast: { along: 0.9, up: 0.5 } } }),
      PROFILE,
      NO_GEOMETRY,
      MM_NM,
    );
    // Usual region 0.3–0.7 both ways (CP); 0 toe, 1 heel (S: GM service manual, 9-1/2 in axle)
    expect(both.patterns.map((p) => [p.side, p.code, p.inUsualRegion])).toEqual([
      ['drive', 'centred', true],
      ['coast', 'heel', false],
    ]);
    const coastOnly = summariseInspection(
      record({ patterns: { drive: null, coast: { along: 0.1, up: 0.5 } } }),
      PROFILE,
      NO_GEOMETRY,
      MM_NM,
    );
    expect(coastOnly.patterns.map((p) => [p.side, p.code])).toEqual([['coast', 'toe']]);
    expect(summariseInspection(record(), PROFILE, NO_GEOMETRY, MM_NM).patterns).toEqual([]);
  });

  it('gives the indicator graduation in the reader’s unit', () => {
    const thou = record({ entry: { unit: 'in', resolution: '0.001in', torqueUnit: 'lbf-in' } });
    // 0.001 in = 0.0254 mm (S: NIST SP 811, 2008, App. B)
    expect(summariseInspection(thou, PROFILE, NO_GEOMETRY, MM_NM).resolution).toBeCloseTo(0.0254, 12);
    expect(summariseInspection(thou, PROFILE, NO_GEOMETRY, IN_LBFIN).resolution).toBeCloseTo(0.001, 12);
    const hundredth = record({ entry: { unit: 'mm', resolution: '0.01mm', torqueUnit: 'N-m' } });
    expect(summariseInspection(hundredth, PROFILE, NO_GEOMETRY, IN_LBFIN).resolution).toBeCloseTo(0.01 / MM_PER_IN, 12);
  });

  it('gives a resolution of 0 for an indicator id it does not know', () => {
    const odd = record({ entry: { unit: 'mm', resolution: '0.05mm', torqueUnit: 'N-m' } });
    expect(summariseInspection(odd, PROFILE, NO_GEOMETRY, MM_NM).resolution).toBe(0);
  });

  it('totals the pinion shim stack in the reader’s unit, and gives none for no stack', () => {
    // 0.030 + 0.005 + 0.003 in = 0.038 in, stored as 0.762 + 0.127 + 0.0762 mm (× 25.4, S: NIST SP 811, 2008, App. B)
    const stacked = record({ pinion: { shimsMm: [0.762, 0.127, 0.0762], depthChangeMm: null, marking: null } });
    expect(summariseInspection(stacked, PROFILE, NO_GEOMETRY, IN_LBFIN).shimTotal).toBeCloseTo(0.038, 12);
    expect(summariseInspection(stacked, PROFILE, NO_GEOMETRY, MM_NM).shimTotal).toBeCloseTo(0.9652, 12);
    const one = record({ pinion: { shimsMm: [0.5], depthChangeMm: null, marking: null } });
    expect(summariseInspection(one, PROFILE, NO_GEOMETRY, MM_NM).shimTotal).toBe(0.5);
    expect(summariseInspection(record(), PROFILE, NO_GEOMETRY, MM_NM).shimTotal).toBeNull();
  });

  it('gives the measured back-face runout as the TIR, and none when it was not measured', () => {
    expect(summariseInspection(record(), PROFILE, GEOMETRY_41_10, MM_NM).runoutTir).toBeNull();
    const measured = record({ runoutMm: { backFace: 0.0508, radial: 0.3 } });
    // 0.0508 mm = 0.002 in (÷ 25.4, S: NIST SP 811, 2008, App. B); the radial figure is not the TIR
    expect(summariseInspection(measured, PROFILE, GEOMETRY_41_10, IN_LBFIN).runoutTir).toBeCloseTo(0.002, 12);
  });

  it('names the reader’s units on the summary', () => {
    const summary = summariseInspection(record(), PROFILE, NO_GEOMETRY, { lengthUnit: 'in', torqueUnit: 'N-m' });
    expect(summary.unit).toBe('in');
    expect(summary.torqueUnit).toBe('N-m');
  });
});

describe('the inch inspection on the printed limits (issue 16)', () => {
  // A new spare set, the team's default profile, a 0.001 in indicator: readings 0.005 / 0.006 / 0.007 / 0.006 in,
  // back-face runout 0.003 in, used-bearing pinion torque 8 lbf·in — each on a printed limit: 0.005–0.009 in at the
  // minimum point and 0.002 in variation (S: GM 1996), 0.003 in flange runout (S: Ford 1997), 8–12 lbf·in used
  // (S: GM, 7-1/2 in axle). Stored as the sheet stores them: × 25.4 and × 0.1129848290276167 (S: NIST SP 811).
  const inchRecord = record({
    entry: { unit: 'in', resolution: '0.001in', torqueUnit: 'lbf-in' },
    backlashMm: [0.005, 0.006, 0.007, 0.006].map((inch) => inch * MM_PER_IN),
    runoutMm: { backFace: 0.003 * MM_PER_IN, radial: null },
    preload: {
      pinionNm: 8 * NM_PER_LBFIN,
      bearings: 'used',
      hubLeft: { unchanged: null, torqueNm: null },
      hubRight: { unchanged: null, torqueNm: null },
    },
  });

  it('judges every figure within, whichever unit the reader reads in, and recommends keep or watch', () => {
    for (const reader of [IN_LBFIN, MM_NM]) {
      for (const geometry of [NO_GEOMETRY, GEOMETRY_41_10]) {
        const summary = summariseInspection(inchRecord, PROFILE, geometry, reader);
        expect(summary.verdicts.filter((v) => v.verdict === 'out-of-band')).toEqual([]);
        const advice = recommendAction({
          runsSinceInstall: 0,
          lifeLimitRuns: 50,
          serviceIntervalRuns: 5,
          verdicts: summary.verdicts,
        });
        expect(['keep', 'watch']).toContain(advice.action);
        expect(advice.reasons.filter((r) => r.severity === 'critical')).toEqual([]);
      }
    }
  });

  it('says beside each length verdict that it was judged at the 0.001 in graduation', () => {
    const summary = summariseInspection(inchRecord, PROFILE, NO_GEOMETRY, MM_NM);
    const tight = summary.verdicts.find((v) => v.measure === 'backlash-min-point')!;
    expect(tight.judgedAt).toBe('judged at the 0.001 in graduation');
    // An mm reader sees the mm figure as printed: 0.13 mm (S: GM 1996)
    expect(tight).toMatchObject({ limitText: '0.13', limitValue: 0.13, unit: 'mm' });
  });
});
