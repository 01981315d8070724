import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import fs from 'node:fs';
import path from 'node:path';
import * as schema from './schema/index';

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };
/** The handle a `db.transaction(...)` callback receives. */
export type DbTransaction = Parameters<Parameters<Db['transaction']>[0]>[0];

const migrationsFolder = path.resolve(import.meta.dirname, '../../drizzle');

/** Opens the SQLite file with the pragmas the app relies on. */
export function openDb(file: string): Db {
  if (file !== ':memory:') fs.mkdirSync(path.dirname(path.resolve(file)), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma('journal_mode = WAL');
  // better-sqlite3 leaves WAL at NORMAL, which may drop the last commits on power loss
  sqlite.pragma('synchronous = FULL');
  sqlite.pragma('busy_timeout = 5000');
  sqlite.pragma('foreign_keys = ON');
  return drizzle(sqlite, { schema }) as Db;
}

export function migrateDb(db: Db) {
  migrate(db, { migrationsFolder });
}

export function closeDb(db: Db) {
  db.$client.close();
}
