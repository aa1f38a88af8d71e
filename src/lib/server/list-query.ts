import { cursorToOffset, toPage } from '../paging';
import { listQuerySchema } from '../register/schemas';
import { HttpError, parseWith } from './http';

/** `?limit=&cursor=` of a list endpoint, checked: 400 names the bad one. */
export function readListQuery(url: URL): { offset: number; limit: number } {
  const { limit, cursor } = parseWith(listQuerySchema, {
    limit: url.searchParams.get('limit') ?? undefined,
    cursor: url.searchParams.get('cursor') ?? undefined,
  });
  const offset = cursorToOffset(cursor);
  if (offset === null)
    throw new HttpError(400, 'cursor: not a cursor from this list; start again without it.', {
      cursor: 'not recognised',
    });
  return { offset, limit };
}

/** One page of an in-memory list. */
export function pageOfList<T>(
  items: T[],
  query: { offset: number; limit: number },
): { items: T[]; nextCursor: string | null } {
  return toPage(items.slice(query.offset, query.offset + query.limit + 1), query.offset, query.limit);
}
