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
  /** The limit as published in the unit shown ("0.005"); without it the limit is formatted. */
  limitText?: string;
  /** What the verdict was judged at ("judged at the 0.001 in graduation"). */
  judgedAt?: string;
}

// The limit as published keeps its printed digits; the unit comes from the formatter.
function limitToText(v: ShownVerdict, format: (value: number) => string): string {
  if (v.limitText === undefined) return format(v.limitValue);
  const unitSuffix = format(v.limitValue).replace(/^[-−+\d.,\s]+/, '');
  return unitSuffix ? `${v.limitText} ${unitSuffix}` : v.limitText;
}

/** Verdicts with their limit, margin, what they were judged at and the source of each band. */
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
              {`${v.limit === 'min' ? 'Lower' : 'Upper'} limit ${limitToText(v, format)}, ${margin}${v.judgedAt ? `, ${v.judgedAt}` : ''}.`}{' '}
              {field && <>Band: {bandToSourceText(profile.values, field, profile.sources, profile.name)}.</>}
            </p>
          </li>
        );
      })}
    </ul>
  );
}
