import { sql } from 'drizzle-orm';
import { sqliteTable, text, integer, real, index, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { timestamp, timestamps } from './columns';
import { users, shops } from './users';
import { swaps, revisions } from './swaps';
import { chassis } from './catalogue';
import { fittedReportStates, mailStatuses } from '../../../shared/schemas/enums';
import { flagKinds, flagOutcomes } from '../../../shared/schemas/flags';
import type { VehicleData } from '../../../shared/schemas/vehicle';
import type { ProfilePoint } from '../../../shared/schemas/swap-data';
import { newMessageId } from '../../mail/message-id';

export const fittedReports = sqliteTable(
  'fitted_reports',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    swapId: integer('swap_id')
      .notNull()
      .references(() => swaps.id, { onDelete: 'cascade' }),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    revisionId: integer('revision_id')
      .notNull()
      .references(() => revisions.id),
    /** { diameterIn, widthIn, offsetMm, spacerMm } */
    wheel: text('wheel', { mode: 'json' }).$type<FittedWheel>().notNull(),
    note: text('note').notNull().default(''),
    photoFileId: text('photo_file_id'),
    /** stored size of the photo, counted against the member's storage quota */
    photoBytes: integer('photo_bytes').notNull().default(0),
    /** smallest gap the member measured between caliper and wheel, in mm; null when they did not measure */
    clearanceMm: real('clearance_mm'),
    /** `held`: written by a new member, waiting for a moderator (not public, not counted); `live` otherwise */
    state: text('state', { enum: fittedReportStates }).notNull().default('live'),
    releasedAt: timestamp('released_at'),
    releasedById: integer('released_by_id').references(() => users.id, { onDelete: 'set null' }),
    hiddenAt: timestamp('hidden_at'),
    hiddenById: integer('hidden_by_id').references(() => users.id),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('fitted_reports_swap_user_uq').on(t.swapId, t.userId),
    index('fitted_reports_state_idx').on(t.state, t.createdAt),
    index('fitted_reports_user_idx').on(t.userId),
  ],
);
export type FittedWheel = { diameterIn: number; widthIn: number; offsetMm: number; spacerMm: number };

/**
 * A moderator's decision to hide a member's fitted reports on a swap. It outlives the report: a member
 * who deletes a hidden report and writes a new one gets it hidden too, until a moderator lifts this.
 */
export const reportHides = sqliteTable(
  'report_hides',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    swapId: integer('swap_id')
      .notNull()
      .references(() => swaps.id, { onDelete: 'cascade' }),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    hiddenById: integer('hidden_by_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at').notNull(),
    liftedAt: timestamp('lifted_at'),
    liftedById: integer('lifted_by_id').references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [uniqueIndex('report_hides_active_uq').on(t.swapId, t.userId).where(sql.raw('lifted_at is null'))],
);

export const flags = sqliteTable(
  'flags',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    swapId: integer('swap_id')
      .notNull()
      .references(() => swaps.id, { onDelete: 'cascade' }),
    reporterId: integer('reporter_id')
      .notNull()
      .references(() => users.id),
    kind: text('kind', { enum: flagKinds }).notNull().default('other'),
    reason: text('reason').notNull(),
    status: text('status', { enum: ['open', 'resolved'] })
      .notNull()
      .default('open'),
    /** the correction that answers it; approving that correction resolves the flag */
    correctionRevisionId: integer('correction_revision_id').references(() => revisions.id, { onDelete: 'set null' }),
    outcome: text('outcome', { enum: flagOutcomes }),
    resolutionNote: text('resolution_note'),
    /** when the reporter was mailed this outcome; null while it waits for their next daily message */
    reporterNotifiedAt: timestamp('reporter_notified_at'),
    resolvedById: integer('resolved_by_id').references(() => users.id),
    resolvedAt: timestamp('resolved_at'),
    ...timestamps,
  },
  (t) => [
    index('flags_status_idx').on(t.status),
    index('flags_swap_status_idx').on(t.swapId, t.status),
    index('flags_reporter_notified_idx').on(t.reporterId, t.reporterNotifiedAt),
    // one open flag per member and swap, held by the database itself
    uniqueIndex('flags_one_open_per_reporter_uq').on(t.swapId, t.reporterId).where(sql.raw(`status = 'open'`)),
  ],
);

