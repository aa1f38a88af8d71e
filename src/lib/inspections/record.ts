import { lengthToMm, mmToLength, nmToTorque, torqueToNm, type LengthUnit, type TorqueUnit } from '../units';
import type { InspectionDraft, Severity } from './schemas';

/**
 * An inspection as stored: every length in mm and every torque in N·m, with the entry unit and the
 * indicator resolution kept beside them, and the conversion back to what the technician typed.
 */
export interface HubCheck {
  unchanged: boolean | null;
  torqueNm: number | null;
}

export interface Pattern {
  along: number;
  up: number;
  length?: number;
}

export interface InspectionData {
  entry: { unit: LengthUnit; resolution: string; torqueUnit: 'lbf-in' | 'N-m' };
  runsChangeReason: string | null;
  backlashMm: (number | null)[];
  runoutMm: { backFace: number | null; radial: number | null };
  pinion: { shimsMm: number[]; depthChangeMm: number | null; marking: string | null };
  carrierShimsMm: { left: number | null; right: number | null };
  preload: { pinionNm: number | null; bearings: 'new' | 'used'; hubLeft: HubCheck; hubRight: HubCheck };
  patterns: { drive: Pattern | null; coast: Pattern | null };
  condition: {
    teeth: { finding: string; severity: Severity }[];
    splines: Severity;
    bearings: Severity;
    seals: Severity;
  };
  notes: string | null;
}

const toMm = (value: number | null | undefined, unit: LengthUnit) =>
  value === null || value === undefined ? null : lengthToMm(value, unit);
const toNm = (value: number | null | undefined, unit: TorqueUnit) =>
  value === null || value === undefined ? null : torqueToNm(value, unit);
// Converting back and forth leaves float noise (0.010000000000000002); twelve decimals is far below any indicator.
const clean = (value: number) => Number(value.toFixed(12));
const fromMm = (mm: number | null, unit: LengthUnit) => (mm === null ? null : clean(mmToLength(mm, unit)));
const fromNm = (nm: number | null, unit: TorqueUnit) => (nm === null ? null : clean(nmToTorque(nm, unit)));

/** A validated draft (entry units) as the canonical record. */
export function draftToData(draft: InspectionDraft): InspectionData {
  const { unit } = draft;
  const torqueUnit = draft.torqueUnit;
  const hub = (side?: { unchanged: boolean | null; torque?: number }): HubCheck => ({
    unchanged: side?.unchanged ?? null,
    torqueNm: toNm(side?.torque, torqueUnit),
  });
  return {
    entry: { unit, resolution: draft.resolution, torqueUnit },
    runsChangeReason: draft.runsChangeReason || null,
    backlashMm: draft.readings.map((r) => toMm(r, unit)),
    runoutMm: { backFace: toMm(draft.runout?.backFace, unit), radial: toMm(draft.runout?.radial, unit) },
    pinion: {
      shimsMm: (draft.pinion?.shims ?? []).map((s) => lengthToMm(s, unit)),
      depthChangeMm: toMm(draft.pinion?.depthChange, unit),
      marking: draft.pinion?.marking || null,
    },
    carrierShimsMm: { left: toMm(draft.carrierShims?.left, unit), right: toMm(draft.carrierShims?.right, unit) },
    preload: {
      pinionNm: toNm(draft.preload?.pinionTorque, torqueUnit),
      bearings: draft.preload?.bearings ?? 'used',
      hubLeft: hub(draft.preload?.hubLeft),
      hubRight: hub(draft.preload?.hubRight),
    },
    patterns: { drive: draft.patterns?.drive ?? null, coast: draft.patterns?.coast ?? null },
    condition: {
      teeth: draft.condition?.teeth ?? [],
      splines: draft.condition?.splines ?? 'none',
      bearings: draft.condition?.bearings ?? 'none',
      seals: draft.condition?.seals ?? 'none',
    },
    notes: draft.notes || null,
  };
}

/** The entry fields back from the record, in the unit the technician typed them in. */
export function dataToEntry(data: InspectionData) {
  const { unit, torqueUnit, resolution } = data.entry;
  const hub = (side: HubCheck) => ({
    unchanged: side.unchanged,
    ...(side.torqueNm === null ? {} : { torque: fromNm(side.torqueNm, torqueUnit)! }),
  });
  return {
    unit,
    resolution,
    torqueUnit,
    runsChangeReason: data.runsChangeReason ?? undefined,
    readings: data.backlashMm.map((mm) => fromMm(mm, unit)),
    runout: { backFace: fromMm(data.runoutMm.backFace, unit), radial: fromMm(data.runoutMm.radial, unit) },
    pinion: {
      shims: data.pinion.shimsMm.map((mm) => fromMm(mm, unit)!),
      depthChange: fromMm(data.pinion.depthChangeMm, unit),
      marking: data.pinion.marking ?? undefined,
    },
    carrierShims: { left: fromMm(data.carrierShimsMm.left, unit), right: fromMm(data.carrierShimsMm.right, unit) },
    preload: {
      pinionTorque: fromNm(data.preload.pinionNm, torqueUnit),
      bearings: data.preload.bearings,
      hubLeft: hub(data.preload.hubLeft),
      hubRight: hub(data.preload.hubRight),
    },
    patterns: data.patterns,
    condition: data.condition,
    notes: data.notes ?? undefined,
  };
}

/** The total of a pinion shim stack, in mm. */
export function sumShimsMm(shimsMm: readonly number[]): number {
  return shimsMm.reduce((total, shim) => total + shim, 0);
}
