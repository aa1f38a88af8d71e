// Backlash against runs: each inspection's mean with its min–max, the tolerance band and the mean's fitted line.
// The band is for the points, not the mean: the projection drawn is the tightest or the loosest point's, whichever
// reaches its limit first; the mean is never projected. Pure.

import {
  coarsestResolution,
  decimalsFor,
  isoToDayText,
  lengthToText,
  resolutionStep,
  stepTicks,
  valueDomain,
} from './format';
import type { GearSetChartInput } from './gear-set-input';
import {
  countToText,
  fitToLine,
  projectionHorizon,
  runDomain,
  shapeProjection,
  X_LABEL,
  type TrendChartPoint,
  type TrendChartShape,
} from './trend-chart';

/**
 * Shapes the backlash trend of a gear set: the mean drawn, the tightest and loosest points projected.
 * @example shapeBacklashTrend(input).projection?.label // 'run 54'
 */
export function shapeBacklashTrend(input: GearSetChartInput): TrendChartShape {
  const { unit, life } = input;
  const inspected = input.inspections.filter((i) => i.backlash !== null);
  const resolution = coarsestResolution(
    inspected.map((i) => i.resolution),
    unit,
  );
  const format = (value: number) => lengthToText(value, unit, resolution);
  const band = input.limits.backlash;

  const points: TrendChartPoint[] = inspected.map((i) => {
    const b = i.backlash!;
    const f = (value: number) => lengthToText(value, unit, i.resolution);
    const dayText = isoToDayText(i.inspectedAt);
    const rangeText = `${f(b.min)}–${f(b.max)} ${unit}`;
    return {
      id: i.id,
      series: 'main',
      runs: i.runs,
      value: b.mean,
      range: [b.mean - b.min, b.max - b.mean],
      href: `/inspections/${i.id}`,
      dayText,
      valueText: `${f(b.mean)} ${unit}`,
      rangeText,
      text: `Inspection of ${dayText} at run ${i.runs}: mean ${f(b.mean)} ${unit}, ${rangeText} around the gear.`,
    };
  });

  const trend = input.trends.backlashMean;
  const lastRuns = Math.max(0, ...points.map((p) => p.runs));
  const horizon = projectionHorizon(lastRuns, life.lifeLimitRuns);
  const pointTrends = [
    { trend: input.trends.backlashMin, measure: 'backlash at the tightest point' },
    { trend: input.trends.backlashMax, measure: 'backlash at the loosest point' },
  ].flatMap(({ trend: t, measure }) =>
    t && points.length > 0
      ? [
          {
            projection: t.projection,
            shaped: shapeProjection(t.fit, t.projection, t.limits, horizon, {
              measure,
              formatValue: format,
              unitLabel: unit,
            }),
          },
        ]
      : [],
  );
  // The line drawn is the crossing that comes first; the sentence says what each point is doing.
  const drawn = pointTrends
    .filter((p) => p.shaped.line !== null)
    .sort((a, b) => (a.projection.projectedRunsAtLimit ?? 0) - (b.projection.projectedRunsAtLimit ?? 0))[0];
  const shaped =
    pointTrends.length > 0
      ? { line: drawn?.shaped.line ?? null, message: [...new Set(pointTrends.map((p) => p.shaped.message))].join(' ') }
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

  const values = [
    band.min,
    band.max,
    ...inspected.flatMap((i) => [i.backlash!.min, i.backlash!.max]),
    ...(fit ?? []).map((p) => p.value),
    ...(shaped?.line ? [shaped.line.from.value] : []),
  ];
  const step = resolutionStep(resolution, unit);
  const yDomain = valueDomain(values, step);
  // The band as printed in the reader's unit where it is (0.005–0.009 in), else to the graduation.
  const printed = input.limitTexts;
  const bandText = `${printed?.backlashMin ?? format(band.min)}–${printed?.backlashMax ?? format(band.max)} ${unit}`;

  let message: string;
  let state: TrendChartShape['state'];
  if (points.length === 0) {
    state = 'empty';
    message =
      'No submitted inspection yet. Record the first teardown inspection; with three, the chart projects where the lash is heading.';
  } else {
    state = points.length < 3 ? 'sparse' : 'ready';
    message = shaped?.message ?? 'No projection.';
  }
  const first = points[0];
  const last = points.at(-1);
  const summary =
    first && last
      ? `Mean backlash over ${countToText(points.length, 'inspection')}: ${first.valueText} at run ${first.runs}${points.length > 1 ? `, ${last.valueText} at run ${last.runs}` : ''}. Band ${bandText}. ${message}`
      : `No inspections to chart. Band ${bandText}.`;

  return {
    key: 'backlash-mean',
    title: 'Mean backlash against runs',
    yLabel: `Mean backlash (${unit})`,
    xLabel: X_LABEL,
    series: [{ key: 'main', name: 'Mean, with min–max around the gear', mark: 'circle' }],
    points,
    bands: [{ low: band.min, high: band.max, label: `band ${bandText}` }],
    limitLines: [],
    fit,
    projection: shaped?.line ?? null,
    lifeLimit:
      life.lifeLimitRuns === null ? null : { runs: life.lifeLimitRuns, label: `life limit ${life.lifeLimitRuns}` },
    xDomain: x.domain,
    xTicks: x.ticks,
    yDomain,
    yTicks: stepTicks(yDomain[0], yDomain[1], step),
    yDecimals: decimalsFor(resolution, unit),
    columns: { value: 'Mean', range: 'Min–max around the gear' },
    state,
    message,
    summary,
  };
}
