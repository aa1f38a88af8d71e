import type { ReactNode } from 'react';
import type { TrendChartShape } from '../../lib/charts/trend-chart';
import { TrendChart } from './TrendChart';

/**
 * A chart with everything that makes it readable without seeing it: its title, a legend in shapes
 * and words, the sentence that says what it shows (or what to do to get more), and every figure in
 * a table behind "The numbers". The table and the sentence are server-rendered, so they are there
 * before (and without) JavaScript.
 */
export interface ChartFigureProps {
  shape: TrendChartShape;
  height: number;
  width?: number;
  /** Heading level of the title inside the page. */
  level?: 2 | 3;
  /** Where to go to add data, for the empty state. */
  action?: { href: string; label: string } | null;
}

function Legend({ shape }: { shape: TrendChartShape }) {
  const items: { key: string; mark: ReactNode; text: string }[] = shape.series
    .filter((s) => shape.points.some((p) => p.series === s.key))
    .map((s) => ({
      key: s.key,
      mark:
        s.mark === 'circle' ? (
          <circle cx="11" cy="8" r="5.5" fill="#15181c" />
        ) : (
          <path d="M11 1.5 L17.5 8 L11 14.5 L4.5 8 Z" fill="#fff" stroke="#0d4a5c" strokeWidth="2.2" />
        ),
      text: s.name,
    }));
  if (shape.points.some((p) => p.range))
    items.push({
      key: 'range',
      mark: <path d="M11 1 V15 M7 1 H15 M7 15 H15" stroke="#15181c" strokeWidth="2" />,
      text: 'min–max bar',
    });
  if (shape.fit)
    items.push({ key: 'fit', mark: <path d="M1 8 H21" stroke="#0d4a5c" strokeWidth="2.5" />, text: 'fitted line' });
  if (shape.projection)
    items.push({
      key: 'projection',
      mark: <path d="M1 8 H21" stroke="#0d4a5c" strokeWidth="2.5" strokeDasharray="5 3" />,
      text: 'projection to the limit',
    });
  for (const band of shape.bands.slice(0, 2))
    items.push({
      key: `band-${band.label}`,
      mark: <rect x="1" y="2" width="20" height="12" fill="#dcecef" stroke="#0d4a5c" strokeDasharray="3 2" />,
      text: band.label,
    });
  for (const limit of shape.limitLines)
    items.push({
      key: `limit-${limit.label}`,
      mark: <path d="M1 8 H21" stroke="#9e1b1b" strokeWidth="2.5" strokeDasharray="6 3" />,
      text: limit.label,
    });
  if (shape.lifeLimit)
    items.push({
      key: 'life',
      mark: <path d="M11 0 V16" stroke="#3d444d" strokeWidth="2" strokeDasharray="2 3" />,
      text: `${shape.lifeLimit.label} runs`,
    });
  return (
    <ul className="mb-1 flex flex-wrap gap-x-4 gap-y-1 text-sm" aria-label="Legend">
      {items.map((item) => (
        <li key={item.key} className="inline-flex items-center gap-1.5">
          <svg width="22" height="16" viewBox="0 0 22 16" aria-hidden="true" focusable="false">
            {item.mark}
          </svg>
          {item.text}
        </li>
      ))}
    </ul>
  );
}

/** Every figure of the chart, one row per inspection, each row a link to it. */
export function ChartTable({ shape }: { shape: TrendChartShape }) {
  const rows = new Map<
    string,
    { href: string; dayText: string; runs: number; cells: Map<string, { value: string; range: string | null }> }
  >();
  for (const p of shape.points) {
    const row = rows.get(p.href) ?? { href: p.href, dayText: p.dayText, runs: p.runs, cells: new Map() };
    row.cells.set(p.series, { value: p.valueText, range: p.rangeText });
    rows.set(p.href, row);
  }
  const series = shape.series.filter((s) => shape.points.some((p) => p.series === s.key));
  const withRange = shape.columns.range !== null && shape.points.some((p) => p.rangeText);
  return (
    <table className="data-table text-sm" data-testid={`table-${shape.key}`}>
      <caption className="sr-only">{shape.title}: every inspection</caption>
      <thead>
        <tr>
          <th scope="col">Inspection</th>
          <th scope="col" className="num">
            Runs
          </th>
          {series.map((s) => (
            <th key={s.key} scope="col" className="num">
              {series.length === 1 ? shape.columns.value : s.name}
            </th>
          ))}
          {withRange && (
            <th scope="col" className="num">
              {shape.columns.range}
            </th>
          )}
        </tr>
      </thead>
      <tbody>
        {[...rows.values()].map((row) => (
          <tr key={row.href}>
            <td>
              <a href={row.href}>{row.dayText}</a>
            </td>
            <td className="num">{row.runs}</td>
            {series.map((s) => (
              <td key={s.key} className="num">
                {row.cells.get(s.key)?.value ?? '—'}
              </td>
            ))}
            {withRange && <td className="num">{row.cells.get('main')?.range ?? '—'}</td>}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function ChartFigure({ shape, height, width, level = 3, action = null }: ChartFigureProps) {
  const Heading = level === 2 ? 'h2' : 'h3';
  const titleId = `chart-title-${shape.key}`;
  return (
    <figure className="min-w-0" aria-labelledby={titleId} data-testid={`figure-${shape.key}`} data-state={shape.state}>
      <Heading id={titleId} className={level === 2 ? 'mb-1' : 'mb-1 text-lg font-bold'}>
        {shape.title}
      </Heading>
      {shape.state === 'empty' ? (
        <div className="rounded-md border-2 border-dashed border-rule bg-paper p-4" data-testid={`empty-${shape.key}`}>
          <p>{shape.message}</p>
          {action && (
            <p className="mt-2">
              <a className="btn" href={action.href}>
                {action.label}
              </a>
            </p>
          )}
        </div>
      ) : (
        <>
          <Legend shape={shape} />
          <TrendChart shape={shape} height={height} width={width} />
          <figcaption
            className={`font-semibold ${shape.state === 'sparse' ? 'notice' : ''}`}
            data-testid={`message-${shape.key}`}
          >
            {shape.message}
          </figcaption>
          <p className="sr-only">{shape.summary}</p>
          <details className="mt-2">
            <summary className="inline-flex min-h-11 cursor-pointer items-center font-semibold text-petrol">
              The numbers ({new Set(shape.points.map((p) => p.href)).size} inspections)
            </summary>
            <div className="relative overflow-x-auto">
              <ChartTable shape={shape} />
            </div>
          </details>
        </>
      )}
    </figure>
  );
}
