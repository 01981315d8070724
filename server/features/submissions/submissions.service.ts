import { and, desc, eq, inArray, max, ne, not, sql } from 'drizzle-orm';
import { ZodError } from 'zod';
import type { Db } from '../../db/client';
import { chassis, parts, reviewClaims, reviewEvents, revisionPhotos, revisions, swaps } from '../../db/schema/index';
import type { StockBrakes, StockWheel } from '../../db/schema/catalogue';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import type { Mailer } from '../../mail/mailer';
import { newFileId, type Storage } from '../../storage/disk-storage';
import { AppError } from '../../lib/app-error';
import { stripHtml, stripHtmlDeep } from '../../lib/sanitize';
import { submissionReceived } from '../../mail/messages';
import type { SessionUser } from '../../middleware/require-role';
import { swapDataSchema, type SwapData } from '../../../shared/schemas/swap-data';
import { neutraliseDeep } from '../../../shared/schemas/text';
import type {
  IncompleteRow,
  IncompleteRowList,
  CreateSubmission,
  MySubmissionItem,
  NewChassis,
  SubmissionView,
  UpdateSubmission,
} from '../../../shared/schemas/submissions';
import { CHANGE_NOTE_MIN, type SubmitSubmission } from '../../../shared/schemas/submissions';
import { answerFlags } from '../flags/flags.service';
import { removePhotoFiles, thumbId } from '../photos/photo-files';
import { slugify, uniqueSlug } from '../../lib/slugs';
import { newSwapSlug, swapSlugBase } from '../swaps/swap-slugs';
import {
  assertEditable,
  behindConflict,
  loadRevision,
  revisionFor,
  submissionView,
  type LoadedRevision,
  type SwapRow,
} from './submission-views';
import { photoIsTakenDown } from '../takedowns/takedown-rules';
import { assertTitleFree, titleConflictFrom } from './title-rule';

export type SubmissionDeps = { db: Db; clock: Clock; mailer: Mailer; storage: Storage; logger: Logger; appUrl: string };
type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/**
 * Raw HTML and invisible format characters (bidi overrides and the like) leave every string of the record
 * and the write-up; the cleaned record is checked again.
 */
export function cleanRecord(data: SwapData, body: string): { data: SwapData; body: string } {
  const parsed = swapDataSchema.safeParse(neutraliseDeep(stripHtmlDeep(data)));
  if (!parsed.success) throw new ZodError(parsed.error.issues.map((i) => ({ ...i, path: ['data', ...i.path] })));
  return { data: parsed.data, body: stripHtml(body) };
}

export function checkPartIds(db: Db | Tx, data: SwapData) {
  const ids = [...new Set(data.parts.flatMap((p) => (p.partId ? [p.partId] : [])))];
  if (ids.length === 0) return;
  const known = new Set(
    db
      .select({ id: parts.id })
      .from(parts)
      .where(inArray(parts.id, ids))
      .all()
      .map((r) => r.id),
  );
  const fields: Record<string, string> = {};
  data.parts.forEach((p, i) => {
    if (p.partId && !known.has(p.partId))
      fields[`data.parts.${i}.partId`] = 'That part is not in the catalogue; pick it again or add it as a new part.';
  });
  if (Object.keys(fields).length) throw AppError.invalid('A part refers to a catalogue entry that does not exist.', fields);
}

function catalogueChassisId(db: Db | Tx, id: number): number {
  const row = db.select({ id: chassis.id, proposed: chassis.proposed }).from(chassis).where(eq(chassis.id, id)).get();
  if (!row || row.proposed)
    throw AppError.invalid('That chassis is not in the catalogue.', {
      chassisId: 'Pick a chassis from the list, or propose a new one.',
    });
  return row.id;
}

