import { requireMember } from '../../../lib/server/guard';
import { handle, json } from '../../../lib/server/http';
import { listMembers } from '../../../lib/server/teams';

/** The members of the current team. */
export const GET = handle(async ({ locals }) => {
  const { team } = requireMember(locals);
  return json({ items: await listMembers(team.id), nextCursor: null });
});
