// What the parts page shows — filters, sort and page — as it lives in the URL query
// (`?serial=&kind=&status=&sort=&dir=&page=&size=`). The page is rendered on the server, so a link
// or a plain GET form is all it takes to change it, with or without JavaScript.

import { z } from 'zod';
import { PART_KINDS, PART_STATUSES } from './kinds';
import { PAGE_SIZES, PART_COLUMN_IDS } from './parts-columns';

// Serials are at most 60 characters (partCreateSchema); a longer search is cut there, which keeps
// the page's links, which echo it, short.
const MAX_SERIAL_SEARCH = 60;

// Every field falls back to its default: a hand-edited or stale link still shows the page.
export const partsViewSchema = z.object({
  serial: z
    .string()
    .transform((text) => text.trim().slice(0, MAX_SERIAL_SEARCH))
    .catch(''),
  kind: z.enum(PART_KINDS).nullable().catch(null),
  status: z.enum(PART_STATUSES).nullable().catch(null),
  sort: z.enum(PART_COLUMN_IDS).nullable().catch(null),
  dir: z.enum(['asc', 'desc']).catch('asc'),
  page: z.coerce.number().int().min(1).catch(1),
  size: z.coerce.number().pipe(z.literal(PAGE_SIZES)).catch(PAGE_SIZES[0]),
});

export type PartsView = z.output<typeof partsViewSchema>;

export const DEFAULT_PARTS_VIEW: PartsView = partsViewSchema.parse({});

/**
 * The view a query asks for; unknown or malformed values read as their defaults. The page is
 * clamped to the pages there are later, once the filtered rows are counted.
 * @example searchParamsToPartsView(new URLSearchParams('kind=axle&page=x')) // { …, kind: 'axle', page: 1 }
 */
export function searchParamsToPartsView(params: URLSearchParams): PartsView {
  const input = Object.fromEntries(
    Object.keys(partsViewSchema.shape).map((key) => [key, params.get(key) ?? undefined]),
  );
  return partsViewSchema.parse(input);
}
