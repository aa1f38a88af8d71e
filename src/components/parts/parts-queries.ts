import type { LifeLimitDefault, TeamSettings } from '../../lib/register/team-settings';
import type { PartKind } from '../../lib/register/kinds';
import { getJson } from '../shared/api';

/** The query keys and paths the parts island shares with its form. */
export const PARTS_KEY = ['parts'] as const;
export const PARTS_PATH = '/api/parts?limit=500';
export const SETTINGS_KEY = ['team-settings'] as const;

export type TeamSettingsAnswer = TeamSettings & { lifeLimitDefaults: Record<PartKind, LifeLimitDefault> };

export function fetchTeamSettings(): Promise<TeamSettingsAnswer> {
  return getJson<TeamSettingsAnswer>('/api/team/settings');
}
