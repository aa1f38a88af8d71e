// What to do with a gear set: keep, watch, re-shim (set up again) or retire, with every reason listed.
// Precedence retire > re-shim > watch > keep: the strongest reason sets the action, none is dropped.

import { measureToLabel } from './measure-labels';
import type { PatternGuidance } from './contact-pattern';
import type { Verdict } from './judge';
import type { TrendProjection } from './trend';

export type RecommendedAction = 'keep' | 'watch' | 're-shim' | 'retire';
export type ReasonSeverity = 'info' | 'warning' | 'critical';

/** One reason, with the action it calls for on its own. */
export interface RecommendationReason {
  readonly code: string;
  readonly message: string;
  readonly severity: ReasonSeverity;
  readonly action: RecommendedAction;
}

export interface Recommendation {
  readonly action: RecommendedAction;
  /** Strongest first; equal strength in input order. */
  readonly reasons: RecommendationReason[];
}

/** A damage finding from the inspection. */
export interface DamageFinding {
  readonly area: 'teeth' | 'bearing' | 'other';
  readonly severity: 'light' | 'moderate' | 'severe';
  readonly note?: string;
}

export interface RecommendationInput {
  readonly runsSinceInstall: number;
  readonly lifeLimitRuns: number;
  /** Team setting: runs until the next planned service. */
  readonly serviceIntervalRuns: number;
  readonly verdicts?: readonly { readonly measure: string; readonly verdict: Verdict }[];
  readonly trends?: readonly { readonly measure: string; readonly projection: TrendProjection }[];
  readonly patterns?: readonly PatternGuidance[];
  readonly damage?: readonly DamageFinding[];
}

const RANK: Readonly<Record<RecommendedAction, number>> = { keep: 0, watch: 1, 're-shim': 2, retire: 3 };

const OUT_OF_BAND: Readonly<Record<string, string>> = {
  'backlash-min-point':
    'Backlash at the tightest point is outside the band: reset it with the carrier shims (GM 1996: moving 0.05 mm of shim side to side changes lash about 0.03 mm).',
  'backlash-max-point':
    'Backlash at the loosest point is outside the band: reset it with the carrier shims, and check the variation between points.',
  spread:
    'Variation between points is over the limit. It points to burrs, a distorted case flange, uneven bolting or debris (GM 1996): take the carrier down, clean and check before setting up again; shims alone will not even it out.',
  'runout-measured':
    'Measured back-face runout is over the limit. Shimming moves the whole gear and cannot cure runout: check the ring gear seats flat, its bolts, and the case flange runout (Ford 1997); a bent case or gear is replaced.',
  runout:
    'Estimated ring-gear runout is over the limit. Shimming moves the whole gear and cannot cure runout: check the ring gear seats flat, its bolts, and the case flange runout (Ford 1997); a bent case or gear is replaced.',
};

function isBacklash(measure: string): boolean {
  return measure.startsWith('backlash');
}

function collectReasons(input: RecommendationInput): RecommendationReason[] {
  const { runsSinceInstall: runs, lifeLimitRuns: life, serviceIntervalRuns: interval } = input;
  const reasons: RecommendationReason[] = [];
  const add = (code: string, action: RecommendedAction, severity: ReasonSeverity, message: string): void => {
    reasons.push({ code, message, severity, action });
  };
  if (runs > life)
    add('life-reached', 'retire', 'critical', `${runs - life} runs over the life limit of ${life}: replace the set.`);
  else if (runs === life)
    add('life-reached', 'retire', 'critical', `${runs} runs reach the life limit of ${life}: replace the set.`);
  else if (life - runs <= interval) {
    add(
      'life-before-next-service',
      'watch',
      'warning',
      `The life limit of ${life} runs falls before the next service (${life - runs} runs left): plan the replacement.`,
    );
  }
  for (const finding of input.damage ?? []) {
    const note = finding.note ? ` (${finding.note})` : '';
    if (finding.severity === 'severe' && finding.area === 'teeth') {
      add('damage-severe-teeth', 'retire', 'critical', `Severe damage on the tooth surfaces${note}: replace the set.`);
    } else if (finding.severity === 'severe') {
      // A new bearing or repaired part changes preload and depth, so the set is set up again.
      add(
        `damage-severe-${finding.area}`,
        're-shim',
        'critical',
        `Severe damage on the ${finding.area}${note}: replace the part and set up again.`,
      );
    } else if (finding.severity === 'moderate') {
      add(
        `damage-moderate-${finding.area}`,
        'watch',
        'warning',
        `Moderate damage on the ${finding.area}${note}: look again at the next inspection.`,
      );
    } else {
      add(`damage-light-${finding.area}`, 'keep', 'info', `Light marks on the ${finding.area}${note}: noted.`);
    }
  }
  for (const { measure, verdict } of input.verdicts ?? []) {
    if (verdict === 'out-of-band') {
      const message =
        OUT_OF_BAND[measure] ??
        `${measureToLabel(measure)} is outside its band: set it up again to the maker's figures.`;
      add(`${measure}-out-of-band`, 're-shim', 'critical', message);
    } else if (verdict === 'near-limit') {
      add(
        `${measure}-near-limit`,
        'watch',
        'warning',
        `${measureToLabel(measure)} is near its limit: check it again at the next inspection.`,
      );
    }
  }
  for (const { measure, projection } of input.trends ?? []) {
    const code = projection.reason?.code;
    const alreadyPast = code === 'already-past-limit' || code === 'past-limit-now';
    const runsLeft = alreadyPast ? 0 : projection.runsToLimit;
    if (runsLeft === null || runsLeft > interval) continue;
    // A backlash heading out of its band is corrected with shims now rather than found out of band later.
    const action: RecommendedAction = isBacklash(measure) ? 're-shim' : 'watch';
    const name = measureToLabel(measure).toLowerCase();
    const message =
      code === 'past-limit-now'
        ? `The ${name} is past its limit now.`
        : alreadyPast
          ? `The ${name} trend line is past its limit and not heading back.`
          : `At this rate the ${name} reaches its limit within the service interval of ${interval} runs.`;
    add(`${measure}-limit-before-next-service`, action, 'warning', message);
  }
  for (const pattern of input.patterns ?? []) {
    // A drive pattern off the usual region sets up again; a coast pattern is a cross-check and never does.
    if (pattern.action !== 'keep')
      add(`pattern-${pattern.side}-${pattern.code}`, pattern.action, 'warning', pattern.guidance);
  }
  return reasons;
}

/**
 * Recommends keep | watch | re-shim | retire from life, damage, verdicts, trends and patterns.
 * @example recommendAction({ runsSinceInstall: 50, lifeLimitRuns: 50, serviceIntervalRuns: 5 }).action // 'retire'
 */
export function recommendAction(input: RecommendationInput): Recommendation {
  const reasons = collectReasons(input);
  if (reasons.length === 0) {
    reasons.push({ code: 'all-clear', message: 'Every check is within its band.', severity: 'info', action: 'keep' });
  }
  // Array.prototype.sort is stable, so equal ranks keep their input order.
  reasons.sort((left, right) => RANK[right.action] - RANK[left.action]);
  const top = reasons[0] as RecommendationReason;
  return { action: top.action, reasons };
}
