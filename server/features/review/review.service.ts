import { and, asc, eq } from 'drizzle-orm';
import type { Db, DbTransaction } from '../../db/client';
import { chassis, parts, reviewEvents, reviewReasonTemplates, revisions, swaps, users } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';
import { stripHtml } from '../../lib/sanitize';
import {
  correctionApproved,
  submissionApproved,
  submissionDeclined,
  submissionSentBack,
} from '../../mail/messages';
import type { SessionUser } from '../../middleware/require-role';
import { revisionStatusLabels } from '../../../shared/schemas/enums';
import type { ReasonTemplate, ReviewDetail, SubmissionView } from '../../../shared/schemas/submissions';
import type { SwapData, SwapPart } from '../../../shared/schemas/swap-data';
import { personRef } from '../swaps/swap-views';
import { behindConflict, checksFor, loadRevision, submissionView, type LoadedRevision } from '../submissions/submission-views';
import { removeFiles, removeRevision, type SubmissionDeps } from '../submissions/submissions.service';
import { slugify, uniqueSlug } from '../../lib/slugs';
import { slugAfterApproval } from '../swaps/swap-slugs';
import { listTakedowns as takedownsOfRevision } from '../takedowns/takedowns.service';
import { claimsOn, endClaim, heldByOther } from './review-claims.service';
import { resolveFlagsAnsweredBy } from '../flags/flags.service';

export type ReviewDeps = SubmissionDeps;
export type Decision = 'approved' | 'sent_back' | 'declined';
type Tx = DbTransaction;

function reviewable(db: Db, revisionId: number): LoadedRevision {
  const row = loadRevision(db, revisionId);
  // drafts stay private to their author, even from the desk
  if (!row || row.revision.status === 'draft') throw AppError.notFound('That submission');
  return row;
}

export function reviewDetail(deps: ReviewDeps, viewer: SessionUser, revisionId: number): ReviewDetail {
  const { db } = deps;
  const row = reviewable(db, revisionId);
  const currentRow =
    row.swap.currentRevisionId !== null && row.swap.currentRevisionId !== row.revision.id
      ? db
          .select({ number: revisions.number, data: revisions.data, body: revisions.body })
          .from(revisions)
          .where(eq(revisions.id, row.swap.currentRevisionId))
          .get()
      : undefined;
  const history = db
    .select({ event: reviewEvents, actor: users })
    .from(reviewEvents)
    .innerJoin(users, eq(users.id, reviewEvents.actorId))
    .where(eq(reviewEvents.revisionId, revisionId))
    .orderBy(asc(reviewEvents.at), asc(reviewEvents.id))
    .all();
  const revision = submissionView(db, row, viewer);
  const basedOn =
    revision.behind && revision.basedOn
      ? db
          .select({ number: revisions.number, data: revisions.data, body: revisions.body })
          .from(revisions)
          .where(eq(revisions.id, revision.basedOn.revisionId))
          .get()
      : undefined;
  return {
    revision,
    checks: checksFor(db, row),
    current: currentRow ?? null,
    basedOn: basedOn ?? null,
    history: history.map((h) => ({
      action: h.event.action,
      actor: personRef(h.actor),
      note: h.event.note,
      at: h.event.at.toISOString(),
    })),
    canDecide: row.revision.status === 'in_review' && row.revision.authorId !== viewer.id,
    claim:
      row.revision.status === 'in_review'
        ? (claimsOn(db, [revisionId], viewer.id, deps.clock.now()).get(revisionId) ?? null)
        : null,
    takedowns: takedownsOfRevision(db, row.revision.id),
    canRevertTakedowns: viewer.role === 'admin',
  };
}

function assertDecidable(actor: SessionUser, row: LoadedRevision) {
  if (row.revision.authorId === actor.id)
    throw AppError.forbidden('You cannot decide on your own submission; another moderator has to review it.');
  if (row.revision.status !== 'in_review') {
    throw AppError.conflict(
      `Only a revision at the review desk can be decided; this one is ${revisionStatusLabels[row.revision.status].toLowerCase()}.`,
    );
  }
}

const partNumberKey = (pn: string) => pn.toLowerCase().replace(/[^a-z0-9]/g, '');

/** A catalogue part of the same kind sharing a part number, if there is one. */
function findCataloguePart(tx: Tx, line: SwapPart): number | null {
  const keys = new Set(line.partNumbers.map(partNumberKey).filter(Boolean));
  if (keys.size === 0) return null;
  const candidates = tx
    .select({ id: parts.id, partNumbers: parts.partNumbers })
    .from(parts)
    .where(eq(parts.kind, line.kind))
    .all();
  return candidates.find((c) => c.partNumbers.some((pn) => keys.has(partNumberKey(pn))))?.id ?? null;
}

