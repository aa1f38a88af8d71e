import { toCsv } from './csv';

/** One line of a gear set's history: an installation event, an inspection or a review. */
export interface HistoryRow {
  at: string;
  record: 'installed' | 'removed' | 'inspection' | 'review-opened' | 'decision';
  runs_at?: number | null;
  place?: string | null;
  mean_backlash_mm?: number | null;
  spread_mm?: number | null;
  runout_tir_mm?: number | null;
  pinion_preload_nm?: number | null;
  decision?: string | null;
  reason?: string | null;
  notes?: string | null;
  link_id?: string | null;
}

const COLUMNS: (keyof HistoryRow)[] = [
  'at',
  'record',
  'runs_at',
  'place',
  'mean_backlash_mm',
  'spread_mm',
  'runout_tir_mm',
  'pinion_preload_nm',
  'decision',
  'reason',
  'notes',
  'link_id',
];

/** The whole history in time order, canonical units named in the column headers. */
export function historyToCsv(rows: HistoryRow[]): string {
  const sorted = [...rows].sort((a, b) => a.at.localeCompare(b.at));
  return toCsv({ fields: COLUMNS, data: sorted.map((row) => COLUMNS.map((c) => row[c] ?? '')) });
}
