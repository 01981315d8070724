import { sqliteTable, text, integer, uniqueIndex, index } from 'drizzle-orm/sqlite-core';
import { timestamp, timestamps } from './columns';
import { roles } from '../../../shared/roles';
import { unitSystems } from '../../../shared/schemas/enums';
import type { OpeningPeriod } from '../../../shared/schemas/shops';

export const shops = sqliteTable('shops', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  slug: text('slug').notNull().unique(),
  name: text('name').notNull(),
  town: text('town').notNull().default(''),
  website: text('website').notNull().default(''),
  about: text('about').notNull().default(''),
  phone: text('phone').notNull().default(''),
  email: text('email').notNull().default(''),
  address: text('address').notNull().default(''),
  /** the week's opening periods; a day with none is closed */
  openingHours: text('opening_hours', { mode: 'json' }).$type<OpeningPeriod[]>().notNull().default([]),
  /** a line beside the hours ("by appointment on Saturdays") */
  hoursNote: text('hours_note').notNull().default(''),
  ...timestamps,
});

export const users = sqliteTable(
  'users',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    provider: text('provider').notNull(),
    providerId: text('provider_id').notNull(),
    login: text('login').notNull(),
    name: text('name').notNull().default(''),
    email: text('email'),
    avatarUrl: text('avatar_url'),
    role: text('role', { enum: roles }).notNull().default('member'),
    shopId: integer('shop_id').references(() => shops.id, { onDelete: 'set null' }),
    units: text('units', { enum: unitSystems }).notNull().default('metric'),
    suspendedAt: timestamp('suspended_at'),
    lastSignInAt: timestamp('last_sign_in_at'),
    ...timestamps,
  },
  (t) => [uniqueIndex('users_provider_id_uq').on(t.provider, t.providerId), uniqueIndex('users_login_uq').on(t.login)],
);

/** Audit trail of role, shop and suspension changes. */
export const userChanges = sqliteTable(
  'user_changes',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    actorId: integer('actor_id').references(() => users.id, { onDelete: 'set null' }),
    field: text('field').notNull(),
    fromValue: text('from_value'),
    toValue: text('to_value'),
    at: timestamp('at').notNull(),
  },
  (t) => [index('user_changes_user_idx').on(t.userId)],
);

export const sessions = sqliteTable(
  'sessions',
  {
    sid: text('sid').primaryKey(),
    userId: integer('user_id'),
    data: text('data').notNull(),
    expiresAt: integer('expires_at').notNull(),
    createdAt: integer('created_at').notNull(),
  },
  (t) => [
    index('sessions_expires_idx').on(t.expiresAt),
    index('sessions_created_idx').on(t.createdAt),
    index('sessions_user_idx').on(t.userId),
  ],
);

/**
 * One-time sign-in links sent by e-mail. Only a hash of the token is kept, so the table cannot be
 * used to sign anyone in; a link works once, for a short time.
 */
export const emailSignInTokens = sqliteTable(
  'email_sign_in_tokens',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    tokenHash: text('token_hash').notNull().unique(),
    /** lower-cased as typed; the account is found (or made) when the link is used */
    email: text('email').notNull(),
    returnTo: text('return_to'),
    createdAt: timestamp('created_at').notNull(),
    expiresAt: timestamp('expires_at').notNull(),
    usedAt: timestamp('used_at'),
  },
  (t) => [index('email_sign_in_tokens_email_idx').on(t.email, t.createdAt)],
);
