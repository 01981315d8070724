import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { revisionPhotos, revisions } from '../../db/schema/index';
import { can } from '../../../shared/roles';
import type { SessionUser } from '../../middleware/require-role';
import { AppError } from '../../lib/app-error';

const publicStatuses = new Set(['approved', 'superseded']);

/**
 * Which stored file a reader may fetch for a photo id. Photos of approved (or superseded) revisions are
 * public; others only reach their author and reviewers. Unknown and hidden photos are the same 404.
 */
export function resolveMedia(db: Db, fileId: string, viewer: SessionUser | undefined) {
  const row = db
    .select({ photo: revisionPhotos, status: revisions.status, authorId: revisions.authorId })
    .from(revisionPhotos)
    .innerJoin(revisions, eq(revisions.id, revisionPhotos.revisionId))
    .where(eq(revisionPhotos.fileId, fileId))
    .get();
  if (!row) throw AppError.notFound('That photo');
  const visible = publicStatuses.has(row.status) || (viewer && (viewer.id === row.authorId || can(viewer.role, 'review')));
  if (!visible) throw AppError.notFound('That photo');
  return { fileId: row.photo.fileId, public: publicStatuses.has(row.status) };
}
