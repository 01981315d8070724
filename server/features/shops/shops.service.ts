import crypto from 'node:crypto';
import { and, desc, eq, inArray, isNotNull, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { revisions, shopLinks, shops, swaps } from '../../db/schema/index';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import { stripHtml } from '../../lib/sanitize';
import type { SessionUser } from '../../middleware/require-role';
import { can } from '../../../shared/roles';
import type {
  CreateShopLink,
  NewerRevision,
  PinnedSheetView,
  ShopLinkItem,
  ShopLinkList,
  ShopPageView,
  ShopView,
  UpdateShop,
} from '../../../shared/schemas/shops';
import { getSwapSheet } from '../swaps/swaps.service';
import { swapCards } from '../swaps/swap-views';
import { newerRevisionOf } from '../swaps/newer-revision';

type ShopRow = typeof shops.$inferSelect;
type LinkRow = typeof shopLinks.$inferSelect;

export const shopView = (s: ShopRow): ShopView => ({
  slug: s.slug,
  name: s.name,
  town: s.town,
  website: s.website,
  about: s.about,
});

/** A shop user acts for their own shop only; everyone else (admins included) may at most look. */
export const actsFor = (user: SessionUser | undefined, shopId: number) =>
  Boolean(user && user.role === 'shop' && can(user.role, 'manage_shop_links') && user.shopId === shopId);

const linkUrl = (appUrl: string, code: string) => `${appUrl.replace(/\/$/, '')}/l/${code}`;

function shopBySlug(db: Db, slug: string) {
  const row = db.select().from(shops).where(eq(shops.slug, slug)).get();
  if (!row) throw AppError.notFound('That shop');
  return row;
}

export function getShopPage(db: Db, slug: string, viewer: SessionUser | undefined): ShopPageView {
  const shop = shopBySlug(db, slug);
  const linked = db
    .selectDistinct({ swapId: shopLinks.swapId })
    .from(shopLinks)
    .where(and(eq(shopLinks.shopId, shop.id), isNull(shopLinks.retiredAt)))
    .all()
    .map((r) => r.swapId);
  return {
    shop: shopView(shop),
    swaps: linked.length ? swapCards(db, and(inArray(swaps.id, linked), isNotNull(swaps.currentRevisionId))) : [],
    canEdit: actsFor(viewer, shop.id),
  };
}

export function updateShop(db: Db, clock: Clock, slug: string, viewer: SessionUser, input: UpdateShop): ShopView {
  const shop = shopBySlug(db, slug);
  if (!actsFor(viewer, shop.id)) throw AppError.forbidden('Only the shop’s own accounts can edit its page.');
  const changes: Partial<ShopRow> = {};
  if (input.name !== undefined) changes.name = stripHtml(input.name).trim() || shop.name;
  if (input.town !== undefined) changes.town = stripHtml(input.town).trim();
  if (input.website !== undefined) changes.website = input.website;
  if (input.about !== undefined) changes.about = stripHtml(input.about).trim();
  const row = db
    .update(shops)
    .set({ ...changes, updatedAt: clock.now() })
    .where(eq(shops.id, shop.id))
    .returning()
    .get();
  return shopView(row);
}

// no 0/o, 1/l/i: codes get read aloud and typed from paper
const alphabet = 'abcdefghjkmnpqrstuvwxyz23456789';
function newCode(length = 7) {
  const bytes = crypto.randomBytes(length);
  return Array.from(bytes, (b) => alphabet[b % alphabet.length]).join('');
}

function linkItems(
  db: Db,
  appUrl: string,
  rows: { link: LinkRow; shop: ShopRow; swap: typeof swaps.$inferSelect; revision: typeof revisions.$inferSelect }[],
) {
  const cache = new Map<string, NewerRevision | null>();
  const titles = new Map<number, string>();
  const titleOf = (swap: typeof swaps.$inferSelect) => {
    if (!titles.has(swap.id)) {
      const current = swap.currentRevisionId
        ? db.select({ data: revisions.data }).from(revisions).where(eq(revisions.id, swap.currentRevisionId)).get()
        : undefined;
      titles.set(swap.id, current?.data.title ?? swap.slug);
    }
    return titles.get(swap.id)!;
  };
  return rows.map(({ link, shop, swap, revision }): ShopLinkItem => ({
    code: link.code,
    url: linkUrl(appUrl, link.code),
    shop: { slug: shop.slug, name: shop.name },
    swap: { slug: swap.slug, title: titleOf(swap) },
    revision: { number: revision.number },
    note: link.note,
    visits: link.visits,
    createdAt: link.createdAt.toISOString(),
    retiredAt: link.retiredAt ? link.retiredAt.toISOString() : null,
    newerRevision: newerRevisionOf(db, swap, link.revisionId, cache),
  }));
}

function linkRows(db: Db, where: ReturnType<typeof eq> | undefined) {
  return db
    .select({ link: shopLinks, shop: shops, swap: swaps, revision: revisions })
    .from(shopLinks)
    .innerJoin(shops, eq(shops.id, shopLinks.shopId))
    .innerJoin(swaps, eq(swaps.id, shopLinks.swapId))
    .innerJoin(revisions, eq(revisions.id, shopLinks.revisionId))
    .where(where)
    .orderBy(desc(shopLinks.createdAt), desc(shopLinks.id))
    .all();
}

/** A shop user sees their shop's links; an admin may look at every shop's (or one shop's, by slug). */
export function listShopLinks(db: Db, appUrl: string, viewer: SessionUser, shopSlug?: string): ShopLinkList {
  if (viewer.role === 'admin') {
    const where = shopSlug ? eq(shopLinks.shopId, shopBySlug(db, shopSlug).id) : undefined;
    return { items: linkItems(db, appUrl, linkRows(db, where)), canManage: false };
  }
  if (!can(viewer.role, 'manage_shop_links')) throw AppError.forbidden('Shop links belong to shop accounts.');
  if (viewer.shopId === null) throw AppError.forbidden('Your account is not linked to a shop yet; ask an admin to link it.');
  return { items: linkItems(db, appUrl, linkRows(db, eq(shopLinks.shopId, viewer.shopId))), canManage: true };
}

function linkByCode(db: Db, code: string) {
  const row = linkRows(db, eq(shopLinks.code, code))[0];
  if (!row) throw AppError.notFound('That shop link');
  return row;
}

/** Pins the link to the swap's current approved revision, whatever is approved later. */
export function createShopLink(db: Db, clock: Clock, appUrl: string, viewer: SessionUser, input: CreateShopLink): ShopLinkItem {
  if (!can(viewer.role, 'manage_shop_links')) throw AppError.forbidden('Only shop accounts make shop links.');
  if (viewer.shopId === null) throw AppError.forbidden('Your account is not linked to a shop yet; ask an admin to link it.');
  const swap = db.select().from(swaps).where(eq(swaps.slug, input.swapSlug)).get();
  if (!swap || swap.currentRevisionId === null) {
    throw AppError.invalid('Shop links point at approved swaps.', { swapSlug: 'No approved swap by that name' });
  }
  const now = clock.now();
  for (let attempt = 0; ; attempt++) {
    const code = newCode();
    try {
      db.insert(shopLinks)
        .values({
          code,
          shopId: viewer.shopId,
          swapId: swap.id,
          revisionId: swap.currentRevisionId,
          createdById: viewer.id,
          note: stripHtml(input.note).trim(),
          createdAt: now,
          updatedAt: now,
        })
        .run();
      return linkItems(db, appUrl, [linkByCode(db, code)])[0]!;
    } catch (err) {
      if (attempt < 5 && err instanceof Error && /UNIQUE constraint failed: shop_links\.code/.test(err.message)) continue;
      throw err;
    }
  }
}

function managedLink(db: Db, viewer: SessionUser, code: string) {
  const row = linkByCode(db, code);
  if (!actsFor(viewer, row.link.shopId)) throw AppError.forbidden('Only the shop that made this link can change it.');
  return row;
}

export function updateShopLinkNote(
  db: Db,
  clock: Clock,
  appUrl: string,
  viewer: SessionUser,
  code: string,
  note: string,
): ShopLinkItem {
  const row = managedLink(db, viewer, code);
  db.update(shopLinks)
    .set({ note: stripHtml(note).trim(), updatedAt: clock.now() })
    .where(eq(shopLinks.id, row.link.id))
    .run();
  return linkItems(db, appUrl, [linkByCode(db, code)])[0]!;
}

export function retireShopLink(db: Db, clock: Clock, appUrl: string, viewer: SessionUser, code: string): ShopLinkItem {
  const row = managedLink(db, viewer, code);
  if (!row.link.retiredAt) {
    const now = clock.now();
    db.update(shopLinks).set({ retiredAt: now, updatedAt: now }).where(eq(shopLinks.id, row.link.id)).run();
  }
  return linkItems(db, appUrl, [linkByCode(db, code)])[0]!;
}

/** The address a QR code carries; any existing link has one (the page behind it says when it was retired). */
export function shopLinkUrl(db: Db, appUrl: string, code: string) {
  return linkUrl(appUrl, linkByCode(db, code).link.code);
}

/**
 * For the client: the shop's banner over the pinned revision, and whether a newer one exists. The link's
 * note is the shop's own record (a customer's name, the price quoted): only the shop's accounts get it.
 */
export function getPinnedSheet(db: Db, appUrl: string, code: string, viewer: SessionUser | undefined): PinnedSheetView {
  const { link, shop, swap, revision } = linkByCode(db, code);
  if (link.retiredAt)
    throw new AppError('link_retired', `${shop.name} has retired this link. The swap it pointed to is still on Swapyard.`, 410);
  return {
    link: {
      code: link.code,
      url: linkUrl(appUrl, link.code),
      note: actsFor(viewer, link.shopId) ? link.note : null,
      createdAt: link.createdAt.toISOString(),
    },
    shop: shopView(shop),
    sheet: getSwapSheet(db, swap.slug, revision.number),
    newerRevision: newerRevisionOf(db, swap, link.revisionId),
  };
}

export type LinkVisit =
  | { kind: 'redirect'; location: string }
  | { kind: 'unknown' }
  | { kind: 'retired'; shopName: string; swap: { slug: string; title: string } | null };

/** GET /l/:code: counts the visit and says where to send the reader. */
export function visitShopLink(db: Db, code: string): LinkVisit {
  const row = db
    .select({ link: shopLinks, shop: shops, swap: swaps, number: revisions.number })
    .from(shopLinks)
    .innerJoin(shops, eq(shops.id, shopLinks.shopId))
    .innerJoin(swaps, eq(swaps.id, shopLinks.swapId))
    .innerJoin(revisions, eq(revisions.id, shopLinks.revisionId))
    .where(eq(shopLinks.code, code))
    .get();
  if (!row) return { kind: 'unknown' };
  if (row.link.retiredAt) {
    const current = row.swap.currentRevisionId
      ? db.select({ data: revisions.data }).from(revisions).where(eq(revisions.id, row.swap.currentRevisionId)).get()
      : undefined;
    return {
      kind: 'retired',
      shopName: row.shop.name,
      swap: current ? { slug: row.swap.slug, title: current.data.title } : null,
    };
  }
  db.update(shopLinks)
    .set({ visits: sql`${shopLinks.visits} + 1` })
    .where(eq(shopLinks.id, row.link.id))
    .run();
  return { kind: 'redirect', location: `/swaps/${row.swap.slug}/r/${row.number}?via=${encodeURIComponent(row.link.code)}` };
}
