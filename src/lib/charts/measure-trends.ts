// Spread, pinion preload and runout against runs: the smaller charts under the backlash trend. Pure.

import { torqueUnitToLabel } from '../units';
import {
  coarsestResolution,
  decimalsFor,
  isoToDayText,
  lengthToText,
  resolutionStep,
  stepTicks,
  torqueToText,
  valueDomain,
} from './format';
import type { ChartInspection, GearSetChartInput } from './gear-set-input';
import {
  countToText,
  fitToLine,
  projectionHorizon,
  runDomain,
  shapeProjection,
  X_LABEL,
  type ChartBand,
  type TrendChartPoint,
  type TrendChartShape,
} from './trend-chart';

function point(
  i: ChartInspection,
  series: 'main' | 'second',
  value: number,
  valueText: string,
  what: string,
): TrendChartPoint {
  const dayText = isoToDayText(i.inspectedAt);
  return {
    id: `${i.id}:${series}`,
    series,
    runs: i.runs,
    value,
    range: null,
    href: `/inspections/${i.id}`,
    dayText,
    valueText,
    rangeText: null,
    text: `Inspection of ${dayText} at run ${i.runs}: ${what} ${valueText}.`,
  };
}

/** The axes and the life-limit line every measure chart shares. */
function axesOf(
  life: GearSetChartInput['life'],
  x: { domain: [number, number]; ticks: number[] },
  yDomain: [number, number],
  step: number,
  resolution: Parameters<typeof decimalsFor>[0],
  unit: Parameters<typeof decimalsFor>[1],
) {
  return {
    lifeLimit: life.lifeLimitRuns === null ? null : { runs: life.lifeLimitRuns, label: `life ${life.lifeLimitRuns}` },
    xDomain: x.domain,
    xTicks: x.ticks,
    yDomain,
    yTicks: stepTicks(yDomain[0], yDomain[1], step, 6),
    yDecimals: decimalsFor(resolution, unit),
  };
}

function emptyOr(
  points: TrendChartPoint[],
  empty: string,
  otherwise: string,
): { state: TrendChartShape['state']; message: string } {
  if (points.length === 0) return { state: 'empty', message: empty };
  return { state: points.length < 3 ? 'sparse' : 'ready', message: otherwise };
}

/**
 * Spread (max − min around the gear) against runs, with its limit, fit and projection.
 * @example shapeSpreadTrend(input).limitLines[0].label // 'limit 0.002 in'
 */
export function shapeSpreadTrend(input: GearSetChartInput): TrendChartShape {
  const { unit, life } = input;
  const inspected = input.inspections.filter((i) => i.backlash !== null);
  const resolution = coarsestResolution(
    inspected.map((i) => i.resolution),
    unit,
  );
  const format = (value: number) => lengthToText(value, unit, resolution);
  const limit = input.limits.maxSpread;
  const limitText = input.limitTexts?.maxSpread ?? format(limit);
  const points = inspected.map((i) =>
    point(i, 'main', i.backlash!.spread, `${lengthToText(i.backlash!.spread, unit, i.resolution)} ${unit}`, 'spread'),
  );
  const trend = input.trends.spread;
  const lastRuns = Math.max(0, ...points.map((p) => p.runs));
  const shaped =
    trend && points.length
      ? shapeProjection(trend.fit, trend.projection, trend.limits, projectionHorizon(lastRuns, life.lifeLimitRuns), {
          measure: 'spread',
          formatValue: format,
          unitLabel: unit,
        })
      : null;
  const fit = trend
    ? fitToLine(
        trend.fit,
        points.map((p) => p.runs),
      )
    : null;
  const x = runDomain(
    points.map((p) => p.runs),
    life.lifeLimitRuns,
    shaped?.line?.to.runs ?? null,
  );
  const step = resolutionStep(resolution, unit);
  const yDomain = valueDomain([0, limit, ...points.map((p) => p.value), ...(fit ?? []).map((p) => p.value)], step);
  const words = emptyOr(
    points,
    'No spread yet: it comes with the first inspection that has every position read.',
    shaped?.message ?? '',
  );
  const last = points.at(-1);
  return {
    key: 'spread',
    title: 'Spread against runs',
    yLabel: `Spread, max − min (${unit})`,
    xLabel: X_LABEL,
    series: [{ key: 'main', name: 'Spread around the gear', mark: 'circle' }],
    points,
    bands: [],
    limitLines: [{ value: limit, label: `limit ${limitText} ${unit}` }],
    fit,
    projection: shaped?.line ?? null,
    ...axesOf(life, x, yDomain, step, resolution, unit),
    columns: { value: 'Spread', range: null },
    ...words,
    summary: last
      ? `Spread over ${countToText(points.length, 'inspection')}, latest ${last.valueText} at run ${last.runs}, against a limit of ${limitText} ${unit}. ${words.message}`
      : words.message,
  };
}

/**
 * Back-face runout (TIR) as measured, and as the once-per-turn lash suggests, against runs and the limit.
 * @example shapeRunoutTrend(input).series.map((s) => s.mark) // ['circle', 'diamond']
 */
