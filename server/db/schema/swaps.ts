import { sql } from 'drizzle-orm';
import { sqliteTable, text, integer, index, uniqueIndex, customType, type AnySQLiteColumn } from 'drizzle-orm/sqlite-core';
import { timestamp, timestamps } from './columns';
import { users } from './users';
import { chassis } from './catalogue';
import { axles, categories, revisionStatuses } from '../../../shared/schemas/enums';
import type { SwapData } from '../../../shared/schemas/swap-data';
import type { IncompleteRow } from '../../../shared/schemas/submissions';
import { upgradeSwapData } from '../../../shared/schemas/swap-data-upgrade';

/** JSON text; data written before version 2 is upgraded as it is read, so every reader sees version 2 */
const swapDataColumn = customType<{ data: SwapData; driverData: string }>({
  dataType: () => 'text',
  toDriver: (value) => JSON.stringify(value),
  fromDriver: (value) => upgradeSwapData(JSON.parse(value)),
});

export const swaps = sqliteTable(
  'swaps',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    slug: text('slug').notNull().unique(),
    chassisId: integer('chassis_id')
      .notNull()
      .references(() => chassis.id),
    axle: text('axle', { enum: axles }).notNull(),
    category: text('category', { enum: categories }).notNull(),
    /** latest approved revision; null until the first approval */
    currentRevisionId: integer('current_revision_id').references((): AnySQLiteColumn => revisions.id),
    authorId: integer('author_id')
      .notNull()
      .references(() => users.id),
    fittedCount: integer('fitted_count').notNull().default(0),
    ...timestamps,
  },
  (t) => [index('swaps_chassis_idx').on(t.chassisId)],
);

/**
 * Addresses a swap had before a title change gave it a new slug. Shops and readers keep old addresses, so
 * they are redirected to the swap's current one; no other swap may ever take a slug listed here.
 */
export const swapOldSlugs = sqliteTable(
  'swap_old_slugs',
  {
    slug: text('slug').primaryKey(),
    swapId: integer('swap_id')
      .notNull()
      .references((): AnySQLiteColumn => swaps.id, { onDelete: 'cascade' }),
    retiredAt: timestamp('retired_at').notNull(),
  },
  (t) => [index('swap_old_slugs_swap_idx').on(t.swapId)],
);

export const revisions = sqliteTable(
  'revisions',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    swapId: integer('swap_id')
      .notNull()
      .references((): AnySQLiteColumn => swaps.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    /**
     * for a correction: the approved revision it started from. Approval needs it to be the swap's current
     * revision, so a correction never silently undoes one approved after it was started. Null for a new
     * swap's first revision and for corrections written before this was recorded.
     */
    basedOnRevisionId: integer('based_on_revision_id').references((): AnySQLiteColumn => revisions.id, {
      onDelete: 'set null',
    }),
    authorId: integer('author_id')
      .notNull()
      .references(() => users.id),
    status: text('status', { enum: revisionStatuses }).notNull().default('draft'),
    /** validated by swapDataSchema */
    data: swapDataColumn('data').notNull(),
    /** markdown, raw HTML already stripped */
    body: text('body').notNull().default(''),
    /** a draft's half-filled rows, validated by incompleteRowSchema; empty once it is sent for review */
    incompleteRows: text('incomplete_rows', { mode: 'json' }).$type<IncompleteRow[]>().notNull().default([]),
    submittedAt: timestamp('submitted_at'),
    reviewedAt: timestamp('reviewed_at'),
    reviewedById: integer('reviewed_by_id').references(() => users.id),
    reviewNote: text('review_note'),
    /** a correction's "what changed and why", in its author's words; required when it goes to review */
    changeNote: text('change_note'),
    /** when the author was told this untouched draft will be removed, and when; a later save (updated_at) cancels it */
    expiryWarnedAt: timestamp('expiry_warned_at'),
    expiresAt: timestamp('expires_at'),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('revisions_swap_number_uq').on(t.swapId, t.number),
    // one open revision (draft, sent back or in review) per member and swap, held by the database itself
    uniqueIndex('revisions_one_open_per_author_uq')
      .on(t.swapId, t.authorId)
      .where(sql.raw(`status in ('draft', 'sent_back', 'in_review')`)),
    // one title per member among their open new swaps, so two drafts (or a draft and a submission) never read alike;
    // a correction is known by its swap and keeps that swap's title, which another swap may share
    uniqueIndex('revisions_one_title_per_author_uq')
      .on(t.authorId, sql`lower(json_extract(${t.data}, '$.title'))`)
      .where(sql.raw(`status in ('draft', 'sent_back', 'in_review') and number = 1`)),
    index('revisions_status_idx').on(t.status),
    index('revisions_author_idx').on(t.authorId),
  ],
);

