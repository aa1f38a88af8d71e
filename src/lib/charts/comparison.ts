// Two inspections of one gear set side by side: every comparable figure, its change, and whether the
// change is larger than two readings' worth of indicator doubt (compareInspections: |Δ| > 2 × the coarser
// graduation). Used by the compare page and by the inspection page's "change since the previous one". Pure.

import { compareInspections, summaryToMeasures, type BacklashSummary } from '../analysis';
import { torqueUnitToLabel, type LengthUnit } from '../units';
import { coarsestResolution, deltaToText, isoToDayText, lengthToText, toResolutionId, torqueToText } from './format';

/** What an inspection answer (GET /api/inspections/:id) carries that a comparison reads. */
export interface ComparableInspection {
  id: string;
  status: string;
  inspectedAt: string;
  runsAtInspection: number;
  /** Resolution id as typed, e.g. '0.001in'. */
  resolution: string;
  readings: (number | null)[];
  unit: string;
  canonical: { preload: { pinionNm: number | null; bearings: 'new' | 'used' } };
  summary: {
    unit: LengthUnit;
    torqueUnit: 'lbf-in' | 'N-m';
    /** The graduation in the reader's unit. */
    resolution: number;
    backlash: BacklashSummary | null;
    runoutTir: number | null;
    verdicts: { measure: string; value: number; unit: string }[];
  };
}

export interface ComparisonRow {
  measure: string;
  label: string;
  beforeText: string;
  afterText: string;
  deltaText: string;
  /** Raw change in the reader's unit (null when either side lacks the figure). */
  delta: number | null;
  flagged: boolean;
  /** Why it is or is not highlighted, for the screen reader and the tooltip. */
  note: string;
}

export interface ComparisonShape {
  before: { id: string; title: string };
  after: { id: string; title: string };
  unit: LengthUnit;
  thresholdText: string;
  rows: ComparisonRow[];
  flaggedCount: number;
  summary: string;
}

const LABELS: Readonly<Record<string, string>> = {
  min: 'Tightest reading (min)',
  max: 'Loosest reading (max)',
  mean: 'Mean backlash',
  spread: 'Spread (max − min)',
  amplitude: 'Once-per-turn wave (±)',
  tir: 'Runout, TIR (back face, measured)',
};

/** "26 Oct 2026, run 44". */
export function inspectionToTitle(inspection: Pick<ComparableInspection, 'inspectedAt' | 'runsAtInspection'>): string {
  return `${isoToDayText(inspection.inspectedAt)}, run ${inspection.runsAtInspection}`;
}

/** The measures the gear-set analysis compares: the backlash figures, and the measured runout over the estimate. */
export function inspectionToMeasures(inspection: ComparableInspection): Record<string, number | undefined> {
  const b = inspection.summary.backlash;
  if (!b) return { tir: inspection.summary.runoutTir ?? undefined };
  return { ...summaryToMeasures(b), tir: inspection.summary.runoutTir ?? undefined };
}

/**
 * Compares `before` with `after` (after − before), flagging only changes past 2 × the coarser graduation.
 * @example shapeComparison(previous, latest).rows.find((r) => r.measure === 'mean')?.deltaText // '+0.001'
 */
