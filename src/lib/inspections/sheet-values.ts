import type { LengthUnit, TorqueUnit } from '../units';
import type { InspectionDraftInput } from './schemas';

/**
 * The inspection sheet's values: the shared draft schema's input, except that "runs at inspection"
 * may still be empty while the sheet is being filled. Pure helpers to make, resize and send them.
 */
export type SheetValues = Omit<InspectionDraftInput, 'runsAtInspection' | 'resolution'> & {
  runsAtInspection?: number | null;
  /** The sheet always holds the resolution's id. */
  resolution: string;
};

export interface BlankSheetOptions {
  gearSetId: string;
  positions: number;
  unit: LengthUnit;
  torqueUnit: Extract<TorqueUnit, 'lbf-in' | 'N-m'>;
  technicianId: string | null;
  inspectedAt: string;
}

/** The resolution a new sheet starts with for an entry unit: the common dial of that unit. */
export function defaultResolutionFor(unit: LengthUnit): string {
  return unit === 'in' ? '0.001in' : '0.01mm';
}

/** A new, empty sheet. */
export function createBlankSheet(o: BlankSheetOptions): SheetValues {
  return {
    gearSetId: o.gearSetId,
    assemblyId: null,
    inspectedAt: o.inspectedAt,
    runsAtInspection: null,
    runsChangeReason: '',
    technicianId: o.technicianId,
    unit: o.unit,
    resolution: defaultResolutionFor(o.unit),
    torqueUnit: o.torqueUnit,
    readings: resizeReadings([], o.positions),
    runout: { backFace: null, radial: null },
    pinion: { shims: [], depthChange: null, marking: '' },
    carrierShims: { left: null, right: null },
    preload: { pinionTorque: null, bearings: 'used', hubLeft: { unchanged: null }, hubRight: { unchanged: null } },
    patterns: { drive: null, coast: null },
    condition: { teeth: [], splines: 'none', bearings: 'none', seals: 'none' },
    notes: '',
  };
}

/**
 * Readings for `count` positions, keeping those already typed.
 * @example resizeReadings([0.008, 0.007], 4) // [0.008, 0.007, null, null]
 */
export function resizeReadings(readings: readonly (number | null)[], count: number): (number | null)[] {
  return Array.from({ length: count }, (_, i) => readings[i] ?? null);
}

/** Whether the runs figure differs from the one Lashline counted, so a reason is needed. */
export function needsRunsReason(runs: number | null | undefined, counted: number | null | undefined): boolean {
  return counted !== null && counted !== undefined && runs !== null && runs !== undefined && runs !== counted;
}

// JSON.stringify drops undefined members and keeps nulls: exactly what the strict schema accepts.
const toJson = <T>(value: T): T => JSON.parse(JSON.stringify(value)) as T;

/** The body of POST /api/inspections. */
export function sheetToCreateBody(values: SheetValues): Record<string, unknown> {
  return toJson(values);
}

/** The body of PATCH /api/inspections/:id: everything but the gear set, which never changes. */
export function sheetToPatchBody(values: SheetValues): Record<string, unknown> {
  const { gearSetId: _gearSet, ...rest } = toJson(values);
  return rest;
}

/** The inspection as the API answers it, as far as the sheet reads it. */
export type InspectionEntryView = Pick<
  InspectionDraftInput,
  | 'gearSetId'
  | 'inspectedAt'
  | 'runsAtInspection'
  | 'unit'
  | 'torqueUnit'
  | 'readings'
  | 'runout'
  | 'pinion'
  | 'carrierShims'
  | 'preload'
  | 'patterns'
  | 'condition'
> & {
  assemblyId: string | null;
  technicianId: string | null;
  runsChangeReason?: string | null;
  notes?: string | null;
  /** The API always answers the resolution's id. */
  resolution: string;
};

/** An existing inspection's entry values as a sheet, to edit it. */
export function viewToSheet(view: InspectionEntryView): SheetValues {
  return {
    gearSetId: view.gearSetId,
    assemblyId: view.assemblyId,
    inspectedAt: view.inspectedAt,
    runsAtInspection: view.runsAtInspection,
    runsChangeReason: view.runsChangeReason ?? '',
    technicianId: view.technicianId,
    unit: view.unit,
    resolution: view.resolution,
    torqueUnit: view.torqueUnit,
    readings: [...view.readings],
    runout: { backFace: view.runout?.backFace ?? null, radial: view.runout?.radial ?? null },
    pinion: {
      shims: [...(view.pinion?.shims ?? [])],
      depthChange: view.pinion?.depthChange ?? null,
      marking: view.pinion?.marking ?? '',
    },
    carrierShims: { left: view.carrierShims?.left ?? null, right: view.carrierShims?.right ?? null },
    preload: {
      pinionTorque: view.preload?.pinionTorque ?? null,
      bearings: view.preload?.bearings ?? 'used',
      hubLeft: view.preload?.hubLeft ?? { unchanged: null },
      hubRight: view.preload?.hubRight ?? { unchanged: null },
    },
    patterns: { drive: view.patterns?.drive ?? null, coast: view.patterns?.coast ?? null },
    condition: {
      teeth: [...(view.condition?.teeth ?? [])],
      splines: view.condition?.splines ?? 'none',
      bearings: view.condition?.bearings ?? 'none',
      seals: view.condition?.seals ?? 'none',
    },
    notes: view.notes ?? '',
  };
}

/**
 * The text an entry field starts with for a stored value: the digits the indicator shows, or the
 * value itself when it carries more.
 * @example valueToEntryText(0.01, 3) // '0.010'
 */
export function valueToEntryText(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  const fixed = value.toFixed(decimals);
  return Number(fixed) === value ? fixed : String(value);
}