/** New parts of an approved revision join the catalogue; the revision's lines then point at them. */
function addNewParts(tx: Tx, now: Date, data: SwapData): SwapData {
  const lines = data.parts.map((line) => {
    if (line.partId) return line;
    const existing = findCataloguePart(tx, line);
    if (existing) return { ...line, partId: existing };
    const created = tx
      .insert(parts)
      .values({
        slug: uniqueSlug(tx, parts, slugify(`${line.maker} ${line.name}`, 70)),
        kind: line.kind,
        name: line.name,
        maker: line.maker,
        partNumbers: line.partNumbers,
        specs: {},
        cameOn: line.cameOn,
        notes: line.notes,
        createdAt: now,
        updatedAt: now,
      })
      .returning({ id: parts.id })
      .get();
    return { ...line, partId: created.id };
  });
  return { ...data, parts: lines };
}

/** The author hears of the approval; when it was a correction, the swap's original author too. */
function tellApproved(deps: ReviewDeps, tx: Tx, row: LoadedRevision, note: string) {
  const title = row.revision.data.title;
  const { author } = row;
  deps.mailer.queue(
    tx,
    author,
    submissionApproved({
      appUrl: deps.appUrl,
      name: author.name || author.login,
      title,
      slug: row.swap.slug,
      number: row.revision.number,
      note,
    }),
  );
  if (row.swap.authorId === author.id) return;
  const original = tx.select().from(users).where(eq(users.id, row.swap.authorId)).get();
  if (!original) return;
  deps.mailer.queue(
    tx,
    original,
    correctionApproved({
      appUrl: deps.appUrl,
      name: original.name || original.login,
      title,
      slug: row.swap.slug,
      number: row.revision.number,
      correctedBy: author.name || author.login,
    }),
  );
}

export function approve(deps: ReviewDeps, actor: SessionUser, revisionId: number, note: string): SubmissionView {
  const { db, clock } = deps;
  const row = reviewable(db, revisionId);
  assertDecidable(actor, row);
  const now = clock.now();
  const cleanNote = stripHtml(note);
  db.transaction((tx) => {
    const held = heldByOther(tx, actor, revisionId, now);
    if (held) throw held;
    // the swap as it is now, inside the write: approving a correction that started from an older revision
    // than the current one would put back what the newer approval changed
    const swap = tx.select().from(swaps).where(eq(swaps.id, row.swap.id)).get()!;
    const behind = behindConflict(tx as unknown as Db, { revision: row.revision, swap }, 'approve');
    if (behind) throw behind;
    const previous = swap.currentRevisionId
      ? tx.select().from(revisions).where(eq(revisions.id, swap.currentRevisionId)).get()
      : undefined;
    const changed = tx
      .update(revisions)
      .set({
        status: 'approved',
        data: addNewParts(tx, now, row.revision.data),
        reviewedAt: now,
        reviewedById: actor.id,
        reviewNote: cleanNote || null,
        updatedAt: now,
      })
      .where(and(eq(revisions.id, revisionId), eq(revisions.status, 'in_review')))
      .run().changes;
    if (!changed) throw AppError.conflict('Another moderator decided on this revision a moment ago.');
    if (previous) {
      tx.update(revisions).set({ status: 'superseded', updatedAt: now }).where(eq(revisions.id, previous.id)).run();
      tx.insert(reviewEvents)
        .values({
          revisionId: previous.id,
          actorId: actor.id,
          action: 'superseded',
          note: `Replaced by revision ${row.revision.number}.`,
          at: now,
        })
        .run();
    }
    tx.update(swaps).set({ currentRevisionId: revisionId, updatedAt: now }).where(eq(swaps.id, swap.id)).run();
    const slug = slugAfterApproval(tx, swap, previous?.data.title ?? null, row.revision.data.title, now);
    tx.update(chassis)
      .set({ proposed: false, updatedAt: now })
      .where(and(eq(chassis.id, swap.chassisId), eq(chassis.proposed, true)))
      .run();
    tx.insert(reviewEvents).values({ revisionId, actorId: actor.id, action: 'approved', note: cleanNote, at: now }).run();
    endClaim(tx, revisionId);
    tellApproved(deps, tx, { ...row, swap: { ...row.swap, slug } }, cleanNote);
    resolveFlagsAnsweredBy(deps, tx, revisionId, row.revision.number, now);
  });
  return submissionView(db, loadRevision(db, revisionId)!, actor);
}

function refuse(tx: Tx, actor: SessionUser, revisionId: number, action: 'sent_back' | 'declined', note: string, now: Date) {
  const held = heldByOther(tx, actor, revisionId, now);
  if (held) throw held;
  const changed = tx
    .update(revisions)
    .set({ status: action, reviewedAt: now, reviewedById: actor.id, reviewNote: note, updatedAt: now })
    .where(and(eq(revisions.id, revisionId), eq(revisions.status, 'in_review')))
    .run().changes;
  if (!changed) throw AppError.conflict('Another moderator decided on this revision a moment ago.');
  tx.insert(reviewEvents).values({ revisionId, actorId: actor.id, action, note, at: now }).run();
  endClaim(tx, revisionId);
}

function tellRefused(
  deps: ReviewDeps,
  tx: Tx,
  row: LoadedRevision,
  action: 'sent_back' | 'declined',
  reasons: string,
  removed = false,
) {
  const { author } = row;
  const base = { appUrl: deps.appUrl, name: author.name || author.login, title: row.revision.data.title, reasons };
  deps.mailer.queue(
    tx,
    author,
    action === 'sent_back'
      ? submissionSentBack({ ...base, revisionId: row.revision.id })
      : submissionDeclined({ ...base, removed }),
  );
}

