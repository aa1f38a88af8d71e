import { describe, expect, it } from 'vitest';
import { dataToEntry, draftToData, sumShimsMm } from '../../../src/lib/inspections/record';
import { inspectionDraftSchema, type InspectionDraftInput } from '../../../src/lib/inspections/schemas';
import { createRandom, pickInteger } from '../../helpers/seeded-random';

// Written out here, not imported from src/lib/units: NIST SP 811 (2008) App. B, exact by definition.
const MM_PER_IN = 25.4; // S: NIST SP 811, 2008, App. B
const NM_PER_LBFIN = 0.1129848290276167; // S: NIST SP 811, 2008, App. B (1 lbf = 4.4482216152605 N, 1 in = 0.0254 m)

/** The fields every draft carries besides the measures (invented demo figures). */
const META = { gearSetId: 'set-demo-1', inspectedAt: '2026-06-01T12:00:00Z', runsAtInspection: 12 } as const;

function parseDraft(input: Omit<InspectionDraftInput, keyof typeof META>) {
  return inspectionDraftSchema.parse({ ...META, ...input });
}

/** A full sheet typed in inches and lbf·in (invented demo figures). */
const INCH_SHEET = {
  unit: 'in',
  resolution: '0.0005in',
  torqueUnit: 'lbf-in',
  runsChangeReason: 'Counter reset after the swap',
  readings: [0.0085, 0.007, 0.0065, 0.0075],
  runout: { backFace: 0.0015, radial: 0.001 },
  pinion: { shims: [0.03, 0.005], depthChange: -0.004, marking: '+2' },
  carrierShims: { left: 0.06, right: 0.055 },
  preload: {
    pinionTorque: 24,
    bearings: 'new',
    hubLeft: { unchanged: true, torque: 18 },
    hubRight: { unchanged: false },
  },
  patterns: { drive: { along: 0.45, up: 0.55, length: 0.4 }, coast: null },
  condition: {
    teeth: [{ finding: 'pitting', severity: 'light' }],
    splines: 'none',
    bearings: 'moderate',
    seals: 'none',
  },
  notes: 'Demo sheet, invented figures.',
} satisfies Omit<InspectionDraftInput, keyof typeof META>;

describe('the unit factors the record relies on', () => {
  it('stores 1 in as exactly 25.4 mm and 1 lbf·in as exactly 0.1129848290276167 N·m', () => {
    // A whole inch is past the sheet's own field limits, so the validated draft gets it afterwards.
    const draft = parseDraft({
      unit: 'in',
      resolution: '0.001in',
      torqueUnit: 'lbf-in',
      readings: [0.008, 0.008, 0.008],
    });
    const data = draftToData({ ...draft, runout: { backFace: 1 }, preload: { ...draft.preload!, pinionTorque: 1 } });
    expect(data.runoutMm.backFace).toBe(MM_PER_IN); // S: NIST SP 811, 2008, App. B
    expect(data.preload.pinionNm).toBe(NM_PER_LBFIN); // S: NIST SP 811, 2008, App. B
  });
});

