import { requirePermission } from '../../../lib/server/guard';
import { handle } from '../../../lib/server/http';
import { cancelInvitation } from '../../../lib/server/invitations';

/** Cancels an open invitation: its link stops working at once. */
export const DELETE = handle(async ({ locals, params }) => {
  await cancelInvitation(requirePermission(locals, 'members:invite'), params.id ?? '');
  return new Response(null, { status: 204 });
});