function chassisValues(input: NewChassis, data: SwapData) {
  const smallest = [...(data.wheel?.testedWheels ?? [])].sort((a, b) => a.diameterIn - b.diameterIn)[0];
  const stockWheel: StockWheel = input.stockWheel ?? {
    diameterIn: smallest?.diameterIn ?? data.wheel?.minDiameterIn ?? 15,
    widthIn: smallest?.widthIn ?? 6,
    offsetMm: smallest?.offsetMm ?? 35,
    tyre: '',
  };
  const before = data.brakes?.before;
  const corner = (c: NonNullable<typeof before>['front'] | undefined): StockBrakes['front'] =>
    c
      ? { ...c, description: 'From the brake figures of the submission that proposed this chassis.' }
      : { kind: 'disc', pistonsPerSideMm: [], rotorDiameterMm: 0, padHeightMm: 0, description: 'Not given yet.' };
  const stockBrakes: StockBrakes = { front: corner(before?.front), rear: corner(before?.rear) };
  const gaps = [
    input.stockWheel ? null : 'stock wheel taken from the submission',
    before ? null : 'stock brakes not given',
  ].filter(Boolean);
  return {
    make: input.make,
    model: input.model,
    code: input.code,
    yearFrom: input.yearFrom,
    yearTo: input.yearTo,
    body: input.body,
    lugCount: input.lugCount,
    pcdMm: input.pcdMm,
    centreBoreMm: input.centreBoreMm,
    wheelBoltThread: input.wheelBoltThread,
    wheelFastening: input.wheelFastening ?? null,
    stockWheel,
    stockBrakes,
    notes: stripHtml(
      [input.notes, gaps.length ? `Proposed with a submission (${gaps.join('; ')}).` : ''].filter(Boolean).join('\n\n'),
    ),
  };
}

function proposeChassis(tx: Tx, clock: Clock, input: NewChassis, data: SwapData): number {
  const now = clock.now();
  const base = slugify(
    input.code.toLowerCase() === input.model.toLowerCase()
      ? `${input.make} ${input.model}`
      : `${input.make} ${input.model} ${input.code}`,
    60,
  );
  return tx
    .insert(chassis)
    .values({
      ...chassisValues(input, data),
      slug: uniqueSlug(tx, chassis, base),
      proposed: true,
      createdAt: now,
      updatedAt: now,
    })
    .returning({ id: chassis.id })
    .get().id;
}

/** A proposed chassis that no swap refers to any more is removed again. */
function dropUnusedProposedChassis(tx: Tx, chassisId: number) {
  const row = tx.select({ proposed: chassis.proposed }).from(chassis).where(eq(chassis.id, chassisId)).get();
  if (!row?.proposed) return;
  const used = tx.select({ id: swaps.id }).from(swaps).where(eq(swaps.chassisId, chassisId)).limit(1).get();
  if (!used) tx.delete(chassis).where(eq(chassis.id, chassisId)).run();
}

const isUniqueViolation = (err: unknown, columns: string) =>
  err instanceof Error && err.message.includes(`UNIQUE constraint failed: ${columns}`);

/** The 409 for a member who already has an open revision (draft, sent back or in review) of this swap, if they have one. */
function openRevisionConflict(db: Db, swapId: number, userId: number): AppError | null {
  const open = db
    .select({ id: revisions.id, number: revisions.number, status: revisions.status })
    .from(revisions)
    .where(
      and(
        eq(revisions.swapId, swapId),
        eq(revisions.authorId, userId),
        inArray(revisions.status, ['draft', 'sent_back', 'in_review']),
      ),
    )
    .get();
  if (!open) return null;
  return new AppError(
    'open_revision',
    `You already have revision ${open.number} of this swap (${open.status.replace('_', ' ')}); continue with that one.`,
    409,
    { swapSlug: `Revision ${open.number} (id ${open.id}) is still open.` },
  );
}

function viewOf(db: Db, id: number, user: SessionUser): SubmissionView {
  return submissionView(db, loadRevision(db, id)!, user);
}

/** A correction keeps its swap's chassis, axle and category; they belong to the swap, not to one revision. */
function refuseSwapLevelChanges(swap: SwapRow, input: Pick<UpdateSubmission, 'chassisId' | 'newChassis' | 'axle' | 'category'>) {
  const fields: Record<string, string> = {};
  const message = 'A correction keeps the swap’s chassis, axle and category.';
  if (input.chassisId !== undefined && input.chassisId !== swap.chassisId) fields.chassisId = message;
  if (input.newChassis) fields.newChassis = message;
  if (input.axle !== undefined && input.axle !== swap.axle) fields.axle = message;
  if (input.category !== undefined && input.category !== swap.category) fields.category = message;
  if (Object.keys(fields).length) throw AppError.invalid(message, fields);
}

