import { createTeamSchema } from '../../../lib/account-schemas';
import { requireUser } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { createTeam, listTeamsOf } from '../../../lib/server/teams';

/** The teams the caller belongs to, with the role in each. */
export const GET = handle(async ({ locals }) => {
  const user = requireUser(locals);
  const items = await listTeamsOf(user.id);
  return json({ items, nextCursor: null });
});

/** `{ name }` → 201; the caller is the owner and the team becomes current. */
export const POST = handle(async ({ request, locals }) => {
  const user = requireUser(locals);
  const { name } = await readJson(request, createTeamSchema);
  const team = await createTeam(user.id, name);
  return json({ id: team.id, name: team.name, role: 'owner' }, 201);
});
