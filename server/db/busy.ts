import Database from 'better-sqlite3';
import { setTimeout as sleep } from 'node:timers/promises';

/**
 * How long one statement waits for another process's lock before SQLite reports the database busy.
 * better-sqlite3 waits synchronously, so this is time the whole server stands still: keep it short
 * and wait longer by retrying with pauses that let other requests run.
 */
export const SHORT_BUSY_TIMEOUT_MS = 20;

/** SQLITE_BUSY and its extended codes: another connection holds a lock this statement needs. */
export function isBusy(err: unknown): boolean {
  return err instanceof Database.SqliteError && err.code.startsWith('SQLITE_BUSY');
}

/**
 * Runs `work`, and while it fails because the database is busy, runs it again after a pause that
 * yields the event loop (10 ms, doubling, at most 200 ms) until `waitMs` have passed; then the busy
 * error goes on to the caller. Safe for work whose writes are in one transaction: a busy error
 * means that transaction rolled back.
 */
export async function retryWhileBusy<T>(work: () => T | Promise<T>, waitMs: number, mayRetry: () => boolean = () => true) {
  const deadline = performance.now() + waitMs;
  for (let pause = 10; ; pause = Math.min(pause * 2, 200)) {
    try {
      return await work();
    } catch (err) {
      if (!isBusy(err) || !mayRetry() || performance.now() + pause > deadline) throw err;
      await sleep(pause);
    }
  }
}