/**
 * The approved revision a new correction starts from: the one the member's form was filled from, when the
 * request names it (it may have been superseded since), else the swap's current one.
 */
function correctionBase(db: Db, swap: SwapRow, named: number | undefined): number {
  if (named === undefined || named === swap.currentRevisionId) return swap.currentRevisionId!;
  const row = db
    .select({ swapId: revisions.swapId, status: revisions.status })
    .from(revisions)
    .where(eq(revisions.id, named))
    .get();
  if (!row || row.swapId !== swap.id || !['approved', 'superseded'].includes(row.status))
    throw AppError.invalid('A correction starts from an approved revision of the same swap.', {
      basedOnRevisionId: 'That is not an approved revision of this swap.',
    });
  return named;
}

/** POST /api/submissions: a new swap with its draft revision 1, or with `swapSlug` a draft correction N+1 of an approved swap. */
export async function createSubmission(
  deps: SubmissionDeps,
  user: SessionUser,
  input: CreateSubmission,
): Promise<SubmissionView> {
  const { db, clock, storage } = deps;
  const { data, body } = cleanRecord(input.data, input.body);
  checkPartIds(db, data);
  const now = clock.now();

  if (input.swapSlug) {
    const swap = db.select().from(swaps).where(eq(swaps.slug, input.swapSlug)).get();
    if (!swap || swap.currentRevisionId === null) throw AppError.notFound('That swap');
    refuseSwapLevelChanges(swap, input);
    // a quick answer for the common case; the unique index decides when requests race (below)
    const open = openRevisionConflict(db, swap.id, user.id);
    if (open) throw open;
    const basedOnRevisionId = correctionBase(db, swap, input.basedOnRevisionId);
    // the correction starts with copies of the current revision's photos, so it can change them without touching the approved one
    const copies = await copyPhotos(deps, swap.currentRevisionId);
    try {
      const id = db.transaction((tx) => {
        const last =
          tx
            .select({ n: max(revisions.number) })
            .from(revisions)
            .where(eq(revisions.swapId, swap.id))
            .get()?.n ?? 0;
        const revisionId = tx
          .insert(revisions)
          .values({
            swapId: swap.id,
            number: last + 1,
            basedOnRevisionId,
            authorId: user.id,
            status: 'draft',
            data,
            body,
            incompleteRows: input.incompleteRows,
            changeNote: cleanChangeNote(input.changeNote),
            createdAt: now,
            updatedAt: now,
          })
          .returning({ id: revisions.id })
          .get().id;
        for (const c of copies)
          tx.insert(revisionPhotos)
            .values({ ...c, revisionId, createdAt: now })
            .run();
        return revisionId;
      });
      return viewOf(db, id, user);
    } catch (err) {
      await removeFiles(
        storage,
        copies.map((c) => c.fileId),
      );
      if (isUniqueViolation(err, 'revisions.swap_id, revisions.author_id'))
        throw openRevisionConflict(db, swap.id, user.id) ?? err;
      throw err;
    }
  }

  if (input.chassisId && input.newChassis) {
    throw AppError.invalid('Pick a chassis or propose a new one, not both.', {
      chassisId: 'Pick a chassis or propose a new one, not both.',
    });
  }
  const id = withTitleRule(db, user.id, data.title, undefined, () =>
    db.transaction((tx) => {
      const chassisId = input.chassisId
        ? catalogueChassisId(tx, input.chassisId)
        : proposeChassis(tx, clock, input.newChassis!, data);
      // after the chassis, so a request with several problems hears of the 400 first
      assertTitleFree(db, user.id, data.title);
      const code = tx.select({ code: chassis.code }).from(chassis).where(eq(chassis.id, chassisId)).get()!.code;
      const slug = newSwapSlug(tx, swapSlugBase(code, input.axle!, data.title));
      const swap = tx
        .insert(swaps)
        .values({
          slug,
          chassisId,
          axle: input.axle!,
          category: input.category!,
          authorId: user.id,
          createdAt: now,
          updatedAt: now,
        })
        .returning({ id: swaps.id })
        .get();
      return tx
        .insert(revisions)
        .values({
          swapId: swap.id,
          number: 1,
          authorId: user.id,
          status: 'draft',
          data,
          body,
          incompleteRows: input.incompleteRows,
          createdAt: now,
          updatedAt: now,
        })
        .returning({ id: revisions.id })
        .get().id;
    }),
  );
  return viewOf(db, id, user);
}

