import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { revisions, swaps } from '../../db/schema/index';
import { compareRevisions, summariseChanges } from '../../../shared/revision-changes';
import type { NewerRevision } from '../../../shared/schemas/shops';

/**
 * "A newer revision exists" for something pinned to `revisionId` (a shop link, a plan), with one line on
 * what changed; null while it is still current.
 */
export function newerRevisionOf(
  db: Db,
  swap: typeof swaps.$inferSelect,
  revisionId: number,
  cache = new Map<string, NewerRevision | null>(),
): NewerRevision | null {
  if (swap.currentRevisionId === null || swap.currentRevisionId === revisionId) return null;
  const key = `${revisionId}:${swap.currentRevisionId}`;
  if (cache.has(key)) return cache.get(key)!;
  const [pinned, current] = [revisionId, swap.currentRevisionId].map((id) =>
    db.select().from(revisions).where(eq(revisions.id, id)).get()!,
  );
  const result =
    current.number > pinned.number
      ? {
          number: current.number,
          summary: summariseChanges(compareRevisions(pinned, current)),
        }
      : null;
  cache.set(key, result);
  return result;
}
