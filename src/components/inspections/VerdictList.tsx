import type { Verdict } from '../../lib/analysis/judge';
import { bandToSourceText, measureToLabel, measureToProfileField } from '../../lib/inspections/verdict-text';
import { VerdictMark } from '../charts/marks';
import type { ProfileInfo } from './sheet-context';

export interface ShownVerdict {
  measure: string;
  value: number;
  verdict: Verdict;
  limit: 'min' | 'max';
  limitValue: number;
  margin: number;
}

/** Verdicts with their limit, margin and the source of each band. */
export function VerdictList({
  verdicts,
  format,
  profile,
  provisional,
}: {
  verdicts: ShownVerdict[];
  format: (value: number) => string;
  profile: ProfileInfo;
  provisional?: boolean;
}) {
  if (verdicts.length === 0) return null;
  return (
    <ul className="flex flex-col gap-2" data-testid="verdicts">
      {verdicts.map((v) => {
        const field = measureToProfileField(v.measure);
        const shown = format(Math.abs(v.margin));
        // Closer to the limit than the display shows: say so rather than print "0.000 beyond".
        const margin = `${parseFloat(shown) === 0 ? 'less than a graduation' : shown} ${v.margin >= 0 ? 'inside' : 'beyond'}`;
        return (
          <li key={v.measure} className="border-l-4 border-rule pl-3">
            <div className="flex flex-wrap items-baseline gap-x-2">
              <VerdictMark verdict={v.verdict} />
              <span>
                {measureToLabel(v.measure)}: <strong className="tabular-nums">{format(v.value)}</strong>
                {provisional ? ' (so far)' : ''}
              </span>
            </div>
            <p className="text-sm text-ink-soft">
              {v.limit === 'min' ? 'Lower' : 'Upper'} limit {format(v.limitValue)}, {margin}.{' '}
              {field && <>Band: {bandToSourceText(profile.values, field, profile.sources, profile.name)}.</>}
            </p>
          </li>
        );
      })}
    </ul>
  );
}
