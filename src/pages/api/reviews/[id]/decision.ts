import { decisionSchema } from '../../../../lib/reviews/schemas';
import { resolveBaseUrl } from '../../../../lib/server/base-url';
import { requirePermission } from '../../../../lib/server/guard';
import { handle, json, readJson } from '../../../../lib/server/http';
import { decideReview } from '../../../../lib/server/reviews/reviews';

/** `{ decision: keep | reshim | retire, reason, notes?, reinspectAfterRuns? }` — crew chief or owner only. */
export const POST = handle(async ({ locals, params, request, url }) => {
  const access = requirePermission(locals, 'reviews:decide');
  const input = await readJson(request, decisionSchema);
  return json(await decideReview(access, params.id ?? '', input, resolveBaseUrl(url)));
});
