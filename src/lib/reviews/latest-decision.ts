import { DECISION_LABELS, type DECISIONS } from './schemas';

type Decision = (typeof DECISIONS)[number];

/** A decided review as read from the database: what was decided for a set, by whom, when. */
export interface DecisionRow {
  reviewId: string;
  gearSetId: string;
  decision: Decision;
  reason: string | null;
  decidedAt: Date;
  decidedByName: string | null;
  /** The set's run count at which it is to be inspected again (keep and re-shim). */
  reinspectAtRuns: number | null;
}

/** The latest decision on a set, in words, with its re-inspection point against the set's runs now. */
export interface LatestDecisionView {
  reviewId: string;
  decision: Decision;
  label: string;
  reason: string | null;
  by: string | null;
  at: string;
  reinspectAtRuns: number | null;
  /** "re-inspect due in 6 runs (at 49)", "re-inspection due now (at 49)", or null without a point. */
  dueText: string | null;
  due: boolean;
}

/**
 * Each set's latest decision: the one decided last, whatever review it closed.
 * @example latestDecisions(rows).get(setId)?.decision // 'reshim'
 */
export function latestDecisions(rows: readonly DecisionRow[]): Map<string, DecisionRow> {
  const latest = new Map<string, DecisionRow>();
  for (const row of rows) {
    const known = latest.get(row.gearSetId);
    if (!known || row.decidedAt.getTime() > known.decidedAt.getTime()) latest.set(row.gearSetId, row);
  }
  return latest;
}

/**
 * Where the set stands against its re-inspection point.
 * @example reinspectionText(49, 43) // { text: 're-inspect due in 6 runs (at 49)', due: false }
 * @example reinspectionText(49, 51) // { text: 're-inspection due now (at 49; 2 runs past it)', due: true }
 */
export function reinspectionText(atRuns: number | null, runsNow: number): { text: string | null; due: boolean } {
  if (atRuns === null) return { text: null, due: false };
  const left = atRuns - runsNow;
  if (left > 0) return { text: `re-inspect due in ${left} run${left === 1 ? '' : 's'} (at ${atRuns})`, due: false };
  const past = -left;
  return {
    text: `re-inspection due now (at ${atRuns}${past ? `; ${past} run${past === 1 ? '' : 's'} past it` : ''})`,
    due: true,
  };
}

/** The latest decision on a set as screens show it, its re-inspection point counted from `runsNow`. */
export function decisionToView(row: DecisionRow, runsNow: number): LatestDecisionView {
  const point = row.decision === 'retire' ? { text: null, due: false } : reinspectionText(row.reinspectAtRuns, runsNow);
  return {
    reviewId: row.reviewId,
    decision: row.decision,
    label: DECISION_LABELS[row.decision],
    reason: row.reason,
    by: row.decidedByName,
    at: row.decidedAt.toISOString(),
    reinspectAtRuns: row.reinspectAtRuns,
    dueText: point.text,
    due: point.due,
  };
}
