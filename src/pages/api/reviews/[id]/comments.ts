import { commentSchema } from '../../../../lib/reviews/schemas';
import { resolveBaseUrl } from '../../../../lib/server/base-url';
import { requirePermission } from '../../../../lib/server/guard';
import { handle, json, readJson } from '../../../../lib/server/http';
import { addComment } from '../../../../lib/server/reviews/reviews';

/** `{ body }` → 201; members mentioned with @name hear of it. */
export const POST = handle(async ({ locals, params, request, url }) => {
  const access = requirePermission(locals, 'reviews:comment');
  const { body } = await readJson(request, commentSchema);
  return json(await addComment(access, params.id ?? '', body, resolveBaseUrl(url)), 201);
});
