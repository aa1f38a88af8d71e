import { useMemo, useState } from 'react';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type SortingState,
} from '@tanstack/react-table';
import type { PartView } from '../../lib/server/register/parts';
import { PART_KINDS, PART_KIND_LABELS, PART_STATUSES, PART_STATUS_LABELS } from '../../lib/register/kinds';
import { lifeStateOf, runsLeftToText, type LifeState } from '../../lib/register/part-life';
import { locationToText, type PlaceLookup } from '../../lib/register/place';
import { LifeMark, StatusMark } from '../shared/StatusMark';

export interface PartRow extends PartView {
  where: string;
  lifeState: LifeState;
}

const column = createColumnHelper<PartRow>();
// Short cells stay on one line; the serial stays in view while the table scrolls sideways on a phone.
const CELL_CLASS: Record<string, string> = { serial: 'sticky left-0 z-10 bg-panel whitespace-nowrap', kind: 'whitespace-nowrap', status: 'whitespace-nowrap' };
const STATUS_ORDER = new Map(PART_STATUSES.map((status, index) => [status, index]));
const PAGE_SIZES = [25, 50, 100];

const columns = [
  column.accessor('serial', {
    header: 'Serial',
    filterFn: 'includesString',
    sortingFn: 'alphanumeric',
    cell: (info) => (
      <a href={`/parts/${encodeURIComponent(info.row.original.id)}`} className="font-bold">
        {info.getValue()}
      </a>
    ),
  }),
  column.accessor('kind', { header: 'Kind', filterFn: 'equalsString', cell: (info) => PART_KIND_LABELS[info.getValue()] }),
  column.accessor('status', {
    header: 'Status',
    filterFn: 'equalsString',
    sortingFn: (a, b) => (STATUS_ORDER.get(a.original.status) ?? 0) - (STATUS_ORDER.get(b.original.status) ?? 0),
    cell: (info) => <StatusMark status={info.getValue()} />,
  }),
  column.accessor('where', { header: 'Where it is now' }),
  column.accessor('runsSinceInstall', { header: 'Runs since install', meta: { numeric: true } }),
  column.accessor('totalRuns', { header: 'Total runs', meta: { numeric: true } }),
  column.accessor((row) => row.lifeLimitRuns ?? undefined, {
    id: 'lifeLimitRuns',
    header: 'Life limit',
    sortUndefined: 'last',
    meta: { numeric: true },
    cell: (info) => info.getValue() ?? '—',
  }),
  column.accessor((row) => row.runsLeft ?? undefined, {
    id: 'runsLeft',
    header: 'Runs left',
    sortUndefined: 'last',
    meta: { numeric: true },
    cell: (info) => (
      <span className="inline-flex flex-col items-end whitespace-nowrap">
        <span className="font-semibold">{runsLeftToText(info.row.original.runsLeft)}</span>
        <LifeMark state={info.row.original.lifeState} />
      </span>
    ),
  }),
];

interface Props {
  parts: PartView[];
  lookup: PlaceLookup;
  /** The team's service interval: a limit within it is "due soon". */
  dueWithin: number;
}

