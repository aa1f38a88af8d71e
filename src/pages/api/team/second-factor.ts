import { requireSecondFactorSchema } from '../../../lib/account-security-schemas';
import { readTeamSecondFactorRule, setTeamSecondFactorRule } from '../../../lib/server/account-security';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, HttpError, json, readJson } from '../../../lib/server/http';

/** Whether the team asks its owners and crew chiefs for a second factor. */
export const GET = handle(async ({ locals }) => {
  const { team } = requireMember(locals);
  return json({ required: await readTeamSecondFactorRule(team.id) });
});

/** `{ required }` (owner). */
export const PUT = handle(async ({ locals, request }) => {
  const { team, user } = requirePermission(locals, 'team:settings');
  const { required } = await readJson(request, requireSecondFactorSchema);
  if (required && !user.secondFactor)
    throw new HttpError(409, 'required: turn on your own second factor first, so the rule does not lock you out.', {
      required: 'your second factor is off',
    });
  await setTeamSecondFactorRule(team.id, user.id, required);
  return json({ required });
});
