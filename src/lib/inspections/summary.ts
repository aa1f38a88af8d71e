import {
  describePattern,
  summariseBacklash,
  type BacklashAnalysis,
  type PatternGuidance,
  type ToleranceProfile,
} from '../analysis';
import type { CutMethod } from '../analysis/contact-pattern';
import { judgeInspection, type InspectionReadings } from '../analysis/judge-inspection';
import { publishedLimitsOf } from '../analysis/tolerance';
import { findResolution, mmToLength, nmToTorque, type LengthUnit } from '../units';
import type { InspectionData } from './record';
import { verdictsForReader, type ReaderVerdict } from './verdicts-for-reader';

/**
 * What one inspection's readings mean against its tolerance profile, in the reader's units: the
 * backlash analysis, a verdict per measure with its limit and margin, and the pattern guidance.
 */
export interface ReaderUnits {
  lengthUnit: LengthUnit;
  torqueUnit: 'lbf-in' | 'N-m';
}

export interface GearGeometry {
  ringTeeth: number | null;
  pinionTeeth: number | null;
  pressureAngleDeg: number | null;
  /** How the set was cut (contact-pattern guidance); not known when absent. */
  cutMethod?: CutMethod;
  /** The set's runout factor setting: a spiral angle or a typed k (runout.ts). */
  spiralAngleDeg?: number | null;
  runoutK?: number | null;
}

/** The geometry the runout estimate needs, when both tooth counts are known. */
function estimateGeometry(geometry: GearGeometry) {
  if (!geometry.ringTeeth || !geometry.pinionTeeth) return undefined;
  return {
    ringTeeth: geometry.ringTeeth,
    pinionTeeth: geometry.pinionTeeth,
    pressureAngleDeg: geometry.pressureAngleDeg ?? undefined,
    spiralAngleDeg: geometry.spiralAngleDeg ?? null,
    runoutK: geometry.runoutK ?? null,
  };
}

export interface InspectionSummary {
  complete: boolean;
  unit: LengthUnit;
  torqueUnit: 'lbf-in' | 'N-m';
  /** The indicator graduation in the reader's length unit (for change thresholds and digits). */
  resolution: number;
  backlash: BacklashAnalysis | null;
  /** Judged in the entry unit against the limits as published, shown in the reader's units. */
  verdicts: ReaderVerdict[];
  patterns: PatternGuidance[];
  shimTotal: number | null;
  runoutTir: number | null;
}

/** Summarises a stored inspection. Incomplete readings (a position not read) give no backlash figures. */
export function summariseInspection(
  data: InspectionData,
  profile: ToleranceProfile,
  geometry: GearGeometry,
  units: ReaderUnits,
): InspectionSummary {
  const unit = units.lengthUnit;
  const len = (mm: number) => mmToLength(mm, unit);
  const complete = data.backlashMm.length >= 3 && data.backlashMm.every((r) => r !== null);
  const backlash: BacklashAnalysis | null = complete
    ? { unit, ...summariseBacklash((data.backlashMm as number[]).map(len), estimateGeometry(geometry)) }
    : null;
  const resolution = findResolution(data.entry.resolution) ?? findResolution(unit === 'in' ? '0.001in' : '0.01mm')!;
  const entryUnit = data.entry.unit;
  const readings: InspectionReadings = {
    backlash: complete ? entryBacklash(data, entryUnit, geometry) : null,
    backFaceRunout: data.runoutMm.backFace === null ? null : mmToLength(data.runoutMm.backFace, entryUnit),
    pinionTorque:
      data.preload.pinionNm === null
        ? null
        : { value: nmToTorque(data.preload.pinionNm, data.entry.torqueUnit), bearings: data.preload.bearings },
    hubs: { left: data.preload.hubLeft.unchanged, right: data.preload.hubRight.unchanged },
  };
  const entryUnits = { unit: entryUnit, torqueUnit: data.entry.torqueUnit };
  const judged = judgeInspection(readings, profile, {
    ...entryUnits,
    graduation: mmToLength(resolution.mm, entryUnit),
  });
  const verdicts = verdictsForReader(judged, publishedLimitsOf(profile), {
    entry: entryUnits,
    reader: { unit, torqueUnit: units.torqueUnit },
    resolution,
  });
  const drive = data.patterns.drive;
  const patternContext = {
    cutMethod: geometry.cutMethod ?? 'unknown',
    drive: drive ? { alongTooth: drive.along, upTooth: drive.up } : null,
  };
  const patterns = (['drive', 'coast'] as const).flatMap((side) => {
    const p = data.patterns[side];
    return p ? [describePattern({ side, alongTooth: p.along, upTooth: p.up }, patternContext)] : [];
  });
  return {
    complete,
    unit,
    torqueUnit: units.torqueUnit,
    resolution: findResolution(data.entry.resolution) ? len(resolution.mm) : 0,
    backlash,
    verdicts,
    patterns,
    shimTotal: data.pinion.shimsMm.length ? len(data.pinion.shimsMm.reduce((a, b) => a + b, 0)) : null,
    runoutTir: data.runoutMm.backFace === null ? null : len(data.runoutMm.backFace),
  };
}

/** The backlash figures the verdicts are judged on, in the unit the dial was read in. */
function entryBacklash(data: InspectionData, entryUnit: LengthUnit, geometry: GearGeometry) {
  const readings = (data.backlashMm as number[]).map((mm) => mmToLength(mm, entryUnit));
  const summary = summariseBacklash(readings, estimateGeometry(geometry));
  return {
    min: summary.min,
    max: summary.max,
    spread: summary.spread,
    ...(summary.runoutEstimate && { runoutEstimate: summary.runoutEstimate.tir }),
  };
}
