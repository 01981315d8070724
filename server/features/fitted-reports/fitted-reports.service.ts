import { and, count, desc, eq, inArray, isNull } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { fittedReports, reportHides, revisions, swaps, users, type FittedWheel } from '../../db/schema/index';
import type { Storage } from '../../storage/disk-storage';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import { stripHtml } from '../../lib/sanitize';
import type { SessionUser } from '../../middleware/require-role';
import { can } from '../../../shared/roles';
import type {
  CreateFittedReport,
  EvidenceKind,
  FittedReportView,
  FittedReportsView,
  UpdateFittedReport,
  Verification,
} from '../../../shared/schemas/fitted-reports';
import { evidenceKinds, evidenceOf } from '../../../shared/schemas/fitted-reports';
import { reportsGoLive } from '../../../shared/trust';
import { trustLevelOf } from '../trust/member-trust';
import { processPhoto } from '../photos/photo-processing';
import { removePhotoFiles, storePhotoFiles } from '../photos/photo-files';
import { assertRoomFor } from '../photos/storage-quota';
import { personRef } from '../swaps/swap-views';

type Deps = { db: Db; storage: Storage; clock: Clock; quotaBytes: number };
export type ReportPhotoUpload = { buffer: Buffer } | undefined;

const publicStatuses = ['approved', 'superseded'] as const;

function approvedSwap(db: Db, slug: string) {
  const swap = db.select().from(swaps).where(eq(swaps.slug, slug)).get();
  if (!swap || swap.currentRevisionId === null) throw AppError.notFound('That swap');
  return swap;
}

/** The revision a member says they followed: one a reader can open (approved or superseded); the current one by default. */
function followedRevision(db: Db, swap: typeof swaps.$inferSelect, number: number | undefined) {
  const row =
    number === undefined
      ? db.select().from(revisions).where(eq(revisions.id, swap.currentRevisionId!)).get()
      : db
          .select()
          .from(revisions)
          .where(and(eq(revisions.swapId, swap.id), eq(revisions.number, number), inArray(revisions.status, [...publicStatuses])))
          .get();
  if (!row)
    throw AppError.invalid('Pick a published revision of this swap.', {
      revisionNumber: `Revision ${number} is not a published revision of this swap`,
    });
  return row;
}

function refusalFor(viewer: SessionUser | undefined, swap: typeof swaps.$inferSelect): FittedReportsView['cannotReport'] {
  if (!viewer) return 'signed_out';
  if (viewer.id === swap.authorId) return 'author';
  if (!can(viewer.role, 'report_fitted')) return 'not_allowed';
  return null;
}

/** Keeps swaps.fitted_count equal to the number of public reports (live, not hidden), so search and its "most fitted" sort see it. */
export function recount(db: Db, swapId: number) {
  const row = db
    .select({ n: count() })
    .from(fittedReports)
    .where(and(eq(fittedReports.swapId, swapId), eq(fittedReports.state, 'live'), isNull(fittedReports.hiddenAt)))
    .get();
  db.update(swaps)
    .set({ fittedCount: row?.n ?? 0 })
    .where(eq(swaps.id, swapId))
    .run();
}

function photoOf(fileId: string | null): FittedReportView['photo'] {
  return fileId ? { url: `/media/${fileId}`, thumbUrl: `/media/${fileId}?size=thumb` } : null;
}

/**
 * Checks and stores a report's photo; it counts against the member's storage quota, less the photo it
 * replaces (`freeing` bytes).
 */
async function storePhoto(
  { db, storage, quotaBytes }: Deps,
  userId: number,
  upload: ReportPhotoUpload,
  freeing = 0,
): Promise<{ fileId: string; bytes: number } | null> {
  if (!upload) return null;
  const processed = await processPhoto(upload.buffer, 'photo');
  assertRoomFor(db, userId, processed.full.length - freeing, quotaBytes, 'photo');
  return { fileId: await storePhotoFiles(storage, processed), bytes: processed.full.length };
}

const cleanNote = (note: string) => stripHtml(note).trim();

/** Public: live and not hidden. A held or hidden report reaches only its member and moderators. */
export const isPublicReport = (r: { state: string; hiddenAt: Date | null }) => r.state === 'live' && r.hiddenAt === null;

type ReportRow = { report: typeof fittedReports.$inferSelect; member: typeof users.$inferSelect; revisionNumber: number };

export function reportView(r: ReportRow): FittedReportView {
  return {
    id: r.report.id,
    member: personRef(r.member),
    revisionNumber: r.revisionNumber,
    wheel: r.report.wheel,
    note: r.report.note,
    photo: photoOf(r.report.photoFileId),
    clearanceMm: r.report.clearanceMm,
    evidence: evidenceOf({ clearanceMm: r.report.clearanceMm, hasPhoto: r.report.photoFileId !== null }),
    createdAt: r.report.createdAt.toISOString(),
    updatedAt: r.report.updatedAt.toISOString(),
    hidden: r.report.hiddenAt !== null,
    state: r.report.state,
  };
}

