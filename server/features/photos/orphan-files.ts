import { isNotNull } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { fittedReports, revisionPhotos } from '../../db/schema/index';
import type { Storage } from '../../storage/disk-storage';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';

const HOUR_MS = 60 * 60 * 1000;

/** Every photo id a row points at (revision photos and fitted-report photos). */
function referencedFileIds(db: Db): Set<string> {
  const ids = new Set<string>();
  for (const r of db.select({ id: revisionPhotos.fileId }).from(revisionPhotos).all()) ids.add(r.id);
  for (const r of db
    .select({ id: fittedReports.photoFileId })
    .from(fittedReports)
    .where(isNotNull(fittedReports.photoFileId))
    .all())
    ids.add(r.id!);
  return ids;
}

/**
 * Removes stored files no row points at, and half-written `.tmp-` files, once they are older than
 * `olderThanMs` (an hour): a request writes its files a moment before the row that points at them,
 * so anything younger may still be on its way. Returns the names removed.
 */
export async function sweepOrphanFiles({
  db,
  storage,
  clock,
  olderThanMs = HOUR_MS,
}: {
  db: Db;
  storage: Storage;
  clock: Clock;
  olderThanMs?: number;
}): Promise<string[]> {
  const cutoff = clock.now().getTime() - olderThanMs;
  const old = (await storage.entries()).filter((e) => e.modifiedAt < cutoff);
  if (old.length === 0) return [];
  const referenced = referencedFileIds(db);
  const removed: string[] = [];
  for (const entry of old) {
    const photoId = entry.name.endsWith('_t') ? entry.name.slice(0, -2) : entry.name;
    if (!entry.temp && referenced.has(photoId)) continue;
    await storage.remove(entry.name);
    removed.push(entry.name);
  }
  return removed;
}

/** Sweeps a few minutes after start and then every hour; returns the function that stops it. */
export function scheduleOrphanSweep(deps: { db: Db; storage: Storage; clock: Clock; logger: Logger }, everyMs = HOUR_MS) {
  const run = () =>
    sweepOrphanFiles(deps).then(
      (removed) =>
        removed.length && deps.logger.info({ event: 'orphan_files_removed', count: removed.length }, 'orphan files removed'),
      (err: unknown) => deps.logger.warn({ event: 'orphan_sweep_failed', err }, 'orphan file sweep failed'),
    );
  const first = setTimeout(run, 5 * 60 * 1000).unref();
  const every = setInterval(run, everyMs).unref();
  return () => {
    clearTimeout(first);
    clearInterval(every);
  };
}
