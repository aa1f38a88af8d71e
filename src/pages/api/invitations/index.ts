import { invitationSchema } from '../../../lib/account-schemas';
import { resolveBaseUrl } from '../../../lib/server/base-url';
import { requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { createInvitation, listOpenInvitations } from '../../../lib/server/invitations';

/** Open invitations of the current team. */
export const GET = handle(async ({ locals }) => {
  const { team } = requirePermission(locals, 'members:invite');
  return json({ items: await listOpenInvitations(team.id), nextCursor: null });
});

/**
 * `{ email, role }` → 201; the e-mail with the single-use link leaves through the outbox. An address with an
 * open invitation gets it again with a new link (200, `resent: true`); a member of the team is refused (409).
 */
export const POST = handle(async ({ request, locals, url }) => {
  const { user, team } = requirePermission(locals, 'members:invite');
  const { email, role } = await readJson(request, invitationSchema);
  const invitation = await createInvitation({
    teamId: team.id,
    actorId: user.id,
    actorRole: team.role,
    email,
    role,
    baseUrl: resolveBaseUrl(url),
  });
  const view = {
    id: invitation.id,
    email,
    role,
    expiresAt: invitation.expiresAt.toISOString(),
    resent: invitation.resent,
  };
  return json(view, invitation.resent ? 200 : 201);
});
