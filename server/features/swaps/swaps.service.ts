import type { Statement } from 'better-sqlite3';
import { and, desc, eq, inArray, isNotNull } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, revisions, swaps, users } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';
import type { SwapSheetView, SwapCard, RevisionSummary } from '../../../shared/schemas/views';
import { chassisView, iso, personRef, photosOf, swapCards } from './swap-views';
import { bodyIsTakenDown } from '../takedowns/takedown-rules';
import { openSafetyFlags } from '../flags/flags.service';

/** Statuses a reader may open by revision number. */
const publicStatuses = ['approved', 'superseded'] as const;

/** The sheet of a swap at its current revision, or at revision `number` when given (approved or superseded only). */
export function getSwapSheet(db: Db, slug: string, number?: number): SwapSheetView {
  const found = db
    .select({ swap: swaps, chassis, author: users })
    .from(swaps)
    .innerJoin(chassis, eq(chassis.id, swaps.chassisId))
    .innerJoin(users, eq(users.id, swaps.authorId))
    .where(eq(swaps.slug, slug))
    .get();
  if (!found || found.swap.currentRevisionId === null) throw AppError.notFound('That swap');
  const { swap } = found;

  const history = db
    .select({ revision: revisions, author: users })
    .from(revisions)
    .innerJoin(users, eq(users.id, revisions.authorId))
    .where(and(eq(revisions.swapId, swap.id), inArray(revisions.status, [...publicStatuses])))
    .orderBy(desc(revisions.number))
    .all();
  const current = history.find((h) => h.revision.id === swap.currentRevisionId);
  const shown = number === undefined ? current : history.find((h) => h.revision.number === number);
  if (!shown) throw AppError.notFound(`Revision ${number} of that swap`);
  const r = shown.revision;
  const bodyTakenDown = bodyIsTakenDown(db, r.id);

  return {
    swap: {
      id: swap.id,
      slug: swap.slug,
      axle: swap.axle,
      category: swap.category,
      fittedCount: swap.fittedCount,
      author: personRef(found.author),
      createdAt: swap.createdAt.toISOString(),
    },
    chassis: chassisView(found.chassis),
    revision: {
      id: r.id,
      number: r.number,
      status: r.status,
      data: r.data,
      body: bodyTakenDown ? '' : r.body,
      bodyTakenDown,
      approvedAt: iso(r.reviewedAt),
      submittedAt: iso(r.submittedAt),
      author: personRef(shown.author),
      photos: photosOf(db, [r.id], { published: true }).get(r.id) ?? [],
    },
    currentNumber: current?.revision.number ?? null,
    history: history.map((h): RevisionSummary => ({
      number: h.revision.number,
      status: h.revision.status,
      approvedAt: iso(h.revision.reviewedAt),
      author: personRef(h.author),
      changeNote: h.revision.changeNote,
    })),
    openSafetyFlags: openSafetyFlags(db, swap.id),
  };
}

/** Whether a reader may open revision `n` (as typed in an address) of the swap. */
export function hasPublicRevision(db: Db, swapId: number, n: string): boolean {
  if (!/^[1-9]\d{0,8}$/.test(n)) return false;
  return (
    db
      .select({ id: revisions.id })
      .from(revisions)
      .where(and(eq(revisions.swapId, swapId), eq(revisions.number, Number(n)), inArray(revisions.status, [...publicStatuses])))
      .get() !== undefined
  );
}

export function recentSwaps(db: Db, limit: number): SwapCard[] {
  return swapCards(db, isNotNull(swaps.currentRevisionId), limit);
}

/**
 * A cheap summary of everything a sheet is built from (the swap, its revisions, chassis and authors);
 * null when there is no such swap. Approved revisions never change, so this moves only when a new
 * revision is approved, the fitted count changes, a chassis or author row is edited, or a flag on it is
 * raised, linked or resolved (the sheet tells readers of open safety flags).
 * It runs on every read of a sheet, so its statement is prepared once per database: preparing it
 * cost more than running it.
 */
export function sheetFingerprint(db: Db, slug: string): string | null {
  let statement = fingerprintStatements.get(db.$client);
  if (!statement) {
    statement = db.$client
      .prepare<[string], unknown[]>(
        `select s.id, s.current_revision_id, s.fitted_count, s.updated_at, c.updated_at as chassis_at,
          (select max(r.updated_at) from revisions r where r.swap_id = s.id) as revisions_at,
          (select max(u.updated_at) from users u
             where u.id = s.author_id or u.id in (select r.author_id from revisions r where r.swap_id = s.id)) as authors_at,
          (select count(*) || '/' || coalesce(max(coalesce(t.reverted_at, t.created_at)), 0) from takedowns t where t.swap_id = s.id)
            as takedowns,
          (select group_concat(f.id || f.status || coalesce(fc.status, ''), ',') from flags f
             left join revisions fc on fc.id = f.correction_revision_id where f.swap_id = s.id) as flags
        from swaps s join chassis c on c.id = s.chassis_id
        where s.slug = ?`,
      )
      .raw();
    fingerprintStatements.set(db.$client, statement);
  }
  const row = statement.get(slug);
  return row ? row.join(':') : null;
}

const fingerprintStatements = new WeakMap<Db['$client'], Statement<[string], unknown[]>>();