export const shopLinks = sqliteTable(
  'shop_links',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    code: text('code').notNull().unique(),
    shopId: integer('shop_id')
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    swapId: integer('swap_id')
      .notNull()
      .references(() => swaps.id, { onDelete: 'cascade' }),
    revisionId: integer('revision_id')
      .notNull()
      .references(() => revisions.id),
    createdById: integer('created_by_id')
      .notNull()
      .references(() => users.id),
    /** markdown, sanitized; private to the shop (its own record of the job) */
    note: text('note').notNull().default(''),
    /** markdown, sanitized; shown to everyone who opens the link */
    publicNote: text('public_note').notNull().default(''),
    /** private to the shop */
    customerRef: text('customer_ref').notNull().default(''),
    /** private to the shop: the quoted price in minor units, with its currency */
    quotedPriceMinor: integer('quoted_price_minor'),
    quotedCurrency: text('quoted_currency'),
    /** private to the shop; from then on the link answers as retired */
    expiresAt: timestamp('expires_at'),
    /** visits by anyone but the shop's own accounts */
    visits: integer('visits').notNull().default(0),
    retiredAt: timestamp('retired_at'),
    ...timestamps,
  },
  (t) => [index('shop_links_shop_idx').on(t.shopId)],
);

export const cars = sqliteTable(
  'cars',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    chassisId: integer('chassis_id')
      .notNull()
      .references(() => chassis.id),
    nickname: text('nickname').notNull(),
    wheelDiameterIn: real('wheel_diameter_in').notNull(),
    wheelWidthIn: real('wheel_width_in').notNull(),
    wheelOffsetMm: real('wheel_offset_mm').notNull(),
    tyre: text('tyre').notNull().default(''),
    spacerMm: real('spacer_mm').notNull().default(0),
    /** the member's own figures for the brake-distribution analysis; null: the chassis' stock figures apply */
    vehicle: text('vehicle', { mode: 'json' }).$type<VehicleData>(),
    /** the wheel's inside surface in the plane through the axle, (z, r) points; null until the member measures it */
    wheelInsideProfile: text('wheel_inside_profile', { mode: 'json' }).$type<ProfilePoint[]>(),
    /** what else was changed on the car, in the member's words */
    otherChanges: text('other_changes').notNull().default(''),
    ...timestamps,
  },
  (t) => [index('cars_user_idx').on(t.userId)],
);

/**
 * Every e-mail, written in the same transaction as the change it reports; the sender in the server
 * process delivers it later. `kept` messages stay here (no mail server is configured).
 */
export const mailOutbox = sqliteTable(
  'mail_outbox',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    /** the member it is for; the address below is theirs at the time of writing */
    userId: integer('user_id').references(() => users.id, { onDelete: 'set null' }),
    to: text('to').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html').notNull(),
    /** the same on every attempt, so a receiver can drop a repeat */
    messageId: text('message_id')
      .unique()
      .$defaultFn(() => newMessageId()),
    /** holds something that acts for its recipient (a sign-in link): its body is not shown on the desk */
    secret: integer('secret', { mode: 'boolean' }).notNull().default(false),
    /** extra headers the message carries (List-Unsubscribe on a digest) */
    headers: text('headers', { mode: 'json' }).$type<Record<string, string>>(),
    status: text('status', { enum: mailStatuses }).notNull().default('kept'),
    attempts: integer('attempts').notNull().default(0),
    lastError: text('last_error'),
    /** when the next attempt is due; while `sending`, when the claim lapses */
    nextAttemptAt: timestamp('next_attempt_at'),
    createdAt: timestamp('created_at').notNull(),
    sentAt: timestamp('sent_at'),
  },
  (t) => [index('mail_outbox_due_idx').on(t.status, t.nextAttemptAt)],
);
