import { and, eq } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { inspections, type Inspection } from '../../../db/schema';
import { roleCan } from '../../roles';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';

/** The inspection if it is the team's; 404 otherwise, whether it exists elsewhere or not. */
export async function requireTeamInspection(teamId: string, inspectionId: string): Promise<Inspection> {
  const db = await getDb();
  const row = await db
    .select()
    .from(inspections)
    .where(and(eq(inspections.id, inspectionId), eq(inspections.teamId, teamId)))
    .get();
  if (!row) throw new HttpError(404, 'No such inspection in this team.');
  return row;
}

/**
 * Whether this person may change this inspection: a crew chief or owner always (every change to a
 * submitted one is audited); a technician only their own draft.
 */
export function canChangeInspection(access: TeamAccess, inspection: Pick<Inspection, 'status' | 'createdBy'>): boolean {
  if (roleCan(access.team.role, 'inspections:edit-any')) return true;
  return (
    roleCan(access.team.role, 'inspections:record') &&
    inspection.status === 'draft' &&
    inspection.createdBy === access.user.id
  );
}

/** The inspection, when this person may change it; 403 says why not. */
export async function requireChangeableInspection(access: TeamAccess, inspectionId: string): Promise<Inspection> {
  const inspection = await requireTeamInspection(access.team.id, inspectionId);
  if (!canChangeInspection(access, inspection)) {
    const why =
      inspection.status === 'submitted'
        ? 'it is submitted; only a crew chief can change it now'
        : 'it is another person’s draft';
    throw new HttpError(403, `You cannot change this inspection: ${why}.`);
  }
  return inspection;
}

/** Photos may be added by whoever may change the inspection, and by its author after submission. */
export async function requirePhotoWriter(access: TeamAccess, inspectionId: string): Promise<Inspection> {
  const inspection = await requireTeamInspection(access.team.id, inspectionId);
  const author = inspection.createdBy === access.user.id && roleCan(access.team.role, 'inspections:record');
  if (!author && !canChangeInspection(access, inspection))
    throw new HttpError(403, 'You cannot add or remove photos on this inspection.');
  return inspection;
}