/** Runs a write that may give a revision a title, turning the title index's refusal into the 409 with its field. */
export function withTitleRule<T>(
  db: Db,
  authorId: number,
  title: string,
  exceptRevisionId: number | undefined,
  write: () => T,
): T {
  try {
    return write();
  } catch (err) {
    throw titleConflictFrom(err, db, authorId, title, exceptRevisionId) ?? err;
  }
}

export function getSubmission(db: Db, user: SessionUser, id: number): SubmissionView {
  return submissionView(db, revisionFor(db, user, id), user);
}

/** PATCH /api/submissions/:id: autosave of the whole record while it is a draft or sent back. */
export function updateSubmission(deps: SubmissionDeps, user: SessionUser, id: number, input: UpdateSubmission): SubmissionView {
  const { db, clock } = deps;
  const row = revisionFor(db, user, id);
  assertEditable(user, row);
  const { data, body } = cleanRecord(input.data, input.body);
  checkPartIds(db, data);
  const now = clock.now();
  const { swap } = row;
  const swapIsNew = swap.currentRevisionId === null && row.revision.number === 1;
  if (!swapIsNew) refuseSwapLevelChanges(swap, input);
  if (input.chassisId && input.newChassis) {
    throw AppError.invalid('Pick a chassis or propose a new one, not both.', {
      chassisId: 'Pick a chassis or propose a new one, not both.',
    });
  }
  // a new swap's title is the member's own among their open ones (a correction keeps its swap's)
  if (row.revision.number === 1) assertTitleFree(db, row.revision.authorId, data.title, id);

  withTitleRule(db, row.revision.authorId, data.title, id, () =>
    db.transaction((tx) => {
      if (swapIsNew) {
        let chassisId = swap.chassisId;
        if (input.chassisId !== undefined && input.chassisId !== swap.chassisId)
          chassisId = catalogueChassisId(tx, input.chassisId);
        if (input.newChassis) {
          const ownProposal =
            row.chassis.proposed &&
            !tx
              .select({ id: swaps.id })
              .from(swaps)
              .where(and(eq(swaps.chassisId, swap.chassisId), ne(swaps.id, swap.id)))
              .get();
          if (ownProposal)
            tx.update(chassis)
              .set({ ...chassisValues(input.newChassis, data), updatedAt: now })
              .where(eq(chassis.id, swap.chassisId))
              .run();
          else chassisId = proposeChassis(tx, clock, input.newChassis, data);
        }
        tx.update(swaps)
          .set({ chassisId, axle: input.axle ?? swap.axle, category: input.category ?? swap.category, updatedAt: now })
          .where(eq(swaps.id, swap.id))
          .run();
        if (chassisId !== swap.chassisId) dropUnusedProposedChassis(tx, swap.chassisId);
      }
      const changed = tx
        .update(revisions)
        .set({
          data,
          body,
          incompleteRows: input.incompleteRows,
          ...(input.changeNote !== undefined ? { changeNote: cleanChangeNote(input.changeNote) } : {}),
          updatedAt: now,
        })
        .where(and(eq(revisions.id, id), inArray(revisions.status, ['draft', 'sent_back'])))
        .run().changes;
      // the status moved between the check and the write (a submit from another tab)
      if (!changed)
        throw AppError.conflict('This revision was just sent to review and is locked; your last change was not saved.');
    }),
  );
  return viewOf(db, id, user);
}

const listWords: Record<IncompleteRowList, string> = {
  parts: 'Parts',
  calipers: 'Calipers',
  rotors: 'Rotors',
  shims: 'Shims',
  spacers: 'Spacers',
  machining: 'Machining',
  fasteners: 'Fasteners & torque',
  testedWheels: 'Tested wheels',
  costs: 'Costs',
};
const formPathOfRow = (r: IncompleteRow) => `data.${r.list === 'testedWheels' ? 'wheel.testedWheels' : r.list}.${r.index}`;

/** A draft with half-filled rows is kept, but a moderator only ever reads finished ones. */
function refuseIncompleteRows(rows: IncompleteRow[]) {
  if (rows.length === 0) return;
  const first = rows[0]!;
  throw AppError.invalid(
    `${listWords[first.list]}, row ${first.index + 1} is incomplete: finish it or remove it before sending.`,
    Object.fromEntries(rows.map((r) => [formPathOfRow(r), 'This row is incomplete: finish it or remove it'])),
  );
}

