import { sql } from 'drizzle-orm';
import { index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';

import type { ToleranceProfile } from '../lib/analysis/tolerance';
import type { InspectionData } from '../lib/inspections/record';
import type { NoticeKind } from '../lib/notices/compose';
import type { AppliedTorque, ProcedureSection } from '../lib/procedures/model';
import { CHECKLIST_STATUSES } from '../lib/procedures/checklist-rules';
import type { TeamSettings } from '../lib/register/team-settings';
import { ROLES } from '../lib/roles';
import { PART_KINDS, PART_STATUSES } from '../lib/register/kinds';

const createdAt = () =>
  integer('created_at', { mode: 'timestamp_ms' })
    .notNull()
    .default(sql`(unixepoch('subsec') * 1000)`);

export const users = sqliteTable('users', {
  id: text('id').primaryKey(),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  lengthUnit: text('length_unit', { enum: ['in', 'mm'] })
    .notNull()
    .default('in'),
  torqueUnit: text('torque_unit', { enum: ['lbf-in', 'N-m'] })
    .notNull()
    .default('lbf-in'),
  currentTeamId: text('current_team_id'),
  // Bumped whenever every other session of this person must end (password change, sign-out everywhere).
  sessionVersion: integer('session_version').notNull().default(1),
  // Second factor (TOTP): the secret encrypted with a key derived from the session secret; recovery
  // codes live in `recovery_codes`. A pending secret waits for its first code before it counts.
  totpSecret: text('totp_secret'),
  totpPendingSecret: text('totp_pending_secret'),
  totpEnabledAt: integer('totp_enabled_at', { mode: 'timestamp_ms' }),
  // The last 30-second time step whose code was accepted: each step's code is taken once (ASVS 6.5.1).
  totpLastStep: integer('totp_last_step'),
  // When the person proved they read mail at this address (a verification, reset or invitation link);
  // null until then: such an account accepts no invitation, claims no imported account, gets no notices.
  emailVerifiedAt: integer('email_verified_at', { mode: 'timestamp_ms' }),
  createdAt: createdAt(),
});

export const teams = sqliteTable('teams', {
  id: text('id').primaryKey(),
  name: text('name').notNull(),
  /** Owners and crew chiefs of this team must use a second factor (set by an owner). */
  requireSecondFactor: integer('require_second_factor', { mode: 'boolean' }).notNull().default(false),
  createdAt: createdAt(),
});

export const memberships = sqliteTable(
  'memberships',
  {
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: text('role', { enum: ROLES }).notNull(),
    createdAt: createdAt(),
  },
  (table) => [primaryKey({ columns: [table.teamId, table.userId] }), index('memberships_user_idx').on(table.userId)],
);

export const invitations = sqliteTable(
  'invitations',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: text('role', { enum: ROLES }).notNull(),
    // Only the SHA-256 of the link's token is kept: a copy of the database cannot accept invitations.
    tokenHash: text('token_hash').notNull(),
    invitedBy: text('invited_by')
      .notNull()
      .references(() => users.id),
    expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
    acceptedAt: integer('accepted_at', { mode: 'timestamp_ms' }),
    acceptedBy: text('accepted_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (table) => [uniqueIndex('invitations_token_idx').on(table.tokenHash), index('invitations_team_idx').on(table.teamId)],
);

/** Every message leaves through this table, so a mail server that is down loses nothing. */
export const outbox = sqliteTable(
  'outbox',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id').references(() => teams.id, { onDelete: 'set null' }),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    textBody: text('text_body').notNull(),
    status: text('status', { enum: ['queued', 'sent', 'failed'] })
      .notNull()
      .default('queued'),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: integer('next_attempt_at', { mode: 'timestamp_ms' }).notNull(),
    lastError: text('last_error'),
    sentAt: integer('sent_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
  },
  (table) => [index('outbox_due_idx').on(table.status, table.nextAttemptAt)],
);

/** Who changed what and when; rows are only ever added. */
export const auditEvents = sqliteTable(
  'audit_events',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id').references(() => teams.id, { onDelete: 'cascade' }),
    actorId: text('actor_id').references(() => users.id),
    action: text('action').notNull(),
    recordType: text('record_type').notNull(),
    recordId: text('record_id').notNull(),
    before: text('before', { mode: 'json' }).$type<unknown>(),
    after: text('after', { mode: 'json' }).$type<unknown>(),
    at: createdAt(),
  },
  (table) => [index('audit_team_record_idx').on(table.teamId, table.recordType, table.recordId)],
);

export type User = typeof users.$inferSelect;
export type Team = typeof teams.$inferSelect;
export type Membership = typeof memberships.$inferSelect;

// ---------------------------------------------------------------------------------------------
// The parts register and the run log

/** Team-wide settings; absent keys fall back to the defaults in src/lib/register/team-settings.ts. */
export const teamSettings = sqliteTable('team_settings', {
  teamId: text('team_id')
    .primaryKey()
    .references(() => teams.id, { onDelete: 'cascade' }),
  values: text('values', { mode: 'json' }).$type<Partial<TeamSettings>>().notNull(),
  updatedAt: createdAt(),
});

export const cars = sqliteTable(
  'cars',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    carClass: text('car_class'),
    notes: text('notes'),
    createdAt: createdAt(),
  },
  (table) => [uniqueIndex('cars_team_name_idx').on(table.teamId, table.name)],
);

