import type Database from 'better-sqlite3';
import { normalisePartNumber, partNumbersIn } from '../../shared/search/normalise';

/**
 * SQL functions the schema's triggers call (drizzle/0008_interchange_lookups.sql), so part numbers are
 * compared in SQL by the same rule the search uses. Every connection that writes `parts` needs them:
 * `openDb` registers them; another SQLite client that edits parts gets "no such function" rather than a
 * lookup table that disagrees with its rows.
 */
export function registerSqlFunctions(sqlite: Database.Database) {
  sqlite.function('part_number_key', { deterministic: true }, (value: unknown) =>
    typeof value === 'string' ? normalisePartNumber(value) : '',
  );
  sqlite.function('part_numbers_in', { deterministic: true }, (text: unknown) =>
    JSON.stringify(typeof text === 'string' ? partNumbersIn(text) : []),
  );
}