/** POST /api/submissions/:id/submit: a draft or sent-back revision goes to the review desk. */
const cleanChangeNote = (note: string | undefined) => (note === undefined ? null : stripHtml(note).trim() || null);

/**
 * A correction goes to review with its "what changed and why" (sent now or saved with the draft), so the
 * desk and the sheet's history can say it; it may name the open flags of its swap that it answers.
 */
export function submitForReview(
  deps: SubmissionDeps,
  user: SessionUser,
  id: number,
  input: SubmitSubmission = { answersFlagIds: [] },
): SubmissionView {
  const { db, clock } = deps;
  const row = revisionFor(db, user, id);
  assertEditable(user, row);
  refuseIncompleteRows(row.revision.incompleteRows);
  const behind = behindConflict(db, row, 'submit');
  if (behind) throw behind;
  const changeNote = input.changeNote !== undefined ? cleanChangeNote(input.changeNote) : row.revision.changeNote;
  // a new revision of a published swap (the first revision of a new swap has nothing to correct)
  const isCorrection = row.swap.currentRevisionId !== null;
  if (isCorrection && (changeNote ?? '').length < CHANGE_NOTE_MIN)
    throw AppError.invalid('Say what this correction changes and why.', {
      changeNote: `Say what changed and why (at least ${CHANGE_NOTE_MIN} characters)`,
    });
  if (!isCorrection && input.answersFlagIds.length > 0)
    throw AppError.invalid('Only a correction of a published swap answers flags.', { answersFlagIds: 'Not a correction' });
  const now = clock.now();
  db.transaction((tx) => {
    tx.update(revisions)
      .set({
        status: 'in_review',
        submittedAt: now,
        reviewNote: null,
        changeNote: isCorrection ? changeNote : null,
        updatedAt: now,
      })
      .where(eq(revisions.id, id))
      .run();
    answerFlags(tx, row.swap.id, id, [...new Set(input.answersFlagIds)], now);
    tx.insert(reviewEvents).values({ revisionId: id, actorId: user.id, action: 'submitted', note: '', at: now }).run();
    deps.mailer.queue(
      tx,
      row.author,
      submissionReceived({
        appUrl: deps.appUrl,
        name: row.author.name || row.author.login,
        title: row.revision.data.title,
        revisionId: id,
        number: row.revision.number,
      }),
    );
  });
  return viewOf(db, id, user);
}

/**
 * POST /api/submissions/:id/withdraw: the author takes a revision off the review desk before anyone decides; it is
 * a draft again (the desk no longer lists it, a moderator's claim on it goes) and can be changed and sent again.
 */
export function withdrawFromReview(deps: SubmissionDeps, user: SessionUser, id: number): SubmissionView {
  const { db, clock } = deps;
  const row = revisionFor(db, user, id);
  if (row.revision.authorId !== user.id) throw AppError.forbidden('Only the author can withdraw a submission.');
  if (row.revision.status !== 'in_review')
    throw AppError.conflict('Only a submission at the review desk can be withdrawn; this one is not waiting for a decision.');
  const now = clock.now();
  db.transaction((tx) => {
    const changed = tx
      .update(revisions)
      .set({ status: 'draft', submittedAt: null, updatedAt: now })
      .where(and(eq(revisions.id, id), eq(revisions.status, 'in_review')))
      .run().changes;
    // a moderator decided between the read and the write
    if (!changed) throw AppError.conflict('A moderator decided on this submission a moment ago; it can no longer be withdrawn.');
    tx.delete(reviewClaims).where(eq(reviewClaims.revisionId, id)).run();
    tx.insert(reviewEvents).values({ revisionId: id, actorId: user.id, action: 'withdrawn', note: '', at: now }).run();
  });
  return viewOf(db, id, user);
}

