// The shape every "measure against runs" chart draws: points (with a min–max range where there is one),
// bands and limit lines, the fitted line, its projection to a limit, and the sentences that say what the
// chart shows. One React component draws any of them; the shaping functions decide what goes in. Pure.

import { MIN_TREND_POINTS, type LineFit, type TrendProjection } from '../analysis/trend';
import { runsToText, stepTicks } from './format';

export type PointMark = 'circle' | 'diamond';

export interface TrendChartPoint {
  id: string;
  series: 'main' | 'second';
  runs: number;
  value: number;
  /** Distances below and above `value` to the min and max (error bar), or null. */
  range: [number, number] | null;
  href: string;
  /** One sentence: the tooltip, the link's accessible name and the table row read the same. */
  text: string;
  dayText: string;
  valueText: string;
  rangeText: string | null;
}

export interface ChartBand {
  /** Run counts the band spans; undefined = the whole chart. */
  from?: number;
  to?: number;
  low: number;
  high: number;
  label: string;
}

export interface TrendChartShape {
  key: string;
  title: string;
  /** Axis title with the unit, e.g. "Mean backlash (in)". */
  yLabel: string;
  xLabel: string;
  series: { key: 'main' | 'second'; name: string; mark: PointMark }[];
  points: TrendChartPoint[];
  bands: ChartBand[];
  limitLines: { value: number; label: string }[];
  /** The fitted line over the runs inspected, or null. */
  fit: { runs: number; value: number }[] | null;
  /** The fitted line carried on to where it meets a limit, drawn dashed; null when it does not on this chart. */
  projection: { from: { runs: number; value: number }; to: { runs: number; value: number }; label: string } | null;
  lifeLimit: { runs: number; label: string } | null;
  xDomain: [number, number];
  xTicks: number[];
  yDomain: [number, number];
  yTicks: number[];
  yDecimals: number;
  /** Column titles of the accessible table. */
  columns: { value: string; range: string | null };
  state: 'empty' | 'sparse' | 'ready';
  /** What the chart says, or what to do to make it say more. */
  message: string;
  /** The chart in a sentence or two, for the text alternative. */
  summary: string;
}

export const X_LABEL = 'Runs on the set (total)';

/**
 * The run axis: from 0 to past the last inspection, the life limit and any projection worth drawing.
 * @example runDomain([0, 44], 50) // { domain: [0, 55], ticks: [0, 10, 20, 30, 40, 50] }
 */
export function runDomain(
  runs: readonly number[],
  lifeLimit: number | null,
  projectionTo: number | null = null,
): { domain: [number, number]; ticks: number[] } {
  const far = Math.max(1, ...runs, lifeLimit ?? 0, projectionTo ?? 0);
  const high = Math.ceil((far * 1.08) / 5) * 5;
  return { domain: [0, high], ticks: stepTicks(0, high, 1, 7, [1, 2, 5]) };
}

/** How far a projection may reach and still be drawn: past that it says so in words instead. */
export function projectionHorizon(lastRuns: number, lifeLimit: number | null): number {
  return Math.max(lastRuns * 1.5, (lifeLimit ?? 0) * 1.25, lastRuns + 10);
}

// A crossing this far off is a flat line, not a forecast.
const NEVER_RUNS = 100_000;

export interface ProjectionWords {
  /** e.g. "mean backlash", "spread". */
  measure: string;
  formatValue: (value: number) => string;
  unitLabel: string;
}

export interface ShapedProjection {
  line: TrendChartShape['projection'];
  message: string;
}

/**
 * The projection of a fitted trend as the chart draws it and the sentence under it.
 * `horizon` is the furthest run the chart will draw to.
 */
