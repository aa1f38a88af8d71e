import { useState } from 'react';
import {
  CartesianGrid,
  ComposedChart,
  ErrorBar,
  Line,
  ReferenceArea,
  ReferenceDot,
  ReferenceLine,
  ResponsiveContainer,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type { PointMark, TrendChartPoint, TrendChartShape } from '../../lib/charts/trend-chart';
import { useHydrated } from '../shared/use-hydrated';
import { PALETTE } from './palette';

/**
 * One "measure against runs" chart, drawn from a shape made in src/lib/charts. Each point is a link
 * to its inspection (a real <a> in the SVG: click, tap or Enter opens it), with a 44 px hit area; the
 * fitted line is solid, its projection dashed to the run where it meets a limit. Recharts writes
 * inline styles, which the page CSP refuses in server HTML, so the chart itself is drawn only once
 * the island runs; the server sends a box of the same size and the figures in words and a table.
 */
export interface TrendChartProps {
  shape: TrendChartShape;
  height: number;
  /** Fixed width (tests, print); otherwise the chart fills its column. */
  width?: number;
}

function PointShape({
  cx,
  cy,
  payload,
  mark,
  onSelect,
}: {
  cx?: number;
  cy?: number;
  payload?: TrendChartPoint;
  mark: PointMark;
  onSelect: (p: TrendChartPoint) => void;
}) {
  if (cx === undefined || cy === undefined || !payload) return <g />;
  return (
    <a
      href={payload.href}
      aria-label={`${payload.text} Open the inspection.`}
      className="chart-point"
      data-testid="chart-point"
      data-runs={payload.runs}
      onMouseEnter={() => onSelect(payload)}
      onFocus={() => onSelect(payload)}
    >
      <circle className="chart-point-hit" cx={cx} cy={cy} r={22} fill="transparent" />
      {mark === 'circle' ? (
        <circle cx={cx} cy={cy} r={6.5} fill={PALETTE.ink} stroke={PALETTE.panel} strokeWidth={2} />
      ) : (
        <path
          d={`M${cx} ${cy - 8} L${cx + 8} ${cy} L${cx} ${cy + 8} L${cx - 8} ${cy} Z`}
          fill={PALETTE.panel}
          stroke={PALETTE.petrol}
          strokeWidth={2.5}
        />
      )}
    </a>
  );
}

function PointTooltip({ active, payload }: { active?: boolean; payload?: readonly { payload?: unknown }[] }) {
  const point = active ? (payload?.[0]?.payload as TrendChartPoint | undefined) : undefined;
  if (!point?.href) return null;
  return (
    <div className="max-w-64 rounded-md border-2 border-ink bg-panel px-3 py-2 text-sm shadow-md">
      <p className="font-bold">
        {point.dayText} · run {point.runs}
      </p>
      <p>
        {point.valueText}
        {point.rangeText && <span className="text-ink-soft"> ({point.rangeText})</span>}
      </p>
      <p className="text-ink-soft">Click to open the inspection</p>
    </div>
  );
}

// Whole class names, so Tailwind finds them: the server's box keeps the chart's place (no layout shift).
const BOX_HEIGHT: Readonly<Record<number, string>> = { 240: 'h-[264px]', 320: 'h-[344px]', 360: 'h-[384px]' };

const TICK = { fill: PALETTE.ink, fontSize: 14 } as const;
const LABEL = { fill: PALETTE.ink, fontSize: 14, fontWeight: 650 } as const;

export function TrendChart({ shape, height, width }: TrendChartProps) {
  const hydrated = useHydrated();
  const [selected, setSelected] = useState<TrendChartPoint | null>(null);
  if (shape.state === 'empty') return null;
  if (!hydrated)
    return (
      <div
        className={`${BOX_HEIGHT[height] ?? 'h-[320px]'} rounded-md border border-rule bg-paper`}
        aria-hidden="true"
      />
    );
  const hasRange = shape.points.some((p) => p.range !== null);
  const chart = (
    <ComposedChart
      width={width}
      height={width ? height : undefined}
      margin={{ top: 28, right: 28, bottom: 34, left: 12 }}
      accessibilityLayer={false}
      title={shape.title}
      desc={shape.summary}
    >
      <CartesianGrid stroke={PALETTE.rule} strokeDasharray="2 5" vertical={false} />
      {shape.bands.map((band) => (
        <ReferenceArea
          key={`${band.label}:${band.from ?? ''}`}
          x1={band.from}
          x2={band.to}
          y1={band.low}
          y2={band.high}
          fill={PALETTE.petrolWash}
          fillOpacity={1}
          stroke={PALETTE.petrol}
          strokeOpacity={0.5}
          strokeDasharray="4 4"
          ifOverflow="hidden"
          label={
            band.from === undefined
              ? { value: band.label, position: 'insideTopLeft', fill: PALETTE.petrol, fontSize: 13, fontWeight: 650 }
              : undefined
          }
        />
      ))}
      {shape.limitLines.map((limit) => (
        <ReferenceLine
          key={limit.label}
          y={limit.value}
          stroke={PALETTE.alarm}
          strokeWidth={2}
          strokeDasharray="8 4"
          ifOverflow="extendDomain"
          label={{ value: limit.label, position: 'insideTopRight', fill: PALETTE.alarm, fontSize: 13, fontWeight: 650 }}
        />
      ))}
      {shape.lifeLimit && (
        <ReferenceLine
          x={shape.lifeLimit.runs}
          stroke={PALETTE.inkSoft}
          strokeWidth={2}
          strokeDasharray="2 4"
          label={{ value: shape.lifeLimit.label, position: 'insideTopRight', fill: PALETTE.inkSoft, fontSize: 13 }}
        />
      )}
      <XAxis
        type="number"
        dataKey="runs"
        domain={shape.xDomain}
        ticks={shape.xTicks}
        padding={{ left: 14, right: 8 }}
        tick={TICK}
        stroke={PALETTE.inkSoft}
        label={{ value: shape.xLabel, position: 'insideBottom', offset: -22, ...LABEL }}
      />
      <YAxis
        type="number"
        dataKey="value"
        domain={shape.yDomain}
        ticks={shape.yTicks}
        tick={TICK}
        stroke={PALETTE.inkSoft}
        width={70}
        tickFormatter={(v: number) => v.toFixed(shape.yDecimals)}
        label={{ value: shape.yLabel, angle: -90, position: 'insideLeft', dx: -2, dy: 70, ...LABEL }}
      />
      {shape.fit && (
        <Line
          data={shape.fit}
          dataKey="value"
          type="linear"
          stroke={PALETTE.petrol}
          strokeWidth={2.5}
          dot={false}
          activeDot={false}
          isAnimationActive={false}
          legendType="none"
          tooltipType="none"
        />
      )}
      {shape.projection && (
        <Line
          data={[shape.projection.from, shape.projection.to]}
          dataKey="value"
          type="linear"
          stroke={PALETTE.petrol}
          strokeWidth={2.5}
          strokeDasharray="8 6"
          dot={false}
          activeDot={false}
          isAnimationActive={false}
          legendType="none"
          tooltipType="none"
        />
      )}
      {shape.projection && (
        <ReferenceDot
          x={shape.projection.to.runs}
          y={shape.projection.to.value}
          r={7}
          fill={PALETTE.panel}
          stroke={PALETTE.alarm}
          strokeWidth={3}
          label={{ value: shape.projection.label, position: 'top', fill: PALETTE.alarm, fontSize: 14, fontWeight: 700 }}
        />
      )}
      {shape.series.map((series) => (
        <Scatter
          key={series.key}
          name={series.name}
          data={shape.points.filter((p) => p.series === series.key)}
          dataKey="value"
          isAnimationActive={false}
          shape={(props: object) => <PointShape {...props} mark={series.mark} onSelect={setSelected} />}
        >
          {series.key === 'main' && hasRange && (
            <ErrorBar
              dataKey="range"
              direction="y"
              width={10}
              strokeWidth={2.5}
              stroke={PALETTE.ink}
              isAnimationActive={false}
            />
          )}
        </Scatter>
      ))}
      <Tooltip content={PointTooltip} cursor={false} isAnimationActive={false} />
    </ComposedChart>
  );
  return (
    <div data-testid={`chart-${shape.key}`}>
      {width ? (
        chart
      ) : (
        <ResponsiveContainer width="100%" height={height}>
          {chart}
        </ResponsiveContainer>
      )}
      <p className="min-h-6 text-sm" aria-live="polite" data-testid="chart-readout">
        {selected
          ? `${selected.dayText}, run ${selected.runs}: ${selected.valueText}${selected.rangeText ? ` (${selected.rangeText})` : ''}.`
          : ''}
      </p>
    </div>
  );
}
