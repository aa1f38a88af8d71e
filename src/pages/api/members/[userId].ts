import { memberRoleSchema } from '../../../lib/account-schemas';
import { requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { changeMemberRole, removeMember } from '../../../lib/server/teams';

/** Changes a member's role (owner only); takes effect on their next request. */
export const PATCH = handle(async ({ request, params, locals }) => {
  const { user, team } = requirePermission(locals, 'members:manage');
  const { role } = await readJson(request, memberRoleSchema);
  await changeMemberRole(user.id, team.id, params.userId ?? '', role);
  return json({ userId: params.userId, role });
});

/** Removes a member (owner only); their access ends at once. */
export const DELETE = handle(async ({ params, locals }) => {
  const { user, team } = requirePermission(locals, 'members:manage');
  await removeMember(user.id, team.id, params.userId ?? '');
  return new Response(null, { status: 204 });
});
