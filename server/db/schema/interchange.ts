import { sqliteTable, text, integer, index, primaryKey } from 'drizzle-orm/sqlite-core';
import { parts } from './catalogue';
import { revisions } from './swaps';

// Lookup tables for the interchange graph. Both hold nothing of their own: triggers on `revisions` and
// `parts` (drizzle/0008_interchange_lookups.sql) write them from those rows in the same statement, so they
// cannot disagree with them, and the migration builds them from the rows already stored. Nothing else
// writes here. They exist because the part lines sit inside each revision's JSON: finding the swaps that
// use one part by reading every revision took seconds at 100,000 swaps.

/** the catalogue part each part line of a revision points at (`data.parts[position].partId`) */
export const revisionParts = sqliteTable(
  'revision_parts',
  {
    revisionId: integer('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    partId: integer('part_id').notNull(),
  },
  (t) => [primaryKey({ columns: [t.revisionId, t.position] }), index('revision_parts_part_idx').on(t.partId, t.revisionId)],
);

export const partNumberSources = ['number', 'stamp'] as const;

/**
 * Every number a catalogue part is known by, normalised by the search's part-number rule (case and
 * separators ignored; SQL function `part_number_key`, server/db/sql-functions.ts): its own numbers, and
 * the stamps its notes mention (`part_numbers_in`).
 */
export const partNumberKeys = sqliteTable(
  'part_number_keys',
  {
    partId: integer('part_id')
      .notNull()
      .references(() => parts.id, { onDelete: 'cascade' }),
    source: text('source', { enum: partNumberSources }).notNull(),
    key: text('key').notNull(),
    /** as written */
    number: text('number').notNull(),
  },
  (t) => [primaryKey({ columns: [t.partId, t.source, t.key] }), index('part_number_keys_key_idx').on(t.key, t.source)],
);
