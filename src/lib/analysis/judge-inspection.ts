// One function judges every measure of an inspection, for the sheet while typing and for the saved record alike,
// so a verdict seen live is the verdict kept. Readings are judged in the unit they were read in, against the limit
// as published in that unit (published-limits.ts); see the README's "Limits as published".

import { judgeRange, type InspectionMeasure, type MeasureVerdict, type RangeLimits } from './judge';
import {
  lengthLimitIn,
  torqueLimitIn,
  type EffectiveLimit,
  type LengthFigures,
  type PublishedTorqueUnit,
  type TorqueBandFigures,
} from './published-limits';
import { publishedLimitsOf, type ToleranceProfile } from './tolerance';
import type { LengthUnit } from '../units';

/** What was read, each figure in the unit it was read in (lengths in `basis.unit`, torques in `basis.torqueUnit`). */
export interface InspectionReadings {
  /** Backlash figures; `spread` only once two positions are read, `runoutEstimate` with a whole turn and a k. */
  readonly backlash?: {
    readonly min: number;
    readonly max: number;
    readonly spread?: number;
    readonly runoutEstimate?: number;
  } | null;
  readonly backFaceRunout?: number | null;
  readonly pinionTorque?: { readonly value: number; readonly bearings: 'new' | 'used' } | null;
  readonly hubs?: { readonly left: boolean | null; readonly right: boolean | null };
}

/** The unit and dial the readings were taken with: what they are judged at. */
export interface JudgingBasis {
  readonly unit: LengthUnit;
  readonly torqueUnit: PublishedTorqueUnit;
  /** One graduation of the indicator, in `unit`. */
  readonly graduation: number;
}

/** A verdict with the unit its figures are in and whether its limit was printed in that unit. */
export interface JudgedMeasure extends MeasureVerdict {
  /** 'in' | 'mm' | 'lbf-in' | 'N-m', or 'check' for a yes/no check. */
  readonly unit: string;
  /** The limit was printed in the reading's unit (judged exactly), or converted with an allowance. */
  readonly asPublished: boolean;
}

function judgeAgainst(
  measure: InspectionMeasure,
  value: number,
  unit: string,
  min: EffectiveLimit | undefined,
  max: EffectiveLimit | undefined,
  nearShare: number,
): JudgedMeasure {
  const limits = { min: min?.value, max: max?.value } as RangeLimits;
  const verdict = judgeRange(value, limits, nearShare, { min: min?.allowance, max: max?.allowance });
  const used = verdict.limit === 'min' ? min : max;
  return { measure, value, ...verdict, unit, asPublished: used?.asPublished ?? true };
}

/**
 * Judges every measure present in `readings` against the profile, in the order a technician reads a verdict
 * list: backlash tightest, loosest, spread, runout estimated from the lash, runout measured, pinion torque, hubs.
 * @example judgeInspection({ backlash: { min: 0.005, max: 0.007, spread: 0.002 } }, DEFAULT_PROFILE, { unit: 'in', torqueUnit: 'lbf-in', graduation: 0.001 })
 *   // three verdicts, all within: the printed inch figures are the limits
 */
export function judgeInspection(
  readings: InspectionReadings,
  profile: ToleranceProfile,
  basis: JudgingBasis,
): JudgedMeasure[] {
  const published = publishedLimitsOf(profile);
  const near = profile.nearShare;
  const { unit, torqueUnit, graduation } = basis;
  const length = (figures: LengthFigures) => lengthLimitIn(figures, unit, graduation);
  const verdicts: JudgedMeasure[] = [];
  const backlash = readings.backlash;
  if (backlash) {
    const low = length(published.backlashMin);
    const high = length(published.backlashMax);
    verdicts.push(judgeAgainst('backlash-min-point', backlash.min, unit, low, high, near));
    verdicts.push(judgeAgainst('backlash-max-point', backlash.max, unit, low, high, near));
    if (backlash.spread !== undefined)
      verdicts.push(judgeAgainst('spread', backlash.spread, unit, undefined, length(published.maxSpread), near));
    if (backlash.runoutEstimate !== undefined)
      verdicts.push(
        judgeAgainst('runout', backlash.runoutEstimate, unit, undefined, length(published.runoutMax), near),
      );
  }
  if (readings.backFaceRunout !== undefined && readings.backFaceRunout !== null) {
    const max = length(published.runoutMax);
    verdicts.push(judgeAgainst('runout-measured', readings.backFaceRunout, unit, undefined, max, near));
  }
  const torque = readings.pinionTorque;
  if (torque) {
    const band: TorqueBandFigures =
      torque.bearings === 'new' ? published.pinionPreloadNew : published.pinionPreloadUsed;
    const min = torqueLimitIn(band.min, torqueUnit);
    const max = torqueLimitIn(band.max, torqueUnit);
    verdicts.push(judgeAgainst(`pinion-preload-${torque.bearings}`, torque.value, torqueUnit, min, max, near));
  }
  if (profile.hubPreloadCheck && readings.hubs) {
    for (const side of ['left', 'right'] as const) {
      const unchanged = readings.hubs[side];
      if (unchanged === null) continue;
      // A yes/no check: "unchanged" passes with margin 1, "changed" fails with margin −1.
      verdicts.push({
        measure: `hub-${side}`,
        value: unchanged ? 1 : 0,
        verdict: unchanged ? 'in-band' : 'out-of-band',
        limit: 'min',
        limitValue: 1,
        margin: unchanged ? 1 : -1,
        unit: 'check',
        asPublished: true,
      });
    }
  }
  return verdicts;
}
