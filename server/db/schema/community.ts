import { sqliteTable, text, integer, real, index, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { timestamp, timestamps } from './columns';
import { users, shops } from './users';
import { swaps, revisions } from './swaps';
import { chassis } from './catalogue';

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
    hiddenAt: timestamp('hidden_at'),
    hiddenById: integer('hidden_by_id').references(() => users.id),
    ...timestamps,
  },
  (t) => [uniqueIndex('fitted_reports_swap_user_uq').on(t.swapId, t.userId)],
);
export type FittedWheel = { diameterIn: number; widthIn: number; offsetMm: number; spacerMm: number };

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
    reason: text('reason').notNull(),
    status: text('status', { enum: ['open', 'resolved'] })
      .notNull()
      .default('open'),
    resolutionNote: text('resolution_note'),
    resolvedById: integer('resolved_by_id').references(() => users.id),
    resolvedAt: timestamp('resolved_at'),
    ...timestamps,
  },
  (t) => [index('flags_status_idx').on(t.status)],
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
    /** markdown, sanitized */
    note: text('note').notNull().default(''),
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
    ...timestamps,
  },
  (t) => [index('cars_user_idx').on(t.userId)],
);

export const mailOutbox = sqliteTable('mail_outbox', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  to: text('to').notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  html: text('html').notNull(),
  createdAt: timestamp('created_at').notNull(),
  sentAt: timestamp('sent_at'),
});
