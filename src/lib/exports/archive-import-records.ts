import { z } from 'zod';
import { dataToEntry, draftToData, type InspectionData } from '../inspections/record';
import { findMissingForSubmit, inspectionDraftSchema } from '../inspections/schemas';
import { PART_STATUSES } from '../register/kinds';
import { checkRunTime, installationSchema } from '../register/schemas';
import { decisionSchema } from '../reviews/schemas';
import { remapJson } from './archive-json';
import { newIdOf, withoutNulls, type Planner, type Row } from './archive-planner';

/** The archive's records with more than one rule each: installation events, inspections, reviews. */

/** Installation events in the archive's order (its `seq`), each a subject and a target of the archive. */
export function planInstallations(p: Planner, archived: Row[], out: Row[]): void {
  const planned: { order: number; index: number; row: Row }[] = [];
  archived.forEach((row, i) => {
    p.at('installationEvents', i);
    const subjectType = p.check(z.enum(['part', 'assembly']), row.subjectType, 'subjectType');
    const targetType = p.check(z.enum(['assembly', 'car']), row.targetType, 'targetType');
    if (subjectType === 'assembly' && targetType === 'assembly')
      return p.problem('targetType', 'an assembly goes into a car');
    const subjectId = subjectType && p.ref(subjectType === 'part' ? 'parts' : 'assemblies', 'subjectId', row.subjectId);
    const targetId = targetType && p.ref(targetType === 'car' ? 'cars' : 'assemblies', 'targetId', row.targetId);
    // The API's own schema, in the shape the API takes.
    const asRequest = {
      action: row.action,
      ...(subjectType === 'assembly' ? { assemblyId: 'subject' } : { partId: 'subject' }),
      ...(targetType === 'car' ? { carId: 'target' } : { assemblyId: 'target' }),
      at: row.at,
      ...withoutNulls(row, ['notes']),
    };
    const event = p.check(installationSchema, asRequest);
    const actorId = p.person('actorId', row.actorId);
    if (!event || !subjectId || !targetId || !event.at) {
      if (event && !event.at) p.problem('at', 'an ISO date-time is required here');
      return;
    }
    const ahead = checkRunTime(event.at, p.context.now);
    if (ahead) return p.problem('at', ahead.replace('The run', 'The event'));
    // The archive's order of events (seq) is kept; the numbers themselves are new.
    const order = typeof row.seq === 'number' && Number.isFinite(row.seq) ? row.seq : Number.MAX_SAFE_INTEGER;
    planned.push({
      order,
      index: i,
      row: {
        id: newIdOf(p, 'installationEvents', row),
        teamId: p.context.teamId,
        action: event.action,
        subjectType,
        subjectId,
        targetType,
        targetId,
        at: new Date(event.at),
        actorId,
        notes: event.notes ?? null,
        createdAt: p.date(row, 'createdAt') ?? p.context.now,
      },
    });
  });
  planned.sort((a, b) => a.order - b.order || a.index - b.index);
  out.push(...planned.map((entry) => entry.row));
}

/** An inspection: its stored record checked as the API checks a draft, then stored anew. */
export function planInspection(p: Planner, row: Row, gearSets: ReadonlySet<string>): Row | undefined {
  const gearSetId = p.ref('parts', 'gearSetId', row.gearSetId);
  if (gearSetId && !gearSets.has(gearSetId)) p.problem('gearSetId', 'refers to a part that is not a gear set');
  const assemblyId = p.ref('assemblies', 'assemblyId', row.assemblyId, true);
  const profileVersionId = p.ref('toleranceProfileVersions', 'profileVersionId', row.profileVersionId, true);
  const technicianId = p.person('technicianId', row.technicianId);
  const createdBy = p.person('createdBy', row.createdBy, false);
  const submittedBy = p.person('submittedBy', row.submittedBy);
  const status = p.check(z.enum(['draft', 'submitted']), row.status, 'status');
  const revision = p.check(z.number().int().min(1).max(100_000), row.revision ?? 1, 'revision');
  let entry: ReturnType<typeof dataToEntry> | undefined;
  try {
    entry = dataToEntry(row.data as InspectionData);
  } catch {
    p.problem('data', 'not an inspection record (entry, backlashMm, runoutMm, pinion, preload, …)');
  }
  if (!entry) return undefined;
  // The API's draft schema checks the measurements in the unit they were typed in.
  const draft = p.check(
    inspectionDraftSchema,
    {
      gearSetId: 'gear-set',
      inspectedAt: row.inspectedAt,
      runsAtInspection: row.runsAtInspection,
      ...entry,
    },
    'data',
  );
  if (draft && status === 'submitted')
    for (const missing of findMissingForSubmit(draft)) p.problem(`data.${missing.path.join('.')}`, missing.message);
  if (!draft || !status || revision === undefined || !gearSetId || !createdBy) return undefined;
  return {
    id: newIdOf(p, 'inspections', row),
    gearSetId,
    assemblyId,
    status,
    inspectedAt: new Date(draft.inspectedAt),
    runsAtInspection: draft.runsAtInspection,
    data: draftToData(draft),
    profileVersionId,
    technicianId,
    createdBy,
    submittedAt: p.date(row, 'submittedAt'),
    submittedBy,
    revision,
    createdAt: p.date(row, 'createdAt') ?? p.context.now,
    updatedAt: p.date(row, 'updatedAt') ?? p.context.now,
  };
}

