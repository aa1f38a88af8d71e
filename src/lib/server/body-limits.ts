import { MAX_PHOTO_BYTES, MULTIPART_OVERHEAD_BYTES } from '../photos/upload-rules';

const KB = 1024;
const MB = 1024 * KB;

/** A cap on the request bodies of the routes whose path matches. */
export interface BodyLimit {
  route: RegExp;
  bytes: number;
  /** Why the cap is what it is. */
  why: string;
  /** The 413's words where the route names its field ("file: a photo may be at most 15 MB …"). */
  refusal?: { message: string; fields: Record<string, string> };
}

/**
 * Every request body's cap, in one place: the first row whose route matches the path wins, and every
 * other route takes `DEFAULT_BODY_LIMIT`. The API gate refuses a body declared larger, and every reader
 * of a body (JSON, CSV, photos, the archive form) stops at the same figure.
 */
export const BODY_LIMITS: readonly BodyLimit[] = [
  {
    route: /^\/api\/inspections\/[^/]+\/photos$/,
    bytes: MAX_PHOTO_BYTES + MULTIPART_OVERHEAD_BYTES,
    why: 'one photo of at most 15 MB and its form fields',
    refusal: {
      message: `file: a photo may be at most ${MAX_PHOTO_BYTES / MB} MB; send a smaller one.`,
      fields: { file: `larger than ${MAX_PHOTO_BYTES / MB} MB` },
    },
  },
  {
    route: /^\/api\/(procedures|checklists)\/[^/]+\/steps\/[^/]+\/photos$/,
    bytes: MAX_PHOTO_BYTES + MULTIPART_OVERHEAD_BYTES,
    why: 'one photo or diagram of a step, at most 15 MB, as for inspection photos',
    refusal: {
      message: `file: a photo may be at most ${MAX_PHOTO_BYTES / MB} MB; send a smaller one.`,
      fields: { file: `larger than ${MAX_PHOTO_BYTES / MB} MB` },
    },
  },
  { route: /^\/api\/runs\/import$/, bytes: 5 * MB, why: 'a run log as CSV (5,000 runs are about 0.4 MB)' },
  {
    route: /^\/(api\/imports\/team|team\/data)$/,
    bytes: 64 * MB,
    why: 'a team archive, by the API or the Team data form',
  },
  {
    route: /^\/api\/analysis\//,
    bytes: 64 * KB,
    why: '24 readings and a profile are under 1 KB, 1,000 trend points about 40 KB',
  },
];

/** The cap of every route the table does not name: JSON bodies of records. */
export const DEFAULT_BODY_LIMIT: BodyLimit = { route: /./, bytes: 1 * MB, why: 'one record as JSON' };

/**
 * The cap on the body of a request to `pathname`, in bytes.
 * @example bodyLimitFor('/api/runs/import') // 5242880
 */
export function bodyLimitFor(pathname: string): number {
  return findBodyLimit(pathname).bytes;
}

/** The row of the table that caps bodies sent to `pathname`. */
export function findBodyLimit(pathname: string): BodyLimit {
  return BODY_LIMITS.find((limit) => limit.route.test(pathname)) ?? DEFAULT_BODY_LIMIT;
}
