import { and, eq, inArray } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { revisions } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';
import type { SessionUser } from '../../middleware/require-role';
import type { RebasePreview, RebaseSubmission, RevisionRef, SubmissionView } from '../../../shared/schemas/submissions';
import {
  assertEditable,
  baseState,
  loadRevision,
  mergeWithCurrent,
  revisionFor,
  submissionView,
  type LoadedRevision,
} from './submission-views';
import { checkPartIds, cleanRecord, type SubmissionDeps } from './submissions.service';

// Bringing a correction up to date with the revision approved since it started: a three-way merge from the
// revision it started from, with the author settling each field both sides changed differently.

function behindRow(db: Db, user: SessionUser, id: number): { row: LoadedRevision; base: RevisionRef; current: RevisionRef } {
  const row = revisionFor(db, user, id);
  if (row.revision.authorId !== user.id) throw AppError.forbidden('Only the author of this correction can bring it up to date.');
  const { basedOn, behind } = baseState(db, row);
  if (!behind || !basedOn)
    throw new AppError('up_to_date', 'This revision already starts from the swap’s current revision.', 409);
  return { row, base: basedOn, current: behind.current };
}

const contentOf = (db: Db, ref: RevisionRef) => ({
  ...ref,
  ...db.select({ data: revisions.data, body: revisions.body }).from(revisions).where(eq(revisions.id, ref.revisionId)).get()!,
});

/** GET /api/submissions/:id/rebase: what the merge takes on its own and what the author has to pick. */
export function rebasePreview(db: Db, user: SessionUser, id: number): RebasePreview {
  const { row, base, current } = behindRow(db, user, id);
  const merge = mergeWithCurrent(db, row, base, current);
  return {
    revision: { revisionId: row.revision.id, number: row.revision.number },
    base: contentOf(db, base),
    current: contentOf(db, current),
    mine: { data: row.revision.data, body: row.revision.body },
    taken: merge.taken,
    conflicts: merge.conflicts,
  };
}

/**
 * POST /api/submissions/:id/rebase: the merged record replaces the draft and the correction now starts from
 * the current revision. Refused when a conflict has no choice, when the swap moved again since the author
 * looked (they merge with what they saw, nothing else), or when the merged record does not validate.
 */
export function rebaseSubmission(deps: SubmissionDeps, user: SessionUser, id: number, input: RebaseSubmission): SubmissionView {
  const { db, clock } = deps;
  const { row, base, current } = behindRow(db, user, id);
  assertEditable(user, row);
  if (input.currentRevisionId !== current.revisionId)
    throw new AppError(
      'record_moved',
      `Revision ${current.number} was approved a moment ago; look at the merge again before bringing your correction up to date.`,
      409,
      { currentRevisionId: `Revision ${current.number} is the current one now.` },
    );
  const merge = mergeWithCurrent(db, row, base, current, input.choices);
  if (merge.unresolved.length)
    throw AppError.invalid(
      'Pick a value for each field both revisions changed.',
      Object.fromEntries(
        merge.unresolved.map((path) => [path, `Revision ${current.number} and your correction both changed this; pick one.`]),
      ),
    );
  const { data, body } = cleanRecord(merge.value.data, merge.value.body);
  checkPartIds(db, data);
  const changed = db
    .update(revisions)
    .set({ data, body, basedOnRevisionId: current.revisionId, updatedAt: clock.now() })
    .where(and(eq(revisions.id, id), inArray(revisions.status, ['draft', 'sent_back'])))
    .run().changes;
  if (!changed) throw AppError.conflict('This revision was just sent to review and is locked; it was not changed.');
  return submissionView(db, loadRevision(db, id)!, user);
}