const count = z.number().int().min(0).max(1_000_000).nullable();

/** A review: a decided one passes the decision schema; its snapshot is remapped and its photos rebuilt. */
export function planReview(
  p: Planner,
  row: Row,
  gearSets: ReadonlySet<string>,
  importedPhotos: ReadonlySet<string>,
): Row | undefined {
  const gearSetId = p.ref('parts', 'gearSetId', row.gearSetId);
  if (gearSetId && !gearSets.has(gearSetId)) p.problem('gearSetId', 'refers to a part that is not a gear set');
  const status = p.check(z.enum(['open', 'decided']), row.status, 'status');
  const statusBefore = p.check(z.enum(PART_STATUSES), row.statusBefore, 'statusBefore');
  const openedBy = p.person('openedBy', row.openedBy, false);
  const decidedBy = p.person('decidedBy', row.decidedBy);
  const numbers = p.check(z.object({ reinspectAtRuns: count, runsAtDecision: count }), {
    reinspectAtRuns: row.reinspectAtRuns ?? null,
    runsAtDecision: row.runsAtDecision ?? null,
  });
  const snapshot = p.check(z.record(z.string(), z.unknown(), { error: 'an object' }), row.snapshot, 'snapshot');
  let decision: z.infer<typeof decisionSchema> | undefined;
  if (status === 'decided')
    decision = p.check(decisionSchema, withoutNulls(row, ['decision', 'reason', 'notes', 'reinspectAfterRuns']));
  else if (status === 'open' && (row.decision ?? null) !== null)
    p.problem('decision', 'an open review has no decision yet');
  if (!gearSetId || !status || !statusBefore || !openedBy || !numbers || !snapshot) return undefined;
  if (status === 'decided' && !decision) return undefined;
  const mapped = remapJson(snapshot, p.allIds) as Record<string, unknown>;
  // A snapshot's photos are rebuilt from the photos imported with it: no address comes from the file.
  mapped.photos = (Array.isArray(mapped.photos) ? (mapped.photos as unknown[]) : []).flatMap((photo) => {
    const { id, side } = (photo ?? {}) as { id?: unknown; side?: unknown };
    if (typeof id !== 'string' || !importedPhotos.has(id)) return [];
    return [
      {
        id,
        side: side === 'coast' ? 'coast' : 'drive',
        url: `/api/photos/${id}`,
        thumbnailUrl: `/api/photos/${id}/thumbnail`,
      },
    ];
  });
  return {
    id: newIdOf(p, 'reviews', row),
    gearSetId,
    status,
    snapshot: mapped,
    openedBy,
    statusBefore,
    decision: decision?.decision ?? null,
    reason: decision?.reason ?? null,
    notes: decision?.notes ?? null,
    reinspectAfterRuns: decision?.reinspectAfterRuns ?? null,
    reinspectAtRuns: numbers.reinspectAtRuns,
    runsAtDecision: numbers.runsAtDecision,
    decidedBy,
    decidedAt: status === 'decided' ? (p.date(row, 'decidedAt', true) ?? p.context.now) : null,
    reminderQueuedAt: p.date(row, 'reminderQueuedAt'),
    createdAt: p.date(row, 'createdAt') ?? p.context.now,
  };
}