function verificationOf(visible: FittedReportView[]): Verification {
  const byEvidence = Object.fromEntries(evidenceKinds.map((k) => [k, 0])) as Record<EvidenceKind, number>;
  for (const r of visible) byEvidence[r.evidence] += 1;
  return {
    reviewed: true,
    fittedBy: visible.length,
    withPhotos: visible.filter((r) => r.photo).length,
    byEvidence,
    strongest: evidenceKinds.find((k) => byEvidence[k] > 0) ?? null,
  };
}

export function listFittedReports(db: Db, slug: string, viewer: SessionUser | undefined): FittedReportsView {
  const swap = approvedSwap(db, slug);
  const canModerate = can(viewer?.role, 'review');
  const rows = db
    .select({ report: fittedReports, member: users, revisionNumber: revisions.number })
    .from(fittedReports)
    .innerJoin(users, eq(users.id, fittedReports.userId))
    .innerJoin(revisions, eq(revisions.id, fittedReports.revisionId))
    .where(eq(fittedReports.swapId, swap.id))
    .orderBy(desc(fittedReports.createdAt), desc(fittedReports.id))
    .all();
  const visibleRows = rows.filter((r) => isPublicReport(r.report));
  const visible = visibleRows.map(reportView);
  const wheels = new Map<string, { wheel: FittedWheel; members: number }>();
  for (const { wheel: w } of visible) {
    const key = `${w.diameterIn}|${w.widthIn}|${w.offsetMm}|${w.spacerMm}`;
    const entry = wheels.get(key) ?? { wheel: w, members: 0 };
    entry.members += 1;
    wheels.set(key, entry);
  }
  const mine = viewer ? rows.find((r) => r.report.userId === viewer.id) : undefined;
  return {
    count: visible.length,
    reports: canModerate ? rows.map(reportView) : visible,
    wheels: [...wheels.values()].sort((a, b) => b.members - a.members || a.wheel.diameterIn - b.wheel.diameterIn),
    verification: verificationOf(visible),
    mine: mine ? reportView(mine) : null,
    cannotReport: refusalFor(viewer, swap),
    canModerate,
  };
}

/** A new member's report waits for a moderator; once they have earned trust, it goes live at once. */
const stateFor = (db: Db, member: SessionUser) => (reportsGoLive(trustLevelOf(db, member)) ? 'live' : 'held');

export async function createFittedReport(
  deps: Deps,
  slug: string,
  viewer: SessionUser,
  input: CreateFittedReport,
  upload: ReportPhotoUpload,
) {
  const { db, storage, clock } = deps;
  const swap = approvedSwap(db, slug);
  const refusal = refusalFor(viewer, swap);
  if (refusal === 'author') throw AppError.forbidden('You wrote this swap; fitted reports come from other members.');
  if (refusal) throw AppError.forbidden();
  const revision = followedRevision(db, swap, input.revisionNumber);
  const existing = db
    .select({ id: fittedReports.id })
    .from(fittedReports)
    .where(and(eq(fittedReports.swapId, swap.id), eq(fittedReports.userId, viewer.id)))
    .get();
  if (existing) throw AppError.conflict('You have already reported fitting this swap. Edit your report instead.');

  // a moderator's hide of this member's reports on this swap outlives a deleted report
  const hide = activeHide(db, swap.id, viewer.id);
  // the photo is checked and stored before the row, so a bad photo loses nothing and a row never points at a missing file
  const photo = await storePhoto(deps, viewer.id, upload);
  const photoFileId = photo?.fileId ?? null;
  const now = clock.now();
  const state = stateFor(db, viewer);
  try {
    db.transaction((tx) => {
      tx.insert(fittedReports)
        .values({
          swapId: swap.id,
          userId: viewer.id,
          revisionId: revision.id,
          wheel: { diameterIn: input.diameterIn, widthIn: input.widthIn, offsetMm: input.offsetMm, spacerMm: input.spacerMm },
          clearanceMm: input.clearanceMm ?? null,
          note: cleanNote(input.note),
          state,
          photoFileId,
          photoBytes: photo?.bytes ?? 0,
          hiddenAt: hide ? hide.createdAt : null,
          hiddenById: hide ? hide.hiddenById : null,
          createdAt: now,
          updatedAt: now,
        })
        .run();
      recount(tx as unknown as Db, swap.id);
    });
  } catch (err) {
    await removePhotoFiles(storage, photoFileId);
    // two requests at once: the unique index decides
    if (err instanceof Error && /UNIQUE constraint failed: fitted_reports/.test(err.message)) {
      throw AppError.conflict('You have already reported fitting this swap. Edit your report instead.');
    }
    throw err;
  }
  return listFittedReports(db, slug, viewer);
}

