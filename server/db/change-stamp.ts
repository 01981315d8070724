import type { Statement } from 'better-sqlite3';
import type { Db } from './client';

type StampStatements = { written: Statement<[], unknown[]>; committed: Statement<[], unknown[]> };
const stampStatements = new WeakMap<Db['$client'], StampStatements>();

/**
 * A value that moves whenever the database may have changed: rows written through this connection
 * (`total_changes()`, triggers included, rolled-back writes too) and commits made by any other
 * connection or process (`data_version`). While it stands still, whatever was read from the database
 * still holds, and checking it is far cheaper than reading again.
 */
export function changeStamp(db: Db): string {
  let s = stampStatements.get(db.$client);
  if (!s) {
    // two statements: the pragma read alone is several times cheaper than as a table-valued function
    s = {
      written: db.$client.prepare<[], unknown[]>('select total_changes()').raw(),
      committed: db.$client.prepare<[], unknown[]>('pragma data_version').raw(),
    };
    stampStatements.set(db.$client, s);
  }
  return `${s.written.get()![0]}:${s.committed.get()![0]}`;
}

/** Remembers `compute(key)` per key until the database changes (at most `maxEntries` keys). */
export function untilDbChanges<T>(db: Db, compute: (key: string) => T, maxEntries = 2000): (key: string) => T {
  let stamp = '';
  const known = new Map<string, T>();
  return (key) => {
    const now = changeStamp(db);
    if (now !== stamp) {
      known.clear();
      stamp = now;
    }
    if (known.has(key)) return known.get(key)!;
    const value = compute(key);
    if (known.size >= maxEntries) known.delete(known.keys().next().value!);
    known.set(key, value);
    return value;
  };
}
