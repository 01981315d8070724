import Database from 'better-sqlite3';
import fs from 'node:fs';
import path from 'node:path';

/**
 * A consistent copy through SQLite's online backup API while other connections keep writing;
 * the copy is a single self-contained file (no WAL beside it).
 */
export async function backupDatabase(sourceFile: string, targetFile: string): Promise<{ pages: number; integrity: string }> {
  fs.mkdirSync(path.dirname(path.resolve(targetFile)), { recursive: true });
  const source = new Database(sourceFile, { fileMustExist: true });
  source.pragma('busy_timeout = 5000');
  try {
    let pages = 0;
    await source.backup(targetFile, {
      // A write from another connection restarts a stepwise backup; copying the rest in one step
      // reads one WAL snapshot, so writers keep going and the copy is consistent.
      progress: ({ totalPages }) => {
        pages = totalPages;
        return 2 ** 30;
      },
    });
    const copy = new Database(targetFile);
    try {
      copy.pragma('journal_mode = DELETE');
      const integrity = copy.pragma('integrity_check', { simple: true }) as string;
      return { pages, integrity };
    } finally {
      copy.close();
    }
  } finally {
    source.close();
  }
}
