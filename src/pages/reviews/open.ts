import type { APIRoute } from 'astro';
import { openReviewSchema } from '../../lib/reviews/schemas';
import { resolveBaseUrl } from '../../lib/server/base-url';
import { readForm } from '../../lib/server/forms';
import { requirePermission } from '../../lib/server/guard';
import { HttpError } from '../../lib/server/http';
import { openReview } from '../../lib/server/reviews/reviews';

/** The gear set page's "Open a review" button posts here (an HTML form: it works without JavaScript). */
export const POST: APIRoute = async ({ locals, request, url, redirect }) => {
  if (!locals.user) return redirect('/sign-in', 303);
  try {
    const access = requirePermission(locals, 'reviews:open');
    const form = await readForm(request, openReviewSchema);
    if (!form.ok) return new Response('Choose the gear set.', { status: 400 });
    const review = await openReview(access, form.data.gearSetId, resolveBaseUrl(url));
    return redirect(`/reviews/${review.id}`, 303);
  } catch (error) {
    if (error instanceof HttpError)
      return new Response(error.message, {
        status: error.status,
        headers: { 'Content-Type': 'text/plain; charset=utf-8' },
      });
    throw error;
  }
};