export const revisionPhotos = sqliteTable(
  'revision_photos',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    revisionId: integer('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    /** random id of the stored file under UPLOAD_DIR */
    fileId: text('file_id').notNull().unique(),
    caption: text('caption').notNull().default(''),
    position: integer('position').notNull().default(0),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    bytes: integer('bytes').notNull(),
    sha256: text('sha256').notNull(),
    createdAt: timestamp('created_at').notNull(),
  },
  (t) => [
    index('revision_photos_revision_idx').on(t.revisionId),
    // copies of a published photo (in a correction) are found by their content
    index('revision_photos_sha256_idx').on(t.sha256),
  ],
);

export const reviewEvents = sqliteTable(
  'review_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    revisionId: integer('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    actorId: integer('actor_id')
      .notNull()
      .references(() => users.id),
    action: text('action', { enum: ['submitted', 'approved', 'sent_back', 'declined', 'superseded', 'withdrawn'] }).notNull(),
    note: text('note').notNull().default(''),
    at: timestamp('at').notNull(),
  },
  (t) => [index('review_events_revision_idx').on(t.revisionId)],
);

/**
 * A moderator working on a revision at the desk. Others see who holds it; a claim lapses at `expires_at`, so a
 * moderator who walks away does not hold a submission for ever. One row per revision: taking over a lapsed claim
 * replaces it in one statement.
 */
export const reviewClaims = sqliteTable(
  'review_claims',
  {
    revisionId: integer('revision_id')
      .primaryKey()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    moderatorId: integer('moderator_id')
      .notNull()
      .references(() => users.id),
    claimedAt: timestamp('claimed_at').notNull(),
    expiresAt: timestamp('expires_at').notNull(),
  },
  (t) => [index('review_claims_moderator_idx').on(t.moderatorId)],
);

export const reviewReasonTemplates = sqliteTable('review_reason_templates', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  label: text('label').notNull(),
  text: text('text').notNull(),
  ...timestamps,
});

/**
 * A moderator's takedown of a published revision's photo or write-up. A photo is taken down by its content
 * within the swap, so the copies later revisions carry of it go too. Recorded with who and why; only an
 * admin reverts one (the record stays, with who reverted it and when).
 */
export const takedowns = sqliteTable(
  'takedowns',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    swapId: integer('swap_id')
      .notNull()
      .references(() => swaps.id, { onDelete: 'cascade' }),
    revisionId: integer('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    target: text('target', { enum: ['photo', 'body'] }).notNull(),
    /** the photo's content hash ('' for a write-up): every photo of the swap with it is taken down */
    photoSha256: text('photo_sha256').notNull().default(''),
    /** the photo the moderator pointed at, for the record */
    photoFileId: text('photo_file_id'),
    reason: text('reason').notNull(),
    createdById: integer('created_by_id')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at').notNull(),
    revertedAt: timestamp('reverted_at'),
    revertedById: integer('reverted_by_id').references(() => users.id),
  },
  (t) => [
    index('takedowns_swap_idx').on(t.swapId),
    uniqueIndex('takedowns_active_uq').on(t.swapId, t.target, t.photoSha256, t.revisionId).where(sql.raw('reverted_at is null')),
  ],
);