export const assemblies = sqliteTable(
  'assemblies',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    serial: text('serial').notNull(),
    name: text('name').notNull(),
    housing: text('housing'),
    notes: text('notes'),
    createdAt: createdAt(),
  },
  (table) => [uniqueIndex('assemblies_team_serial_idx').on(table.teamId, table.serial)],
);

export const parts = sqliteTable(
  'parts',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    kind: text('kind', { enum: PART_KINDS }).notNull(),
    serial: text('serial').notNull(),
    status: text('status', { enum: PART_STATUSES }).notNull().default('spare'),
    // Null when neither the part nor the team's default for its kind sets a limit.
    lifeLimitRuns: integer('life_limit_runs'),
    maker: text('maker'),
    model: text('model'),
    material: text('material'),
    notes: text('notes'),
    // Gear sets only.
    ringTeeth: integer('ring_teeth'),
    pinionTeeth: integer('pinion_teeth'),
    pressureAngleDeg: real('pressure_angle_deg'),
    // The tolerance profile the set is judged by; null means the team's default profile.
    toleranceProfileId: text('tolerance_profile_id'),
    // Gear sets only: how the teeth were cut, which decides the contact-pattern guidance (face-hobbed sets get the
    // gear maker's chart, not the toe/heel rule), and the runout factor k as a spiral angle or a typed k (null:
    // k from the tooth counts and pressure angle alone).
    cutMethod: text('cut_method', { enum: ['face-milled', 'face-hobbed', 'unknown'] })
      .notNull()
      .default('unknown'),
    spiralAngleDeg: real('spiral_angle_deg'),
    runoutK: real('runout_k'),
    createdAt: createdAt(),
  },
  (table) => [
    uniqueIndex('parts_team_kind_serial_idx').on(table.teamId, table.kind, table.serial),
    index('parts_team_status_idx').on(table.teamId, table.status),
  ],
);

/**
 * The installation history, append-only: a part goes into an assembly (or straight into a car) and
 * an assembly goes into a car; each install is ended by a later remove of the same subject. `seq`
 * orders events that share a timestamp.
 */
