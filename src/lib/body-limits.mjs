// Plain JavaScript so that the serving wrapper (scripts/serve.mjs) caps every request body with the
// same table the app reads (src/lib/server/body-limits.ts adds the words of each refusal).

const KB = 1024;
const MB = 1024 * KB;

/**
 * A cap on the request bodies of the routes whose path matches; `refusal` holds the 413's words where
 * the route names its field.
 * @typedef {{ route: RegExp, bytes: number, why: string,
 *   refusal?: { message: string, fields: Record<string, string> } }} BodyCap
 */

/**
 * Every request body's cap, in one place: the first row whose route matches the path wins, and every
 * other route takes `DEFAULT_BODY_CAP`. scripts/serve.mjs counts each body as it streams and answers
 * 413 the moment it passes its cap, before the app (Astro, Auth.js) reads any of it; the app's readers
 * stop at the same figure.
 * @type {readonly BodyCap[]}
 */
export const BODY_CAPS = [
  {
    route: /^\/api\/inspections\/[^/]+\/photos$/,
    // MAX_PHOTO_BYTES + MULTIPART_OVERHEAD_BYTES of src/lib/photos/upload-rules.ts (a unit test holds them equal).
    bytes: 15 * MB + 64 * KB,
    why: 'one photo of at most 15 MB and its form fields',
    refusal: {
      message: 'file: a photo may be at most 15 MB; send a smaller one.',
      fields: { file: 'larger than 15 MB' },
    },
  },
  {
    route: /^\/api\/(procedures|checklists)\/[^/]+\/steps\/[^/]+\/photos$/,
    bytes: 15 * MB + 64 * KB,
    why: 'one photo or diagram of a step, at most 15 MB, as for inspection photos',
    refusal: {
      message: 'file: a photo may be at most 15 MB; send a smaller one.',
      fields: { file: 'larger than 15 MB' },
    },
  },
  { route: /^\/api\/runs\/import$/, bytes: 5 * MB, why: 'a run log as CSV (5,000 runs are about 0.4 MB)' },
  {
    route: /^\/(api\/imports\/team|team\/data)$/,
    bytes: 64 * MB,
    why: 'a team archive, by the API or the Team data form: a season without photos is about 21 MB (decision 009)',
  },
  {
    route: /^\/api\/analysis\//,
    bytes: 64 * KB,
    why: '24 readings and a profile are under 1 KB, 1,000 trend points about 40 KB',
  },
  { route: /^\/api\/auth\//, bytes: 64 * KB, why: 'the sign-in and sign-out forms: an e-mail, a password, a token' },
  {
    route: /^\/(?!api\/)/,
    bytes: 64 * KB,
    why: 'page forms (sign-up, account, invitations, reviews): a few fields of text',
  },
];

/** @type {BodyCap} The cap of every route the table does not name: JSON bodies of records. */
export const DEFAULT_BODY_CAP = { route: /./, bytes: 1 * MB, why: 'one record as JSON' };

/**
 * The 413's body for a request to `pathname` past its cap, in the route's words where it has them.
 * @param {string} pathname
 * @returns {{ error: { message: string, fields?: Record<string, string> } }}
 */
export function tooLargeBody(pathname) {
  const cap = findBodyCap(pathname);
  if (cap.refusal) return { error: { ...cap.refusal } };
  const size = cap.bytes >= MB ? `${cap.bytes / MB} MB` : `${cap.bytes / KB} KB`;
  return { error: { message: `The request body is larger than ${size}; send less.` } };
}

/**
 * The row of the table that caps bodies sent to `pathname`.
 * @param {string} pathname
 * @returns {BodyCap}
 */
export function findBodyCap(pathname) {
  return BODY_CAPS.find((cap) => cap.route.test(pathname)) ?? DEFAULT_BODY_CAP;
}
