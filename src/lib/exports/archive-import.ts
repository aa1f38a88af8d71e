import { z } from 'zod';
import { profileCreateSchema } from '../inspections/profile-schema';
import { dataToEntry, draftToData, type InspectionData } from '../inspections/record';
import { findMissingForSubmit, inspectionDraftSchema } from '../inspections/schemas';
import { PART_STATUSES } from '../register/kinds';
import {
  assemblyCreateSchema,
  carCreateSchema,
  checkRunTime,
  installationSchema,
  partCreateSchema,
  runCreateSchema,
} from '../register/schemas';
import { photoFieldsSchema, type PhotoSide } from '../photos/upload-rules';
import { commentSchema, decisionSchema } from '../reviews/schemas';
import { zodIssuesToFields } from '../validation';
import { remapJson } from './archive-json';

/**
 * How a team archive's rows become rows of a new team, without a database: every row gets a new id,
 * every reference must point at a row of the same archive (or a person it lists), only the columns
 * named here are read, and each row passes the API's own schema for that kind of record. What comes
 * out is ready to insert; any problem is reported with its table, row and field.
 */

/** The tables of an archive, in the order they are written (each refers only to earlier ones). */
export const ARCHIVE_TABLES = [
  'cars',
  'assemblies',
  'toleranceProfileVersions',
  'parts',
  'installationEvents',
  'runs',
  'inspections',
  'inspectionPhotos',
  'reviews',
  'reviewComments',
  'auditEvents',
] as const;
export type ArchiveTable = (typeof ARCHIVE_TABLES)[number];

export interface ImportProblem {
  table: string;
  row: number;
  field: string;
  message: string;
}

export interface ImportContext {
  teamId: string;
  /** The importing Lashline's account for each person id the archive lists. */
  people: ReadonlyMap<string, string>;
  newId: () => string;
  now: Date;
}

/** A photo to re-encode and store before its row is written. */
export interface PhotoToImport {
  row: { id: string; teamId: string; inspectionId: string; side: PhotoSide; createdBy: string | null; createdAt: Date };
  image: Uint8Array;
}

export type Row = Record<string, unknown>;

export interface ImportPlan {
  rows: Record<Exclude<ArchiveTable, 'inspectionPhotos'>, Row[]>;
  photos: PhotoToImport[];
  /** Photo rows that came without their bytes and so are not imported. */
  photosWithoutBytes: number;
}

/** A stored photo may be at most 15 MB, which is 20 MB as base64. */
const MAX_IMAGE_BASE64 = Math.ceil((15 * 1024 * 1024 * 4) / 3) + 4;

const idField = z.string({ error: 'an id (text)' }).min(1, 'an id (text)').max(64, 'an id of at most 64 characters');
const dateField = z.iso.datetime({ offset: true, error: 'an ISO date-time, e.g. 2026-05-03T14:20:00Z' });

/** Fields whose null means "not given" to the API's schemas, which take them as optional. */
function withoutNulls(row: Row, keys: readonly string[]): Row {
  const copy: Row = {};
  for (const key of keys) if (row[key] !== null && row[key] !== undefined) copy[key] = row[key];
  return copy;
}

class Planner {
  readonly problems: ImportProblem[] = [];
  readonly ids = new Map<ArchiveTable, Map<string, string>>();
  readonly profileIds = new Map<string, string>();
  /** Every old id to its new one, for the free-form JSON of snapshots and audit entries. */
  readonly allIds = new Map<string, string>();
  private table: ArchiveTable = 'cars';
  private row = 0;

  constructor(readonly context: ImportContext) {
    for (const [from, to] of context.people) this.allIds.set(from, to);
  }

  at(table: ArchiveTable, row: number): this {
    this.table = table;
    this.row = row;
    return this;
  }

  problem(field: string, message: string): void {
    this.problems.push({ table: this.table, row: this.row, field, message });
  }

  /** The value parsed by `schema`, or undefined with each issue reported under `field`. */
  check<S extends z.ZodType>(schema: S, value: unknown, prefix = ''): z.infer<S> | undefined {
    const parsed = schema.safeParse(value);
    if (parsed.success) return parsed.data;
    for (const [field, message] of Object.entries(zodIssuesToFields(parsed.error)))
      this.problem([prefix, field].filter(Boolean).join('.'), message);
    return undefined;
  }

