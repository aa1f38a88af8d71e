import {
  compareInspections,
  computeRunsLeft,
  lifeToText,
  fitTrendLine,
  projectTrend,
  recommendAction,
  summaryToMeasures,
  type DamageFinding,
  type LineFit,
  type MeasureChange,
  type Recommendation,
  type TrendProjection,
} from '../analysis';
import type { InspectionData } from './record';
import type { InspectionSummary } from './summary';

/**
 * A gear set's whole story from its submitted inspections: the latest summary and verdicts, the
 * change against the one before, the trend of mean backlash and spread against runs with where
 * each line meets its limit, the runs left, and the recommendation with every reason. Pure.
 */
export interface AnalysedInspection {
  id: string;
  inspectedAt: string;
  runsAtInspection: number;
  data: InspectionData;
  summary: InspectionSummary;
}

/**
 * One measure against runs. The band is for the points, not the mean: the tightest and loosest points and the
 * spread are projected to their limits; the mean is kept for the chart with no projection of its own.
 */
export interface TrendSeries {
  measure: 'backlash-min-point' | 'backlash-max-point' | 'backlash-mean' | 'spread';
  points: { inspectionId: string; runs: number; value: number }[];
  fit: LineFit;
  limits: { min?: number; max?: number };
  projection: TrendProjection;
}

export interface GearSetAnalysis {
  inspectionCount: number;
  latest: AnalysedInspection | null;
  previous: AnalysedInspection | null;
  change: MeasureChange[] | null;
  trends: TrendSeries[];
  life: {
    totalRuns: number;
    runsSinceInstall: number;
    lifeLimitRuns: number | null;
    /** Runs left to the life limit, never negative (0 once reached or passed); null without a limit. */
    runsLeft: number | null;
    /** Runs past the life limit (0 until then); null without a limit. */
    runsOver: number | null;
    /** "8 runs left", "17 runs over the life limit"; null without a limit. */
    text: string | null;
  };
  recommendation: Recommendation | null;
}

export interface GearSetAnalysisInput {
  inspections: AnalysedInspection[];
  /** The current profile's limits in the reader's length unit (as published in that unit where printed). */
  limits: { backlashMin: number; backlashMax: number; maxSpread: number };
  totalRuns: number;
  runsSinceInstall: number;
  lifeLimitRuns: number | null;
  serviceIntervalRuns: number;
}

/** Damage noted on the sheet, as the recommendation reads it. */
export function conditionToDamage(condition: InspectionData['condition']): DamageFinding[] {
  const findings: DamageFinding[] = [];
  for (const tooth of condition.teeth)
    if (tooth.severity !== 'none') findings.push({ area: 'teeth', severity: tooth.severity, note: tooth.finding });
  if (condition.bearings !== 'none') findings.push({ area: 'bearing', severity: condition.bearings });
  if (condition.splines !== 'none') findings.push({ area: 'other', severity: condition.splines, note: 'splines' });
  if (condition.seals !== 'none') findings.push({ area: 'other', severity: condition.seals, note: 'seals' });
  return findings;
}

function series(
  measure: TrendSeries['measure'],
  inspections: AnalysedInspection[],
  pick: (s: InspectionSummary) => number | undefined,
  limits: TrendSeries['limits'],
): TrendSeries {
  const points = inspections.flatMap((i) => {
    const value = pick(i.summary);
    return value === undefined ? [] : [{ inspectionId: i.id, runs: i.runsAtInspection, value }];
  });
  const fit: LineFit = points.length
    ? fitTrendLine(points)
    : { count: 0, slope: null, intercept: null, r2: null, residualSd: null, lastRuns: 0 };
  if (measure === 'backlash-mean') {
    const reason = {
      code: 'mean-not-projected' as const,
      message: 'The band is for the tightest and loosest points, not the mean: the mean is not projected.',
    };
    return { measure, points, fit, limits, projection: { projectedRunsAtLimit: null, runsToLimit: null, reason } };
  }
  // Past the limit now is the latest inspection's own verdict (judged at its graduation against the limit as
  // published), not a comparison of converted figures.
  const last = inspections.filter((i) => pick(i.summary) !== undefined).at(-1);
  const verdict = last?.summary.verdicts.find((v) => v.measure === measure)?.verdict;
  const latest = points.at(-1);
  const reading = latest && { value: latest.value, ...(verdict && { past: verdict === 'out-of-band' }) };
  return { measure, points, fit, limits, projection: projectTrend(fit, limits, reading) };
}

export function analyseGearSet(input: GearSetAnalysisInput): GearSetAnalysis {
  const usable = input.inspections.filter((i) => i.summary.backlash !== null);
  const sorted = [...usable].sort(
    (a, b) => a.runsAtInspection - b.runsAtInspection || a.inspectedAt.localeCompare(b.inspectedAt),
  );
  const latest = sorted.at(-1) ?? null;
  const previous = sorted.at(-2) ?? null;
  const measuresOf = (i: AnalysedInspection) => ({
    measures: { ...summaryToMeasures(i.summary.backlash!), tir: i.summary.runoutTir ?? undefined },
    resolution: i.summary.resolution,
  });
  const change =
    latest && previous && latest.summary.resolution > 0 && previous.summary.resolution > 0
      ? compareInspections(measuresOf(previous), measuresOf(latest))
      : null;
  const band = { min: input.limits.backlashMin, max: input.limits.backlashMax };
  // The mean and the spread first, as the charts read them; then the two points the band is for.
  const trends = [
    series('backlash-mean', sorted, (s) => s.backlash?.mean, band),
    series('spread', sorted, (s) => s.backlash?.spread, { max: input.limits.maxSpread }),
    series('backlash-min-point', sorted, (s) => s.backlash?.min, band),
    series('backlash-max-point', sorted, (s) => s.backlash?.max, band),
  ];
  const limit = input.lifeLimitRuns;
  const life = {
    totalRuns: input.totalRuns,
    runsSinceInstall: input.runsSinceInstall,
    lifeLimitRuns: limit,
    runsLeft: limit === null ? null : computeRunsLeft(input.totalRuns, limit),
    runsOver: limit === null ? null : Math.max(0, input.totalRuns - limit),
    text: limit === null ? null : lifeToText(input.totalRuns, limit),
  };
  const recommendation = latest
    ? recommendAction({
        runsSinceInstall: input.totalRuns,
        lifeLimitRuns: input.lifeLimitRuns ?? Number.POSITIVE_INFINITY,
        serviceIntervalRuns: input.serviceIntervalRuns,
        verdicts: latest.summary.verdicts,
        trends: trends
          .filter((t) => t.measure !== 'backlash-mean')
          .map((t) => ({ measure: t.measure, projection: t.projection })),
        patterns: latest.summary.patterns,
        damage: conditionToDamage(latest.data.condition),
      })
    : null;
  return { inspectionCount: input.inspections.length, latest, previous, change, trends, life, recommendation };
}
