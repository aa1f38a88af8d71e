/**
 * Free-form JSON kept in records (a review's snapshot, an audit entry's before and after) as it may
 * travel in a team archive: object-storage keys taken out, ids of the archive put in their new form.
 */

/** Keys that name a stored object; they stay inside the server, never in an audit entry or an archive. */
export const STORAGE_KEY_FIELDS: readonly string[] = ['storageKey', 'thumbnailKey'];

/**
 * A copy of `value` without any storage-key field, at any depth.
 * @example withoutStorageKeys({ id: 'p1', storageKey: 'a.jpg' }) // { id: 'p1' }
 */
export function withoutStorageKeys(value: unknown): unknown {
  return mapJson(value, (text) => text);
}

/**
 * A copy of `value` without storage keys, where every string equal to an id in `ids` becomes the
 * id it maps to, and a photo address (`/api/photos/<id>…`) follows its photo.
 * @example remapJson({ gearSetId: 'old' }, new Map([['old', 'new']])) // { gearSetId: 'new' }
 */
export function remapJson(value: unknown, ids: ReadonlyMap<string, string>): unknown {
  return mapJson(value, (text) => remapString(text, ids));
}

function mapJson(value: unknown, mapString: (text: string) => string): unknown {
  if (typeof value === 'string') return mapString(value);
  // A row read from the database holds its times as Dates; JSON writes them as ISO text.
  if (value instanceof Date) return value.toISOString();
  if (Array.isArray(value)) return value.map((item) => mapJson(item, mapString));
  if (value && typeof value === 'object') {
    const copy: Record<string, unknown> = {};
    for (const [key, item] of Object.entries(value)) {
      if (STORAGE_KEY_FIELDS.includes(key)) continue;
      copy[key] = mapJson(item, mapString);
    }
    return copy;
  }
  return value;
}

const PHOTO_ADDRESS = /^\/api\/photos\/([^/]+)(\/thumbnail)?$/;

function remapString(value: string, ids: ReadonlyMap<string, string>): string {
  const mapped = ids.get(value);
  if (mapped !== undefined) return mapped;
  const photo = PHOTO_ADDRESS.exec(value);
  if (photo) {
    const id = ids.get(photo[1]!);
    // A photo the archive does not hold has no address here.
    return id ? `/api/photos/${id}${photo[2] ?? ''}` : '';
  }
  return value;
}
