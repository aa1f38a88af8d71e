import { describe, expect, it } from 'vitest';
import { addedPartToHref, nextSort, partsViewToHref, sortToHref } from '../../../src/lib/register/parts-href';
import { DEFAULT_PARTS_VIEW, searchParamsToPartsView, type PartsView } from '../../../src/lib/register/parts-view';

const read = (query: string) => searchParamsToPartsView(new URLSearchParams(query));
const queryOf = (href: string) => Object.fromEntries(new URL(href, 'http://x').searchParams);

describe('the parts page’s view in the URL', () => {
  it('reads an empty query as every part, unsorted, first page of 25', () => {
    expect(read('')).toEqual({ serial: '', kind: null, status: null, sort: null, dir: 'asc', page: 1, size: 25 });
    expect(DEFAULT_PARTS_VIEW).toEqual(read(''));
  });

  it('reads every field it knows', () => {
    expect(read('serial=GS-41&kind=gear-set&status=in-service&sort=runsLeft&dir=desc&page=3&size=50')).toEqual({
      serial: 'GS-41',
      kind: 'gear-set',
      status: 'in-service',
      sort: 'runsLeft',
      dir: 'desc',
      page: 3,
      size: 50,
    });
  });

  it('reads what the form sends for “every kind” and “every status” as no filter', () => {
    expect(read('serial=&kind=&status=&size=100')).toEqual({ ...DEFAULT_PARTS_VIEW, size: 100 });
  });

  it('falls back to the default for each unknown or malformed value, keeping the good ones', () => {
    expect(read('kind=gearbox&status=lost&sort=colour&dir=up&page=2')).toEqual({ ...DEFAULT_PARTS_VIEW, page: 2 });
    for (const page of ['0', '-1', '2.5', 'two', '', 'Infinity', '1e400'])
      expect(read(`page=${page}&kind=axle`), page).toEqual({ ...DEFAULT_PARTS_VIEW, kind: 'axle' });
    for (const size of ['30', '0', 'all', '25.5', '']) expect(read(`size=${size}`).size, size).toBe(25);
  });

  it('keeps a page past the end as asked (the table clamps it) and takes the first of repeated keys', () => {
    expect(read('page=999').page).toBe(999);
    expect(read('kind=axle&kind=hub').kind).toBe('axle');
  });

  it('trims the serial search and cuts one longer than any serial', () => {
    expect(read('serial=%20%20sp-%20').serial).toBe('sp-');
    expect(read(`serial=${'A'.repeat(200)}`).serial).toHaveLength(60);
  });
});

describe('links to the parts page', () => {
  const view: PartsView = {
    serial: 'GS 41&',
    kind: 'gear-set',
    status: null,
    sort: 'serial',
    dir: 'desc',
    page: 2,
    size: 50,
  };

  it('is the plain page for the default view', () => {
    expect(partsViewToHref(DEFAULT_PARTS_VIEW)).toBe('/parts');
  });

  it('changes what is asked and keeps the rest, leaving defaults out', () => {
    expect(queryOf(partsViewToHref(view, { page: 3 }))).toEqual({
      serial: 'GS 41&',
      kind: 'gear-set',
      sort: 'serial',
      dir: 'desc',
      page: '3',
      size: '50',
    });
    expect(queryOf(partsViewToHref(view, { kind: null, page: 1, size: 25 }))).toEqual({
      serial: 'GS 41&',
      sort: 'serial',
      dir: 'desc',
    });
    expect(queryOf(partsViewToHref(view, { sort: null }))).toEqual({
      serial: 'GS 41&',
      kind: 'gear-set',
      page: '2',
      size: '50',
    });
  });

  it('reads back as the view it was built from', () => {
    const href = partsViewToHref(view, { status: 'spare' });
    expect(searchParamsToPartsView(new URL(href, 'http://x').searchParams)).toEqual({ ...view, status: 'spare' });
  });

  it('cycles a column’s sort ascending, descending, then none', () => {
    const unsorted = { sort: null, dir: 'asc' } as const;
    expect(nextSort(unsorted, 'runsLeft')).toEqual({ sort: 'runsLeft', dir: 'asc' });
    expect(nextSort({ sort: 'runsLeft', dir: 'asc' }, 'runsLeft')).toEqual({ sort: 'runsLeft', dir: 'desc' });
    expect(nextSort({ sort: 'runsLeft', dir: 'desc' }, 'runsLeft')).toEqual(unsorted);
    expect(nextSort({ sort: 'runsLeft', dir: 'desc' }, 'serial')).toEqual({ sort: 'serial', dir: 'asc' });
  });

  it('sorts from the first page, with the filters and page size kept', () => {
    expect(queryOf(sortToHref(view, 'serial'))).toEqual({ serial: 'GS 41&', kind: 'gear-set', size: '50' });
    expect(queryOf(sortToHref(view, 'status'))).toEqual({
      serial: 'GS 41&',
      kind: 'gear-set',
      sort: 'status',
      dir: 'asc',
      size: '50',
    });
  });

  it('names a part just added and nothing else', () => {
    expect(addedPartToHref('a b/1')).toBe('/parts?added=a+b%2F1');
    expect(queryOf(addedPartToHref('a b/1'))).toEqual({ added: 'a b/1' });
  });
});
