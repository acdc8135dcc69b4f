import { sql } from 'drizzle-orm';
import {
  type AnyPgColumn,
  bigserial,
  check,
  index,
  integer,
  json,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uuid,
  varchar,
} from 'drizzle-orm/pg-core';
import type { AuditAction } from '../../shared/api/audit';
import type { ReceiveForm } from '../../shared/api/instruments';
import { bandRoles } from '../../shared/api/roles';

/** Site-wide role of a user: admins can see and repair everything. */
export const siteRole = pgEnum('site_role', ['member', 'admin']);

/** Role of a user inside one band. */
export const bandRole = pgEnum('band_role', bandRoles);

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow();

export const users = pgTable('users', {
  id: uuid('id').primaryKey().defaultRandom(),
  githubId: text('github_id').notNull().unique(),
  login: text('login').notNull(),
  name: text('name'),
  email: text('email'),
  avatarUrl: text('avatar_url'),
  siteRole: siteRole('site_role').notNull().default('member'),
  createdAt: createdAt(),
  lastSignInAt: timestamp('last_sign_in_at', { withTimezone: true }),
});

export const bands = pgTable('bands', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
});

export const memberships = pgTable(
  'memberships',
  {
    bandId: uuid('band_id')
      .notNull()
      .references(() => bands.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: bandRole('role').notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    primaryKey({ columns: [t.bandId, t.userId] }),
    index('memberships_user_idx').on(t.userId),
  ],
);

/** An e-mail invitation into a band; only a hash of the single-use token is kept. */
export const invites = pgTable(
  'invites',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    bandId: uuid('band_id')
      .notNull()
      .references(() => bands.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: bandRole('role').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    acceptedBy: uuid('accepted_by').references(() => users.id, { onDelete: 'set null' }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [index('invites_band_idx').on(t.bandId)],
);

/**
 * A saved tuning. The document itself lives in its revisions; this row holds what lists and searches need.
 * A preset belongs to its owner's own library when band_id is null, else to the band's library.
 */
export const presets = pgTable(
  'presets',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    ownerId: uuid('owner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'restrict' }),
    bandId: uuid('band_id').references(() => bands.id, { onDelete: 'restrict' }),
    name: text('name').notNull(),
    latestRevision: integer('latest_revision').notNull().default(1),
    forkedFromId: uuid('forked_from_id').references((): AnyPgColumn => presets.id, {
      onDelete: 'set null',
    }),
    forkedFromRevision: integer('forked_from_revision'),
    createdAt: createdAt(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    deletedAt: timestamp('deleted_at', { withTimezone: true }),
  },
  (t) => [
    index('presets_owner_idx').on(t.ownerId),
    index('presets_band_idx').on(t.bandId),
    index('presets_updated_idx').on(t.updatedAt),
    check('presets_latest_revision_positive', sql`${t.latestRevision} >= 1`),
  ],
);

/** Every save is a new row; rows are never updated. */
export const presetRevisions = pgTable(
  'preset_revisions',
  {
    presetId: uuid('preset_id')
      .notNull()
      .references(() => presets.id, { onDelete: 'cascade' }),
    revision: integer('revision').notNull(),
    document: jsonb('document').notNull(),
    note: text('note'),
    authorId: uuid('author_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [
    primaryKey({ columns: [t.presetId, t.revision] }),
    check('preset_revisions_revision_positive', sql`${t.revision} >= 1`),
  ],
);

/** A read-only link to a preset, optionally pinned to one revision; only a hash of the token is kept. */
export const shareLinks = pgTable(
  'share_links',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    presetId: uuid('preset_id')
      .notNull()
      .references(() => presets.id, { onDelete: 'cascade' }),
    revision: integer('revision'),
    tokenHash: text('token_hash').notNull().unique(),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
  },
  (t) => [index('share_links_preset_idx').on(t.presetId)],
);

/** Songs and files users sent for retuning or import, kept as history with a checksum. */
export const uploads = pgTable(
  'uploads',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    purpose: text('purpose').notNull(),
    fileName: text('file_name').notNull(),
    byteSize: integer('byte_size').notNull(),
    sha256: varchar('sha256', { length: 64 }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('uploads_user_idx').on(t.userId, t.createdAt)],
);

/** The session store's table, in the layout connect-pg-simple reads and writes. */
export const sessions = pgTable(
  'sessions',
  {
    sid: varchar('sid').primaryKey(),
    sess: json('sess').notNull(),
    expire: timestamp('expire', { precision: 6 }).notNull(),
  },
  (t) => [index('sessions_expire_idx').on(t.expire)],
);

/** Who changed what: appended to, never edited. */
export const auditLog = pgTable(
  'audit_log',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
    bandId: uuid('band_id').references(() => bands.id, { onDelete: 'cascade' }),
    presetId: uuid('preset_id').references(() => presets.id, { onDelete: 'set null' }),
    action: text('action').$type<AuditAction>().notNull(),
    detail: jsonb('detail').$type<Record<string, unknown>>(),
    createdAt: createdAt(),
  },
  (t) => [
    index('audit_log_band_idx').on(t.bandId, t.createdAt),
    index('audit_log_preset_idx').on(t.presetId),
  ],
);

/** A member's instrument: how their gear takes a tuning. Private to its owner. */
export const instruments = pgTable(
  'instruments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    ownerId: uuid('owner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    receives: text('receives').$type<ReceiveForm>().notNull(),
    deviceId: integer('device_id').notNull(),
    program: integer('program').notNull(),
    bank: integer('bank').notNull(),
    bendRange: integer('bend_range').notNull(),
    firstMemberChannel: integer('first_member_channel').notNull(),
    lastMemberChannel: integer('last_member_channel').notNull(),
    port: text('port'),
    createdAt: createdAt(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('instruments_owner_idx').on(t.ownerId)],
);

/** A band's setlist, with the stage's live position in it. */
export const setlists = pgTable(
  'setlists',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    bandId: uuid('band_id')
      .notNull()
      .references(() => bands.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    position: integer('position').notNull().default(0),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('setlists_band_idx').on(t.bandId),
    check('setlists_position_not_negative', sql`${t.position} >= 0`),
  ],
);

/** The entries of a setlist in order; a null revision follows the preset's latest. */
export const setlistEntries = pgTable(
  'setlist_entries',
  {
    setlistId: uuid('setlist_id')
      .notNull()
      .references(() => setlists.id, { onDelete: 'cascade' }),
    place: integer('place').notNull(),
    presetId: uuid('preset_id')
      .notNull()
      .references(() => presets.id, { onDelete: 'cascade' }),
    revision: integer('revision'),
    trigger: integer('trigger'),
  },
  (t) => [
    primaryKey({ columns: [t.setlistId, t.place] }),
    unique('setlist_entries_trigger_unique').on(t.setlistId, t.trigger),
    index('setlist_entries_preset_idx').on(t.presetId),
  ],
);

/**
 * Every change the stage's followers must hear, numbered: a move of the position, or a new revision of the entry
 * the position is on. The id is the Server-Sent Events id a reconnecting follower resumes from.
 */
export const stageEvents = pgTable(
  'stage_events',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    setlistId: uuid('setlist_id')
      .notNull()
      .references(() => setlists.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('stage_events_setlist_idx').on(t.setlistId, t.id)],
);