export function shapeRunoutTrend(input: GearSetChartInput): TrendChartShape {
  const { unit, life } = input;
  const resolution = coarsestResolution(
    input.inspections.map((i) => i.resolution),
    unit,
  );
  const format = (value: number) => lengthToText(value, unit, resolution);
  const limit = input.limits.runoutMax;
  const limitText = input.limitTexts?.runoutMax ?? format(limit);
  const measured = input.inspections
    .filter((i) => i.runoutTir !== null)
    .map((i) =>
      point(i, 'main', i.runoutTir!, `${lengthToText(i.runoutTir!, unit, i.resolution)} ${unit}`, 'measured runout'),
    );
  const estimated = input.inspections
    .filter((i) => i.runoutEstimate !== null)
    .map((i) =>
      point(
        i,
        'second',
        i.runoutEstimate!,
        `${lengthToText(i.runoutEstimate!, unit, i.resolution)} ${unit}`,
        'runout estimated from the lash',
      ),
    );
  const points = [...measured, ...estimated];
  const x = runDomain(
    points.map((p) => p.runs),
    life.lifeLimitRuns,
  );
  const step = resolutionStep(resolution, unit);
  const yDomain = valueDomain([0, limit, ...points.map((p) => p.value)], step);
  const last = measured.at(-1);
  const over = measured.filter((p) => p.value > limit).length;
  const said = last
    ? `Latest measured runout ${last.valueText} against a limit of ${limitText} ${unit}${over ? `; ${countToText(over, 'inspection')} over it` : ''}.`
    : estimated.length
      ? `No measured runout yet; the lash suggests ${estimated.at(-1)!.valueText}. Measure the ring-gear back face at the next teardown.`
      : '';
  const words = emptyOr(
    points,
    'No runout recorded yet: measure the ring-gear back face with the dial indicator at the next teardown.',
    said,
  );
  return {
    key: 'runout',
    title: 'Runout (TIR) against runs',
    yLabel: `Runout, TIR (${unit})`,
    xLabel: X_LABEL,
    series: [
      { key: 'main', name: 'Measured at the back face', mark: 'circle' },
      { key: 'second', name: 'Estimated from the lash', mark: 'diamond' },
    ],
    points,
    bands: [],
    limitLines: [{ value: limit, label: `limit ${limitText} ${unit}` }],
    fit: null,
    projection: null,
    ...axesOf(life, x, yDomain, step, resolution, unit),
    columns: { value: 'Runout', range: null },
    ...words,
    summary: words.message,
  };
}

/**
 * Pinion turning torque against runs. The band follows the bearings: new ones have their own band.
 * @example shapePreloadTrend(input).bands.map((b) => b.label) // ['new bearings 24.0–32.0 lbf·in', 'used bearings …']
 */
export function shapePreloadTrend(input: GearSetChartInput): TrendChartShape {
  const { life } = input;
  const torqueLabel = torqueUnitToLabel(input.torqueUnit);
  const withPreload = input.inspections.filter((i) => i.preload !== null);
  const points = withPreload.map((i) =>
    point(
      i,
      'main',
      i.preload!.value,
      `${torqueToText(i.preload!.value)} ${torqueLabel}`,
      `pinion turning torque (${i.preload!.bearings} bearings)`,
    ),
  );
  const x = runDomain(
    points.map((p) => p.runs),
    life.lifeLimitRuns,
  );
  const bandOf = (bearings: 'new' | 'used') =>
    bearings === 'new' ? input.limits.preloadNew : input.limits.preloadUsed;
  // As printed in the reader's unit where it is (8–12 lbf·in, 1.0–1.4 N·m), else to one decimal.
  const printedOf = (bearings: 'new' | 'used') =>
    bearings === 'new' ? input.limitTexts?.preloadNew : input.limitTexts?.preloadUsed;
  const bandText = (bearings: 'new' | 'used') =>
    `${bearings} bearings ${printedOf(bearings)?.min ?? torqueToText(bandOf(bearings).min)}–${printedOf(bearings)?.max ?? torqueToText(bandOf(bearings).max)} ${torqueLabel}`;
  // Each inspection's band holds until the next inspection: bearings change only at a teardown.
  const bands: ChartBand[] = withPreload.map((i, k) => {
    const next = withPreload[k + 1];
    const band = bandOf(i.preload!.bearings);
    return {
      from: k === 0 ? x.domain[0] : i.runs,
      to: next ? next.runs : x.domain[1],
      low: band.min,
      high: band.max,
      label: bandText(i.preload!.bearings),
    };
  });
  const merged = bands
    .filter((b, k) => k === 0 || b.label !== bands[k - 1]!.label)
    .map((b, k, kept) => ({ ...b, to: kept[k + 1]?.from ?? x.domain[1] }));
  const yDomain = valueDomain([...points.map((p) => p.value), ...merged.flatMap((b) => [b.low, b.high])], 1);
  const last = withPreload.at(-1);
  const said = last
    ? `Latest ${torqueToText(last.preload!.value)} ${torqueLabel} with ${last.preload!.bearings} bearings; band ${bandText(last.preload!.bearings)}.`
    : '';
  const words = emptyOr(
    points,
    'No pinion turning torque recorded yet: read it with the inch-pound wrench at the next teardown.',
    said,
  );
  return {
    key: 'preload',
    title: 'Pinion preload against runs',
    yLabel: `Turning torque (${torqueLabel})`,
    xLabel: X_LABEL,
    series: [{ key: 'main', name: 'Pinion turning torque', mark: 'circle' }],
    points,
    bands: merged,
    limitLines: [],
    fit: null,
    projection: null,
    lifeLimit: life.lifeLimitRuns === null ? null : { runs: life.lifeLimitRuns, label: `life ${life.lifeLimitRuns}` },
    xDomain: x.domain,
    xTicks: x.ticks,
    yDomain,
    yTicks: stepTicks(yDomain[0], yDomain[1], 1, 6),
    yDecimals: 0,
    columns: { value: 'Turning torque', range: null },
    ...words,
    summary: words.message,
  };
}
