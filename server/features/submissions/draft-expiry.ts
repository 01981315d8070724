import { and, eq, isNotNull, isNull, lt, lte, or, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { revisionPhotos, revisions } from '../../db/schema/index';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import type { Mailer } from '../../mail/mailer';
import type { Storage } from '../../storage/disk-storage';
import { draftExpiring } from '../../mail/messages';
import { loadRevision } from './submission-views';
import { removeFiles, removeRevision } from './submissions.service';

// Drafts that nobody touches hold their photos forever. A draft untouched for `idleDays` gets an e-mail
// to its author; still untouched `noticeDays` later, it is removed with its photos (and a new swap's
// proposed chassis). Any save, or "keep this draft", moves updated_at past the warning and cancels it.
// Only drafts expire: a revision in review or sent back has a moderator's attention or decision on it.

export type DraftExpiryDeps = {
  db: Db;
  storage: Storage;
  mailer: Mailer;
  clock: Clock;
  logger: Logger;
  appUrl: string;
  expiry: { idleDays: number; noticeDays: number };
};

const DAY_MS = 24 * 60 * 60 * 1000;

export async function expireAbandonedDrafts(deps: DraftExpiryDeps): Promise<{ warned: number; removed: number }> {
  const { db, clock, expiry } = deps;
  const now = clock.now();
  const idleSince = new Date(now.getTime() - expiry.idleDays * DAY_MS);

  const toWarn = db
    .select({ id: revisions.id })
    .from(revisions)
    .where(
      and(
        eq(revisions.status, 'draft'),
        lt(revisions.updatedAt, idleSince),
        or(isNull(revisions.expiryWarnedAt), lte(revisions.expiryWarnedAt, revisions.updatedAt)),
      ),
    )
    .all();
  let warned = 0;
  for (const { id } of toWarn) {
    const row = loadRevision(db, id);
    if (!row) continue;
    const removeOn = new Date(now.getTime() + expiry.noticeDays * DAY_MS);
    const photos = db
      .select({ n: sql<number>`count(*)` })
      .from(revisionPhotos)
      .where(eq(revisionPhotos.revisionId, id))
      .get()!.n;
    db.transaction((tx) => {
      // updated_at stays as it is: the warning is not activity
      const changed = tx
        .update(revisions)
        .set({ expiryWarnedAt: now, expiresAt: removeOn })
        .where(and(eq(revisions.id, id), eq(revisions.status, 'draft'), lt(revisions.updatedAt, idleSince)))
        .run().changes;
      if (!changed) return;
      warned++;
      deps.mailer.queue(
        tx,
        row.author,
        draftExpiring({
          appUrl: deps.appUrl,
          name: row.author.name || row.author.login,
          title: row.revision.data.title,
          revisionId: id,
          lastChanged: row.revision.updatedAt,
          removeOn,
          photos,
        }),
      );
    });
  }

  const toRemove = db
    .select({ id: revisions.id })
    .from(revisions)
    .where(and(eq(revisions.status, 'draft'), lte(revisions.expiresAt, now), isNotNull(revisions.expiryWarnedAt)))
    .all();
  let removed = 0;
  const files: string[] = [];
  for (const { id } of toRemove) {
    const row = loadRevision(db, id);
    // saved at or after the warning: it stays (the next idle period starts a new notice); the warning
    // itself never moves updated_at, which was months older when it was sent
    if (!row || !row.revision.expiryWarnedAt || row.revision.updatedAt >= row.revision.expiryWarnedAt) continue;
    files.push(...db.transaction((tx) => removeRevision(tx, row)));
    removed++;
    deps.logger.info({ event: 'draft_expired', revisionId: id, userId: row.revision.authorId }, 'abandoned draft removed');
  }
  await removeFiles(deps.storage, files);
  return { warned, removed };
}

/** Runs the sweep now and every hour until stopped; a failed run is logged and the next one tries again. */
export function startDraftExpiry(deps: DraftExpiryDeps, everyMs = 60 * 60 * 1000): () => void {
  const run = () =>
    expireAbandonedDrafts(deps).then(
      (r) => (r.warned || r.removed) && deps.logger.info({ event: 'draft_expiry', ...r }, 'abandoned drafts swept'),
      (err) => deps.logger.error({ err, event: 'draft_expiry_failed' }, 'abandoned drafts could not be swept'),
    );
  const first = setTimeout(run, 60_000);
  const timer = setInterval(run, everyMs);
  first.unref();
  timer.unref();
  return () => {
    clearTimeout(first);
    clearInterval(timer);
  };
}
