import { analyseTrend } from '../../../lib/analysis';
import { trendRequestSchema } from '../../../lib/analysis/schemas';
import { requireMember } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';

/** `{ points: [{ runs, value }], limit? }` → the fitted line and where it meets the limit. */
export const POST = handle(async ({ locals, request }) => {
  requireMember(locals);
  return json(analyseTrend(await readJson(request, trendRequestSchema)));
});
