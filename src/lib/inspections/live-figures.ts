import { summariseBacklash, type RunoutEstimate } from '../analysis/backlash';
import type { HarmonicFit } from '../analysis/harmonic-fit';
import { judgeBacklash, judgeRange, type MeasureVerdict, type RangeVerdict } from '../analysis/judge';
import { computeMean, summariseReadings } from '../analysis/statistics';
import type { ToleranceProfile } from '../analysis/tolerance';
import { mmToLength, nmToTorque, type LengthUnit, type TorqueUnit } from '../units';

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
  /** In the entry unit, like every figure here. */
  verdicts: MeasureVerdict[];
}

export interface Geometry {
  ringTeeth?: number | null;
  pinionTeeth?: number | null;
  pressureAngleDeg?: number | null;
}

/** The profile's length limits in the entry unit (the profile is stored in mm). */
export function profileToLengthLimits(profile: ToleranceProfile, unit: LengthUnit) {
  return {
    backlashMin: mmToLength(profile.backlashMin, unit),
    backlashMax: mmToLength(profile.backlashMax, unit),
    maxSpread: mmToLength(profile.maxSpread, unit),
    runoutMax: mmToLength(profile.runoutMax, unit),
    nearShare: profile.nearShare,
  };
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
    const verdicts = judgeBacklash(
      {
        min: figures.min!,
        max: figures.max!,
        spread: figures.spread!,
        runoutEstimate: figures.runoutEstimate ?? undefined,
      },
      profileToLengthLimits(profile, unit),
    );
    // One reading has no spread to judge yet.
    figures.verdicts = read.length < 2 ? verdicts.filter((v) => v.measure !== 'spread') : verdicts;
  }
  return figures;
}

/** A measured back-face runout (entry unit) against the profile's runout limit. */
export function judgeMeasuredRunout(value: number, unit: LengthUnit, profile: ToleranceProfile): RangeVerdict {
  return judgeRange(value, { max: mmToLength(profile.runoutMax, unit) }, profile.nearShare);
}

/** The pinion turning-torque band for new or used bearings, in `torqueUnit`. */
export function preloadBandIn(
  profile: ToleranceProfile,
  bearings: 'new' | 'used',
  torqueUnit: TorqueUnit,
): { min: number; max: number } {
  const band = bearings === 'new' ? profile.pinionPreloadNew : profile.pinionPreloadUsed;
  return { min: nmToTorque(band.min, torqueUnit), max: nmToTorque(band.max, torqueUnit) };
}

/** A pinion turning torque (in `torqueUnit`) against its band. */
export function judgePreload(
  value: number,
  bearings: 'new' | 'used',
  torqueUnit: TorqueUnit,
  profile: ToleranceProfile,
): RangeVerdict {
  return judgeRange(value, preloadBandIn(profile, bearings, torqueUnit), profile.nearShare);
}
