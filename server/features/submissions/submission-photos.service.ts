import { and, eq, max, sql } from 'drizzle-orm';
import { z } from 'zod';
import { singleLine } from '../../../shared/schemas/text';
import { revisionPhotos, revisions } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';
import { stripHtml } from '../../lib/sanitize';
import type { SessionUser } from '../../middleware/require-role';
import type { PhotoView } from '../../../shared/schemas/views';
import { processPhoto, type ProcessedPhoto } from '../photos/photo-processing';
import { removePhotoFiles, storePhotoFiles } from '../photos/photo-files';
import { assertRoomFor } from '../photos/storage-quota';
import { photosOf } from '../swaps/swap-views';
import { assertEditable, revisionFor } from './submission-views';
import type { SubmissionDeps } from './submissions.service';

export const MAX_PHOTOS_PER_REVISION = 12;

const captionsSchema = z
  .array(singleLine().trim().max(300, 'A caption may be at most 300 characters'))
  .max(MAX_PHOTOS_PER_REVISION);

/** The optional `captions` form field: a JSON array of strings, one per uploaded file in order. */
export function parseCaptions(raw: unknown): string[] {
  if (raw === undefined || raw === '') return [];
  if (typeof raw !== 'string')
    throw AppError.invalid('Send the captions once, as one JSON array.', {
      captions: 'Send the captions as one JSON array of strings.',
    });
  let value: unknown;
  try {
    value = JSON.parse(raw);
  } catch {
    throw AppError.invalid('The captions are not valid JSON.', { captions: 'Send the captions as a JSON array of strings.' });
  }
  const parsed = captionsSchema.safeParse(value);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw AppError.invalid(issue.message, { [['captions', ...issue.path].join('.')]: issue.message });
  }
  return parsed.data;
}

function photosOfRevision(deps: SubmissionDeps, revisionId: number): PhotoView[] {
  return photosOf(deps.db, [revisionId]).get(revisionId) ?? [];
}

const countOf = (deps: SubmissionDeps, revisionId: number) =>
  deps.db
    .select({ n: sql<number>`count(*)` })
    .from(revisionPhotos)
    .where(eq(revisionPhotos.revisionId, revisionId))
    .get()!.n;

function tooMany(existing: number, adding: number) {
  const left = Math.max(0, MAX_PHOTOS_PER_REVISION - existing);
  const message = `A revision may have at most ${MAX_PHOTOS_PER_REVISION} photos; it has ${existing}, so ${left === 0 ? 'no more can be added' : `at most ${left} more can be added`} (this upload had ${adding}).`;
  return new AppError('too_many_photos', message, 400, { photos: message });
}

/** Author, status and quota checks before the upload body is read, so a refused upload costs no parsing. */
export function assertCanUpload(deps: SubmissionDeps, user: SessionUser, revisionId: number, quotaBytes: number) {
  assertEditable(user, revisionFor(deps.db, user, revisionId));
  assertRoomFor(deps.db, user.id, null, quotaBytes, 'photos');
}

/**
 * POST /api/submissions/:id/photos. Every file is checked and re-encoded before anything is written; the
 * files are stored completely before their rows exist; a failure anywhere leaves nothing of the batch behind.
 * The uploaded file names are never looked at.
 */
