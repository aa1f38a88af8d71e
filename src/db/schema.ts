import { sql } from 'drizzle-orm';
import { index, integer, primaryKey, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';

import { ROLES } from '../lib/roles';

const createdAt = () =>
  integer('created_at', { mode: 'timestamp_ms' })
    .notNull()
    .default(sql`(unixepoch('subsec') * 1000)`);

export const users = sqliteTable('users', {
  id: text('id').primaryKey(),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  lengthUnit: text('length_unit', { enum: ['in', 'mm'] }).notNull().default('in'),
  torqueUnit: text('torque_unit', { enum: ['lbf-in', 'N-m'] }).notNull().default('lbf-in'),
  currentTeamId: text('current_team_id'),
  // Bumped whenever every other session of this person must end (password change, sign-out everywhere).
  sessionVersion: integer('session_version').notNull().default(1),
  createdAt: createdAt(),
});

export const teams = sqliteTable('teams', {
  id: text('id').primaryKey(),
  name: text('name').notNull(),
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
    status: text('status', { enum: ['queued', 'sent', 'failed'] }).notNull().default('queued'),
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
    before: text('before', { mode: 'json' }),
    after: text('after', { mode: 'json' }),
    at: createdAt(),
  },
  (table) => [index('audit_team_record_idx').on(table.teamId, table.recordType, table.recordId)],
);

export type User = typeof users.$inferSelect;
export type Team = typeof teams.$inferSelect;
export type Membership = typeof memberships.$inferSelect;
