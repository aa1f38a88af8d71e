import { analyseBacklash } from '../../../lib/analysis';
import { backlashRequestSchema } from '../../../lib/analysis/schemas';
import { requireMember } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';

/** `{ unit, readings, profile?, ringTeeth?, pinionTeeth?, pressureAngleDeg? }` → statistics, fit, verdicts. */
export const POST = handle(async ({ locals, request }) => {
  requireMember(locals);
  return json(analyseBacklash(await readJson(request, backlashRequestSchema)));
});
