import { requireMember } from '../../../../lib/server/guard';
import { handle, json } from '../../../../lib/server/http';
import { profileForGearSet } from '../../../../lib/server/inspections/profiles';

/** The profile a gear set is judged by now (its own or the team default). */
export const GET = handle(async ({ locals, params }) => {
  const { team } = requireMember(locals);
  return json(await profileForGearSet(team.id, params.id ?? ''));
});
