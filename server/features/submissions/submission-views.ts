import { and, eq, inArray, ne } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, revisions, revisionPhotos, swaps, users } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';
import { canSeeUnpublishedRevision } from '../../../shared/roles';
import type { SessionUser } from '../../middleware/require-role';
import type { SubmissionView, CheckResult } from '../../../shared/schemas/submissions';
import type { RevisionStatus } from '../../../shared/schemas/enums';
import type { SwapData } from '../../../shared/schemas/swap-data';
import { automaticChecks, sameDonorCaliper } from '../../../shared/review-checks';
import { chassisFigures } from '../../../shared/schemas/vehicle';
import { chassisView, iso, personRef, photosOf } from '../swaps/swap-views';

// Loading one revision with its swap, chassis and author, and the rules on who may see or change it.
// Shared by the submissions and review services.

export type RevisionRow = typeof revisions.$inferSelect;
export type SwapRow = typeof swaps.$inferSelect;
export type ChassisRow = typeof chassis.$inferSelect;
export type UserRow = typeof users.$inferSelect;
export type LoadedRevision = { revision: RevisionRow; swap: SwapRow; chassis: ChassisRow; author: UserRow };

export const editableStatuses: readonly RevisionStatus[] = ['draft', 'sent_back'];

export function loadRevision(db: Db, id: number): LoadedRevision | null {
  return (
    db
      .select({ revision: revisions, swap: swaps, chassis, author: users })
      .from(revisions)
      .innerJoin(swaps, eq(swaps.id, revisions.swapId))
      .innerJoin(chassis, eq(chassis.id, swaps.chassisId))
      .innerJoin(users, eq(users.id, revisions.authorId))
      .where(eq(revisions.id, id))
      .get() ?? null
  );
}

/** The revision, if the user is its author or (once it was sent to review) a reviewer; everyone else gets the same 404 as for a missing one. */
export function revisionFor(db: Db, user: SessionUser, id: number): LoadedRevision {
  const row = loadRevision(db, id);
  if (!row || !canSeeUnpublishedRevision(user, row.revision)) throw AppError.notFound('That submission');
  return row;
}

const lockedMessages: Partial<Record<RevisionStatus, string>> = {
  in_review: 'This revision is in review and locked until a moderator decides; you can edit it again if it is sent back.',
  approved: 'Approved revisions never change. Propose a correction instead: it starts a new revision of the swap.',
  superseded: 'This revision was replaced by a newer approved one and never changes.',
  declined: 'This revision was declined and can no longer be edited. Start a new submission instead.',
};

/** Only the author changes a revision, and only while it is a draft or sent back. */
export function assertEditable(user: SessionUser, row: LoadedRevision) {
  if (row.revision.authorId !== user.id) throw AppError.forbidden('Only the author of this revision can change it.');
  const message = lockedMessages[row.revision.status];
  if (message) throw AppError.conflict(message);
}

export function submissionView(db: Db, row: LoadedRevision, viewer?: SessionUser): SubmissionView {
  const r = row.revision;
  return {
    id: r.id,
    swapId: row.swap.id,
    swapSlug: row.swap.slug,
    number: r.number,
    status: r.status,
    isCorrection: r.number > 1,
    axle: row.swap.axle,
    category: row.swap.category,
    chassis: chassisView(row.chassis),
    data: r.data,
    body: r.body,
    photos: photosOf(db, [r.id]).get(r.id) ?? [],
    author: personRef(row.author),
    reviewNote: r.reviewNote,
    submittedAt: iso(r.submittedAt),
    reviewedAt: iso(r.reviewedAt),
    updatedAt: r.updatedAt.toISOString(),
    editable: Boolean(viewer && viewer.id === r.authorId && editableStatuses.includes(r.status)),
    // a notice stands while nothing was saved after it
    expiresAt:
      r.status === 'draft' && r.expiresAt && r.expiryWarnedAt && r.updatedAt < r.expiryWarnedAt
        ? r.expiresAt.toISOString()
        : null,
  };
}

/** Approved swaps on the same chassis and axle whose current revision has the same donor caliper. */
export function likelyDuplicates(db: Db, swap: SwapRow, data: SwapData): { slug: string; title: string }[] {
  const candidates = db
    .select({ slug: swaps.slug, data: revisions.data })
    .from(swaps)
    .innerJoin(revisions, eq(revisions.id, swaps.currentRevisionId))
    .where(and(eq(swaps.chassisId, swap.chassisId), eq(swaps.axle, swap.axle), ne(swaps.id, swap.id)))
    .all();
  return candidates.filter((c) => sameDonorCaliper(data, c.data)).map((c) => ({ slug: c.slug, title: c.data.title }));
}

export function photoCounts(db: Db, revisionIds: number[]): Map<number, number> {
  const counts = new Map<number, number>();
  if (revisionIds.length === 0) return counts;
  for (const p of db
    .select({ revisionId: revisionPhotos.revisionId })
    .from(revisionPhotos)
    .where(inArray(revisionPhotos.revisionId, revisionIds))
    .all()) {
    counts.set(p.revisionId, (counts.get(p.revisionId) ?? 0) + 1);
  }
  return counts;
}

export function checksFor(db: Db, row: LoadedRevision, photoCount?: number): CheckResult[] {
  return automaticChecks({
    data: row.revision.data,
    body: row.revision.body,
    photoCount: photoCount ?? photoCounts(db, [row.revision.id]).get(row.revision.id) ?? 0,
    chassis: {
      wheelBoltThread: row.chassis.wheelBoltThread,
      figures: chassisFigures({ ...row.chassis, vehicle: row.chassis.vehicle ?? null }),
    },
    axle: row.swap.axle,
    category: row.swap.category,
    duplicates: likelyDuplicates(db, row.swap, row.revision.data),
  });
}
