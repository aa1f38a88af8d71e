import { useState } from 'react';
import type { LengthUnit } from '../../lib/units';
import { shapePolar, type PolarPointShape, type PolarSeriesInput } from '../../lib/charts/polar';
import { PALETTE } from './palette';

/**
 * Backlash around the ring gear: a polar chart in plain SVG (sized, no inline styles, so the server
 * can render it and the CSP is kept). One inspection, or two overlaid for a comparison: the first
 * solid with round marks, the second dashed with square marks. The tight spot of each fitted
 * once-per-turn curve is marked with a wedge and its angle written beside it. Hydrated, a tap or
 * hover on a reading writes it out below; every figure is in the table behind "The numbers".
 */
export interface PolarChartProps {
  series: PolarSeriesInput[];
  unit: LengthUnit;
  band?: { min: number; max: number } | null;
  title?: string;
  size?: number;
}

const SERIES_COLOURS = [PALETTE.ink, PALETTE.petrol];

function Mark({
  point,
  mark,
  colour,
  onSelect,
}: {
  point: PolarPointShape;
  mark: 'circle' | 'square';
  colour: string;
  onSelect: (text: string) => void;
}) {
  const select = () => onSelect(point.text);
  return (
    <g onPointerEnter={select} onPointerDown={select} data-testid="polar-point">
      <title>{point.text}</title>
      <circle cx={point.x} cy={point.y} r={16} fill="transparent" />
      {mark === 'circle' ? (
        <circle cx={point.x} cy={point.y} r={6} fill={colour} stroke={PALETTE.panel} strokeWidth={2} />
      ) : (
        <rect
          x={point.x - 6}
          y={point.y - 6}
          width={12}
          height={12}
          fill={PALETTE.panel}
          stroke={colour}
          strokeWidth={3}
        />
      )}
    </g>
  );
}

