import { DEFAULT_LIFE_LIMITS, teamSettingsSchema } from '../../../lib/register/team-settings';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { readTeamSettings, saveTeamSettings } from '../../../lib/server/register/team-settings';

/** The team's settings, with where each default life limit comes from. */
export const GET = handle(async ({ locals }) => {
  const { team } = requireMember(locals);
  return json({ ...(await readTeamSettings(team.id)), lifeLimitDefaults: DEFAULT_LIFE_LIMITS });
});

/** Owner only: life limits per kind, near-limit share, service interval, backlash positions. */
export const PATCH = handle(async ({ locals, request }) => {
  const { team, user } = requirePermission(locals, 'team:settings');
  const changes = await readJson(request, teamSettingsSchema.partial());
  return json(await saveTeamSettings(team.id, user.id, changes));
});