export async function addPhotos(
  deps: SubmissionDeps,
  user: SessionUser,
  revisionId: number,
  files: { buffer: Buffer }[],
  captions: string[],
  quotaBytes: number,
): Promise<PhotoView[]> {
  const { db, storage, clock } = deps;
  assertEditable(user, revisionFor(db, user, revisionId));
  if (files.length === 0)
    throw AppError.invalid('Choose at least one photo.', { photos: 'Choose at least one photo (JPEG, PNG or WebP).' });
  if (captions.length > files.length)
    throw AppError.invalid('There are more captions than photos.', { captions: 'Give one caption per photo.' });
  const existing = countOf(deps, revisionId);
  if (existing + files.length > MAX_PHOTOS_PER_REVISION) throw tooMany(existing, files.length);

  const processed: ProcessedPhoto[] = [];
  for (const [i, f] of files.entries()) processed.push(await processPhoto(f.buffer, `photos.${i}`));
  const adding = processed.reduce((sum, p) => sum + p.full.length, 0);
  assertRoomFor(db, user.id, adding, quotaBytes, 'photos');

  const stored: { fileId: string; photo: ProcessedPhoto; caption: string }[] = [];
  try {
    for (const [i, photo] of processed.entries()) {
      stored.push({ fileId: await storePhotoFiles(storage, photo), photo, caption: stripHtml(captions[i] ?? '') });
    }
    const now = clock.now();
    db.transaction((tx) => {
      // checked again inside the write: two uploads at once must not pass 12 together, nor one after a submit
      const status = tx.select({ status: revisions.status }).from(revisions).where(eq(revisions.id, revisionId)).get()?.status;
      if (status !== 'draft' && status !== 'sent_back')
        throw AppError.conflict('This revision was sent to review meanwhile; the photos were not added.');
      const count = tx
        .select({ n: sql<number>`count(*)` })
        .from(revisionPhotos)
        .where(eq(revisionPhotos.revisionId, revisionId))
        .get()!.n;
      if (count + stored.length > MAX_PHOTOS_PER_REVISION) throw tooMany(count, stored.length);
      // and the quota, for uploads running side by side
      assertRoomFor(tx, user.id, adding, quotaBytes, 'photos');
      const last =
        tx
          .select({ p: max(revisionPhotos.position) })
          .from(revisionPhotos)
          .where(eq(revisionPhotos.revisionId, revisionId))
          .get()?.p ?? -1;
      stored.forEach((s, i) => {
        tx.insert(revisionPhotos)
          .values({
            revisionId,
            fileId: s.fileId,
            caption: s.caption,
            position: last + 1 + i,
            width: s.photo.width,
            height: s.photo.height,
            bytes: s.photo.full.length,
            sha256: s.photo.sha256,
            createdAt: now,
          })
          .run();
      });
      tx.update(revisions).set({ updatedAt: now }).where(eq(revisions.id, revisionId)).run();
    });
  } catch (err) {
    for (const s of stored) await removePhotoFiles(storage, s.fileId);
    throw err;
  }
  return photosOfRevision(deps, revisionId);
}

/** PATCH /api/submissions/:id/photos: captions and order; the list names every photo of the revision once. */
export function updatePhotos(
  deps: SubmissionDeps,
  user: SessionUser,
  revisionId: number,
  list: { id: string; caption: string }[],
): PhotoView[] {
  const { db, clock } = deps;
  assertEditable(user, revisionFor(db, user, revisionId));
  const current = db
    .select({ fileId: revisionPhotos.fileId })
    .from(revisionPhotos)
    .where(eq(revisionPhotos.revisionId, revisionId))
    .all();
  const known = new Set(current.map((c) => c.fileId));
  const given = new Set(list.map((p) => p.id));
  const fields: Record<string, string> = {};
  list.forEach((p, i) => {
    if (!known.has(p.id)) fields[`photos.${i}.id`] = 'That photo is not part of this revision.';
  });
  if (given.size !== list.length) fields.photos = 'Each photo may appear only once.';
  else if (Object.keys(fields).length === 0 && given.size !== known.size)
    fields.photos = 'List every photo of the revision, in the order wanted.';
  if (Object.keys(fields).length) throw AppError.invalid('The photo list does not match the revision’s photos.', fields);
  const now = clock.now();
  db.transaction((tx) => {
    list.forEach((p, i) => {
      tx.update(revisionPhotos)
        .set({ caption: stripHtml(p.caption), position: i })
        .where(and(eq(revisionPhotos.revisionId, revisionId), eq(revisionPhotos.fileId, p.id)))
        .run();
    });
    tx.update(revisions).set({ updatedAt: now }).where(eq(revisions.id, revisionId)).run();
  });
  return photosOfRevision(deps, revisionId);
}

/** DELETE /api/submissions/:id/photos/:photoId: the row goes first, then its files. */
export async function deletePhoto(
  deps: SubmissionDeps,
  user: SessionUser,
  revisionId: number,
  fileId: string,
): Promise<PhotoView[]> {
  const { db, storage, clock } = deps;
  assertEditable(user, revisionFor(db, user, revisionId));
  db.transaction((tx) => {
    const removed = tx
      .delete(revisionPhotos)
      .where(and(eq(revisionPhotos.revisionId, revisionId), eq(revisionPhotos.fileId, fileId)))
      .run().changes;
    if (!removed) throw AppError.notFound('That photo');
    tx.update(revisions).set({ updatedAt: clock.now() }).where(eq(revisions.id, revisionId)).run();
  });
  await removePhotoFiles(storage, fileId);
  return photosOfRevision(deps, revisionId);
}
