import { desc, eq, inArray, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, revisionPhotos, revisions, swaps, users } from '../../db/schema/index';
import type { ChassisView, PersonRef, PhotoView, SwapCard } from '../../../shared/schemas/views';

// Row → view helpers shared by the read services (sheet, chassis and part pages, shop pages).

type ChassisRow = typeof chassis.$inferSelect;
type UserRow = typeof users.$inferSelect;

export const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);

export function personRef(u: Pick<UserRow, 'login' | 'name' | 'avatarUrl'>): PersonRef {
  return { login: u.login, name: u.name || u.login, avatarUrl: u.avatarUrl };
}

export function chassisView(c: ChassisRow): ChassisView {
  return {
    id: c.id,
    slug: c.slug,
    make: c.make,
    model: c.model,
    code: c.code,
    yearFrom: c.yearFrom,
    yearTo: c.yearTo,
    body: c.body,
    lugCount: c.lugCount,
    pcdMm: c.pcdMm,
    centreBoreMm: c.centreBoreMm,
    wheelBoltThread: c.wheelBoltThread,
    stockWheel: c.stockWheel,
    stockBrakes: c.stockBrakes,
    vehicle: c.vehicle ?? null,
    notes: c.notes,
  };
}

export function photoView(p: typeof revisionPhotos.$inferSelect): PhotoView {
  return {
    id: p.fileId,
    caption: p.caption,
    width: p.width,
    height: p.height,
    url: `/media/${p.fileId}`,
    thumbUrl: `/media/${p.fileId}?size=thumb`,
  };
}

export function photosOf(db: Db, revisionIds: number[]) {
  if (revisionIds.length === 0) return new Map<number, PhotoView[]>();
  const rows = db
    .select()
    .from(revisionPhotos)
    .where(inArray(revisionPhotos.revisionId, revisionIds))
    .orderBy(revisionPhotos.position, revisionPhotos.id)
    .all();
  const byRevision = new Map<number, PhotoView[]>();
  for (const r of rows) byRevision.set(r.revisionId, [...(byRevision.get(r.revisionId) ?? []), photoView(r)]);
  return byRevision;
}

/** Cards of approved swaps matching the condition, newest approval first. */
export function swapCards(db: Db, where?: SQL, limit = 500): SwapCard[] {
  const rows = db
    .select({ swap: swaps, revision: revisions, chassis })
    .from(swaps)
    .innerJoin(revisions, eq(revisions.id, swaps.currentRevisionId))
    .innerJoin(chassis, eq(chassis.id, swaps.chassisId))
    .where(where)
    .orderBy(desc(revisions.reviewedAt), desc(swaps.id))
    .limit(limit)
    .all();
  const photos = photosOf(
    db,
    rows.map((r) => r.revision.id),
  );
  return rows.map(({ swap, revision, chassis: c }) => ({
    slug: swap.slug,
    title: revision.data.title,
    summary: revision.data.summary,
    axle: swap.axle,
    category: swap.category,
    chassis: { slug: c.slug, make: c.make, model: c.model, code: c.code, yearFrom: c.yearFrom, yearTo: c.yearTo },
    revisionNumber: revision.number,
    approvedAt: iso(revision.reviewedAt),
    fittedCount: swap.fittedCount,
    minWheelIn: revision.data.wheel?.minDiameterIn ?? null,
    thumbUrl: photos.get(revision.id)?.[0]?.thumbUrl ?? null,
  }));
}
