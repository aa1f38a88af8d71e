import { PART_STATUS_LABELS } from '../../lib/register/kinds';
import { roleCan } from '../../lib/roles';
import type { TeamAccess } from '../../lib/server/guard';
import type { InspectionView } from '../../lib/server/inspections/inspections';
import { listAssemblies } from '../../lib/server/register/assemblies';
import { listParts } from '../../lib/server/register/parts';
import { readTeamSettings } from '../../lib/server/register/team-settings';
import { listMembers } from '../../lib/server/teams';
import type { InspectionViewLite } from './inspection-api';
import type { SheetProps } from './sheet-context';

/**
 * The island's props: only team-wide lists and the person, never anything from the query string,
 * so the one cached copy of the page serves every ?gearSetId and ?draft offline.
 */
export async function loadSheetProps(
  access: TeamAccess,
  mode: SheetProps['mode'],
  inspection?: InspectionView,
): Promise<SheetProps> {
  const teamId = access.team.id;
  const [sets, assemblies, members, settings] = await Promise.all([
    listParts(teamId, 'gear-set'),
    listAssemblies(teamId),
    listMembers(teamId),
    readTeamSettings(teamId),
  ]);
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

/** Only what the sheet reads of an inspection (not the canonical copy or the summary). */
function viewToLite(view: InspectionView): InspectionViewLite {
  const {
    id,
    status,
    createdBy,
    revision,
    gearSetId,
    assemblyId,
    inspectedAt,
    runsAtInspection,
    runsChangeReason,
    technicianId,
    unit,
    resolution,
    torqueUnit,
    readings,
    runout,
    pinion,
    carrierShims,
    preload,
    patterns,
    condition,
    notes,
  } = view;
  // The record keeps a finding as text; the sheet offers the known ones.
  return {
    id,
    status,
    createdBy,
    revision,
    gearSetId,
    assemblyId,
    inspectedAt,
    runsAtInspection,
    runsChangeReason,
    technicianId,
    unit,
    resolution,
    torqueUnit,
    readings,
    runout,
    pinion,
    carrierShims,
    preload,
    patterns,
    condition: condition as InspectionViewLite['condition'],
    notes,
  };
}
