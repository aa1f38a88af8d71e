import { describe, expect, it } from 'vitest';
import { buildPartsTable, PART_COLUMNS } from '../../../src/lib/register/parts-table';
import { PART_COLUMN_IDS } from '../../../src/lib/register/parts-columns';
import { DEFAULT_PARTS_VIEW, type PartsView } from '../../../src/lib/register/parts-view';
import type { PartView } from '../../../src/lib/server/register/parts';
import { LOOKUP, makePart, PARTS } from '../../helpers/part-fixtures';

function tableOf(view: Partial<PartsView>, parts: PartView[] = PARTS) {
  return buildPartsTable(parts, LOOKUP, 8, { ...DEFAULT_PARTS_VIEW, ...view });
}
const serialsOf = (view: Partial<PartsView>, parts?: PartView[]) => tableOf(view, parts).rows.map((row) => row.serial);

describe('the parts table built on the server', () => {
  it('has a column for every id the view can sort by, in the same order', () => {
    expect(PART_COLUMNS.map((c) => c.id ?? ('accessorKey' in c ? c.accessorKey : undefined))).toEqual([
      ...PART_COLUMN_IDS,
    ]);
  });

  it('keeps the register’s order with no sort, and says where each part is and how it stands', () => {
    const table = tableOf({});
    expect(table.rows.map((r) => r.serial)).toEqual(['GS-4101', 'GS-4102', 'GS-4104', 'SP-11', 'AX-11', 'GS-4103']);
    const first = table.rows[0]!;
    expect(first.where).toBe('RE-01 Ember rear end · in 714 Ember');
    expect(first.lifeState).toBe('due');
    expect(table.rows.find((r) => r.serial === 'GS-4102')?.lifeState).toBe('over');
    expect(table.rows.find((r) => r.serial === 'GS-4104')?.where).toBe('Not installed');
    expect(table).toMatchObject({ total: 6, matched: 6, pageCount: 1, first: 1, last: 6 });
  });

  it('filters the serial by text it contains, whatever its case', () => {
    expect(serialsOf({ serial: '02' })).toEqual(['GS-4102']);
    expect(serialsOf({ serial: 'sp-' })).toEqual(['SP-11']);
    expect(serialsOf({ serial: 'ZZ' })).toEqual([]);
  });

  it('filters kind and status by the whole value, not by part of it', () => {
    const hubs = [
      makePart({ id: 'h1', serial: 'HB-1', kind: 'hub' }),
      makePart({ id: 'h2', serial: 'DH-1', kind: 'drive-hub' }),
    ];
    expect(serialsOf({ kind: 'hub' }, hubs)).toEqual(['HB-1']);
    expect(serialsOf({ kind: 'gear-set' })).toEqual(['GS-4101', 'GS-4102', 'GS-4104', 'GS-4103']);
    expect(serialsOf({ status: 'in-service' })).toEqual(['GS-4101', 'GS-4102', 'SP-11', 'AX-11']);
  });

  it('applies every filter together and counts what they keep', () => {
    const table = tableOf({ kind: 'gear-set', status: 'in-service', serial: 'GS-41' });
    expect(table.rows.map((r) => r.serial)).toEqual(['GS-4101', 'GS-4102']);
    expect(table).toMatchObject({ total: 6, matched: 2, first: 1, last: 2 });
  });

  it('sorts serials as people read them, numbers by value', () => {
    const parts = ['GS-10', 'GS-9', 'AX-2', 'GS-100'].map((serial, i) =>
      makePart({ id: `s${i}`, serial, kind: 'other' }),
    );
    expect(serialsOf({ sort: 'serial', dir: 'asc' }, parts)).toEqual(['AX-2', 'GS-9', 'GS-10', 'GS-100']);
    expect(serialsOf({ sort: 'serial', dir: 'desc' }, parts)).toEqual(['GS-100', 'GS-10', 'GS-9', 'AX-2']);
  });

  it('sorts statuses in the order a part lives through them, not alphabetically', () => {
    const statuses = ['scrapped', 'retired', 'spare', 'under-review', 'in-service'] as const;
    const parts = statuses.map((status, i) => makePart({ id: `t${i}`, serial: status, kind: 'other', status }));
    expect(serialsOf({ sort: 'status', dir: 'asc' }, parts)).toEqual([
      'spare',
      'in-service',
      'under-review',
      'retired',
      'scrapped',
    ]);
    expect(serialsOf({ sort: 'status', dir: 'desc' }, parts)).toEqual([
      'scrapped',
      'retired',
      'under-review',
      'in-service',
      'spare',
    ]);
  });

  it('sorts runs left, fewest first, with the parts that have no limit last either way', () => {
    expect(serialsOf({ sort: 'runsLeft', dir: 'asc' })).toEqual([
      'GS-4102',
      'GS-4101',
      'GS-4103',
      'SP-11',
      'GS-4104',
      'AX-11',
    ]);
    expect(serialsOf({ sort: 'runsLeft', dir: 'desc' })).toEqual([
      'GS-4104',
      'SP-11',
      'GS-4103',
      'GS-4101',
      'GS-4102',
      'AX-11',
    ]);
  });

  it('sorts the life limit with the parts that have none last either way', () => {
    expect(serialsOf({ sort: 'lifeLimitRuns', dir: 'asc' }).at(-1)).toBe('AX-11');
    expect(serialsOf({ sort: 'lifeLimitRuns', dir: 'desc' })).toEqual([
      'SP-11',
      'GS-4101',
      'GS-4102',
      'GS-4104',
      'GS-4103',
      'AX-11',
    ]);
  });

  it('sorts the run counts and the place by value', () => {
    expect(serialsOf({ sort: 'totalRuns', dir: 'desc' })).toEqual([
      'GS-4102',
      'SP-11',
      'AX-11',
      'GS-4101',
      'GS-4103',
      'GS-4104',
    ]);
    expect(serialsOf({ sort: 'runsSinceInstall', dir: 'asc' }).slice(0, 2)).toEqual(['GS-4104', 'GS-4103']);
    expect(serialsOf({ sort: 'where', dir: 'asc' }).slice(0, 3)).toEqual(['GS-4102', 'GS-4104', 'GS-4103']);
    expect(serialsOf({ sort: 'kind', dir: 'asc' })[0]).toBe('AX-11');
  });

  it('sorts the filtered rows only', () => {
    expect(serialsOf({ kind: 'gear-set', sort: 'runsLeft', dir: 'asc' })).toEqual([
      'GS-4102',
      'GS-4101',
      'GS-4103',
      'GS-4104',
    ]);
  });

  describe('paging', () => {
    const many = Array.from({ length: 60 }, (_, i) =>
      makePart({ id: `b${i}`, serial: `BR-${String(i + 1).padStart(2, '0')}`, kind: 'bearing' }),
    );

    it('pages through a long register 25 rows at a time by default', () => {
      const first = tableOf({}, many);
      expect(first.rows).toHaveLength(25);
      expect(first).toMatchObject({ pageCount: 3, first: 1, last: 25, matched: 60 });
      const last = tableOf({ page: 3 }, many);
      expect(last.rows.map((r) => r.serial)).toEqual(Array.from({ length: 10 }, (_, i) => `BR-${51 + i}`));
      expect(last).toMatchObject({ pageCount: 3, first: 51, last: 60 });
    });

    it('pages the sorted, filtered rows with the size asked for', () => {
      const second = tableOf({ size: 50, page: 2, sort: 'serial', dir: 'desc' }, many);
      expect(second.rows.map((r) => r.serial)).toEqual([
        'BR-10',
        'BR-09',
        'BR-08',
        'BR-07',
        'BR-06',
        'BR-05',
        'BR-04',
        'BR-03',
        'BR-02',
        'BR-01',
      ]);
      expect(second).toMatchObject({ pageCount: 2, first: 51, last: 60 });
      expect(tableOf({ size: 100 }, many)).toMatchObject({ pageCount: 1, first: 1, last: 60 });
    });

    it('shows the last page for a page past the end, and says which page it is', () => {
      const table = tableOf({ page: 9 }, many);
      expect(table.view.page).toBe(3);
      expect(table.rows[0]?.serial).toBe('BR-51');
      const filtered = tableOf({ page: 3, serial: 'BR-0' }, many);
      expect(filtered.view.page).toBe(1);
      expect(filtered.rows.map((r) => r.serial)).toEqual([
        'BR-01',
        'BR-02',
        'BR-03',
        'BR-04',
        'BR-05',
        'BR-06',
        'BR-07',
        'BR-08',
        'BR-09',
      ]);
    });

    it('calls an empty result page 1 of 1, with nothing shown', () => {
      expect(tableOf({ serial: 'nothing', page: 4 }, many)).toMatchObject({
        rows: [],
        matched: 0,
        total: 60,
        pageCount: 1,
        first: 0,
        last: 0,
        view: { page: 1 },
      });
      expect(tableOf({}, [])).toMatchObject({ rows: [], total: 0, pageCount: 1, first: 0, last: 0 });
    });
  });
});
