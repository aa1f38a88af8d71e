import { switchTeamSchema } from '../../../lib/account-schemas';
import { requireUser } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { findRole, switchTeam } from '../../../lib/server/teams';

/** The current team. */
export const GET = handle(({ locals }) => {
  requireUser(locals);
  return json({ team: locals.team });
});

/** Switches the current team: `{ teamId }`; 404 for a team the caller is not in. */
export const PUT = handle(async ({ request, locals }) => {
  const user = requireUser(locals);
  const { teamId } = await readJson(request, switchTeamSchema);
  await switchTeam(user.id, teamId);
  return json({ id: teamId, role: await findRole(teamId, user.id) });
});