  date(row: Row, field: string, required = false): Date | null {
    const value = row[field];
    if (value === null || value === undefined) {
      if (required) this.problem(field, 'an ISO date-time is required here');
      return required ? this.context.now : null;
    }
    const text = this.check(dateField, value, field);
    return text ? new Date(text) : null;
  }

  /** The new id of the row of `table` that `value` names; anything else is reported. */
  ref(tables: ArchiveTable | ArchiveTable[], field: string, value: unknown, nullable = false): string | null {
    if ((value === null || value === undefined) && nullable) return null;
    const names = Array.isArray(tables) ? tables : [tables];
    for (const name of names) {
      const mapped = typeof value === 'string' ? this.ids.get(name)?.get(value) : undefined;
      if (mapped) return mapped;
    }
    this.problem(field, `refers to no row of ${names.join(' or ')} in this archive`);
    return null;
  }

  person(field: string, value: unknown, nullable = true): string | null {
    if ((value === null || value === undefined) && nullable) return null;
    const mapped = typeof value === 'string' ? this.context.people.get(value) : undefined;
    if (!mapped) this.problem(field, 'refers to no person in this archive’s people or formerPeople');
    return mapped ?? null;
  }

  /** Gives every row of every table a new id; a missing or repeated id is reported. */
  assignIds(archive: Record<ArchiveTable, Row[]>): void {
    for (const table of ARCHIVE_TABLES) {
      const map = new Map<string, string>();
      archive[table].forEach((row, index) => {
        this.at(table, index);
        const id = this.check(idField, row.id, 'id');
        if (id === undefined) return;
        if (map.has(id)) return this.problem('id', 'the same id is on an earlier row of this table');
        const fresh = this.context.newId();
        map.set(id, fresh);
        this.allIds.set(id, fresh);
      });
      this.ids.set(table, map);
    }
  }
}

function unique(planner: Planner, seen: Set<string>, key: string, field: string, what: string): void {
  if (seen.has(key)) planner.problem(field, `another row of this archive has the same ${what}`);
  seen.add(key);
}

const newIdOf = (planner: Planner, table: ArchiveTable, row: Row): string =>
  planner.ids.get(table)!.get(row.id as string) ?? '';

/**
 * The rows of a new team from an archive's tables, or the problems that stop the import.
 * @example planArchiveImport({ cars: [{ id: 'c1', name: 'Dragster' }], … }, context).rows.cars[0].id // a new id
 */
