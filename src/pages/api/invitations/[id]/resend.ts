import { resolveBaseUrl } from '../../../../lib/server/base-url';
import { requirePermission } from '../../../../lib/server/guard';
import { handle, json } from '../../../../lib/server/http';
import { resendInvitation } from '../../../../lib/server/invitations';

/** Sends an open invitation again with a new link and a new week to answer; the old link stops working. */
export const POST = handle(async ({ locals, params, url }) => {
  const access = requirePermission(locals, 'members:invite');
  return json(await resendInvitation(access, params.id ?? '', resolveBaseUrl(url)));
});