/** DELETE /api/submissions/:id: only a draft that never went to review; a new swap's draft takes the swap with it. */
export async function deleteSubmission(deps: SubmissionDeps, user: SessionUser, id: number) {
  const { db, storage } = deps;
  const row = revisionFor(db, user, id);
  if (row.revision.authorId !== user.id) throw AppError.forbidden('Only the author can delete a draft.');
  if (row.revision.status !== 'draft') {
    throw AppError.conflict('Only a draft that was never sent to review can be deleted; this revision keeps its review history.');
  }
  const files = db.transaction((tx) => removeRevision(tx, row));
  // files go after the rows, so no row ever points at a missing file
  await removeFiles(storage, files);
}

/**
 * Removes one revision that was never approved; when it was a new swap's only revision, the swap and the
 * chassis it proposed go too (a proposed chassis lives only as long as the submission that proposed it).
 * Returns the photo files to remove once the transaction has committed.
 */
export function removeRevision(tx: Tx, row: Pick<LoadedRevision, 'revision' | 'swap'>): string[] {
  const files = tx
    .select({ fileId: revisionPhotos.fileId })
    .from(revisionPhotos)
    .where(eq(revisionPhotos.revisionId, row.revision.id))
    .all()
    .map((f) => f.fileId);
  tx.delete(revisions).where(eq(revisions.id, row.revision.id)).run();
  const others = tx
    .select({ n: sql<number>`count(*)` })
    .from(revisions)
    .where(eq(revisions.swapId, row.swap.id))
    .get()!.n;
  if (others === 0 && row.swap.currentRevisionId === null) {
    tx.delete(swaps).where(eq(swaps.id, row.swap.id)).run();
    dropUnusedProposedChassis(tx, row.swap.chassisId);
  }
  return files;
}

/** Removes stored photos (full size and thumbnail); a file already gone is no error. */
export async function removeFiles(storage: Storage, fileIds: string[]) {
  for (const id of fileIds) await removePhotoFiles(storage, id);
}

/** New files (full and thumbnail) with the same content as a revision's photos, and the rows to insert for them. */
async function copyPhotos(deps: SubmissionDeps, revisionId: number) {
  const { db, storage } = deps;
  // a photo a moderator took down is not carried into the correction
  const rows = db
    .select({ photo: revisionPhotos })
    .from(revisionPhotos)
    .innerJoin(revisions, eq(revisions.id, revisionPhotos.revisionId))
    .where(and(eq(revisionPhotos.revisionId, revisionId), not(photoIsTakenDown)))
    .orderBy(revisionPhotos.position, revisionPhotos.id)
    .all()
    .map((r) => r.photo);
  const copies: Omit<typeof revisionPhotos.$inferInsert, 'revisionId' | 'createdAt'>[] = [];
  try {
    for (const r of rows) {
      const fileId = newFileId();
      copies.push({
        fileId,
        caption: r.caption,
        position: r.position,
        width: r.width,
        height: r.height,
        bytes: r.bytes,
        sha256: r.sha256,
      });
      await storage.put(fileId, await storage.read(r.fileId));
      if (await storage.exists(thumbId(r.fileId))) await storage.put(thumbId(fileId), await storage.read(thumbId(r.fileId)));
    }
  } catch (err) {
    await removeFiles(
      storage,
      copies.map((c) => c.fileId),
    );
    throw err;
  }
  return copies;
}

/** POST /api/submissions/:id/keep: the author keeps an untouched draft they were told would be removed. */
export function keepDraft(deps: SubmissionDeps, user: SessionUser, id: number): SubmissionView {
  const { db, clock } = deps;
  const row = revisionFor(db, user, id);
  assertEditable(user, row);
  db.update(revisions).set({ updatedAt: clock.now(), expiryWarnedAt: null, expiresAt: null }).where(eq(revisions.id, id)).run();
  return viewOf(db, id, user);
}

export function listMySubmissions(db: Db, userId: number): MySubmissionItem[] {
  return db
    .select({ revision: revisions, slug: swaps.slug })
    .from(revisions)
    .innerJoin(swaps, eq(swaps.id, revisions.swapId))
    .where(eq(revisions.authorId, userId))
    .orderBy(desc(revisions.updatedAt), desc(revisions.id))
    .all()
    .map(({ revision: r, slug }) => ({
      id: r.id,
      swapSlug: slug,
      number: r.number,
      title: r.data.title,
      status: r.status,
      reviewNote: r.reviewNote,
      updatedAt: r.updatedAt.toISOString(),
      submittedAt: r.submittedAt ? r.submittedAt.toISOString() : null,
    }));
}