export const installationEvents = sqliteTable(
  'installation_events',
  {
    seq: integer('seq').primaryKey({ autoIncrement: true }),
    id: text('id').notNull().unique(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    action: text('action', { enum: ['install', 'remove'] }).notNull(),
    subjectType: text('subject_type', { enum: ['part', 'assembly'] }).notNull(),
    subjectId: text('subject_id').notNull(),
    targetType: text('target_type', { enum: ['assembly', 'car'] }).notNull(),
    targetId: text('target_id').notNull(),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
    actorId: text('actor_id').references(() => users.id),
    notes: text('notes'),
    createdAt: createdAt(),
  },
  (table) => [
    index('installation_subject_idx').on(table.subjectType, table.subjectId, table.seq),
    index('installation_target_idx').on(table.targetType, table.targetId, table.at),
    index('installation_team_idx').on(table.teamId, table.at),
  ],
);

export const runs = sqliteTable(
  'runs',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    carId: text('car_id')
      .notNull()
      .references(() => cars.id),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
    event: text('event'),
    round: text('round'),
    lane: text('lane'),
    notes: text('notes'),
    elapsedSeconds: real('elapsed_seconds'),
    speedMph: real('speed_mph'),
    recordedBy: text('recorded_by').references(() => users.id),
    // A retried "log run" over a poor connection carries the same key and is stored once.
    idempotencyKey: text('idempotency_key'),
    createdAt: createdAt(),
  },
  (table) => [
    index('runs_car_at_idx').on(table.carId, table.at),
    index('runs_team_at_idx').on(table.teamId, table.at),
    uniqueIndex('runs_idempotency_idx').on(table.teamId, table.idempotencyKey),
  ],
);

export type Car = typeof cars.$inferSelect;
export type Assembly = typeof assemblies.$inferSelect;
export type Part = typeof parts.$inferSelect;
export type InstallationEvent = typeof installationEvents.$inferSelect;
export type Run = typeof runs.$inferSelect;

// ---------------------------------------------------------------------------------------------
// Tolerance profiles and inspections

/**
 * Tolerance profiles, versioned: editing a profile adds a version, and an inspection keeps the
 * version it was judged by. `values` is a ToleranceProfile in canonical units (mm, N·m).
 */
export const toleranceProfileVersions = sqliteTable(
  'tolerance_profile_versions',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    profileId: text('profile_id').notNull(),
    version: integer('version').notNull(),
    name: text('name').notNull(),
    values: text('values', { mode: 'json' }).$type<ToleranceProfile>().notNull(),
    createdBy: text('created_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (table) => [
    uniqueIndex('profile_version_idx').on(table.profileId, table.version),
    index('profile_team_idx').on(table.teamId),
  ],
);

export const INSPECTION_STATUSES = ['draft', 'submitted'] as const;

/**
 * One teardown inspection of a gear set. `data` holds every measurement in canonical units (mm,
 * N·m) with the entry unit and the resolution beside it (src/lib/inspections/record.ts).
 */
export const inspections = sqliteTable(
  'inspections',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    gearSetId: text('gear_set_id')
      .notNull()
      .references(() => parts.id),
    assemblyId: text('assembly_id').references(() => assemblies.id),
    status: text('status', { enum: INSPECTION_STATUSES }).notNull().default('draft'),
    inspectedAt: integer('inspected_at', { mode: 'timestamp_ms' }).notNull(),
    runsAtInspection: integer('runs_at_inspection').notNull(),
    data: text('data', { mode: 'json' }).$type<InspectionData>().notNull(),
    profileVersionId: text('profile_version_id').references(() => toleranceProfileVersions.id),
    technicianId: text('technician_id').references(() => users.id),
    createdBy: text('created_by')
      .notNull()
      .references(() => users.id),
    idempotencyKey: text('idempotency_key'),
    submittedAt: integer('submitted_at', { mode: 'timestamp_ms' }),
    submittedBy: text('submitted_by').references(() => users.id),
    revision: integer('revision').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (table) => [
    index('inspections_gear_set_idx').on(table.gearSetId, table.inspectedAt),
    index('inspections_team_idx').on(table.teamId, table.inspectedAt),
    uniqueIndex('inspections_idempotency_idx').on(table.teamId, table.idempotencyKey),
  ],
);

