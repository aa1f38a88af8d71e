import type { LifeLimitDefault, TeamSettings } from '../../lib/register/team-settings';
import type { PartKind } from '../../lib/register/kinds';
import { getJson } from '../shared/api';

/** The team settings as GET /api/team/settings answers them, and their TanStack Query key. */
export const SETTINGS_KEY = ['team-settings'] as const;

export type TeamSettingsAnswer = TeamSettings & { lifeLimitDefaults: Record<PartKind, LifeLimitDefault> };

/** Reads the team's settings; throws with the endpoint's message on failure. */
export function fetchTeamSettings(): Promise<TeamSettingsAnswer> {
  return getJson<TeamSettingsAnswer>('/api/team/settings');
}
