import { z } from 'zod';
import { openReviewSchema } from '../../../lib/reviews/schemas';
import { resolveBaseUrl } from '../../../lib/server/base-url';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, parseWith, readJson } from '../../../lib/server/http';
import { pageOfList, readListQuery } from '../../../lib/server/list-query';
import { listReviews, openReview } from '../../../lib/server/reviews/reviews';

const filterSchema = z.object({
  status: z.enum(['open', 'decided'], { error: 'status: open or decided.' }).optional(),
  gearSetId: z.string().max(64).optional(),
});

export const GET = handle(async ({ locals, url }) => {
  const { team } = requireMember(locals);
  const filter = parseWith(filterSchema, {
    status: url.searchParams.get('status') ?? undefined,
    gearSetId: url.searchParams.get('gearSetId') ?? undefined,
  });
  return json(pageOfList(await listReviews(team.id, filter), readListQuery(url)));
});

/** `{ gearSetId }` → 201: a review with a snapshot of the evidence as it stands now. */
export const POST = handle(async ({ locals, request, url }) => {
  const access = requirePermission(locals, 'reviews:open');
  const { gearSetId } = await readJson(request, openReviewSchema);
  return json(await openReview(access, gearSetId, resolveBaseUrl(url)), 201);
});
