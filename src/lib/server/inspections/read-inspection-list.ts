import { and, asc, eq, inArray, type SQL } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { inspections, parts } from '../../../db/schema';
import type { InspectionView } from '../../inspections/views';
import { toPage } from '../../paging';
import type { TeamAccess } from '../guard';
import { readerUnitsOf, rowToInspectionView } from './inspections';
import { profileOfSet, readProfileBook, valuesForInspection } from './read-analyses';

export interface InspectionListFilter {
  gearSetId?: string;
  status?: 'draft' | 'submitted';
}

/**
 * GET /api/inspections: one page of the team's inspections (or one set's), oldest first, filtered,
 * ordered and paged in SQL (the order is stored: inspected at, then created at, then id), in three queries
 * however many there are: the page (one row more than asked, to know whether another page follows), the
 * gear sets of its rows and the profile versions. Every query filters by the team.
 */
export async function readInspectionList(
  access: TeamAccess,
  filter: InspectionListFilter,
  page: { offset: number; limit: number },
): Promise<{ items: InspectionView[]; nextCursor: string | null }> {
  const teamId = access.team.id;
  const units = readerUnitsOf(access);
  const db = await getDb();
  const conditions: SQL[] = [eq(inspections.teamId, teamId)];
  if (filter.gearSetId) conditions.push(eq(inspections.gearSetId, filter.gearSetId));
  if (filter.status) conditions.push(eq(inspections.status, filter.status));
  const [rows, book] = await Promise.all([
    db
      .select()
      .from(inspections)
      .where(and(...conditions))
      .orderBy(asc(inspections.inspectedAt), asc(inspections.createdAt), asc(inspections.id))
      .limit(page.limit + 1)
      .offset(page.offset),
    readProfileBook(teamId),
  ]);
  const shown = toPage(rows, page.offset, page.limit);
  const setIds = [...new Set(shown.items.map((r) => r.gearSetId))];
  const sets = setIds.length
    ? await db
        .select()
        .from(parts)
        .where(and(eq(parts.teamId, teamId), inArray(parts.id, setIds)))
    : [];
  const setById = new Map(sets.map((s) => [s.id, s]));
  const items = shown.items.flatMap((row) => {
    const set = setById.get(row.gearSetId);
    if (!set) return [];
    const current = profileOfSet(book, set.toleranceProfileId);
    return [rowToInspectionView(row, units, set, valuesForInspection(book, row, current))];
  });
  return { items, nextCursor: shown.nextCursor };
}
