// The parts register as a table: filtered, sorted and paged on the server with TanStack Table's core,
// so the browser gets finished rows and no table library. The view comes from the URL (parts-view.ts).

import {
  createColumnHelper,
  createTable,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  type ColumnFiltersState,
  type Table,
} from '@tanstack/table-core';
import type { PartView } from './views';
import { PART_STATUSES } from './kinds';
import { lifeStateOf, type LifeState } from './part-life';
import type { PartsView } from './parts-view';
import { locationToText, type PlaceLookup } from './place';

export interface PartRow extends PartView {
  where: string;
  lifeState: LifeState;
}

export interface PartsTablePage {
  /** The rows of the page shown. */
  rows: PartRow[];
  /** Every part of the team, and those the filters keep. */
  total: number;
  matched: number;
  /** The view as shown: the page clamped to the pages there are. */
  view: PartsView;
  /** At least 1, so an empty result is page 1 of 1. */
  pageCount: number;
  /** Positions (from 1) of the first and last row shown among the matched ones; 0 when none match. */
  first: number;
  last: number;
}

const column = createColumnHelper<PartRow>();
const STATUS_ORDER = new Map(PART_STATUSES.map((status, index) => [status, index]));

// The ids are PART_COLUMN_IDS, in order (the unit tests hold them together).
export const PART_COLUMNS = [
  column.accessor('serial', { filterFn: 'includesString', sortingFn: 'alphanumeric' }),
  column.accessor('kind', { filterFn: 'equalsString' }),
  column.accessor('status', {
    filterFn: 'equalsString',
    // In the order a part lives through them, not alphabetically.
    sortingFn: (a, b) => (STATUS_ORDER.get(a.original.status) ?? 0) - (STATUS_ORDER.get(b.original.status) ?? 0),
  }),
  column.accessor('where', {}),
  column.accessor('runsSinceInstall', {}),
  column.accessor('totalRuns', {}),
  // A part without a limit has nothing to compare: it goes last whichever way the column is sorted.
  column.accessor((row) => row.lifeLimitRuns ?? undefined, { id: 'lifeLimitRuns', sortUndefined: 'last' }),
  column.accessor((row) => row.runsLeft ?? undefined, { id: 'runsLeft', sortUndefined: 'last' }),
];

/** A part as a row: where it is in words and how it stands against its life limit. */
export function partToRow(part: PartView, lookup: PlaceLookup, dueWithin: number): PartRow {
  return { ...part, where: locationToText(part.location, lookup), lifeState: lifeStateOf(part.runsLeft, dueWithin) };
}

function viewToFilters(view: PartsView): ColumnFiltersState {
  const filters: ColumnFiltersState = [];
  if (view.serial) filters.push({ id: 'serial', value: view.serial });
  if (view.kind) filters.push({ id: 'kind', value: view.kind });
  if (view.status) filters.push({ id: 'status', value: view.status });
  return filters;
}

// The state is controlled: the URL holds it, so the table never changes it itself.
function showPage(table: Table<PartRow>, view: PartsView, page: number): void {
  table.setOptions((options) => ({
    ...options,
    state: {
      ...table.initialState,
      columnFilters: viewToFilters(view),
      sorting: view.sort ? [{ id: view.sort, desc: view.dir === 'desc' }] : [],
      pagination: { pageIndex: page - 1, pageSize: view.size },
    },
  }));
}

/**
 * The page of the parts table a view asks for. `dueWithin` is the team's service interval in runs;
 * a page past the last one shows the last one.
 */
export function buildPartsTable(
  parts: readonly PartView[],
  lookup: PlaceLookup,
  dueWithin: number,
  view: PartsView,
): PartsTablePage {
  const table = createTable<PartRow>({
    data: parts.map((part) => partToRow(part, lookup, dueWithin)),
    columns: PART_COLUMNS,
    state: {},
    onStateChange: () => undefined,
    renderFallbackValue: null,
    getCoreRowModel: getCoreRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    getRowId: (row) => row.id,
    autoResetPageIndex: false,
  });
  showPage(table, view, view.page);
  const pageCount = Math.max(1, table.getPageCount());
  const page = Math.min(view.page, pageCount);
  if (page !== view.page) showPage(table, view, page);

  const rows = table.getRowModel().rows.map((row) => row.original);
  const matched = table.getFilteredRowModel().rows.length;
  const first = rows.length === 0 ? 0 : (page - 1) * view.size + 1;
  return {
    rows,
    total: parts.length,
    matched,
    view: { ...view, page },
    pageCount,
    first,
    last: first === 0 ? 0 : first + rows.length - 1,
  };
}
