import { and, desc, eq, inArray, lt } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, flags, revisions, revisionPhotos, swaps, users } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';
import { canSeeUnpublishedRevision } from '../../../shared/roles';
import type { SessionUser } from '../../middleware/require-role';
import type { SubmissionView, CheckResult, RevisionRef } from '../../../shared/schemas/submissions';
import type { RevisionStatus } from '../../../shared/schemas/enums';
import type { SwapData } from '../../../shared/schemas/swap-data';
import { automaticChecks, sameDonorCaliper } from '../../../shared/review-checks';
import { chassisFigures } from '../../../shared/schemas/vehicle';
import { mergeThreeWay, type MergeOutcome } from '../../../shared/revision-merge';
import { chassisView, iso, personRef, photosOf } from '../swaps/swap-views';
import { bodyIsTakenDown } from '../takedowns/takedown-rules';

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
  in_review:
    'This revision is at the review desk and locked until a moderator decides; you can edit it again if it is sent back for rework.',
  approved: 'Published revisions never change. Propose a correction instead: it starts a new revision of the swap.',
  superseded: 'This revision was replaced by a newer published one and never changes.',
  declined: 'This revision was not published and can no longer be edited. Start a new submission instead.',
};

/** Only the author changes a revision, and only while it is a draft or sent back. */
export function assertEditable(user: SessionUser, row: LoadedRevision) {
  if (row.revision.authorId !== user.id) throw AppError.forbidden('Only the author of this revision can change it.');
  const message = lockedMessages[row.revision.status];
  if (message) throw AppError.conflict(message);
}

const openStatuses: readonly RevisionStatus[] = ['draft', 'sent_back', 'in_review'];

function revisionRef(db: Db, id: number | null): RevisionRef | null {
  if (id === null) return null;
  return (
    db.select({ revisionId: revisions.id, number: revisions.number }).from(revisions).where(eq(revisions.id, id)).get() ?? null
  );
}

/**
 * The approved revision a correction started from. Corrections written before this was recorded are taken
 * to have started from the newest approved revision numbered below them, the swap's current one when they
 * were created unless an older correction was approved later.
 */
export function baseOf(db: Db, revision: Pick<RevisionRow, 'basedOnRevisionId' | 'swapId' | 'number'>): RevisionRef | null {
  if (revision.basedOnRevisionId !== null) return revisionRef(db, revision.basedOnRevisionId);
  if (revision.number === 1) return null;
  return (
    db
      .select({ revisionId: revisions.id, number: revisions.number })
      .from(revisions)
      .where(
        and(
          eq(revisions.swapId, revision.swapId),
          lt(revisions.number, revision.number),
          inArray(revisions.status, ['approved', 'superseded']),
        ),
      )
      .orderBy(desc(revisions.number))
      .get() ?? null
  );
}

/**
 * An open correction is behind when the swap's current revision is not the one it started from: approving
 * it as it is would put back what the newer approval changed.
 */
export function baseState(db: Db, row: Pick<LoadedRevision, 'revision' | 'swap'>): Pick<SubmissionView, 'basedOn' | 'behind'> {
  const r = row.revision;
  const basedOn = baseOf(db, r);
  const currentId = row.swap.currentRevisionId;
  if (!openStatuses.includes(r.status) || currentId === null || currentId === r.id || currentId === basedOn?.revisionId)
    return { basedOn, behind: null };
  const current = revisionRef(db, currentId);
  return { basedOn, behind: current ? { current } : null };
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
    bodyTakenDown: bodyIsTakenDown(db, r.id),
    // what the author has not finished is theirs alone
    incompleteRows: viewer?.id === r.authorId ? r.incompleteRows : [],
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
    changeNote: r.changeNote,
    answersFlags: db
      .select({ id: flags.id, kind: flags.kind, reason: flags.reason, status: flags.status })
      .from(flags)
      .where(eq(flags.correctionRevisionId, r.id))
      .orderBy(flags.id)
      .all(),
    ...baseState(db, row),
  };
}

export type DuplicateCandidate = { swapId: number; slug: string; data: SwapData };

/** Approved swaps (current revisions) on one chassis and axle: what a new record is compared with for duplicates. */
export function duplicateCandidates(db: Db, chassisId: number, axle: SwapRow['axle']): DuplicateCandidate[] {
  return db
    .select({ swapId: swaps.id, slug: swaps.slug, data: revisions.data })
    .from(swaps)
    .innerJoin(revisions, eq(revisions.id, swaps.currentRevisionId))
    .where(and(eq(swaps.chassisId, chassisId), eq(swaps.axle, axle)))
    .all();
}

