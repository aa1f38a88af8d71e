import type { ComparisonShape } from '../../lib/charts/comparison';

/**
 * Two inspections' figures side by side with the change; only a change past two graduations of the
 * coarser indicator is highlighted — with a mark and the word "changed", not by colour alone. Static.
 */
export interface ChangeTableProps {
  comparison: ComparisonShape | null;
  /** Column titles; default "Before" / "After" with the inspections' dates and runs. */
  beforeLabel?: string;
  afterLabel?: string;
  caption?: string;
  /** Link the column titles to the inspections. */
  linkColumns?: boolean;
}

export default function ChangeTable({
  comparison,
  beforeLabel,
  afterLabel,
  caption = 'Change since the previous inspection',
  linkColumns = true,
}: ChangeTableProps) {
  if (!comparison) {
    return (
      <p className="text-ink-soft" data-testid="change-table-empty">
        This is the set’s first inspection: the change shows from the next one on.
      </p>
    );
  }
  const { before, after } = comparison;
  const head = (side: { id: string; title: string }, label: string | undefined) =>
    linkColumns ? <a href={`/inspections/${side.id}`}>{label ?? side.title}</a> : (label ?? side.title);
  return (
    <div>
      <div className="relative overflow-x-auto">
        <table className="data-table" data-testid="change-table">
          <caption className="mb-1 text-left font-semibold">{caption}</caption>
          <thead>
            <tr>
              <th scope="col">Measure</th>
              <th scope="col" className="num !whitespace-normal">
                {head(before, beforeLabel)}
              </th>
              <th scope="col" className="num !whitespace-normal">
                {head(after, afterLabel)}
              </th>
              <th scope="col" className="num">
                Change
              </th>
            </tr>
          </thead>
          <tbody>
            {comparison.rows.map((row) => (
              <tr
                key={row.measure}
                data-measure={row.measure}
                data-flagged={row.flagged ? 'true' : 'false'}
                className={row.flagged ? 'bg-amber-wash' : undefined}
              >
                <th scope="row" className="font-semibold">
                  {row.label}
                </th>
                <td className="num">{row.beforeText}</td>
                <td className="num">{row.afterText}</td>
                <td className="num" data-testid="change-delta">
                  {row.flagged ? (
                    <strong className="inline-flex items-center gap-1 text-amber">
                      <svg width="14" height="14" viewBox="0 0 14 14" aria-hidden="true" focusable="false">
                        <path d="M7 1 L13 13 H1 Z" fill="currentColor" />
                      </svg>
                      <span className="text-ink">{row.deltaText}</span>
                      <span className="text-ink">changed</span>
                    </strong>
                  ) : (
                    <span>{row.deltaText}</span>
                  )}
                  <span className="sr-only"> — {row.note}</span>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-1 text-sm text-ink-soft" data-testid="change-summary">
        {comparison.summary} A change is marked “changed” only when it is larger than {comparison.thresholdText} (two
        graduations of the coarser indicator); anything smaller the indicator could account for.
      </p>
    </div>
  );
}
