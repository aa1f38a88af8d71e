import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { assemblies, inspectionPhotos, inspections, memberships, users } from '../../../db/schema';
import { findPreviousInspection, shapeComparison } from '../../charts/comparison';
import type { InspectionPageView } from '../../inspections/views';
import type { TeamAccess } from '../guard';
import { photoToView } from '../photos';
import { readPartViews } from '../register/part-views';
import { canChangeInspection } from './access';
import { readerUnitsOf, rowToInspectionView } from './inspections';
import { profileOfSet, readProfileBook, valuesForInspection } from './read-analyses';

/**
 * The inspection page in at most fourteen queries however many inspections its set has: the inspection
 * (one); then its set with run counts and place (five), the profile versions, its photos, its technician,
 * its assembly and the set's inspections' dates and runs (one each); then the previous inspection (one).
 * Every query filters by the team. Null for an unknown inspection or another team's.
 */
export async function readInspection(access: TeamAccess, inspectionId: string): Promise<InspectionPageView | null> {
  const teamId = access.team.id;
  const units = readerUnitsOf(access);
  const db = await getDb();
  const row = await db
    .select()
    .from(inspections)
    .where(and(eq(inspections.id, inspectionId), eq(inspections.teamId, teamId)))
    .get();
  if (!row) return null;
  const [register, book, photoRows, technician, assembly, siblings] = await Promise.all([
    readPartViews(teamId, { ids: [row.gearSetId] }),
    readProfileBook(teamId),
    db
      .select()
      .from(inspectionPhotos)
      .where(and(eq(inspectionPhotos.inspectionId, row.id), eq(inspectionPhotos.teamId, teamId)))
      .orderBy(asc(inspectionPhotos.createdAt), asc(inspectionPhotos.id)),
    row.technicianId
      ? db
          .select({ name: users.name })
          .from(memberships)
          .innerJoin(users, eq(users.id, memberships.userId))
          .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, row.technicianId)))
          .get()
      : undefined,
    row.assemblyId
      ? db
          .select({ serial: assemblies.serial, name: assemblies.name })
          .from(assemblies)
          .where(and(eq(assemblies.id, row.assemblyId), eq(assemblies.teamId, teamId)))
          .get()
      : undefined,
    // Only the columns the order needs: a set may have hundreds of inspections.
    db
      .select({
        id: inspections.id,
        status: inspections.status,
        runsAtInspection: inspections.runsAtInspection,
        inspectedAt: inspections.inspectedAt,
      })
      .from(inspections)
      .where(and(eq(inspections.teamId, teamId), eq(inspections.gearSetId, row.gearSetId))),
  ]);
  const gearSet = register.parts[0];
  const setRow = register.rows.get(row.gearSetId);
  if (!gearSet || !setRow) return null;
  const current = profileOfSet(book, setRow.toleranceProfileId);
  const profile = (row.profileVersionId && book.byVersion.get(row.profileVersionId)) || current;
  const view = rowToInspectionView(row, units, setRow, valuesForInspection(book, row, current));
  let change: InspectionPageView['change'] = null;
  if (view.summary.complete) {
    const ordered = siblings.map((s) => ({ ...s, inspectedAt: s.inspectedAt.toISOString() }));
    const previous = findPreviousInspection(ordered, row.id);
    const previousRow = previous
      ? await db
          .select()
          .from(inspections)
          .where(and(eq(inspections.id, previous.id), eq(inspections.teamId, teamId)))
          .get()
      : undefined;
    if (previousRow) {
      const before = rowToInspectionView(previousRow, units, setRow, valuesForInspection(book, previousRow, current));
      change = { previousId: previousRow.id, comparison: shapeComparison(before, view) };
    }
  }
  return {
    view,
    gearSet,
    profile,
    photos: photoRows.map(photoToView),
    technician: technician?.name ?? null,
    assembly: assembly ?? null,
    canEdit: canChangeInspection(access, row),
    change,
  };
}
