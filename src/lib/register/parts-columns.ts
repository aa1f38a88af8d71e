/**
 * The parts table's columns and page sizes: plain constants, shared by the view's schema on the
 * server and the links the page's island builds (which must not pull zod into the browser).
 */
export const PART_COLUMN_IDS = [
  'serial',
  'kind',
  'status',
  'where',
  'runsSinceInstall',
  'totalRuns',
  'lifeLimitRuns',
  'runsLeft',
] as const;
export type PartColumnId = (typeof PART_COLUMN_IDS)[number];

export const PART_COLUMN_HEADERS: Readonly<Record<PartColumnId, string>> = {
  serial: 'Serial',
  kind: 'Kind',
  status: 'Status',
  where: 'Where it is now',
  runsSinceInstall: 'Runs since install',
  totalRuns: 'Total runs',
  lifeLimitRuns: 'Life limit',
  runsLeft: 'Runs left',
};

/** Columns of counts: right-aligned, in tabular figures. */
export const NUMERIC_COLUMNS: ReadonlySet<PartColumnId> = new Set([
  'runsSinceInstall',
  'totalRuns',
  'lifeLimitRuns',
  'runsLeft',
]);

/** Rows per page; the first is the default. */
export const PAGE_SIZES = [25, 50, 100] as const;
export type PageSize = (typeof PAGE_SIZES)[number];