describe('draftToData (entry units to canonical mm and N·m)', () => {
  it('stores every length typed in inches in millimetres, 25.4 mm to the inch', () => {
    const data = draftToData(parseDraft(INCH_SHEET));
    // S: NIST SP 811, 2008, App. B — each figure multiplied out by hand: 0.0085 in × 25.4 = 0.2159 mm, …
    expect(data.backlashMm).toHaveLength(4);
    [0.2159, 0.1778, 0.1651, 0.1905].forEach((mm, i) => expect(data.backlashMm[i]).toBeCloseTo(mm, 12));
    expect(data.runoutMm.backFace).toBeCloseTo(0.0381, 12); // 0.0015 × 25.4
    expect(data.runoutMm.radial).toBeCloseTo(0.0254, 12); // 0.001 × 25.4
    expect(data.pinion.shimsMm[0]).toBeCloseTo(0.762, 12); // 0.030 × 25.4
    expect(data.pinion.shimsMm[1]).toBeCloseTo(0.127, 12); // 0.005 × 25.4
    expect(data.pinion.depthChangeMm).toBeCloseTo(-0.1016, 12); // −0.004 × 25.4, the sign kept
    expect(data.carrierShimsMm.left).toBeCloseTo(1.524, 12); // 0.060 × 25.4
    expect(data.carrierShimsMm.right).toBeCloseTo(1.397, 12); // 0.055 × 25.4
  });

  it('stores torques typed in lbf·in in N·m, 0.1129848290276167 N·m to the lbf·in', () => {
    const data = draftToData(parseDraft(INCH_SHEET));
    // S: NIST SP 811, 2008, App. B; 24 lbf·in is the low end of GM's new-bearing band, "2.7 N·m" (S: GM, 7-1/2 in axle)
    expect(data.preload.pinionNm).toBeCloseTo(24 * 0.1129848290276167, 14);
    expect(data.preload.pinionNm).toBeCloseTo(2.7, 1);
    expect(data.preload.hubLeft).toEqual({ unchanged: true, torqueNm: 18 * NM_PER_LBFIN });
    expect(data.preload.hubRight).toEqual({ unchanged: false, torqueNm: null });
  });

  it('keeps the entry unit, the torque unit and the indicator resolution beside the canonical figures', () => {
    expect(draftToData(parseDraft(INCH_SHEET)).entry).toEqual({
      unit: 'in',
      resolution: '0.0005in',
      torqueUnit: 'lbf-in',
    });
    const metric = draftToData(
      parseDraft({ unit: 'mm', resolution: '0.01mm', torqueUnit: 'N-m', readings: [0.18, 0.17, 0.16] }),
    );
    expect(metric.entry).toEqual({ unit: 'mm', resolution: '0.01mm', torqueUnit: 'N-m' });
  });

  it('stores figures typed in mm and N·m as they were typed', () => {
    const data = draftToData(
      parseDraft({
        unit: 'mm',
        resolution: '0.01mm',
        torqueUnit: 'N-m',
        readings: [0.18, 0.17, 0.16, 0.17],
        runout: { backFace: 0.03 },
        pinion: { shims: [0.76, 0.13] },
        preload: { pinionTorque: 1.2, hubLeft: { unchanged: true, torque: 2.1 } },
      }),
    );
    expect(data.backlashMm).toEqual([0.18, 0.17, 0.16, 0.17]);
    expect(data.runoutMm.backFace).toBe(0.03);
    expect(data.pinion.shimsMm).toEqual([0.76, 0.13]);
    expect(data.preload.pinionNm).toBe(1.2);
    expect(data.preload.hubLeft.torqueNm).toBe(2.1);
  });

  it('keeps a position not read yet as null, in its place', () => {
    const data = draftToData(parseDraft({ unit: 'in', resolution: '0.001in', readings: [0.008, null, 0.006, null] }));
    expect(data.backlashMm[1]).toBeNull();
    expect(data.backlashMm[3]).toBeNull();
    expect(data.backlashMm[0]).toBeCloseTo(0.008 * MM_PER_IN, 12); // S: NIST SP 811, 2008, App. B
    expect(data.backlashMm[2]).toBeCloseTo(0.006 * MM_PER_IN, 12);
  });

  it('fills every section the sheet left out with an empty value, used bearings and no damage', () => {
    const data = draftToData(parseDraft({ unit: 'mm', resolution: '0.01mm', readings: [0.15, 0.15, 0.15] }));
    expect(data).toEqual({
      entry: { unit: 'mm', resolution: '0.01mm', torqueUnit: 'lbf-in' },
      runsChangeReason: null,
      backlashMm: [0.15, 0.15, 0.15],
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
    });
  });

  it('stores blank text (a reason, a marking, the notes) as null rather than an empty string', () => {
    const data = draftToData(
      parseDraft({
        unit: 'mm',
        resolution: '0.01mm',
        readings: [0.15, 0.15, 0.15],
        runsChangeReason: '   ',
        pinion: { marking: '' },
        notes: '',
      }),
    );
    expect(data.runsChangeReason).toBeNull();
    expect(data.pinion.marking).toBeNull();
    expect(data.notes).toBeNull();
  });

  it('keeps the contact patterns, the findings and the text as typed', () => {
    const data = draftToData(parseDraft(INCH_SHEET));
    expect(data.patterns).toEqual({ drive: { along: 0.45, up: 0.55, length: 0.4 }, coast: null });
    expect(data.condition).toEqual(INCH_SHEET.condition);
    expect(data.runsChangeReason).toBe('Counter reset after the swap');
    expect(data.pinion.marking).toBe('+2');
    expect(data.preload.bearings).toBe('new');
  });
});

