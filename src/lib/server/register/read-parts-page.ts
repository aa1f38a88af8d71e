import { buildPartsTable, type PartsTablePage } from '../../register/parts-table';
import { searchParamsToPartsView } from '../../register/parts-view';
import { listsToPlaceLookup } from '../../register/place';
import type { PartView } from '../../register/views';
import type { TeamAccess } from '../guard';
import { readPartViews } from './part-views';
import { readTeamSettings } from './team-settings';

export interface PartsPageView {
  table: PartsTablePage;
  serviceIntervalRuns: number;
  /** The part just added (`?added=<id>`), when it is this team's. */
  added: PartView | null;
}

/**
 * The parts page in six queries however many parts, runs or installations there are: the parts with
 * their run counts and places (five) and the team's settings (one). The table is filtered, sorted and
 * paged here from the view in the URL: its "runs left" and "where" columns are derived, not stored.
 */
export async function readPartsPage(access: TeamAccess, params: URLSearchParams): Promise<PartsPageView> {
  const teamId = access.team.id;
  const [register, settings] = await Promise.all([readPartViews(teamId), readTeamSettings(teamId)]);
  const table = buildPartsTable(
    register.parts,
    listsToPlaceLookup(register.places.assemblies, register.places.cars),
    settings.serviceIntervalRuns,
    searchParamsToPartsView(params),
  );
  const addedId = params.get('added');
  return {
    table,
    serviceIntervalRuns: settings.serviceIntervalRuns,
    added: (addedId && register.parts.find((part) => part.id === addedId)) || null,
  };
}
