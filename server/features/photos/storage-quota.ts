import { sql } from 'drizzle-orm';
import type { Db, DbTransaction } from '../../db/client';
import { AppError } from '../../lib/app-error';
import type { StorageUse } from '../../../shared/schemas/submissions';

// What a member stores counts against their quota until moderators have published it: photos on their
// revisions that are drafts, sent back or in review, and the photos of their fitted reports. Photos of
// approved (or superseded) revisions do not count, nor do the copies a correction starts with of a
// published photo (same content); declined revisions are closed and do not count either.

/** Bytes of photos the member keeps unpublished and on fitted reports. */
export function storageUsed(db: Db | DbTransaction, userId: number): number {
  const row = db.get<{ revisions: number | null; reports: number | null }>(sql`
    select
      (select sum(p.bytes) from revision_photos p join revisions r on r.id = p.revision_id
        where r.author_id = ${userId} and r.status in ('draft', 'sent_back', 'in_review')
          and not exists (
            select 1 from revision_photos q join revisions pr on pr.id = q.revision_id
            where q.sha256 = p.sha256 and pr.status in ('approved', 'superseded'))) as revisions,
      (select sum(f.photo_bytes) from fitted_reports f where f.user_id = ${userId}) as reports`);
  return (row?.revisions ?? 0) + (row?.reports ?? 0);
}

export function storageUse(db: Db, userId: number, quotaBytes: number): StorageUse {
  return { usedBytes: storageUsed(db, userId), quotaBytes };
}

const mb = (bytes: number) => `${(bytes / (1024 * 1024)).toLocaleString('en-GB', { maximumFractionDigits: 1 })} MB`;

/**
 * Refuses (413, on `field`) when `adding` more bytes would take the member past their quota; with
 * `adding` unknown yet (before an upload is read), when the quota is already used up.
 */
export function assertRoomFor(db: Db | DbTransaction, userId: number, adding: number | null, quotaBytes: number, field: string) {
  const used = storageUsed(db, userId);
  if (adding === null ? used < quotaBytes : used + adding <= quotaBytes) return;
  const message = `Your photos not yet published use ${mb(used)} of your ${mb(quotaBytes)}${adding === null ? '' : `; this upload needs ${mb(adding)} more`}. Delete photos from drafts you no longer need, or wait until a moderator publishes your submissions.`;
  throw new AppError('storage_quota', message, 413, { [field]: message });
}
