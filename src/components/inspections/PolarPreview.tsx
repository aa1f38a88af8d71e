import { shapePolarPreview } from '../../lib/inspections/polar';

/**
 * Readings around the ring gear: the marked tooth (position 1) at the top, later positions
 * clockwise in the order of rotation, the fitted once-per-turn curve and the tight spot. Drawn
 * here in SVG; the figures beside it carry the numbers, so the picture needs no colour to read.
 */
export function PolarPreview({
  readings,
  format,
  unit,
}: {
  readings: (number | null)[];
  format: (value: number) => string;
  unit: string;
}) {
  const shape = shapePolarPreview(readings);
  const { size, centre, meanRadius } = shape;
  const read = readings.filter((r) => r !== null).length;
  const tightText = shape.tight
    ? `tight spot at ${Math.round(shape.tight.angleDeg)}° from the marked tooth`
    : 'no fit until every position is read';
  const summary = `${read} of ${readings.length} positions read; ${tightText}.`;
  return (
    <figure className="flex flex-col items-center">
      <svg
        viewBox={`0 0 ${size} ${size}`}
        width={size}
        height={size}
        role="img"
        aria-label={`Polar preview of the backlash readings: ${summary}`}
        className="max-w-full"
        data-testid="polar-preview"
      >
        <circle
          cx={centre}
          cy={centre}
          r={meanRadius}
          fill="none"
          stroke="#c9c4b8"
          strokeWidth="1.5"
          strokeDasharray="4 4"
        />
        <circle cx={centre} cy={centre} r={3} fill="#3d444d" />
        {/* The marked tooth at the top, and the direction of rotation. */}
        <path d={shape.marker} fill="#15181c" />
        <path d={shape.arrow} fill="none" stroke="#0d4a5c" strokeWidth="2" markerEnd="url(#polar-arrow)" />
        <defs>
          <marker id="polar-arrow" viewBox="0 0 10 10" refX="6" refY="5" markerWidth="7" markerHeight="7" orient="auto">
            <path d="M0 0 L10 5 L0 10 Z" fill="#0d4a5c" />
          </marker>
        </defs>
        {shape.curve && (
          <path d={shape.curve} fill="none" stroke="#0d4a5c" strokeWidth="2.5" data-testid="polar-curve" />
        )}
        {shape.points.map((p) => (
          <g key={p.position}>
            {p.value === null ? (
              <circle cx={p.x} cy={p.y} r={5} fill="#ffffff" stroke="#3d444d" strokeWidth="1.5" strokeDasharray="2 2" />
            ) : (
              <circle cx={p.x} cy={p.y} r={5.5} fill="#15181c" />
            )}
            <text
              x={p.labelX}
              y={p.labelY}
              textAnchor="middle"
              dominantBaseline="middle"
              fontSize="13"
              fontWeight="650"
              fill="#15181c"
            >
              {p.position}
            </text>
          </g>
        ))}
        {shape.tight && (
          <g data-testid="polar-tight">
            <line
              x1={shape.tight.rimX}
              y1={shape.tight.rimY}
              x2={shape.tight.x}
              y2={shape.tight.y}
              stroke="#8a4b00"
              strokeWidth="2"
            />
            <path
              d={`M${shape.tight.x - 6} ${shape.tight.y - 6} L${shape.tight.x + 6} ${shape.tight.y + 6} M${shape.tight.x + 6} ${shape.tight.y - 6} L${shape.tight.x - 6} ${shape.tight.y + 6}`}
              stroke="#8a4b00"
              strokeWidth="3"
            />
            <text
              x={shape.tight.labelX}
              y={shape.tight.labelY}
              textAnchor="middle"
              dominantBaseline="middle"
              fontSize="12"
              fontWeight="700"
              fill="#8a4b00"
            >
              tight
            </text>
          </g>
        )}
      </svg>
      <figcaption className="mt-1 max-w-[18rem] text-center text-sm text-ink-soft">
        Position 1 (the marked tooth) at the top, then clockwise in the order of rotation (arrow). Dashed circle: the
        mean
        {shape.points.some((p) => p.value !== null) ? ` (${format(meanOf(readings))} ${unit})` : ''}; distance from it
        is exaggerated.
        {shape.tight ? ' ✕ marks the tight spot of the once-per-turn fit.' : ''}
      </figcaption>
    </figure>
  );
}

function meanOf(readings: (number | null)[]): number {
  const read = readings.filter((r): r is number => r !== null);
  return read.reduce((a, b) => a + b, 0) / read.length;
}