/** Approved swaps on the same chassis and axle whose current revision has the same donor caliper. */
export function likelyDuplicates(
  db: Db,
  swap: SwapRow,
  data: SwapData,
  candidates: DuplicateCandidate[] = duplicateCandidates(db, swap.chassisId, swap.axle),
): { slug: string; title: string }[] {
  return candidates
    .filter((c) => c.swapId !== swap.id && sameDonorCaliper(data, c.data))
    .map((c) => ({ slug: c.slug, title: c.data.title }));
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

/** `candidates`: the approved swaps on the row's chassis and axle, when the caller already has them (the queue reads them once per chassis) */
export function checksFor(db: Db, row: LoadedRevision, photoCount?: number, candidates?: DuplicateCandidate[]): CheckResult[] {
  return automaticChecks({
    data: row.revision.data,
    body: row.revision.body,
    photoCount: photoCount ?? photoCounts(db, [row.revision.id]).get(row.revision.id) ?? 0,
    chassis: {
      wheelBoltThread: row.chassis.wheelBoltThread,
      figures: chassisFigures({ ...row.chassis, vehicle: row.chassis.vehicle ?? null }),
      centreBoreMm: row.chassis.centreBoreMm,
      wheelFastening: row.chassis.wheelFastening,
    },
    axle: row.swap.axle,
    category: row.swap.category,
    duplicates: likelyDuplicates(db, row.swap, row.revision.data, candidates),
  });
}

type Content = { data: SwapData; body: string };
const contentOf = (db: Db, id: number): Content =>
  db.select({ data: revisions.data, body: revisions.body }).from(revisions).where(eq(revisions.id, id)).get()!;

/** The three-way merge of a behind correction (mine) with the swap's current revision (theirs), from its base. */
export function mergeWithCurrent(
  db: Db,
  row: Pick<LoadedRevision, 'revision'>,
  base: RevisionRef,
  current: RevisionRef,
  choices: Record<string, 'theirs' | 'mine'> = {},
): MergeOutcome<Content> {
  const mine: Content = { data: row.revision.data, body: row.revision.body };
  return mergeThreeWay(contentOf(db, base.revisionId), contentOf(db, current.revisionId), mine, choices);
}

const MAX_FIELDS_LISTED = 40;
const brief = (v: string | null, none: string) => (v === null ? none : v.length > 60 ? `${v.slice(0, 57)}…` : v);

/**
 * The 409 for a correction that is behind the swap's current revision, naming each field the newer approval
 * changed that this correction would put back or also changed; null when it is up to date.
 */
export function behindConflict(
  db: Db,
  row: Pick<LoadedRevision, 'revision' | 'swap'>,
  doing: 'approve' | 'submit',
): AppError | null {
  const { basedOn, behind } = baseState(db, row);
  if (!behind) return null;
  const { current } = behind;
  const fields: Record<string, string> = {
    basedOnRevisionId: basedOn
      ? `This correction started from revision ${basedOn.number}; revision ${current.number} is the current one now.`
      : `Revision ${current.number} was approved after this correction was written.`,
  };
  if (basedOn) {
    const merge = mergeWithCurrent(db, row, basedOn, current);
    const listed = [
      ...merge.taken
        .filter((f) => f.from === 'theirs')
        .map(
          (f) =>
            [
              f.path,
              `Revision ${current.number} changed this (${brief(f.base, 'empty')} → ${brief(f.theirs, 'empty')}); this correction would put ${brief(f.base, 'nothing')} back.`,
            ] as const,
        ),
      ...merge.conflicts.map((f) => [f.path, `Revision ${current.number} and this correction both changed this.`] as const),
    ];
    for (const [path, text] of listed.slice(0, MAX_FIELDS_LISTED)) fields[path] = text;
  }
  const next =
    doing === 'approve'
      ? 'Send it back so its author can bring it up to date; approving it now would undo that revision.'
      : 'Bring it up to date first: the merge keeps both sides’ changes and asks you where they differ.';
  return new AppError(
    'behind_current',
    `Revision ${current.number} of this swap was approved after this correction was started. ${next}`,
    409,
    fields,
  );
}
