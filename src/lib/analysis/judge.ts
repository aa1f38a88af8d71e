// Verdicts: where a value sits against a band, and the named verdicts for one backlash inspection.

import type { BacklashSummary } from './backlash';
import type { ToleranceProfile } from './tolerance';

export type Verdict = 'in-band' | 'near-limit' | 'out-of-band';

/** Limits of a range; at least one side must be given. */
export type RangeLimits =
  { readonly min: number; readonly max?: number } | { readonly min?: number; readonly max: number };

/** Where a value sits against the nearest (or the broken) limit. */
export interface RangeVerdict {
  readonly verdict: Verdict;
  readonly limit: 'min' | 'max';
  readonly limitValue: number;
  /** Distance to that limit, positive inside the band, negative outside. */
  readonly margin: number;
}

export type BacklashMeasure = 'backlash-min-point' | 'backlash-max-point' | 'spread' | 'runout';
/** Every measure an inspection is judged on. */
export type InspectionMeasure =
  BacklashMeasure | 'runout-measured' | 'pinion-preload-new' | 'pinion-preload-used' | 'hub-left' | 'hub-right';

/** A verdict on one named measure. */
export interface MeasureVerdict extends RangeVerdict {
  readonly measure: InspectionMeasure;
  readonly value: number;
}

// Inputs come through unit conversions; a boundary value must not flip on the 17th digit.
const RELATIVE_TOLERANCE = 1e-12;

/** How far past each limit a value may sit and still be within (a limit judged in the other unit, CP). */
export interface LimitAllowance {
  readonly min?: number;
  readonly max?: number;
}

/**
 * Judges a value against a closed band. Near = within nearShare × (max − min) of a limit; for a one-sided
 * limit, within nearShare × that limit. Limits are inclusive: a value on a limit is near-limit, not out; with an
 * allowance, a value up to that far past the limit is near-limit too (the margin stays measured to the limit).
 * @example judgeRange(0.14, { min: 0.13, max: 0.23 }, 0.1) // { verdict: 'near-limit', limit: 'min', margin: 0.01 }
 */
export function judgeRange(
  value: number,
  limits: RangeLimits,
  nearShare: number,
  allowance: LimitAllowance = {},
): RangeVerdict {
  const { min, max } = limits;
  if (!Number.isFinite(value)) throw new RangeError('judgeRange needs a finite value.');
  if (min === undefined && max === undefined) throw new RangeError('judgeRange needs a min or a max.');
  if (min !== undefined && max !== undefined && min > max) throw new RangeError(`Band min ${min} is above max ${max}.`);
  const tolerance = RELATIVE_TOLERANCE * Math.max(Math.abs(value), Math.abs(min ?? 0), Math.abs(max ?? 0));
  const nearZone = nearShare * (min !== undefined && max !== undefined ? max - min : Math.abs((max ?? min) as number));
  const marginMin = min === undefined ? Infinity : value - min;
  const marginMax = max === undefined ? Infinity : max - value;
  // Ties go to min: on a zero-width band the tight side is the one a technician checks first.
  const limit: 'min' | 'max' = marginMin <= marginMax ? 'min' : 'max';
  const margin = limit === 'min' ? marginMin : marginMax;
  const limitValue = (limit === 'min' ? min : max) as number;
  const allowed = (limit === 'min' ? allowance.min : allowance.max) ?? 0;
  const verdict: Verdict =
    margin < -(tolerance + allowed) ? 'out-of-band' : margin <= nearZone + tolerance ? 'near-limit' : 'in-band';
  return { verdict, limit, limitValue, margin };
}

/** The limits judgeBacklash reads; any missing one is simply not judged. */
export type BacklashLimits = Partial<
  Pick<ToleranceProfile, 'backlashMin' | 'backlashMax' | 'maxSpread' | 'runoutMax' | 'nearShare'>
>;

const DEFAULT_NEAR_SHARE = 0.1;

/**
 * Judges one backlash inspection, in the summary's unit. GM 1996 specifies backlash "at the minimum point", so
 * the tightest reading is judged against the band; the loosest reading is judged against the same band (it can
 * only break the min when the tightest does). Spread against maxSpread; estimated runout against runoutMax.
 * @example judgeBacklash(summary, DEFAULT_PROFILE).map((v) => v.measure) // ['backlash-min-point', …]
 */
export function judgeBacklash(
  summary: Pick<BacklashSummary, 'min' | 'max' | 'spread'> & { readonly runoutEstimate?: { readonly tir: number } },
  limits: BacklashLimits,
): MeasureVerdict[] {
  const nearShare = limits.nearShare ?? DEFAULT_NEAR_SHARE;
  const verdicts: MeasureVerdict[] = [];
  const { backlashMin: min, backlashMax: max } = limits;
  const band = min !== undefined ? { min, max } : max !== undefined ? { max } : undefined;
  if (band) {
    verdicts.push({ measure: 'backlash-min-point', value: summary.min, ...judgeRange(summary.min, band, nearShare) });
    verdicts.push({ measure: 'backlash-max-point', value: summary.max, ...judgeRange(summary.max, band, nearShare) });
  }
  if (limits.maxSpread !== undefined) {
    const spread = summary.spread;
    verdicts.push({ measure: 'spread', value: spread, ...judgeRange(spread, { max: limits.maxSpread }, nearShare) });
  }
  if (limits.runoutMax !== undefined && summary.runoutEstimate) {
    const tir = summary.runoutEstimate.tir;
    verdicts.push({ measure: 'runout', value: tir, ...judgeRange(tir, { max: limits.runoutMax }, nearShare) });
  }
  return verdicts;
}
