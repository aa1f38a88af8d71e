import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { installationEvents, parts, reviews } from '../../../db/schema';
import { historyToCsv, type HistoryRow } from '../../exports/history-csv';
import { inspectionToCsv } from '../../exports/inspection-csv';
import { summariseRetirements, type RetirementSummary } from '../../exports/retirements';
import { HttpError } from '../http';
import { requireTeamInspection } from '../inspections/access';
import { listInspectionRows } from '../inspections/inspections';
import { describeTarget } from '../register/locations';
import { getPart } from '../register/parts';
import { summariseBacklash } from '../../analysis/backlash';

/** One inspection as CSV (one row per reading). */
export async function exportInspectionCsv(
  teamId: string,
  inspectionId: string,
): Promise<{ filename: string; csv: string }> {
  const row = await requireTeamInspection(teamId, inspectionId);
  const set = await getPart(teamId, row.gearSetId);
  const csv = inspectionToCsv({
    id: row.id,
    gearSetSerial: set.serial,
    inspectedAt: row.inspectedAt.toISOString(),
    runsAtInspection: row.runsAtInspection,
    status: row.status,
    data: row.data,
  });
  return { filename: `lashline-inspection-${set.serial}-${row.inspectedAt.toISOString().slice(0, 10)}.csv`, csv };
}

/** A gear set's whole history — installs, removals, inspections, reviews — as CSV in mm and N·m. */
export async function exportGearSetHistoryCsv(
  teamId: string,
  gearSetId: string,
): Promise<{ filename: string; csv: string }> {
  const set = await getPart(teamId, gearSetId);
  if (set.kind !== 'gear-set') throw new HttpError(404, 'No such gear set in this team.');
  const db = await getDb();
  const rows: HistoryRow[] = [];
  const events = await db
    .select()
    .from(installationEvents)
    .where(
      and(
        eq(installationEvents.teamId, teamId),
        eq(installationEvents.subjectType, 'part'),
        eq(installationEvents.subjectId, gearSetId),
      ),
    )
    .orderBy(asc(installationEvents.seq));
  for (const event of events) {
    rows.push({
      at: event.at.toISOString(),
      record: event.action === 'install' ? 'installed' : 'removed',
      place: await describeTarget(db, event.targetType, event.targetId, teamId),
      notes: event.notes,
      link_id: event.id,
    });
  }
  for (const inspection of await listInspectionRows(teamId, gearSetId)) {
    const data = inspection.data;
    const complete = data.backlashMm.every((r) => r !== null) && data.backlashMm.length >= 3;
    const summary = complete ? summariseBacklash(data.backlashMm as number[]) : null;
    rows.push({
      at: inspection.inspectedAt.toISOString(),
      record: 'inspection',
      runs_at: inspection.runsAtInspection,
      mean_backlash_mm: summary ? Number(summary.mean.toFixed(6)) : null,
      spread_mm: summary ? Number(summary.spread.toFixed(6)) : null,
      runout_tir_mm: data.runoutMm.backFace,
      pinion_preload_nm: data.preload.pinionNm === null ? null : Number(data.preload.pinionNm.toFixed(4)),
      notes: [inspection.status === 'draft' ? 'draft' : '', data.notes ?? ''].filter(Boolean).join(' — ') || null,
      link_id: inspection.id,
    });
  }
  const reviewRows = await db
    .select()
    .from(reviews)
    .where(and(eq(reviews.teamId, teamId), eq(reviews.gearSetId, gearSetId)));
  for (const review of reviewRows) {
    rows.push({ at: review.createdAt.toISOString(), record: 'review-opened', link_id: review.id });
    if (review.decidedAt)
      rows.push({
        at: review.decidedAt.toISOString(),
        record: 'decision',
        runs_at: review.runsAtDecision,
        decision: review.decision,
        reason: review.reason,
        notes: review.notes,
        link_id: review.id,
      });
  }
  return { filename: `lashline-gear-set-${set.serial}.csv`, csv: historyToCsv(rows) };
}

/** Retired sets decided in [from, to), their runs against their limits, and the share retired early. */
export async function summariseTeamRetirements(teamId: string, from: string, to: string): Promise<RetirementSummary> {
  const db = await getDb();
  const rows = await db
    .select({ review: reviews, serial: parts.serial, lifeLimitRuns: parts.lifeLimitRuns })
    .from(reviews)
    .innerJoin(parts, and(eq(parts.id, reviews.gearSetId), eq(parts.teamId, teamId)))
    .where(and(eq(reviews.teamId, teamId), eq(reviews.decision, 'retire')));
  return summariseRetirements(
    rows.map(({ review, serial, lifeLimitRuns }) => ({
      gearSetId: review.gearSetId,
      serial,
      retiredAt: review.decidedAt!.toISOString(),
      runsAtRetirement: review.runsAtDecision ?? 0,
      lifeLimitRuns,
      reason: review.reason ?? '',
      notes: review.notes,
    })),
    from,
    to,
  );
}