export function shapeProjection(
  fit: LineFit,
  projection: TrendProjection,
  limits: { min?: number; max?: number },
  horizon: number,
  words: ProjectionWords,
): ShapedProjection {
  const { measure, formatValue, unitLabel } = words;
  const side = (s: 'min' | 'max') => (s === 'max' ? 'upper limit' : 'lower limit');
  const reason = projection.reason;
  if (reason) {
    const pastSide = (): 'min' | 'max' | null => {
      if (fit.slope === null || fit.intercept === null) return null;
      const fittedNow = fit.intercept + fit.slope * fit.lastRuns;
      if (limits.max !== undefined && fittedNow > limits.max) return 'max';
      if (limits.min !== undefined && fittedNow < limits.min) return 'min';
      return null;
    };
    const limitWords = (which: 'min' | 'max') =>
      `the ${side(which)} (${formatValue(limits[which] as number)} ${unitLabel})`;
    if (reason.code === 'past-limit-now') {
      return { line: null, message: `The latest ${measure} is past its limit now.` };
    }
    if (reason.code === 'returning') {
      const which = pastSide();
      const past = which ? ` is past ${limitWords(which)} but` : '';
      return { line: null, message: `The fitted line of ${measure}${past} is coming back toward the band.` };
    }
    if (reason.code === 'already-past-limit') {
      const which = pastSide();
      const past = which ? `past ${limitWords(which)}` : 'past its limit';
      // Never a crossing "before the last inspection": the reading, not the line, says where the set is.
      return {
        line: null,
        message: `The fitted line of ${measure} sits ${past} at the last inspection and is not heading back, though the latest reading is within it.`,
      };
    }
    if (reason.code === 'moving-away')
      return {
        line: null,
        message: `${capitalise(measure)} is heading away from its limit: no crossing ahead at this rate.`,
      };
    if (reason.code === 'flat')
      return { line: null, message: `${capitalise(measure)} holds steady: at this rate it never reaches a limit.` };
    return { line: null, message: reason.message };
  }
  const at = projection.projectedRunsAtLimit;
  if (at === null || projection.limit === undefined || fit.slope === null || fit.intercept === null) {
    return { line: null, message: `No projection for ${measure}.` };
  }
  const limitValue = limits[projection.limit] as number;
  const limitText = `the ${side(projection.limit)} (${formatValue(limitValue)} ${unitLabel})`;
  if (at > NEVER_RUNS) {
    return {
      line: null,
      message: `${capitalise(measure)} is nearly flat: at this rate it does not reach ${limitText} within any useful number of runs.`,
    };
  }
  const left = projection.runsToLimit ?? at - fit.lastRuns;
  const leftText = `${runsToText(left)} run${Math.round(left) === 1 ? '' : 's'} after the last inspection`;
  if (at > horizon) {
    return {
      line: null,
      message: `At this rate ${measure} reaches ${limitText} only at about run ${runsToText(at)}, ${leftText} — beyond this chart.`,
    };
  }
  const from = { runs: fit.lastRuns, value: fit.intercept + fit.slope * fit.lastRuns };
  return {
    line: { from, to: { runs: at, value: limitValue }, label: `run ${runsToText(at)}` },
    message: `At this rate ${measure} reaches ${limitText} at about run ${runsToText(at)}, ${leftText}.`,
  };
}

/** The fitted line across the runs inspected, or null with fewer than three points or no slope. */
export function fitToLine(fit: LineFit, runs: readonly number[]): { runs: number; value: number }[] | null {
  // Two points always make a line; the trend says something from three on, as the projection does.
  if (fit.slope === null || fit.intercept === null || fit.count < MIN_TREND_POINTS || runs.length < MIN_TREND_POINTS)
    return null;
  const first = Math.min(...runs);
  const last = Math.max(...runs);
  if (first === last) return null;
  return [first, last].map((r) => ({ runs: r, value: (fit.intercept as number) + (fit.slope as number) * r }));
}

export function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** "1 inspection", "7 inspections". */
export function countToText(count: number, noun: string): string {
  return `${count} ${noun}${count === 1 ? '' : 's'}`;
}
