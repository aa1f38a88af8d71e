import {
  analyseBacklash,
  describePattern,
  judgeRange,
  type BacklashAnalysis,
  type MeasureVerdict,
  type PatternGuidance,
  type ToleranceProfile,
} from '../analysis';
import { findResolution, mmToLength, nmToTorque, type LengthUnit } from '../units';
import type { InspectionData } from './record';

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
}

export interface InspectionSummary {
  complete: boolean;
  unit: LengthUnit;
  torqueUnit: 'lbf-in' | 'N-m';
  /** The indicator graduation in the reader's length unit (for change thresholds and digits). */
  resolution: number;
  backlash: BacklashAnalysis | null;
  verdicts: (MeasureVerdict & { unit: string })[];
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
  const torque = (nm: number) => nmToTorque(nm, units.torqueUnit);
  const complete = data.backlashMm.length >= 3 && data.backlashMm.every((r) => r !== null);
  const backlash = complete
    ? analyseBacklash({
        unit,
        readings: (data.backlashMm as number[]).map(len),
        profile: { min: len(profile.backlashMin), max: len(profile.backlashMax), maxSpread: len(profile.maxSpread) },
        ...(geometry.ringTeeth && geometry.pinionTeeth
          ? {
              ringTeeth: geometry.ringTeeth,
              pinionTeeth: geometry.pinionTeeth,
              pressureAngleDeg: geometry.pressureAngleDeg ?? 20,
            }
          : {}),
      })
    : null;
  const verdicts: (MeasureVerdict & { unit: string })[] = (backlash?.verdicts ?? []).map((v) => ({ ...v, unit }));
  const near = profile.nearShare;
  if (data.runoutMm.backFace !== null) {
    const value = len(data.runoutMm.backFace);
    verdicts.push({
      measure: 'runout-measured' as MeasureVerdict['measure'],
      value,
      ...judgeRange(value, { max: len(profile.runoutMax) }, near),
      unit,
    });
  }
  if (data.preload.pinionNm !== null) {
    const band = data.preload.bearings === 'new' ? profile.pinionPreloadNew : profile.pinionPreloadUsed;
    const value = torque(data.preload.pinionNm);
    verdicts.push({
      measure: `pinion-preload-${data.preload.bearings}` as MeasureVerdict['measure'],
      value,
      ...judgeRange(value, { min: torque(band.min), max: torque(band.max) }, near),
      unit: units.torqueUnit,
    });
  }
  if (profile.hubPreloadCheck) {
    for (const [side, check] of [
      ['left', data.preload.hubLeft],
      ['right', data.preload.hubRight],
    ] as const) {
      if (check.unchanged === null) continue;
      // A yes/no check: "unchanged" passes with margin 1, "changed" fails with margin -1.
      verdicts.push({
        measure: `hub-${side}` as MeasureVerdict['measure'],
        value: check.unchanged ? 1 : 0,
        verdict: check.unchanged ? 'in-band' : 'out-of-band',
        limit: 'min',
        limitValue: 1,
        margin: check.unchanged ? 1 : -1,
        unit: 'check',
      });
    }
  }
  const patterns = (['drive', 'coast'] as const).flatMap((side) => {
    const p = data.patterns[side];
    return p ? [describePattern({ side, alongTooth: p.along, upTooth: p.up })] : [];
  });
  const resolution = findResolution(data.entry.resolution);
  return {
    complete,
    unit,
    torqueUnit: units.torqueUnit,
    resolution: resolution ? len(resolution.mm) : 0,
    backlash,
    verdicts,
    patterns,
    shimTotal: data.pinion.shimsMm.length ? len(data.pinion.shimsMm.reduce((a, b) => a + b, 0)) : null,
    runoutTir: data.runoutMm.backFace === null ? null : len(data.runoutMm.backFace),
  };
}
