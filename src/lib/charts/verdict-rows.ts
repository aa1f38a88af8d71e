// The verdicts of one inspection as table rows: the measure in words, the value, the limit it was judged
// against and the margin, each with the digits its indicator resolves. Pure.

import type { Verdict } from '../analysis';
import { torqueUnitToLabel, type IndicatorResolutionId, type LengthUnit } from '../units';
import { measureToWords } from './action-text';
import { lengthToText, torqueToText } from './format';

export interface VerdictInput {
  measure: string;
  value: number;
  verdict: Verdict;
  limit: 'min' | 'max';
  limitValue: number;
  margin: number;
  /** 'in' | 'mm' for lengths, 'lbf-in' | 'N-m' for torques, 'check' for a yes/no check. */
  unit: string;
  /** The limit as published in this unit ("0.005"); without it the limit is formatted to the graduation. */
  limitText?: string;
  /** What the verdict was judged at ("judged at the 0.001 in graduation"). */
  judgedAt?: string;
}

export interface VerdictRow {
  key: string;
  label: string;
  valueText: string;
  limitText: string;
  marginText: string;
  /** What the verdict was judged at, or '' when the summary does not say. */
  judgedAt: string;
  verdict: Verdict;
}

const LABELS: Readonly<Record<string, string>> = {
  'runout-estimated': 'Runout estimated from the lash (TIR)',
  'runout-measured': 'Back-face runout, measured (TIR)',
};

/**
 * Rows for the verdict table. A summary names the runout estimated from the lash `runout` and the measured back
 * face `runout-measured`; `engineCount` is kept for callers of the older shape and no longer decides anything.
 * @example verdictsToRows(summary.verdicts, 3, '0.001in')[0].label // 'Backlash at the tightest point'
 */
export function verdictsToRows(
  verdicts: readonly VerdictInput[],
  engineCount: number,
  resolution: IndicatorResolutionId,
): VerdictRow[] {
  return verdicts.map((v, i) => {
    void engineCount;
    const measure = v.measure === 'runout' ? 'runout-estimated' : v.measure;
    const isLength = v.unit === 'in' || v.unit === 'mm';
    const show = (x: number): string => {
      if (v.unit === 'check') return x ? 'yes' : 'no';
      if (isLength) return `${lengthToText(x, v.unit as LengthUnit, resolution)} ${v.unit}`;
      return `${torqueToText(x)} ${torqueUnitToLabel(v.unit === 'N-m' ? 'N-m' : 'lbf-in')}`;
    };
    const label = LABELS[measure] ?? capitalise(measureToWords(measure));
    if (v.unit === 'check') {
      return {
        key: `${measure}:${i}`,
        label,
        valueText: v.value ? 'effort unchanged' : 'effort changed',
        limitText: 'effort stays the same',
        marginText: '—',
        judgedAt: '',
        verdict: v.verdict,
      };
    }
    return {
      key: `${measure}:${i}`,
      label,
      valueText: show(v.value),
      limitText: `${v.limit === 'min' ? 'lower' : 'upper'} ${v.limitText !== undefined ? `${v.limitText} ${unitLabel(v.unit)}` : show(v.limitValue)}`,
      marginText: `${show(Math.abs(v.margin))} ${v.margin >= 0 ? 'inside' : 'beyond'}`,
      judgedAt: v.judgedAt ?? '',
      verdict: v.verdict,
    };
  });
}

function unitLabel(unit: string): string {
  return unit === 'in' || unit === 'mm' ? unit : torqueUnitToLabel(unit === 'N-m' ? 'N-m' : 'lbf-in');
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
