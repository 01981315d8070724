import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { fittedReports, revisionPhotos, revisions } from '../../db/schema/index';
import { can, canSeeUnpublishedRevision } from '../../../shared/roles';
import type { SessionUser } from '../../middleware/require-role';
import { AppError } from '../../lib/app-error';
import { photoIsTakenDown } from '../takedowns/takedown-rules';

const publicStatuses = new Set(['approved', 'superseded']);

/**
 * How long a public photo may be kept without asking again. What an address holds never changes (a new
 * photo is a new id), so a reader's browser keeps it a year. Photos can be taken down and fitted reports
 * hidden, so a shared cache, which serves everyone, asks again after five minutes and then gets 410/404.
 */
export const PUBLIC_PHOTO_CACHE = 'public, max-age=31536000, s-maxage=300, immutable';

const takenDown = () => new AppError('taken_down', 'A moderator took this photo down.', 410);

/**
 * Which stored file a reader may fetch for a photo id. Photos of approved (or superseded) revisions are
 * public; others only reach their author and reviewers. Unknown and hidden photos are the same 404; a
 * photo a moderator took down answers 410 to readers.
 */
export function resolveMedia(db: Db, fileId: string, viewer: SessionUser | undefined) {
  const row = db
    .select({ photo: revisionPhotos, status: revisions.status, authorId: revisions.authorId, takenDown: photoIsTakenDown })
    .from(revisionPhotos)
    .innerJoin(revisions, eq(revisions.id, revisionPhotos.revisionId))
    .where(eq(revisionPhotos.fileId, fileId))
    .get();
  if (!row) return resolveFittedReportPhoto(db, fileId, viewer);
  // a photo a moderator took down is gone for readers (410, never stored by a cache); its author and the
  // review desk still get it privately, to see what was taken down and for an admin to put it back
  if (row.takenDown) {
    if (!(viewer && (viewer.id === row.authorId || can(viewer.role, 'review')))) throw takenDown();
    return { fileId: row.photo.fileId, public: false };
  }
  const visible = publicStatuses.has(row.status) || canSeeUnpublishedRevision(viewer, row);
  if (!visible) throw AppError.notFound('That photo');
  return { fileId: row.photo.fileId, public: publicStatuses.has(row.status) };
}

/**
 * A fitted report's photo is public while the report is: live and not hidden. A held report's photo (a new
 * member's, waiting for a moderator) and a hidden one reach only its member and reviewers.
 */
function resolveFittedReportPhoto(db: Db, fileId: string, viewer: SessionUser | undefined) {
  const report = db
    .select({ userId: fittedReports.userId, hiddenAt: fittedReports.hiddenAt, state: fittedReports.state })
    .from(fittedReports)
    .where(eq(fittedReports.photoFileId, fileId))
    .get();
  if (!report) throw AppError.notFound('That photo');
  const shown = report.hiddenAt === null && report.state === 'live';
  if (!shown && !(viewer && (viewer.id === report.userId || can(viewer.role, 'review')))) throw AppError.notFound('That photo');
  return { fileId, public: shown };
}