export const inspectionPhotos = sqliteTable(
  'inspection_photos',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    inspectionId: text('inspection_id')
      .notNull()
      .references(() => inspections.id, { onDelete: 'cascade' }),
    side: text('side', { enum: ['drive', 'coast'] }).notNull(),
    storageKey: text('storage_key').notNull(),
    thumbnailKey: text('thumbnail_key').notNull(),
    contentType: text('content_type').notNull(),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    bytes: integer('bytes').notNull(),
    createdBy: text('created_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (table) => [index('photos_inspection_idx').on(table.inspectionId)],
);

export type ToleranceProfileVersion = typeof toleranceProfileVersions.$inferSelect;
export type Inspection = typeof inspections.$inferSelect;
export type InspectionPhoto = typeof inspectionPhotos.$inferSelect;

// ---------------------------------------------------------------------------------------------
// Reviews, decisions and notices

export const REVIEW_DECISIONS = ['keep', 'reshim', 'retire'] as const;

/**
 * A review of a gear set. `snapshot` freezes the evidence when the review opens (analysis,
 * verdicts, trend, recommendation, photos), so the decision reads later exactly as it was made.
 */
export const reviews = sqliteTable(
  'reviews',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    gearSetId: text('gear_set_id')
      .notNull()
      .references(() => parts.id),
    status: text('status', { enum: ['open', 'decided'] })
      .notNull()
      .default('open'),
    snapshot: text('snapshot', { mode: 'json' }).notNull(),
    openedBy: text('opened_by')
      .notNull()
      .references(() => users.id),
    statusBefore: text('status_before', { enum: PART_STATUSES }).notNull(),
    decision: text('decision', { enum: REVIEW_DECISIONS }),
    reason: text('reason'),
    notes: text('notes'),
    reinspectAfterRuns: integer('reinspect_after_runs'),
    /** The set's total runs at which the re-inspection falls due. */
    reinspectAtRuns: integer('reinspect_at_runs'),
    runsAtDecision: integer('runs_at_decision'),
    decidedBy: text('decided_by').references(() => users.id),
    decidedAt: integer('decided_at', { mode: 'timestamp_ms' }),
    reminderQueuedAt: integer('reminder_queued_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
  },
  (table) => [
    index('reviews_team_idx').on(table.teamId, table.status),
    index('reviews_gear_set_idx').on(table.gearSetId),
  ],
);

export const reviewComments = sqliteTable(
  'review_comments',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    reviewId: text('review_id')
      .notNull()
      .references(() => reviews.id, { onDelete: 'cascade' }),
    authorId: text('author_id')
      .notNull()
      .references(() => users.id),
    body: text('body').notNull(),
    mentions: text('mentions', { mode: 'json' }).$type<string[]>().notNull(),
    createdAt: createdAt(),
  },
  (table) => [index('review_comments_review_idx').on(table.reviewId)],
);

export const NOTICE_KINDS = [
  'review-opened',
  'decision-made',
  'mention',
  'near-limit',
  'life-reached',
  'reinspect-due',
] as const;

/** Which notices a person wants from a team; a missing row means all of them. */
export const noticePreferences = sqliteTable(
  'notice_preferences',
  {
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    muted: text('muted', { mode: 'json' }).$type<NoticeKind[]>().notNull(),
    updatedAt: createdAt(),
  },
  (table) => [primaryKey({ columns: [table.userId, table.teamId] })],
);

