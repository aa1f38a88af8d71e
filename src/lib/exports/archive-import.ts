import { z } from 'zod';
import { profileCreateSchema } from '../inspections/profile-schema';
import { PART_STATUSES } from '../register/kinds';
import {
  assemblyCreateSchema,
  carCreateSchema,
  checkRunTime,
  partCreateSchema,
  runCreateSchema,
} from '../register/schemas';
import { photoFieldsSchema, type PhotoSide } from '../photos/upload-rules';
import { commentSchema } from '../reviews/schemas';
import { planInspection, planInstallations, planReview } from './archive-import-records';
import { remapJson } from './archive-json';
import {
  ARCHIVE_TABLES,
  idField,
  newIdOf,
  Planner,
  unique,
  withoutNulls,
  type ArchiveTable,
  type ImportContext,
  type ImportProblem,
  type Row,
} from './archive-planner';

/**
 * How a team archive's rows become rows of a new team, without a database: every row gets a new id,
 * every reference must point at a row of the same archive (or a person it lists), only the columns
 * named here are read, and each row passes the API's own schema for that kind of record. What comes
 * out is ready to insert; any problem is reported with its table, row and field.
 */

export { ARCHIVE_TABLES, type ArchiveTable, type ImportContext, type ImportProblem, type Row } from './archive-planner';

/** A photo to re-encode and store before its row is written. */
export interface PhotoToImport {
  row: { id: string; teamId: string; inspectionId: string; side: PhotoSide; createdBy: string | null; createdAt: Date };
  image: Uint8Array;
}

export interface ImportPlan {
  rows: Record<Exclude<ArchiveTable, 'inspectionPhotos'>, Row[]>;
  photos: PhotoToImport[];
  /** Photo rows that came without their bytes and so are not imported. */
  photosWithoutBytes: number;
}

/** A stored photo may be at most 15 MB, which is 20 MB as base64. */
const MAX_IMAGE_BASE64 = Math.ceil((15 * 1024 * 1024 * 4) / 3) + 4;

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
