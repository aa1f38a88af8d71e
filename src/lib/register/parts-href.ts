import { PAGE_SIZES, type PartColumnId } from './parts-columns';
import type { PartsView } from './parts-view';

/**
 * Links of the parts page. Kept apart from the view's zod schema so the page's island can build
 * the "added" link without shipping zod to the browser.
 */
export const PARTS_PATH = '/parts';

/**
 * The parts page with `changes` applied to `view` and everything else kept; defaults are left out
 * of the query, so the plain page stays `/parts`.
 * @example partsViewToHref(view, { page: 2 }) // '/parts?kind=axle&sort=serial&dir=asc&page=2'
 */
export function partsViewToHref(view: PartsView, changes: Partial<PartsView> = {}): string {
  const next = { ...view, ...changes };
  const params = new URLSearchParams();
  if (next.serial) params.set('serial', next.serial);
  if (next.kind) params.set('kind', next.kind);
  if (next.status) params.set('status', next.status);
  if (next.sort) {
    params.set('sort', next.sort);
    params.set('dir', next.dir);
  }
  if (next.page > 1) params.set('page', String(next.page));
  if (next.size !== PAGE_SIZES[0]) params.set('size', String(next.size));
  const query = params.toString();
  return query ? `${PARTS_PATH}?${query}` : PARTS_PATH;
}

/**
 * The sort a click on a column's header asks for: ascending first, then descending, then none.
 * @example nextSort({ sort: 'serial', dir: 'asc' }, 'serial') // { sort: 'serial', dir: 'desc' }
 */
export function nextSort(view: Pick<PartsView, 'sort' | 'dir'>, column: PartColumnId): Pick<PartsView, 'sort' | 'dir'> {
  if (view.sort !== column) return { sort: column, dir: 'asc' };
  if (view.dir === 'asc') return { sort: column, dir: 'desc' };
  return { sort: null, dir: 'asc' };
}

/** The header link of `column`: the next sort, from the first page, with the filters kept. */
export function sortToHref(view: PartsView, column: PartColumnId): string {
  return partsViewToHref(view, { ...nextSort(view, column), page: 1 });
}

/** The plain parts page that names a part just added, so the page can say so. */
export function addedPartToHref(partId: string): string {
  return `${PARTS_PATH}?${new URLSearchParams({ added: partId }).toString()}`;
}
