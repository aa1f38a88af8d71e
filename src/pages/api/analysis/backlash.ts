import { analyseBacklash } from '../../../lib/analysis';
import { backlashRequestSchema } from '../../../lib/analysis/schemas';
import { requireMember } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';

// 24 readings and a profile fit in well under 1 KB; 64 KB leaves room for whitespace and nothing more.
const MAX_BODY_BYTES = 64 * 1024;

/** `{ unit, readings, profile?, ringTeeth?, pinionTeeth?, pressureAngleDeg? }` → statistics, fit, verdicts. */
export const POST = handle(async ({ request, locals }) => {
  requireMember(locals);
  const body = await readJson(request, backlashRequestSchema, MAX_BODY_BYTES);
  return json(analyseBacklash(body));
});