/**
 * A declined new swap on a chassis it proposed is removed with that chassis: a proposed chassis is never
 * public, and once its submission is declined nothing keeps it. Returns the photo files to remove after
 * the commit, or null when the revision stays (as every other declined revision does, with its history).
 */
function removeIfDeclinedProposal(tx: Tx, row: LoadedRevision): string[] | null {
  if (row.swap.currentRevisionId !== null || !row.chassis.proposed) return null;
  return removeRevision(tx, row);
}

/** Send back (changes requested) or decline; both need the reason the member will read. */
export async function sendBackOrDecline(
  deps: ReviewDeps,
  actor: SessionUser,
  revisionId: number,
  action: 'sent_back' | 'declined',
  note: string,
): Promise<SubmissionView> {
  const { db, clock } = deps;
  const row = reviewable(db, revisionId);
  assertDecidable(actor, row);
  const reasons = requireReason(note);
  const { view, files } = db.transaction((tx) => {
    refuse(tx, actor, revisionId, action, reasons, clock.now());
    // the answer describes the revision as decided, even when it is removed below
    const decided = submissionView(tx as unknown as Db, loadRevision(tx as unknown as Db, revisionId)!, actor);
    const removed = action === 'declined' ? removeIfDeclinedProposal(tx, row) : null;
    tellRefused(deps, tx, row, action, reasons, removed !== null);
    return { view: decided, files: removed ?? [] };
  });
  await removeFiles(deps.storage, files);
  return view;
}

function requireReason(note: string): string {
  const clean = stripHtml(note).trim();
  if (clean.length < 3)
    throw AppError.invalid('Give the reason the member will read.', { note: 'Give the reason the member will read.' });
  return clean;
}

/** Several obvious spam submissions declined at once with one reason: all of them or none. */
export async function bulkDecline(deps: ReviewDeps, actor: SessionUser, revisionIds: number[], note: string): Promise<number[]> {
  const { db, clock } = deps;
  const ids = [...new Set(revisionIds)];
  const reasons = requireReason(note);
  const rows = ids.map((id) => loadRevision(db, id));
  const fields: Record<string, string> = {};
  rows.forEach((row, i) => {
    if (!row || row.revision.status === 'draft') fields[`revisionIds.${i}`] = `Revision ${ids[i]} was not found.`;
    else if (row.revision.authorId === actor.id)
      fields[`revisionIds.${i}`] = `Revision ${ids[i]} is your own; another moderator has to decide on it.`;
    else if (row.revision.status !== 'in_review')
      fields[`revisionIds.${i}`] = `Revision ${ids[i]} is ${row.revision.status.replace('_', ' ')}, not in review.`;
    else {
      const held = heldByOther(db, actor, ids[i]!, clock.now());
      if (held) fields[`revisionIds.${i}`] = `Revision ${ids[i]}: ${held.message}`;
    }
  });
  if (Object.keys(fields).length)
    throw new AppError('not_decidable', 'Some of these revisions cannot be declined; nothing was changed.', 409, fields);
  const now = clock.now();
  const files = db.transaction((tx) =>
    ids.flatMap((id, i) => {
      refuse(tx, actor, id, 'declined', reasons, now);
      const removed = removeIfDeclinedProposal(tx, rows[i]!);
      tellRefused(deps, tx, rows[i]!, 'declined', reasons, removed !== null);
      return removed ?? [];
    }),
  );
  await removeFiles(deps.storage, files);
  return ids;
}

// --- reason templates ---

const templateOf = (t: typeof reviewReasonTemplates.$inferSelect): ReasonTemplate => ({ id: t.id, label: t.label, text: t.text });

export function listTemplates(db: Db): ReasonTemplate[] {
  return db
    .select()
    .from(reviewReasonTemplates)
    .orderBy(asc(reviewReasonTemplates.label), asc(reviewReasonTemplates.id))
    .all()
    .map(templateOf);
}

export function createTemplate(deps: ReviewDeps, input: { label: string; text: string }): ReasonTemplate {
  const now = deps.clock.now();
  return templateOf(
    deps.db
      .insert(reviewReasonTemplates)
      .values({ label: stripHtml(input.label), text: stripHtml(input.text), createdAt: now, updatedAt: now })
      .returning()
      .get(),
  );
}

export function updateTemplate(deps: ReviewDeps, id: number, input: { label: string; text: string }): ReasonTemplate {
  const row = deps.db
    .update(reviewReasonTemplates)
    .set({ label: stripHtml(input.label), text: stripHtml(input.text), updatedAt: deps.clock.now() })
    .where(eq(reviewReasonTemplates.id, id))
    .returning()
    .get();
  if (!row) throw AppError.notFound('That reason template');
  return templateOf(row);
}

export function deleteTemplate(db: Db, id: number) {
  if (!db.delete(reviewReasonTemplates).where(eq(reviewReasonTemplates.id, id)).run().changes)
    throw AppError.notFound('That reason template');
}