function myReport(db: Db, swapId: number, userId: number) {
  const row = db
    .select()
    .from(fittedReports)
    .where(and(eq(fittedReports.swapId, swapId), eq(fittedReports.userId, userId)))
    .get();
  if (!row) throw AppError.notFound('Your fitted report');
  return row;
}

export async function updateFittedReport(
  deps: Deps,
  slug: string,
  viewer: SessionUser,
  input: UpdateFittedReport,
  upload: ReportPhotoUpload,
) {
  const { db, storage, clock } = deps;
  const swap = approvedSwap(db, slug);
  const report = myReport(db, swap.id, viewer.id);
  const revision = input.revisionNumber === undefined ? null : followedRevision(db, swap, input.revisionNumber);
  const newPhoto = await storePhoto(deps, viewer.id, upload, report.photoBytes);
  const state = report.state === 'held' ? 'held' : stateFor(db, viewer);
  let replaced: string | null;
  try {
    // read and replace the photo in one write: of two edits at once, each removes exactly the photo it replaced
    replaced = db.transaction((tx) => {
      const current = tx.select().from(fittedReports).where(eq(fittedReports.id, report.id)).get();
      if (!current) throw AppError.notFound('Your fitted report');
      const wheel: FittedWheel = {
        diameterIn: input.diameterIn ?? current.wheel.diameterIn,
        widthIn: input.widthIn ?? current.wheel.widthIn,
        offsetMm: input.offsetMm ?? current.wheel.offsetMm,
        spacerMm: input.spacerMm ?? current.wheel.spacerMm,
      };
      const photoFileId = newPhoto?.fileId ?? (input.removePhoto ? null : current.photoFileId);
      tx.update(fittedReports)
        .set({
          wheel,
          ...(revision ? { revisionId: revision.id } : {}),
          ...(input.note !== undefined ? { note: cleanNote(input.note) } : {}),
          ...(input.clearanceMm !== undefined ? { clearanceMm: input.clearanceMm } : {}),
          // an edit by a member who has not earned trust yet is checked again, like their first report
          state,
          ...(state === 'held' ? { releasedAt: null, releasedById: null } : {}),
          photoFileId,
          photoBytes: newPhoto ? newPhoto.bytes : photoFileId ? current.photoBytes : 0,
          updatedAt: clock.now(),
        })
        .where(eq(fittedReports.id, report.id))
        .run();
      recount(tx as unknown as Db, swap.id);
      return current.photoFileId !== photoFileId ? current.photoFileId : null;
    });
  } catch (err) {
    await removePhotoFiles(storage, newPhoto?.fileId ?? null);
    throw err;
  }
  await removePhotoFiles(storage, replaced);
  return listFittedReports(db, slug, viewer);
}

export async function deleteFittedReport({ db, storage }: Deps, slug: string, viewer: SessionUser) {
  const swap = approvedSwap(db, slug);
  const report = myReport(db, swap.id, viewer.id);
  // the photo as it is at the delete (an edit a moment earlier may have replaced it)
  const photoFileId = db.transaction((tx) => {
    const current = tx
      .select({ photo: fittedReports.photoFileId })
      .from(fittedReports)
      .where(eq(fittedReports.id, report.id))
      .get();
    if (!current) throw AppError.notFound('Your fitted report');
    tx.delete(fittedReports).where(eq(fittedReports.id, report.id)).run();
    recount(tx as unknown as Db, swap.id);
    return current.photo;
  });
  await removePhotoFiles(storage, photoFileId);
}

function activeHide(db: Db, swapId: number, userId: number) {
  return db
    .select()
    .from(reportHides)
    .where(and(eq(reportHides.swapId, swapId), eq(reportHides.userId, userId), isNull(reportHides.liftedAt)))
    .get();
}

/**
 * A moderator hides an abusive report, or lifts the hide; the count follows. Hiding is recorded against
 * the member and the swap (report_hides), so it also covers any report they write there later.
 */
export function setFittedReportHidden({ db, clock }: Deps, id: number, moderator: SessionUser, hidden: boolean) {
  const report = db.select().from(fittedReports).where(eq(fittedReports.id, id)).get();
  if (!report) throw AppError.notFound('That fitted report');
  const now = clock.now();
  db.transaction((tx) => {
    const active = activeHide(tx as unknown as Db, report.swapId, report.userId);
    if (hidden && !active)
      tx.insert(reportHides)
        .values({ swapId: report.swapId, userId: report.userId, hiddenById: moderator.id, createdAt: now })
        .run();
    if (!hidden && active)
      tx.update(reportHides).set({ liftedAt: now, liftedById: moderator.id }).where(eq(reportHides.id, active.id)).run();
    tx.update(fittedReports)
      .set(
        hidden
          ? { hiddenAt: active?.createdAt ?? now, hiddenById: active?.hiddenById ?? moderator.id }
          : { hiddenAt: null, hiddenById: null },
      )
      .where(eq(fittedReports.id, id))
      .run();
    recount(tx as unknown as Db, report.swapId);
  });
  return { id, hidden };
}