export function planArchiveImport(
  archive: Record<ArchiveTable, Row[]>,
  context: ImportContext,
): { ok: true; plan: ImportPlan } | { ok: false; problems: ImportProblem[] } {
  const p = new Planner(context);
  p.assignIds(archive);
  const teamId = context.teamId;
  const rows = Object.fromEntries(ARCHIVE_TABLES.map((t) => [t, [] as Row[]])) as ImportPlan['rows'];
  const photos: PhotoToImport[] = [];
  let photosWithoutBytes = 0;
  const seen = { cars: new Set<string>(), assemblies: new Set<string>(), parts: new Set<string>() };
  const profileVersions = new Set<string>();
  const gearSets = new Set<string>();

  archive.cars.forEach((row, i) => {
    p.at('cars', i);
    const car = p.check(carCreateSchema, withoutNulls(row, ['name', 'carClass', 'notes']));
    if (!car) return;
    unique(p, seen.cars, car.name, 'name', 'car name');
    rows.cars.push({
      id: newIdOf(p, 'cars', row),
      teamId,
      name: car.name,
      carClass: car.carClass ?? null,
      notes: car.notes ?? null,
      createdAt: p.date(row, 'createdAt') ?? context.now,
    });
  });

  archive.assemblies.forEach((row, i) => {
    p.at('assemblies', i);
    const assembly = p.check(assemblyCreateSchema, withoutNulls(row, ['serial', 'name', 'housing', 'notes']));
    if (!assembly) return;
    unique(p, seen.assemblies, assembly.serial, 'serial', 'assembly serial');
    rows.assemblies.push({
      id: newIdOf(p, 'assemblies', row),
      teamId,
      serial: assembly.serial,
      name: assembly.name,
      housing: assembly.housing ?? null,
      notes: assembly.notes ?? null,
      createdAt: p.date(row, 'createdAt') ?? context.now,
    });
  });

  archive.toleranceProfileVersions.forEach((row, i) => {
    p.at('toleranceProfileVersions', i);
    const profile = p.check(profileCreateSchema, { name: row.name, values: row.values });
    const profileId = p.check(idField, row.profileId, 'profileId');
    const version = p.check(z.number().int().min(1).max(100_000), row.version, 'version');
    if (!profile || !profileId || version === undefined) return;
    if (!p.profileIds.has(profileId)) p.profileIds.set(profileId, context.newId());
    p.allIds.set(profileId, p.profileIds.get(profileId)!);
    unique(p, profileVersions, `${profileId}|${version}`, 'version', 'profile and version');
    rows.toleranceProfileVersions.push({
      id: newIdOf(p, 'toleranceProfileVersions', row),
      teamId,
      profileId: p.profileIds.get(profileId),
      version,
      name: profile.name,
      values: profile.values,
      createdBy: p.person('createdBy', row.createdBy),
      createdAt: p.date(row, 'createdAt') ?? context.now,
    });
  });

  const partColumns = ['kind', 'serial', 'status', 'lifeLimitRuns', 'maker', 'model', 'material', 'notes'];
  const gearColumns = ['ringTeeth', 'pinionTeeth', 'pressureAngleDeg'];
  archive.parts.forEach((row, i) => {
    p.at('parts', i);
    const part = p.check(partCreateSchema, withoutNulls(row, [...partColumns, ...gearColumns]));
    const status = p.check(z.enum(PART_STATUSES), row.status ?? 'spare', 'status');
    let toleranceProfileId: string | null = null;
    if (row.toleranceProfileId !== null && row.toleranceProfileId !== undefined) {
      toleranceProfileId =
        typeof row.toleranceProfileId === 'string' ? (p.profileIds.get(row.toleranceProfileId) ?? null) : null;
      if (!toleranceProfileId) p.problem('toleranceProfileId', 'refers to no tolerance profile in this archive');
    }
    if (!part || !status) return;
    unique(p, seen.parts, `${part.kind}|${part.serial}`, 'serial', 'kind and serial');
    if (part.kind === 'gear-set') gearSets.add(newIdOf(p, 'parts', row));
    rows.parts.push({
      id: newIdOf(p, 'parts', row),
      teamId,
      kind: part.kind,
      serial: part.serial,
      status,
      lifeLimitRuns: part.lifeLimitRuns ?? null,
      maker: part.maker ?? null,
      model: part.model ?? null,
      material: part.material ?? null,
      notes: part.notes ?? null,
      ringTeeth: part.ringTeeth ?? null,
      pinionTeeth: part.pinionTeeth ?? null,
      pressureAngleDeg: part.pressureAngleDeg ?? null,
      toleranceProfileId,
      createdAt: p.date(row, 'createdAt') ?? context.now,
    });
  });

  planInstallations(p, archive.installationEvents, rows.installationEvents);

  archive.runs.forEach((row, i) => {
    p.at('runs', i);
    const runColumns = ['carId', 'at', 'event', 'round', 'lane', 'notes', 'elapsedSeconds', 'speedMph'];
    const run = p.check(runCreateSchema, withoutNulls(row, runColumns));
    const carId = p.ref('cars', 'carId', row.carId);
    const recordedBy = p.person('recordedBy', row.recordedBy);
    if (!run || !carId) return;
    const ahead = checkRunTime(run.at, context.now);
    if (ahead) return p.problem('at', ahead);
    rows.runs.push({
      id: newIdOf(p, 'runs', row),
      teamId,
      carId,
      at: new Date(run.at),
      event: run.event ?? null,
      round: run.round ?? null,
      lane: run.lane ?? null,
      notes: run.notes ?? null,
      elapsedSeconds: run.elapsedSeconds ?? null,
      speedMph: run.speedMph ?? null,
      recordedBy,
      createdAt: p.date(row, 'createdAt') ?? context.now,
    });
  });

  archive.inspections.forEach((row, i) => {
    p.at('inspections', i);
    const inspection = planInspection(p, row, gearSets);
    if (inspection) rows.inspections.push({ ...inspection, teamId });
  });

  archive.inspectionPhotos.forEach((row, i) => {
    p.at('inspectionPhotos', i);
    const inspectionId = p.ref('inspections', 'inspectionId', row.inspectionId);
    const side = p.check(photoFieldsSchema, { side: row.side });
    const createdBy = p.person('createdBy', row.createdBy);
    const createdAt = p.date(row, 'createdAt') ?? context.now;
    if (row.image === undefined || row.image === null) {
      photosWithoutBytes += 1;
      return;
    }
    const image = p.check(
      z
        .string({ error: 'the photo’s bytes as base64 text' })
        .max(MAX_IMAGE_BASE64, 'a photo may be at most 15 MB')
        .regex(/^[A-Za-z0-9+/]*={0,2}$/, 'the photo’s bytes as base64 text'),
      row.image,
      'image',
    );
    if (!inspectionId || !side || image === undefined) return;
    photos.push({
      row: { id: newIdOf(p, 'inspectionPhotos', row), teamId, inspectionId, side: side.side, createdBy, createdAt },
      image: Buffer.from(image, 'base64'),
    });
  });
  // Only the photos that are imported keep an address in snapshots.
  const importedPhotos = new Set(photos.map((photo) => photo.row.id));
  for (const [old, fresh] of p.ids.get('inspectionPhotos')!) if (!importedPhotos.has(fresh)) p.allIds.delete(old);

  archive.reviews.forEach((row, i) => {
    p.at('reviews', i);
    const review = planReview(p, row, gearSets, importedPhotos);
    if (review) rows.reviews.push({ ...review, teamId });
  });

  archive.reviewComments.forEach((row, i) => {
    p.at('reviewComments', i);
    const comment = p.check(commentSchema, { body: row.body });
    const reviewId = p.ref('reviews', 'reviewId', row.reviewId);
    const authorId = p.person('authorId', row.authorId, false);
    const mentions = p.check(z.array(idField).max(100), row.mentions ?? [], 'mentions');
    const mapped = (mentions ?? []).map((id, n) => p.person(`mentions.${n}`, id, false));
    if (!comment || !reviewId || !authorId || mapped.includes(null)) return;
    rows.reviewComments.push({
      id: newIdOf(p, 'reviewComments', row),
      teamId,
      reviewId,
      authorId,
      body: comment.body,
      mentions: mapped,
      createdAt: p.date(row, 'createdAt') ?? context.now,
    });
  });

  const text = z.string({ error: 'text' }).trim().min(1, 'text').max(60, 'at most 60 characters');
  // A record that is no longer in the archive (deleted before the export) keeps its entries together
  // under one new id, which names nothing.
  const gone = new Map<string, string>();
  archive.auditEvents.forEach((row, i) => {
    p.at('auditEvents', i);
    const action = p.check(text, row.action, 'action');
    const recordType = p.check(text, row.recordType, 'recordType');
    const recordId = p.check(idField, row.recordId, 'recordId');
    const actorId = p.person('actorId', row.actorId);
    if (!action || !recordType || !recordId) return;
    if (!p.allIds.has(recordId) && !gone.has(recordId)) gone.set(recordId, context.newId());
    rows.auditEvents.push({
      id: newIdOf(p, 'auditEvents', row),
      teamId,
      actorId,
      action,
      recordType,
      recordId: p.allIds.get(recordId) ?? gone.get(recordId),
      before: remapJson(row.before ?? null, p.allIds),
      after: remapJson(row.after ?? null, p.allIds),
      at: p.date(row, 'at') ?? context.now,
    });
  });

  if (p.problems.length) return { ok: false, problems: p.problems };
  return { ok: true, plan: { rows, photos, photosWithoutBytes } };
}

function planInstallations(p: Planner, archived: Row[], out: Row[]): void {
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

function planInspection(p: Planner, row: Row, gearSets: ReadonlySet<string>): Row | undefined {
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

function planReview(
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
