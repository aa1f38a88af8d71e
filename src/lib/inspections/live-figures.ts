import { summariseBacklash, type RunoutEstimate } from '../analysis/backlash';
import type { HarmonicFit } from '../analysis/harmonic-fit';
import { judgeInspection, type InspectionReadings, type JudgedMeasure } from '../analysis/judge-inspection';
import { computeMean, summariseReadings } from '../analysis/statistics';
import { publishedLimitsOf, type ToleranceProfile } from '../analysis/tolerance';
import { findResolution, mmToLength, type LengthUnit } from '../units';
import { verdictsForReader, type ReaderVerdict } from './verdicts-for-reader';

/**
 * The figures the sheet shows while the technician types: the server's own functions (statistics,
 * once-per-turn fit, judgeBacklash) on the readings so far, in the entry unit. Until every position
 * is read the figures are "so far" and there is no fit (it needs the whole turn).
 */
export interface LiveFigures {
  total: number;
  readCount: number;
  complete: boolean;
  mean: number | null;
  min: number | null;
  max: number | null;
  spread: number | null;
  sd: number | null;
  harmonic: HarmonicFit | null;
  runoutEstimate: RunoutEstimate | null;
  /** In the entry unit, like every figure here; judged by the same function as the saved summary. */
  verdicts: JudgedMeasure[];
}

export interface Geometry {
  ringTeeth?: number | null;
  pinionTeeth?: number | null;
  pressureAngleDeg?: number | null;
  /** The set's runout factor setting (runout.ts): a spiral angle or a typed k. */
  spiralAngleDeg?: number | null;
  runoutK?: number | null;
}

/** What the sheet's verdicts are judged at: the entry units and the dial's graduation in the entry unit. */
export interface SheetBasis {
  unit: LengthUnit;
  torqueUnit: 'lbf-in' | 'N-m';
  resolution: string;
}

/** The graduation of a resolution id in `unit` (the coarsest dial of that unit when the id is unknown). */
export function graduationIn(resolutionId: string, unit: LengthUnit): number {
  const resolution = findResolution(resolutionId) ?? findResolution(unit === 'in' ? '0.001in' : '0.01mm')!;
  return mmToLength(resolution.mm, unit);
}

/**
 * Judges what the sheet holds so far with the one function the saved summary uses (judge-inspection.ts), so the
 * verdicts seen while typing are the verdicts kept after submit.
 */
export function judgeSheetReadings(
  readings: InspectionReadings,
  profile: ToleranceProfile,
  basis: SheetBasis,
): JudgedMeasure[] {
  const graduation = graduationIn(basis.resolution, basis.unit);
  return judgeInspection(readings, profile, { unit: basis.unit, torqueUnit: basis.torqueUnit, graduation });
}

/**
 * Live figures for readings in `unit` (null = not read yet).
 * @example computeLiveFigures([0.008, null, 0.006], 'in', DEFAULT_PROFILE).mean // 0.007
 */
export function computeLiveFigures(
  readings: readonly (number | null)[],
  unit: LengthUnit,
  profile: ToleranceProfile | null,
  geometry: Geometry = {},
  resolution: string = unit === 'in' ? '0.001in' : '0.01mm',
): LiveFigures {
  const read = readings.filter((r): r is number => r !== null && Number.isFinite(r));
  const total = readings.length;
  const empty: LiveFigures = {
    total,
    readCount: read.length,
    complete: false,
    mean: null,
    min: null,
    max: null,
    spread: null,
    sd: null,
    harmonic: null,
    runoutEstimate: null,
    verdicts: [],
  };
  if (read.length === 0) return empty;
  const complete = total >= 3 && read.length === total;
  const geo =
    geometry.ringTeeth && geometry.pinionTeeth
      ? {
          ringTeeth: geometry.ringTeeth,
          pinionTeeth: geometry.pinionTeeth,
          pressureAngleDeg: geometry.pressureAngleDeg ?? undefined,
          spiralAngleDeg: geometry.spiralAngleDeg ?? null,
          runoutK: geometry.runoutK ?? null,
        }
      : undefined;
  let figures: LiveFigures;
  if (complete) {
    const s = summariseBacklash(read, geo);
    figures = {
      ...empty,
      complete,
      mean: s.mean,
      min: s.min,
      max: s.max,
      spread: s.spread,
      sd: s.sd,
      harmonic: s.harmonic,
      runoutEstimate: s.runoutEstimate ?? null,
    };
  } else if (read.length >= 2) {
    const s = summariseReadings(read);
    figures = { ...empty, mean: s.mean, min: s.min, max: s.max, spread: s.spread, sd: s.sd };
  } else {
    const only = computeMean(read);
    figures = { ...empty, mean: only, min: only, max: only, spread: 0 };
  }
  if (profile) {
    // One reading has no spread to judge yet.
    const backlash = {
      min: figures.min!,
      max: figures.max!,
      ...(read.length >= 2 && { spread: figures.spread! }),
      ...(figures.runoutEstimate && { runoutEstimate: figures.runoutEstimate.tir }),
    };
    figures.verdicts = judgeSheetReadings({ backlash }, profile, { unit, torqueUnit: 'lbf-in', resolution });
  }
  return figures;
}

/** A measured back-face runout (entry unit) against the profile's runout limit as published. */
export function judgeMeasuredRunout(
  value: number,
  basis: SheetBasis,
  profile: ToleranceProfile,
): JudgedMeasure | undefined {
  return judgeSheetReadings({ backFaceRunout: value }, profile, basis)[0];
}

/** A pinion turning torque (in the entry torque unit) against its band as published. */
export function judgePreload(
  value: number,
  bearings: 'new' | 'used',
  basis: SheetBasis,
  profile: ToleranceProfile,
): JudgedMeasure | undefined {
  return judgeSheetReadings({ pinionTorque: { value, bearings } }, profile, basis)[0];
}

/** The sheet's verdicts as the list shows them: the limit as published in the entry unit and what it was judged at. */
export function showSheetVerdicts(
  judged: readonly JudgedMeasure[],
  profile: ToleranceProfile,
  basis: SheetBasis,
): ReaderVerdict[] {
  const resolution = findResolution(basis.resolution) ?? findResolution(basis.unit === 'in' ? '0.001in' : '0.01mm')!;
  const units = { unit: basis.unit, torqueUnit: basis.torqueUnit };
  return verdictsForReader(judged, publishedLimitsOf(profile), { entry: units, reader: units, resolution });
}
