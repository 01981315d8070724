import { sqliteTable, text, integer, index, primaryKey } from 'drizzle-orm/sqlite-core';
import { timestamp, timestamps } from './columns';
import { shops, users } from './users';
import { chassis } from './catalogue';
import { revisions, swaps } from './swaps';
import { cars } from './community';

/** Approved swaps a member has fitted to one of their cars: the car as it is. */
export const carFittedSwaps = sqliteTable(
  'car_fitted_swaps',
  {
    carId: integer('car_id')
      .notNull()
      .references(() => cars.id, { onDelete: 'cascade' }),
    swapId: integer('swap_id')
      .notNull()
      .references(() => swaps.id, { onDelete: 'cascade' }),
    /** the revision that was current when the member recorded it */
    revisionId: integer('revision_id')
      .notNull()
      .references(() => revisions.id),
    position: integer('position').notNull().default(0),
    createdAt: timestamp('created_at').notNull(),
  },
  (t) => [primaryKey({ columns: [t.carId, t.swapId] })],
);

/** A build plan: swaps for one car, computed together. */
export const plans = sqliteTable(
  'plans',
  {
    /** random and unguessable: the address is the way to share it */
    id: text('id').primaryKey(),
    title: text('title').notNull().default(''),
    chassisId: integer('chassis_id')
      .notNull()
      .references(() => chassis.id),
    carId: integer('car_id').references(() => cars.id, { onDelete: 'set null' }),
    /** null for a visitor's plan, which its device holds by key until they sign in */
    ownerId: integer('owner_id').references(() => users.id, { onDelete: 'cascade' }),
    deviceKeyHash: text('device_key_hash'),
    /** a plan a shop made for a customer: its swaps stay at the revisions it was made with */
    shopId: integer('shop_id').references(() => shops.id, { onDelete: 'set null' }),
    ...timestamps,
  },
  (t) => [index('plans_owner_idx').on(t.ownerId)],
);

export const planSwaps = sqliteTable(
  'plan_swaps',
  {
    planId: text('plan_id')
      .notNull()
      .references(() => plans.id, { onDelete: 'cascade' }),
    swapId: integer('swap_id')
      .notNull()
      .references(() => swaps.id, { onDelete: 'cascade' }),
    /** the revision that was current when the swap joined the plan */
    revisionId: integer('revision_id')
      .notNull()
      .references(() => revisions.id),
    position: integer('position').notNull(),
  },
  (t) => [primaryKey({ columns: [t.planId, t.swapId] })],
);