/** Thresholds already announced for a part, so each one is announced once, not once per later run. */
export const partNotices = sqliteTable(
  'part_notices',
  {
    partId: text('part_id')
      .notNull()
      .references(() => parts.id, { onDelete: 'cascade' }),
    threshold: text('threshold').notNull(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
  },
  (table) => [primaryKey({ columns: [table.partId, table.threshold] })],
);

export type Review = typeof reviews.$inferSelect;
export type ReviewComment = typeof reviewComments.$inferSelect;

// ---------------------------------------------------------------------------------------------
// Sign-in: sessions, recovery codes and attempt limits (shared by every process on the database)

/** One signed-in device: its id rides in the session cookie; sign-out deletes the row. */
export const sessions = sqliteTable(
  'sessions',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
    // Moved on at most once a minute by the requests of the session; the idle timeout counts from it.
    lastSeenAt: integer('last_seen_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (table) => [index('sessions_user_idx').on(table.userId)],
);

/** Single-use recovery codes, kept as HMAC-SHA-256 under a server key; `used_at` set by one conditional update. */
export const recoveryCodes = sqliteTable(
  'recovery_codes',
  {
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    codeHash: text('code_hash').notNull(),
    usedAt: integer('used_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
  },
  (table) => [primaryKey({ columns: [table.userId, table.codeHash] })],
);

/** Attempts counted against a limit (sign-in per account and per address, codes, password re-entry, resets). */
export const limitAttempts = sqliteTable(
  'limit_attempts',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    kind: text('kind').notNull(),
    key: text('key').notNull(),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
  },
  (table) => [
    index('limit_attempts_key_idx').on(table.kind, table.key, table.at),
    index('limit_attempts_at_idx').on(table.at),
  ],
);

// ---------------------------------------------------------------------------------------------
// Proof of an address and the way back from a forgotten password

export const EMAIL_TOKEN_PURPOSES = ['verify-email', 'reset-password'] as const;

/** Single-use links mailed to a person: only the SHA-256 of the token is kept. */
export const emailTokens = sqliteTable(
  'email_tokens',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    purpose: text('purpose', { enum: EMAIL_TOKEN_PURPOSES }).notNull(),
    tokenHash: text('token_hash').notNull(),
    expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
    usedAt: integer('used_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
  },
  (table) => [
    uniqueIndex('email_tokens_hash_idx').on(table.tokenHash),
    index('email_tokens_user_idx').on(table.userId),
  ],
);

// ---------------------------------------------------------------------------------------------
// Procedures and checklists (issue 18)

/** A team's procedure; its content lives in versions, and `currentVersion` is the one new checklists follow. */
export const procedures = sqliteTable(
  'procedures',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    currentVersion: integer('current_version').notNull().default(1),
    archivedAt: integer('archived_at', { mode: 'timestamp_ms' }),
    /** Set on the demo's procedures, whose torque figures are invented and shown as examples. */
    example: integer('example', { mode: 'boolean' }).notNull().default(false),
    createdBy: text('created_by').references(() => users.id),
    createdAt: createdAt(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (table) => [index('procedures_team_idx').on(table.teamId)],
);

/** One version of a procedure, never changed once written; `sections` holds its sections and steps. */
export const procedureVersions = sqliteTable(
  'procedure_versions',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    procedureId: text('procedure_id')
      .notNull()
      .references(() => procedures.id, { onDelete: 'cascade' }),
    version: integer('version').notNull(),
    name: text('name').notNull(),
    purpose: text('purpose'),
    appliesTo: text('applies_to'),
    notes: text('notes'),
    sections: text('sections', { mode: 'json' }).$type<ProcedureSection[]>().notNull(),
    createdBy: text('created_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (table) => [uniqueIndex('procedure_version_idx').on(table.procedureId, table.version)],
);

/** A checklist at a rebuild: the procedure version it follows, on an assembly or a gear set (or both). */
export const checklists = sqliteTable(
  'checklists',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    procedureId: text('procedure_id')
      .notNull()
      .references(() => procedures.id),
    procedureVersionId: text('procedure_version_id')
      .notNull()
      .references(() => procedureVersions.id),
    // A deleted assembly or part leaves its checklists in place, unlinked.
    assemblyId: text('assembly_id').references(() => assemblies.id, { onDelete: 'set null' }),
    gearSetId: text('gear_set_id').references(() => parts.id, { onDelete: 'set null' }),
    status: text('status', { enum: CHECKLIST_STATUSES }).notNull().default('in-progress'),
    startedBy: text('started_by')
      .notNull()
      .references(() => users.id),
    startedAt: integer('started_at', { mode: 'timestamp_ms' }).notNull(),
    completedBy: text('completed_by').references(() => users.id),
    completedAt: integer('completed_at', { mode: 'timestamp_ms' }),
    signedOffBy: text('signed_off_by').references(() => users.id),
    signedOffAt: integer('signed_off_at', { mode: 'timestamp_ms' }),
    signOffNote: text('sign_off_note'),
  },
  (table) => [
    index('checklists_team_idx').on(table.teamId, table.status),
    index('checklists_assembly_idx').on(table.assemblyId),
    index('checklists_gear_set_idx').on(table.gearSetId),
    index('checklists_procedure_idx').on(table.procedureId),
  ],
);

/** The state of one step of a checklist: the later change wins (by the time it was made on its device). */
export const checklistSteps = sqliteTable(
  'checklist_steps',
  {
    checklistId: text('checklist_id')
      .notNull()
      .references(() => checklists.id, { onDelete: 'cascade' }),
    stepId: text('step_id').notNull(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    status: text('status', { enum: ['done', 'skipped'] }).notNull(),
    reason: text('reason'),
    torqueApplied: text('torque_applied', { mode: 'json' }).$type<AppliedTorque[]>(),
    boltsInOrder: text('bolts_in_order', { mode: 'json' }).$type<number[]>(),
    orderDeviation: integer('order_deviation', { mode: 'boolean' }).notNull().default(false),
    value: real('value'),
    valueUnit: text('value_unit'),
    note: text('note'),
    by: text('by')
      .notNull()
      .references(() => users.id),
    /** When the change was made on the device. */
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
    receivedAt: integer('received_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (table) => [primaryKey({ columns: [table.checklistId, table.stepId] })],
);

/** Every step change received, once per Idempotency-Key: a change sent twice is stored once. */
export const checklistStepChanges = sqliteTable(
  'checklist_step_changes',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    checklistId: text('checklist_id')
      .notNull()
      .references(() => checklists.id, { onDelete: 'cascade' }),
    stepId: text('step_id').notNull(),
    idempotencyKey: text('idempotency_key'),
    body: text('body', { mode: 'json' }).notNull(),
    applied: integer('applied', { mode: 'boolean' }).notNull(),
    by: text('by')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (table) => [
    uniqueIndex('checklist_change_key_idx').on(table.teamId, table.idempotencyKey),
    index('checklist_change_idx').on(table.checklistId, table.stepId),
  ],
);

/** Photos and diagrams of a procedure's step, or of a checklist's step; re-encoded like inspection photos. */
export const stepPhotos = sqliteTable(
  'step_photos',
  {
    id: text('id').primaryKey(),
    teamId: text('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    procedureId: text('procedure_id').references(() => procedures.id, { onDelete: 'cascade' }),
    checklistId: text('checklist_id').references(() => checklists.id, { onDelete: 'cascade' }),
    stepId: text('step_id').notNull(),
    storageKey: text('storage_key').notNull(),
    thumbnailKey: text('thumbnail_key').notNull(),
    contentType: text('content_type').notNull(),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    bytes: integer('bytes').notNull(),
    createdBy: text('created_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (table) => [
    index('step_photos_procedure_idx').on(table.procedureId, table.stepId),
    index('step_photos_checklist_idx').on(table.checklistId, table.stepId),
  ],
);

export type Procedure = typeof procedures.$inferSelect;
export type ProcedureVersion = typeof procedureVersions.$inferSelect;
export type Checklist = typeof checklists.$inferSelect;
export type ChecklistStep = typeof checklistSteps.$inferSelect;
export type StepPhoto = typeof stepPhotos.$inferSelect;
