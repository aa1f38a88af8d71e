import { requireMember } from '../../../lib/server/guard';
import { handle, json } from '../../../lib/server/http';
import { getReview } from '../../../lib/server/reviews/reviews';

/** The review: its snapshot of the evidence, its comments and its decision. */
export const GET = handle(async ({ locals, params }) => json(await getReview(requireMember(locals), params.id ?? '')));
