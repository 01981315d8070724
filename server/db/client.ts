import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import fs from 'node:fs';
import path from 'node:path';
import * as schema from './schema/index';
import { registerSqlFunctions } from './sql-functions';

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };
/** The handle a `db.transaction(...)` callback receives. */
export type DbTransaction = Parameters<Parameters<Db['transaction']>[0]>[0];

const migrationsFolder = path.resolve(import.meta.dirname, '../../drizzle');

/**
 * Opens the SQLite file with the pragmas the app relies on. Scripts keep the long busy timeout (they may
 * simply wait for the server); the server shortens it once started (`setBusyTimeout`).
 */
export function openDb(file: string, { busyTimeoutMs = 5000 }: { busyTimeoutMs?: number } = {}): Db {
  if (file !== ':memory:') fs.mkdirSync(path.dirname(path.resolve(file)), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma('journal_mode = WAL');
  // better-sqlite3 leaves WAL at NORMAL, which may drop the last commits on power loss
  sqlite.pragma('synchronous = FULL');
  sqlite.pragma(`busy_timeout = ${busyTimeoutMs}`);
  sqlite.pragma('foreign_keys = ON');
  registerSqlFunctions(sqlite);
  return drizzle(sqlite, { schema }) as Db;
}

export function setBusyTimeout(db: Db, ms: number) {
  db.$client.pragma(`busy_timeout = ${Math.round(ms)}`);
}

export function migrateDb(db: Db) {
  migrate(db, { migrationsFolder });
}

export function closeDb(db: Db) {
  db.$client.close();
}
