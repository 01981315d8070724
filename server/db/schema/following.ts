import { sql } from 'drizzle-orm';
import { sqliteTable, text, integer, index, uniqueIndex, check } from 'drizzle-orm/sqlite-core';
import { timestamp, timestamps } from './columns';
import { users } from './users';
import { chassis } from './catalogue';
import { cars } from './community';
import { digestFrequencies } from '../../../shared/schemas/following';

/**
 * A member following a chassis or one of their cars. The digest scheduler sends one message per follow
 * and period with the swaps published on that chassis after `since`, then moves `since` on.
 */
export const follows = sqliteTable(
  'follows',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    /** exactly one of chassis and car is set */
    chassisId: integer('chassis_id').references(() => chassis.id, { onDelete: 'cascade' }),
    carId: integer('car_id').references(() => cars.id, { onDelete: 'cascade' }),
    frequency: text('frequency', { enum: digestFrequencies }).notNull(),
    /** swaps published after this moment belong in the next digest */
    since: timestamp('since').notNull(),
    ...timestamps,
  },
  (t) => [
    check('follows_one_target', sql`(${t.chassisId} is null) <> (${t.carId} is null)`),
    uniqueIndex('follows_user_chassis_uq').on(t.userId, t.chassisId).where(sql.raw('chassis_id is not null')),
    uniqueIndex('follows_car_uq').on(t.carId).where(sql.raw('car_id is not null')),
    index('follows_frequency_idx').on(t.frequency, t.since),
  ],
);