describe('dataToEntry (canonical back to what was typed)', () => {
  it('gives back the inch and lbf·in figures exactly as typed, without float noise', () => {
    const entry = dataToEntry(draftToData(parseDraft(INCH_SHEET)));
    expect(entry.unit).toBe('in');
    expect(entry.resolution).toBe('0.0005in');
    expect(entry.torqueUnit).toBe('lbf-in');
    expect(entry.readings).toEqual([0.0085, 0.007, 0.0065, 0.0075]);
    expect(entry.runout).toEqual({ backFace: 0.0015, radial: 0.001 });
    expect(entry.pinion).toEqual({ shims: [0.03, 0.005], depthChange: -0.004, marking: '+2' });
    expect(entry.carrierShims).toEqual({ left: 0.06, right: 0.055 });
    expect(entry.preload).toEqual({
      pinionTorque: 24,
      bearings: 'new',
      hubLeft: { unchanged: true, torque: 18 },
      hubRight: { unchanged: false },
    });
    expect(entry.notes).toBe('Demo sheet, invented figures.');
  });

  it('converts a record in its own entry unit, not in any other', () => {
    // The same 0.2032 mm (0.008 in × 25.4, S: NIST SP 811, 2008, App. B) reads 0.008 in an inch record, 0.2032 in a mm one.
    const inch = draftToData(parseDraft({ unit: 'in', resolution: '0.001in', readings: [0.008, 0.008, 0.008] }));
    const metric = { ...inch, entry: { ...inch.entry, unit: 'mm' as const } };
    expect(dataToEntry(inch).readings).toEqual([0.008, 0.008, 0.008]);
    dataToEntry(metric).readings.forEach((mm) => expect(mm).toBeCloseTo(0.2032, 12));
  });

  it('leaves a missing value null, and a hub torque nobody measured out', () => {
    const entry = dataToEntry(
      draftToData(parseDraft({ unit: 'in', resolution: '0.001in', readings: [0.008, null, 0.006] })),
    );
    expect(entry.readings).toEqual([0.008, null, 0.006]);
    expect(entry.runout).toEqual({ backFace: null, radial: null });
    expect(entry.preload.pinionTorque).toBeNull();
    expect(entry.preload.hubLeft).toEqual({ unchanged: null });
    expect(entry.runsChangeReason).toBeUndefined();
    expect(entry.notes).toBeUndefined();
  });

  it('round-trips seeded random sheets through the record and the schema back to the same record', () => {
    const random = createRandom(2540);
    for (let i = 0; i < 200; i++) {
      const inches = random() < 0.5;
      // Whole graduations, as an indicator reads them: 0.0005 in or 0.01 mm (CP: indicator graduations, TRADE.md Units).
      const step = inches ? 0.0005 : 0.01;
      const grads = (low: number, high: number) => Number((pickInteger(random, low, high) * step).toFixed(4));
      const count = pickInteger(random, 3, 12);
      const readings = Array.from({ length: count }, () => (random() < 0.1 ? null : grads(6, 20)));
      const typed = parseDraft({
        unit: inches ? 'in' : 'mm',
        resolution: inches ? '0.0005in' : '0.01mm',
        torqueUnit: inches ? 'lbf-in' : 'N-m',
        readings,
        runout: { backFace: grads(0, 6), radial: random() < 0.5 ? null : grads(0, 6) },
        pinion: {
          shims: Array.from({ length: pickInteger(random, 0, 4) }, () => grads(1, 60)),
          depthChange: grads(-8, 8),
        },
        carrierShims: { left: grads(20, 140), right: grads(20, 140) },
        preload: {
          pinionTorque: inches ? pickInteger(random, 8, 32) : pickInteger(random, 10, 36) / 10,
          bearings: random() < 0.5 ? 'new' : 'used',
          hubLeft: {
            unchanged: random() < 0.5,
            torque: inches ? pickInteger(random, 5, 40) : pickInteger(random, 5, 40) / 10,
          },
        },
      });
      const data = draftToData(typed);
      const entry = dataToEntry(data);
      expect(entry.readings).toEqual(readings);
      expect(entry.pinion.shims).toEqual(typed.pinion?.shims);
      expect(entry.preload.pinionTorque).toBe(typed.preload?.pinionTorque);
      expect(entry.preload.hubLeft.torque).toBe(typed.preload?.hubLeft?.torque);
      // What was given back is a valid sheet again, and it stores as the same record.
      expect(draftToData(parseDraft(entry as Omit<InspectionDraftInput, keyof typeof META>))).toEqual(data);
    }
  });
});

describe('sumShimsMm', () => {
  it('adds a stack of shims, 0 for no stack and the shim itself for one', () => {
    expect(sumShimsMm([])).toBe(0);
    expect(sumShimsMm([0.762])).toBe(0.762);
    // 0.030 in + 0.005 in + 0.003 in = 0.038 in = 0.9652 mm (× 25.4, S: NIST SP 811, 2008, App. B)
    expect(sumShimsMm([0.03 * MM_PER_IN, 0.005 * MM_PER_IN, 0.003 * MM_PER_IN])).toBeCloseTo(0.9652, 12);
    expect(sumShimsMm([0.5, 0.25, 0.1])).toBeCloseTo(0.85, 12); // 0.5 + 0.25 + 0.1 by hand
  });
});
