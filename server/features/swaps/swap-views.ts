import { desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, revisionPhotos, revisions, swaps, users } from '../../db/schema/index';
import type { ChassisView, PersonRef, PhotoView, SwapCard } from '../../../shared/schemas/views';
import { photoIsTakenDown } from '../takedowns/takedown-rules';

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
    wheelFastening: c.wheelFastening ?? null,
    notes: c.notes,
  };
}

export function photoView(p: typeof revisionPhotos.$inferSelect, takenDown = false): PhotoView {
  return {
    id: p.fileId,
    caption: p.caption,
    width: p.width,
    height: p.height,
    url: `/media/${p.fileId}`,
    thumbUrl: `/media/${p.fileId}?size=thumb`,
    ...(takenDown ? { takenDown: true } : {}),
  };
}

/**
 * The photos of each revision in order. Readers (`published`) never get a photo a moderator took down;
 * its author and the desk still see it, marked.
 */
export function photosOf(db: Db, revisionIds: number[], { published = false } = {}) {
  if (revisionIds.length === 0) return new Map<number, PhotoView[]>();
  const rows = db
    .select({ photo: revisionPhotos, takenDown: photoIsTakenDown })
    .from(revisionPhotos)
    .innerJoin(revisions, eq(revisions.id, revisionPhotos.revisionId))
    .where(inArray(revisionPhotos.revisionId, revisionIds))
    .orderBy(revisionPhotos.position, revisionPhotos.id)
    .all();
  const byRevision = new Map<number, PhotoView[]>();
  for (const { photo, takenDown } of rows) {
    if (takenDown && published) continue;
    byRevision.set(photo.revisionId, [...(byRevision.get(photo.revisionId) ?? []), photoView(photo, Boolean(takenDown))]);
  }
  return byRevision;
}

/** Cards of approved swaps matching the condition, newest approval first. */
export function swapCards(db: Db, where?: SQL, limit = 500): SwapCard[] {
  const rows = db
    .select({
      swap: swaps,
      // a card shows three fields of the record: read them, rather than the whole record (the same paths in
      // version 1 and 2), so a list of hundreds of cards costs no full parse of each record
      card: sql<string>`json_extract(${revisions.data}, '$.title', '$.summary', '$.wheel.minDiameterIn')`,
      revision: { id: revisions.id, number: revisions.number, reviewedAt: revisions.reviewedAt },
      chassis,
    })
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
    { published: true },
  );
  return rows.map(({ swap, card, revision, chassis: c }) => {
    const [title, summary, minWheelIn] = JSON.parse(card) as [string, string | null, number | null];
    return {
      slug: swap.slug,
      title,
      summary: summary ?? '',
      axle: swap.axle,
      category: swap.category,
      chassis: { slug: c.slug, make: c.make, model: c.model, code: c.code, yearFrom: c.yearFrom, yearTo: c.yearTo },
      revisionNumber: revision.number,
      approvedAt: iso(revision.reviewedAt),
      fittedCount: swap.fittedCount,
      minWheelIn: minWheelIn ?? null,
      thumbUrl: photos.get(revision.id)?.[0]?.thumbUrl ?? null,
    };
  });
}
