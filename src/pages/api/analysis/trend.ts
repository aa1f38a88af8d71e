import { analyseTrend } from '../../../lib/analysis';
import { trendRequestSchema } from '../../../lib/analysis/schemas';
import { requireMember } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';

// 1000 points of { runs, value } are about 40 KB of JSON.
const MAX_BODY_BYTES = 64 * 1024;

/** `{ points: [{ runs, value }], limit? }` → the fitted line and where it meets the limit. */
export const POST = handle(async ({ request, locals }) => {
  requireMember(locals);
  const body = await readJson(request, trendRequestSchema, MAX_BODY_BYTES);
  return json(analyseTrend(body));
});
