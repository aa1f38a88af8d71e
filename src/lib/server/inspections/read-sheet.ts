import type { InspectionViewLite } from '../../../components/inspections/inspection-api';
import type { SheetProps } from '../../../components/inspections/sheet-context';
import type { InspectionView } from '../../inspections/views';
import { PART_STATUS_LABELS } from '../../register/kinds';
import { roleCan } from '../../roles';
import type { TeamAccess } from '../guard';
import { readPartViews } from '../register/part-views';
import { readTeamSettings } from '../register/team-settings';
import { listMembers } from '../teams';

/**
 * The inspection sheet's read model (new and edit pages), in seven queries: the gear sets with the team's
 * places (five), the members and the settings. The island's props: only team-wide lists and the person,
 * never anything from the query string, so the one cached copy of the page serves every ?gearSetId and
 * ?draft offline. (Its prop types live beside the island, which owns them.)
 */
export async function readSheet(
  access: TeamAccess,
  mode: SheetProps['mode'],
  inspection?: InspectionView,
): Promise<SheetProps> {
  const teamId = access.team.id;
  const [register, members, settings] = await Promise.all([
    readPartViews(teamId, { kind: 'gear-set' }),
    listMembers(teamId),
    readTeamSettings(teamId),
  ]);
  const sets = register.parts;
  const assemblies = register.places.assemblies;
  const recorders = members.filter((m) => roleCan(m.role, 'inspections:record') || m.id === inspection?.technicianId);
  return {
    mode,
    ...(inspection ? { inspection: viewToLite(inspection) } : {}),
    user: {
      id: access.user.id,
      name: access.user.name,
      lengthUnit: access.user.lengthUnit,
      torqueUnit: access.user.torqueUnit,
    },
    role: access.team.role,
    canEditAny: roleCan(access.team.role, 'inspections:edit-any'),
    gearSets: sets.map((s) => ({
      id: s.id,
      serial: s.serial,
      ratioLabel: s.ratioLabel ?? null,
      status: s.status === 'in-service' ? s.status : PART_STATUS_LABELS[s.status].toLowerCase(),
    })),
    assemblies: assemblies.map((a) => ({ id: a.id, serial: a.serial, name: a.name })),
    members: recorders.map((m) => ({ id: m.id, name: m.name })),
    positionsDefault: settings.backlashPositions,
  };
}

/** What the sheet reads of an inspection: not the canonical copy or the summary, which it never shows. */
const SHEET_FIELDS = [
  'id',
  'status',
  'createdBy',
  'revision',
  'gearSetId',
  'assemblyId',
  'inspectedAt',
  'runsAtInspection',
  'runsChangeReason',
  'technicianId',
  'unit',
  'resolution',
  'torqueUnit',
  'readings',
  'runout',
  'pinion',
  'carrierShims',
  'preload',
  'patterns',
  'condition',
  'notes',
] as const satisfies readonly (keyof InspectionView)[];

function viewToLite(view: InspectionView): InspectionViewLite {
  const lite = Object.fromEntries(SHEET_FIELDS.map((field) => [field, view[field]])) as Pick<
    InspectionView,
    (typeof SHEET_FIELDS)[number]
  >;
  // The record keeps a finding as text; the sheet offers the known ones.
  return { ...lite, condition: view.condition as InspectionViewLite['condition'] };
}
