import { acceptInvitationSchema } from '../../../lib/account-schemas';
import { requireUser } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { acceptInvitation } from '../../../lib/server/invitations';

/** `{ token }` from the link → the team joined and the role held. */
export const POST = handle(async ({ request, locals }) => {
  const user = requireUser(locals);
  const { token } = await readJson(request, acceptInvitationSchema);
  return json(await acceptInvitation(user.id, token));
});