export function shapeComparison(before: ComparableInspection, after: ComparableInspection): ComparisonShape {
  const unit = after.summary.unit;
  const resBefore = toResolutionId(before.resolution, unit);
  const resAfter = toResolutionId(after.resolution, unit);
  const coarse = coarsestResolution([resBefore, resAfter], unit);
  const fallbackStep = unit === 'in' ? 0.001 : 0.01;
  const changes = compareInspections(
    { measures: inspectionToMeasures(before), resolution: before.summary.resolution || fallbackStep },
    { measures: inspectionToMeasures(after), resolution: after.summary.resolution || fallbackStep },
  );
  const threshold = changes[0]?.threshold ?? 2 * fallbackStep;
  const thresholdText = `${lengthToText(threshold, unit, coarse)} ${unit}`;
  const rows: ComparisonRow[] = changes.map((c) => ({
    measure: c.measure,
    label: LABELS[c.measure] ?? c.measure,
    beforeText: c.previous === null ? '—' : `${lengthToText(c.previous, unit, resBefore)} ${unit}`,
    afterText: c.current === null ? '—' : `${lengthToText(c.current, unit, resAfter)} ${unit}`,
    deltaText: c.delta === null ? '—' : `${deltaToText(c.delta, unit, coarse)} ${unit}`,
    delta: c.delta,
    flagged: c.flagged,
    note:
      c.delta === null
        ? 'Not in both inspections.'
        : c.flagged
          ? `Changed by more than ${thresholdText}: more than the indicator explains.`
          : `Within ${thresholdText}: the indicator could account for it.`,
  }));
  const torqueLabel = torqueUnitToLabel(after.summary.torqueUnit);
  const preloadOf = (i: ComparableInspection) => i.summary.verdicts.find((v) => v.measure.startsWith('pinion-preload'));
  const pb = preloadOf(before);
  const pa = preloadOf(after);
  if (pb || pa) {
    const bearings = (i: ComparableInspection) => i.canonical.preload.bearings;
    rows.push({
      measure: 'pinion-preload',
      label: 'Pinion turning torque',
      beforeText: pb ? `${torqueToText(pb.value)} ${torqueLabel} (${bearings(before)})` : '—',
      afterText: pa ? `${torqueToText(pa.value)} ${torqueLabel} (${bearings(after)})` : '—',
      deltaText:
        pb && pa
          ? `${pa.value - pb.value >= 0.05 ? '+' : pa.value - pb.value <= -0.05 ? '−' : ''}${torqueToText(Math.abs(pa.value - pb.value))} ${torqueLabel}`
          : '—',
      delta: pb && pa ? pa.value - pb.value : null,
      flagged: false,
      note: 'Torque is not judged against the indicator; compare it with its band.',
    });
  }
  const flaggedCount = rows.filter((r) => r.flagged).length;
  const summary = flaggedCount
    ? `${flaggedCount} of ${rows.length} figures changed by more than ${thresholdText}: ${rows
        .filter((r) => r.flagged)
        .map((r) => r.label.toLowerCase())
        .join(', ')}.`
    : `No figure changed by more than ${thresholdText}, two graduations of the coarser indicator.`;
  return {
    before: { id: before.id, title: inspectionToTitle(before) },
    after: { id: after.id, title: inspectionToTitle(after) },
    unit,
    thresholdText,
    rows,
    flaggedCount,
    summary,
  };
}

/** Submitted inspections oldest first (by runs, then date), as the trend orders them. */
export function sortInspections<T extends Pick<ComparableInspection, 'status' | 'runsAtInspection' | 'inspectedAt'>>(
  items: readonly T[],
): T[] {
  return items
    .filter((i) => i.status === 'submitted')
    .sort((a, b) => a.runsAtInspection - b.runsAtInspection || a.inspectedAt.localeCompare(b.inspectedAt));
}

/** The submitted inspection just before `id` in the set's order, or null for the first. */
export function findPreviousInspection<
  T extends Pick<ComparableInspection, 'id' | 'status' | 'runsAtInspection' | 'inspectedAt'>,
>(items: readonly T[], id: string): T | null {
  const sorted = sortInspections(items);
  const index = sorted.findIndex((i) => i.id === id);
  if (index > 0) return sorted[index - 1]!;
  if (index === 0) return null;
  // A draft is not in the order yet: its previous is the latest submitted one before it in runs.
  const self = items.find((i) => i.id === id);
  if (!self) return null;
  return (
    sorted.filter((i) => i.runsAtInspection <= self.runsAtInspection && i.inspectedAt <= self.inspectedAt).at(-1) ??
    null
  );
}

/**
 * Which two inspections the compare page shows: the requested ones when both belong to the set,
 * else the latest and the one before. Returns nulls when the set has fewer than two.
 */
export function pickComparePair<
  T extends Pick<ComparableInspection, 'id' | 'status' | 'runsAtInspection' | 'inspectedAt'>,
>(items: readonly T[], a: string | null, b: string | null): { before: T | null; after: T | null; defaulted: boolean } {
  const sorted = sortInspections(items);
  const byId = (id: string | null) => (id ? (sorted.find((i) => i.id === id) ?? null) : null);
  const first = byId(a);
  const second = byId(b);
  if (first && second && first.id !== second.id) {
    // Older on the left, so a delta always reads "what happened since".
    const ordered = sorted.indexOf(first) < sorted.indexOf(second) ? [first, second] : [second, first];
    return { before: ordered[0]!, after: ordered[1]!, defaulted: false };
  }
  return { before: sorted.at(-2) ?? null, after: sorted.at(-1) ?? null, defaulted: Boolean(a || b) };
}
