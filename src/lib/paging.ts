/**
 * Opaque list cursors. A cursor holds the offset of the next page; lists are ordered by a stable key
 * so a page never repeats a row while the list is unchanged.
 */
export function offsetToCursor(offset: number): string {
  return Buffer.from(JSON.stringify({ o: offset })).toString('base64url');
}

/** The offset in a cursor, or null when the cursor is not one of ours. */
export function cursorToOffset(cursor: string | undefined): number | null {
  if (!cursor) return 0;
  try {
    const value = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8')) as { o?: unknown };
    return typeof value.o === 'number' && Number.isInteger(value.o) && value.o >= 0 ? value.o : null;
  } catch {
    return null;
  }
}

/** `{ items, nextCursor }` from one extra row fetched beyond the page. */
export function toPage<T>(rows: T[], offset: number, limit: number): { items: T[]; nextCursor: string | null } {
  const items = rows.slice(0, limit);
  return { items, nextCursor: rows.length > limit ? offsetToCursor(offset + limit) : null };
}
