import { and, eq, isNull, sql, type SQL } from 'drizzle-orm';
import type { Db, DbTransaction } from '../../db/client';
import { revisionPhotos, revisions, takedowns } from '../../db/schema/index';

// What an active takedown hides, as conditions the read queries use. A photo goes by its content within
// its swap (so a correction's copy of it goes too); a write-up goes for its own revision only.

/** True for a revision_photos row (joined with its revision) whose photo is taken down. */
export const photoIsTakenDown: SQL<boolean> = sql<boolean>`exists (
  select 1 from ${takedowns} t
  where t.target = 'photo' and t.reverted_at is null
    and t.swap_id = ${revisions.swapId} and t.photo_sha256 = ${revisionPhotos.sha256})`;

export function bodyIsTakenDown(db: Db | DbTransaction, revisionId: number): boolean {
  return Boolean(
    db
      .select({ id: takedowns.id })
      .from(takedowns)
      .where(and(eq(takedowns.revisionId, revisionId), eq(takedowns.target, 'body'), isNull(takedowns.revertedAt)))
      .get(),
  );
}
