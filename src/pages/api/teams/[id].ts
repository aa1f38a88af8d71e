import { requireUser } from '../../../lib/server/guard';
import { handle, HttpError, json } from '../../../lib/server/http';
import { listTeamsOf } from '../../../lib/server/teams';

/** One of the caller's teams; any other team answers 404, whether it exists or not. */
export const GET = handle(async ({ params, locals }) => {
  const user = requireUser(locals);
  const team = (await listTeamsOf(user.id)).find((t) => t.id === params.id);
  if (!team) throw new HttpError(404, 'No such team.');
  return json(team);
});
