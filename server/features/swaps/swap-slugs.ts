import { and, eq, isNotNull } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, swapOldSlugs, swaps } from '../../db/schema/index';
import { slugify, uniqueSlug } from '../../lib/slugs';

// A swap's address is made from its chassis code, axle and title. It stays put while the approved title
// does; a new approved title gives a new address, and the old one keeps working as a redirect.

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type SwapRef = { id: number; slug: string; chassisId: number; axle: string };

export const swapSlugBase = (chassisCode: string, axle: string, title: string) => slugify(`${chassisCode} ${axle} ${title}`);

/** `base` itself or `base-2`, `base-3` …: the slug a title would give, made unique */
const derivesFrom = (slug: string, base: string) => slug === base || new RegExp(`^${base}-\\d+$`).test(slug);

const oldSlugTaken = (db: Db | Tx, slug: string) =>
  db.select({ slug: swapOldSlugs.slug }).from(swapOldSlugs).where(eq(swapOldSlugs.slug, slug)).get() !== undefined;

/** A fresh slug for a new swap, unlike any swap's current or old address. */
export function newSwapSlug(tx: Tx, base: string): string {
  return uniqueSlug(tx, swaps, base, (slug) => oldSlugTaken(tx, slug));
}

/**
 * The swap's address once a revision titled `title` is approved; `previousTitle` is the title of the
 * revision it replaces (null for a first approval). A published swap's old address is kept as a redirect;
 * a draft's provisional one was never public and is simply replaced.
 */
export function slugAfterApproval(tx: Tx, swap: SwapRef, previousTitle: string | null, title: string, now: Date): string {
  if (previousTitle === title) return swap.slug;
  const code = tx.select({ code: chassis.code }).from(chassis).where(eq(chassis.id, swap.chassisId)).get()!.code;
  const base = swapSlugBase(code, swap.axle, title);
  if (derivesFrom(swap.slug, base)) return swap.slug;

  // a title changed back takes back the address it had
  const own = tx.select().from(swapOldSlugs).where(eq(swapOldSlugs.swapId, swap.id)).all();
  const reclaimed = own.find((o) => derivesFrom(o.slug, base));
  if (reclaimed) tx.delete(swapOldSlugs).where(eq(swapOldSlugs.slug, reclaimed.slug)).run();
  const next = reclaimed?.slug ?? newSwapSlug(tx, base);

  if (previousTitle !== null) tx.insert(swapOldSlugs).values({ slug: swap.slug, swapId: swap.id, retiredAt: now }).run();
  tx.update(swaps).set({ slug: next }).where(eq(swaps.id, swap.id)).run();
  return next;
}

/**
 * Where a published swap's address leads: its current slug (`moved` when `slug` is one of its old
 * addresses), or null when no published swap has or had it.
 */
export function findSwapAddress(db: Db, slug: string): { id: number; slug: string; moved: boolean } | null {
  const current = db
    .select({ id: swaps.id, slug: swaps.slug })
    .from(swaps)
    .where(and(eq(swaps.slug, slug), isNotNull(swaps.currentRevisionId)))
    .get();
  if (current) return { ...current, moved: false };
  const old = db
    .select({ id: swaps.id, slug: swaps.slug })
    .from(swapOldSlugs)
    .innerJoin(swaps, eq(swaps.id, swapOldSlugs.swapId))
    .where(and(eq(swapOldSlugs.slug, slug), isNotNull(swaps.currentRevisionId)))
    .get();
  return old ? { ...old, moved: true } : null;
}