/** The register as a table: filter by kind, status and serial; sort by any column; page through. */
export function PartsTable({ parts, lookup, dueWithin }: Props) {
  const rows = useMemo<PartRow[]>(
    () => parts.map((part) => ({ ...part, where: locationToText(part.location, lookup), lifeState: lifeStateOf(part.runsLeft, dueWithin) })),
    [parts, lookup, dueWithin],
  );
  const [sorting, setSorting] = useState<SortingState>([]);
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting, columnFilters },
    onSortingChange: setSorting,
    onColumnFiltersChange: setColumnFilters,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    getRowId: (row) => row.id,
    sortDescFirst: false,
    initialState: { pagination: { pageSize: PAGE_SIZES[0] } },
  });

  const filterOf = (id: string) => String(table.getColumn(id)?.getFilterValue() ?? '');
  const setFilter = (id: string, value: string) => table.getColumn(id)?.setFilterValue(value === '' ? undefined : value);
  const shown = table.getFilteredRowModel().rows.length;
  const { pageIndex, pageSize } = table.getState().pagination;
  const first = shown === 0 ? 0 : pageIndex * pageSize + 1;
  const last = Math.min(shown, (pageIndex + 1) * pageSize);

  return (
    <div>
      <div role="search" aria-label="Filter the parts" className="mb-4 grid grid-cols-2 gap-3 sm:grid-cols-[2fr_1fr_1fr_auto] sm:items-end">
        <div className="col-span-2 flex flex-col gap-1 sm:col-span-1">
          <label htmlFor="parts-serial">Serial contains</label>
          <input id="parts-serial" type="search" autoComplete="off" spellCheck={false} value={filterOf('serial')} onChange={(e) => setFilter('serial', e.target.value)} />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="parts-kind">Kind</label>
          <select id="parts-kind" value={filterOf('kind')} onChange={(e) => setFilter('kind', e.target.value)}>
            <option value="">Every kind</option>
            {PART_KINDS.map((kind) => (
              <option key={kind} value={kind}>{PART_KIND_LABELS[kind]}</option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="parts-status">Status</label>
          <select id="parts-status" value={filterOf('status')} onChange={(e) => setFilter('status', e.target.value)}>
            <option value="">Every status</option>
            {PART_STATUSES.map((status) => (
              <option key={status} value={status}>{PART_STATUS_LABELS[status]}</option>
            ))}
          </select>
        </div>
        <button type="button" className="btn btn-quiet col-span-2 sm:col-span-1" onClick={() => table.resetColumnFilters()} disabled={columnFilters.length === 0}>
          Clear filters
        </button>
      </div>

      <p className="mb-2 text-ink-soft" role="status" aria-live="polite">
        {shown === 0 ? 'No parts match these filters.' : `Parts ${first}–${last} of ${shown}${shown !== rows.length ? ` (filtered from ${rows.length})` : ''}.`}
      </p>

      <div className="overflow-x-auto rounded-md border border-rule bg-panel" role="region" aria-label="Parts" tabIndex={0}>
        <table className="data-table min-w-[56rem]">
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const numeric = (header.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                  return (
                    <th key={header.id} scope="col" className={`!p-0 ${numeric ? 'num' : ''} ${CELL_CLASS[header.column.id] ?? ''}`} aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}>
                      <button
                        type="button"
                        className={`flex min-h-11 w-full items-center gap-1 px-2 py-2 font-bold hover:bg-petrol-wash ${numeric ? 'justify-end text-right' : ''}`}
                        onClick={header.column.getToggleSortingHandler()}
                      >
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden="true" className="text-ink-soft">{sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}</span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} data-testid="part-row" data-serial={row.original.serial}>
                {row.getVisibleCells().map((cell) => {
                  const numeric = (cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                  return (
                    <td key={cell.id} className={`${numeric ? 'num' : ''} ${CELL_CLASS[cell.column.id] ?? ''}`} data-column={cell.column.id}>
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <nav aria-label="Pages of parts" className="mt-3 flex flex-wrap items-center gap-3">
        <button type="button" className="btn btn-quiet" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
          Previous page
        </button>
        <span>
          Page {table.getPageCount() === 0 ? 0 : pageIndex + 1} of {table.getPageCount()}
        </span>
        <button type="button" className="btn btn-quiet" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
          Next page
        </button>
        <label className="ml-auto flex items-center gap-2 font-normal">
          Rows per page
          <select className="!w-auto" value={pageSize} onChange={(e) => table.setPageSize(Number(e.target.value))}>
            {PAGE_SIZES.map((size) => (
              <option key={size} value={size}>{size}</option>
            ))}
          </select>
        </label>
      </nav>
    </div>
  );
}
