import { BODY_CAPS, DEFAULT_BODY_CAP, findBodyCap, type BodyCap } from '../body-limits.mjs';

/**
 * A cap on the request bodies of the routes whose path matches. The table itself is plain JavaScript
 * (src/lib/body-limits.mjs) because scripts/serve.mjs enforces it while each body streams, before the app
 * reads any of it.
 */
export type BodyLimit = BodyCap;

/**
 * Every request body's cap, in one place: the first row whose route matches the path wins, and every
 * other route takes `DEFAULT_BODY_LIMIT`. The serving wrapper answers 413 the moment a body passes its
 * cap; the API gate refuses a body declared larger, and every reader of a body (JSON, CSV, photos, the
 * archive form) stops at the same figure.
 */
export const BODY_LIMITS: readonly BodyLimit[] = BODY_CAPS;

/** The cap of every route the table does not name: JSON bodies of records. */
export const DEFAULT_BODY_LIMIT: BodyLimit = DEFAULT_BODY_CAP;

/**
 * The cap on the body of a request to `pathname`, in bytes.
 * @example bodyLimitFor('/api/runs/import') // 5242880
 */
export function bodyLimitFor(pathname: string): number {
  return findBodyCap(pathname).bytes;
}

/** The row of the table that caps bodies sent to `pathname`. */
export function findBodyLimit(pathname: string): BodyLimit {
  return findBodyCap(pathname);
}
