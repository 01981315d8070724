import { and, eq, inArray, ne, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { revisions } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';

// One title per member among their open new swaps (draft, sent back, at the desk): two drafts that read alike get
// mixed up in "my submissions" and on the desk. A correction is known by its swap and keeps that swap's title
// (which a swap on another chassis may share), so it is not held to this. The partial unique index `revisions_one_title_per_author_uq`
// holds the rule when requests race; this gives the same answer earlier and turns the index's refusal into it.

const openStatuses = ['draft', 'sent_back', 'in_review'] as const;

function titleConflictError(title: string, other: { id: number; status: string }): AppError {
  const where =
    other.status === 'in_review' ? 'at the review desk' : other.status === 'sent_back' ? 'back for rework' : 'a draft';
  const message = `You already have an open submission called “${title}” (${where}). Give this one a title of its own.`;
  return new AppError('title_taken', message, 409, { 'data.title': message });
}

/** The member's other open revision with this title (case ignored), if any. */
function otherWithTitle(db: Db, authorId: number, title: string, exceptRevisionId?: number) {
  return db
    .select({ id: revisions.id, status: revisions.status })
    .from(revisions)
    .where(
      and(
        eq(revisions.authorId, authorId),
        inArray(revisions.status, [...openStatuses]),
        eq(revisions.number, 1),
        sql`lower(json_extract(${revisions.data}, '$.title')) = lower(${title})`,
        exceptRevisionId === undefined ? undefined : ne(revisions.id, exceptRevisionId),
      ),
    )
    .get();
}

/** Throws the 409 when another open revision of the member already has this title. */
export function assertTitleFree(db: Db, authorId: number, title: string, exceptRevisionId?: number) {
  const other = otherWithTitle(db, authorId, title, exceptRevisionId);
  if (other) throw titleConflictError(title, other);
}

/** The 409 for an error thrown by the unique index (a request that raced past assertTitleFree); null for any other error. */
export function titleConflictFrom(err: unknown, db: Db, authorId: number, title: string, exceptRevisionId?: number) {
  if (!(err instanceof Error && err.message.includes('revisions_one_title_per_author_uq'))) return null;
  const other = otherWithTitle(db, authorId, title, exceptRevisionId);
  return titleConflictError(title, other ?? { id: 0, status: 'draft' });
}