export function PolarChart({
  series,
  unit,
  band = null,
  title = 'Backlash around the ring gear',
  size = 400,
}: PolarChartProps) {
  const shape = shapePolar(series, unit, band, size);
  const [readout, setReadout] = useState('');
  const { centre, outerRadius, innerRadius } = shape;
  const id = `polar-${series.map((s) => s.key).join('-')}`;
  if (shape.state === 'empty') {
    return (
      <figure
        data-testid="polar-chart"
        data-state="empty"
        className="rounded-md border-2 border-dashed border-rule bg-paper p-4"
      >
        <figcaption>{shape.summary}</figcaption>
      </figure>
    );
  }
  return (
    <figure data-testid="polar-chart" data-state={shape.state} aria-labelledby={`${id}-title`}>
      <p id={`${id}-title`} className="mb-1 text-lg font-bold">
        {title}
      </p>
      {/* The words sit beside the chart when there is room for a readable line (20 rem), else under it. */}
      <div className="flex flex-wrap items-start gap-3">
        <svg
          viewBox={`0 0 ${size} ${size}`}
          width={size}
          height={size}
          className="h-auto max-w-full flex-none"
          role="img"
          aria-labelledby={`${id}-title ${id}-desc`}
          data-testid="polar-svg"
        >
          <desc id={`${id}-desc`}>{shape.summary}</desc>
          {shape.band && (
            <path
              d={shape.band.path}
              fill={PALETTE.petrolWash}
              fillRule="evenodd"
              stroke={PALETTE.petrol}
              strokeOpacity={0.5}
              strokeDasharray="4 4"
            />
          )}
          {shape.rings.map((ring) => (
            <g key={ring.value}>
              <circle cx={centre} cy={centre} r={ring.radius} fill="none" stroke={PALETTE.rule} strokeWidth={1} />
              <text
                x={ring.labelX}
                y={ring.labelY}
                fontSize={12}
                fill={PALETTE.inkSoft}
                stroke={PALETTE.panel}
                strokeWidth={3}
                paintOrder="stroke"
              >
                {ring.label}
              </text>
            </g>
          ))}
          <circle cx={centre} cy={centre} r={innerRadius} fill={PALETTE.paper} stroke={PALETTE.rule} />
          {shape.spokes.map((spoke) => (
            <g key={spoke.angleDeg}>
              <line x1={centre} y1={centre} x2={spoke.x2} y2={spoke.y2} stroke={PALETTE.rule} strokeWidth={1} />
              {spoke.label && (
                <text
                  x={spoke.labelX}
                  y={spoke.labelY}
                  textAnchor="middle"
                  dominantBaseline="middle"
                  fontSize={14}
                  fontWeight={700}
                  fill={PALETTE.ink}
                >
                  {spoke.label}
                </text>
              )}
            </g>
          ))}
          {/* The marked tooth (position 1) and the direction of rotation. */}
          <path d={`M${centre} ${centre - outerRadius - 4} l-6 -10 h12 z`} fill={PALETTE.ink} />
          <text x={centre + 10} y={size * 0.035 + 8} fontSize={12} fill={PALETTE.inkSoft}>
            marked tooth · clockwise
          </text>
          {shape.series.map((s, i) => (
            <g key={s.key} data-testid={`polar-series-${i}`}>
              {s.curve && (
                <path
                  d={s.curve}
                  fill="none"
                  stroke={SERIES_COLOURS[i]}
                  strokeWidth={2.5}
                  strokeDasharray={s.dashed ? '7 5' : undefined}
                  data-testid="polar-curve"
                />
              )}
              {s.points.map((p) => (
                <Mark key={p.position} point={p} mark={s.mark} colour={SERIES_COLOURS[i]!} onSelect={setReadout} />
              ))}
              {s.tight && (
                <g data-testid="polar-tight" onPointerEnter={() => setReadout(s.tight!.text)}>
                  <path
                    d={wedge(centre, s.tight.x, s.tight.y)}
                    fill={PALETTE.amber}
                    stroke={PALETTE.panel}
                    strokeWidth={1.5}
                  />
                  <text
                    x={s.tight.labelX}
                    y={s.tight.labelY + i * 15}
                    textAnchor="middle"
                    dominantBaseline="middle"
                    fontSize={13}
                    fontWeight={700}
                    fill={PALETTE.amber}
                    stroke={PALETTE.panel}
                    strokeWidth={3}
                    paintOrder="stroke"
                  >
                    tight {Math.round(s.tight.angleDeg)}°
                  </text>
                </g>
              )}
            </g>
          ))}
        </svg>
        <div className="min-w-[min(100%,20rem)] flex-1 basis-80">
          <ul className="mb-2 flex flex-wrap gap-x-4 gap-y-1 text-sm" aria-label="Legend">
            {shape.series.map((s, i) => (
              <li key={s.key} className="inline-flex items-center gap-1.5">
                <svg width="34" height="16" viewBox="0 0 34 16" aria-hidden="true" focusable="false">
                  <path
                    d="M1 8 H33"
                    stroke={SERIES_COLOURS[i]}
                    strokeWidth="2.5"
                    strokeDasharray={s.dashed ? '6 4' : undefined}
                  />
                  {s.mark === 'circle' ? (
                    <circle cx="17" cy="8" r="5" fill={SERIES_COLOURS[i]} />
                  ) : (
                    <rect
                      x="12"
                      y="3"
                      width="10"
                      height="10"
                      fill="#fff"
                      stroke={SERIES_COLOURS[i]}
                      strokeWidth="2.5"
                    />
                  )}
                </svg>
                {s.name}
              </li>
            ))}
            {shape.band && (
              <li className="inline-flex items-center gap-1.5">
                <svg width="22" height="16" viewBox="0 0 22 16" aria-hidden="true" focusable="false">
                  <rect
                    x="1"
                    y="2"
                    width="20"
                    height="12"
                    fill={PALETTE.petrolWash}
                    stroke={PALETTE.petrol}
                    strokeDasharray="3 2"
                  />
                </svg>
                {shape.band.label}
              </li>
            )}
          </ul>
          <figcaption className="mt-1 text-sm">
            Position 1 (the marked tooth) at the top, then clockwise in the order of rotation. The radius is the lash:
            rings are labelled in {unit}, the centre is {shape.rings[0]?.label ?? ''} {unit} or less, not zero.
            {shape.series.some((s) => s.tight)
              ? ' The wedge marks the tight spot of the fitted once-per-turn curve.'
              : ''}
          </figcaption>
          <p className="min-h-6 font-semibold" aria-live="polite" data-testid="polar-readout">
            {readout || shape.series.map((s) => (s.tight ? `${s.name}: ${s.tight.text}.` : '')).join(' ')}
          </p>
          <details className="mt-1">
            <summary className="inline-flex min-h-11 cursor-pointer items-center font-semibold text-petrol">
              The numbers
            </summary>
            <div className="relative overflow-x-auto">
              {shape.series.map((s) => (
                <table key={s.key} className="data-table mb-3 text-sm" data-testid="polar-table">
                  <caption className="text-left font-semibold">{s.name}</caption>
                  <thead>
                    <tr>
                      <th scope="col">Position</th>
                      <th scope="col" className="num">
                        Angle
                      </th>
                      <th scope="col" className="num">
                        Reading
                      </th>
                      <th scope="col" className="num">
                        Fitted curve
                      </th>
                    </tr>
                  </thead>
                  <tbody>
                    {s.rows.map((row) => (
                      <tr key={row.position}>
                        <td>{row.position}</td>
                        <td className="num">{row.angleDeg}°</td>
                        <td className="num">{row.readingText}</td>
                        <td className="num">{row.fittedText ?? '—'}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              ))}
            </div>
          </details>
        </div>
      </div>
    </figure>
  );
}

/** A small wedge pointing at the tight spot from the centre side. */
function wedge(centre: number, x: number, y: number): string {
  const dx = x - centre;
  const dy = y - centre;
  const length = Math.hypot(dx, dy) || 1;
  const ux = dx / length;
  const uy = dy / length;
  const back = 16;
  const half = 7;
  const bx = x - ux * back;
  const by = y - uy * back;
  const r = (n: number) => Math.round(n * 100) / 100;
  return `M${r(x)} ${r(y)} L${r(bx - uy * half)} ${r(by + ux * half)} L${r(bx + uy * half)} ${r(by - ux * half)} Z`;
}

export default PolarChart;
