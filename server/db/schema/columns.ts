import { integer } from 'drizzle-orm/sqlite-core';

/** Unix milliseconds, UTC. */
export const timestamp = (name: string) => integer(name, { mode: 'timestamp_ms' });

export const timestamps = {
  createdAt: timestamp('created_at').notNull(),
  updatedAt: timestamp('updated_at').notNull(),
};
