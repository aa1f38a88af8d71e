import { decisionSchema } from '../../../../lib/reviews/schemas';
import { resolveBaseUrl } from '../../../../lib/server/base-url';
import { requirePermission } from '../../../../lib/server/guard';
import { handle, json, readJson } from '../../../../lib/server/http';
import { correctDecision } from '../../../../lib/server/reviews/correct-decision';

/**
 * `{ decision, reason, notes?, reinspectAfterRuns? }` → 201 with the new decision, which supersedes this
 * review's (the set's latest); both stay in the history. Crew chief or owner only.
 */
export const POST = handle(async ({ locals, params, request, url }) => {
  const access = requirePermission(locals, 'reviews:decide');
  const input = await readJson(request, decisionSchema);
  return json(await correctDecision(access, params.id ?? '', input, resolveBaseUrl(url)), 201);
});
