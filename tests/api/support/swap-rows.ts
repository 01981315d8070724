import { eq } from 'drizzle-orm';
import type { Db } from '../../../server/db/client';
import { revisions, swaps } from '../../../server/db/schema/index';
import { swapDataSchema, type SwapDataInput, type SwapPart } from '../../../shared/schemas/swap-data';
import type { Axle, RevisionStatus } from '../../../shared/schemas/enums';

// Rows for tests that need approved swaps without going through the review desk.

export function swapData(title: string, extra: Partial<SwapDataInput> = {}) {
  return swapDataSchema.parse({
    schemaVersion: 2,
    title,
    parts: [
      {
        role: 'Front caliper',
        kind: 'caliper',
        name: 'Vela four-piston fixed caliper',
        maker: 'Orsino',
        partNumbers: ['OV-355-104-L', 'OV-355-104-R'],
        cameOn: ['Orsino Vela 2.0 (1996–2001)'],
        quantity: 2,
      },
    ],
    adapter: { name: 'H31 caliper bracket', maker: 'Northgate Fabrication', partNumber: 'NF-H31-VB' },
    wheel: { minDiameterIn: 16, caliperRadialProjectionMm: 12, caliperOutboardMm: 30 },
    ...extra,
  });
}

/** a record's part line pointing at a catalogue part (the interchange graph follows `partId`) */
export const catalogueLine = (partId: number, kind: SwapPart['kind'], name: string, partNumbers: string[]): SwapPart => ({
  role: kind === 'adapter' ? 'Caliper bracket' : 'Front caliper',
  kind,
  name,
  maker: kind === 'adapter' ? 'Northgate Fabrication' : 'Orsino',
  partNumbers,
  cameOn: [],
  quantity: 1,
  notes: '',
  partId,
});

export type RevisionSpec = { status: RevisionStatus; data?: ReturnType<typeof swapData>; body?: string };

/** A swap by `authorId` with one revision per spec; its current revision is the last approved one, if any. */
export function addSwap(
  db: Db,
  opts: { slug: string; chassisId: number; authorId: number; axle?: Axle; revisions: RevisionSpec[] },
) {
  const at = new Date('2026-03-01T10:00:00Z');
  const swap = db
    .insert(swaps)
    .values({
      slug: opts.slug,
      chassisId: opts.chassisId,
      axle: opts.axle ?? 'front',
      category: 'brakes',
      authorId: opts.authorId,
      createdAt: at,
      updatedAt: at,
    })
    .returning()
    .get();
  const ids = opts.revisions.map(
    (r, i) =>
      db
        .insert(revisions)
        .values({
          swapId: swap.id,
          number: i + 1,
          authorId: opts.authorId,
          status: r.status,
          data: r.data ?? swapData(`${opts.slug} revision ${i + 1}`),
          body: r.body ?? '',
          submittedAt: r.status === 'draft' ? null : at,
          reviewedAt: ['approved', 'superseded', 'declined', 'sent_back'].includes(r.status) ? at : null,
          createdAt: at,
          updatedAt: at,
        })
        .returning({ id: revisions.id })
        .get().id,
  );
  const approved = opts.revisions.map((r) => r.status).lastIndexOf('approved');
  if (approved >= 0) db.update(swaps).set({ currentRevisionId: ids[approved] }).where(eq(swaps.id, swap.id)).run();
  return { swapId: swap.id, slug: opts.slug, revisionIds: ids };
}

/** What the review desk does on approval of a correction: the old current revision is superseded, the new one is current. */
export function approveNewRevision(db: Db, swapId: number, data: ReturnType<typeof swapData>, authorId: number, body = '') {
  const swap = db.select().from(swaps).where(eq(swaps.id, swapId)).get()!;
  const last = db.select({ number: revisions.number }).from(revisions).where(eq(revisions.swapId, swapId)).all();
  const number = Math.max(...last.map((r) => r.number)) + 1;
  const now = new Date();
  const id = db
    .insert(revisions)
    .values({
      swapId,
      number,
      authorId,
      status: 'approved',
      data,
      body,
      submittedAt: now,
      reviewedAt: now,
      createdAt: now,
      updatedAt: now,
    })
    .returning({ id: revisions.id })
    .get().id;
  if (swap.currentRevisionId)
    db.update(revisions).set({ status: 'superseded', updatedAt: now }).where(eq(revisions.id, swap.currentRevisionId)).run();
  db.update(swaps).set({ currentRevisionId: id, updatedAt: now }).where(eq(swaps.id, swapId)).run();
  return { revisionId: id, number };
}

/**
 * Gives a member the trust an approved revision earns (their fitted reports then go live at once): a
 * published swap of their own on the chassis.
 */
export function earnTrust(db: Db, userId: number, chassisId: number) {
  return addSwap(db, { slug: `trust-earned-${userId}`, chassisId, authorId: userId, revisions: [{ status: 'approved' }] });
}
