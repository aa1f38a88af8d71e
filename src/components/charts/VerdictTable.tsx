import type { IndicatorResolutionId } from '../../lib/units';
import { verdictsToRows, type VerdictInput } from '../../lib/charts/verdict-rows';
import { VerdictMark } from './marks';

/**
 * The verdicts of one inspection as a table: measure, value, the limit it is nearest (or past), the
 * margin, and the verdict as a word with a shape. Static (no island): render it from .astro.
 */
export interface VerdictTableProps {
  verdicts: VerdictInput[];
  /** How many of `verdicts` came from the backlash engine (summary.backlash.verdicts.length). */
  engineCount: number;
  resolution: IndicatorResolutionId;
  caption?: string;
}

export default function VerdictTable({
  verdicts,
  engineCount,
  resolution,
  caption = 'Verdicts against the tolerance profile',
}: VerdictTableProps) {
  if (verdicts.length === 0) {
    return (
      <p className="text-ink-soft" data-testid="verdict-table-empty">
        Nothing to judge yet: the verdicts come with the readings.
      </p>
    );
  }
  const rows = verdictsToRows(verdicts, engineCount, resolution);
  // Every length verdict of one inspection is judged at its one dial: say it once under the table.
  const judgedAt = rows.find((row) => row.judgedAt.includes('graduation'))?.judgedAt;
  return (
    <div className="relative overflow-x-auto">
      <table className="data-table" data-testid="verdict-table">
        <caption className="mb-1 text-left font-semibold">{caption}</caption>
        <thead>
          <tr>
            <th scope="col">Measure</th>
            <th scope="col" className="num">
              Value
            </th>
            <th scope="col" className="num">
              Limit
            </th>
            <th scope="col" className="num">
              Margin
            </th>
            <th scope="col">Verdict</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.key} data-verdict={row.verdict}>
              <th scope="row" className="font-semibold">
                {row.label}
              </th>
              <td className="num">{row.valueText}</td>
              <td className="num">{row.limitText}</td>
              <td className="num">{row.marginText}</td>
              <td>
                <VerdictMark verdict={row.verdict} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {judgedAt && (
        <p className="mt-1 text-sm text-ink-soft" data-testid="verdict-table-judged-at">
          {`Lengths ${judgedAt}; each limit as published in the unit shown.`}
        </p>
      )}
    </div>
  );
}
