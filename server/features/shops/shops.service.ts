import crypto from 'node:crypto';
import { and, desc, eq, gt, inArray, isNotNull, isNull, or, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { fittedReports, revisions, shopLinks, shops, swaps, users } from '../../db/schema/index';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import { stripHtml } from '../../lib/sanitize';
import type { SessionUser } from '../../middleware/require-role';
import { can } from '../../../shared/roles';
import type {
  CreateShopLink,
  NewerRevision,
  PinnedSheetView,
  ShopFittedReport,
  ShopLinkItem,
  ShopLinkList,
  ShopLinkPrivate,
  ShopPageView,
  ShopView,
  UpdateShop,
  UpdateShopLink,
} from '../../../shared/schemas/shops';
import { weekdays } from '../../../shared/schemas/shops';
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
  contact: { phone: s.phone, email: s.email, address: s.address, hoursNote: s.hoursNote },
  openingHours: s.openingHours,
});

/** A link whose expiry has passed answers as a retired one. */
const isExpired = (link: LinkRow, now: Date) => link.expiresAt !== null && link.expiresAt <= now;
const isRetired = (link: LinkRow, now: Date) => link.retiredAt !== null || isExpired(link, now);

const privatePart = (link: LinkRow): ShopLinkPrivate => ({
  note: link.note,
  customerRef: link.customerRef,
  quotedPrice:
    link.quotedPriceMinor !== null && link.quotedCurrency
      ? { amountMinor: link.quotedPriceMinor, currency: link.quotedCurrency }
      : null,
  expiresAt: link.expiresAt ? link.expiresAt.toISOString() : null,
});

/** The shop's members: accounts linked to it (shop accounts, and an admin who set theirs). */
const isShopMember = (viewer: SessionUser | undefined, shopId: number) => Boolean(viewer && viewer.shopId === shopId);

/** A shop user acts for their own shop only; everyone else (admins included) may at most look. */
export const actsFor = (user: SessionUser | undefined, shopId: number) =>
  Boolean(user && user.role === 'shop' && can(user.role, 'manage_shop_links') && user.shopId === shopId);

const linkUrl = (appUrl: string, code: string) => `${appUrl.replace(/\/$/, '')}/l/${code}`;

function shopBySlug(db: Db, slug: string) {
  const row = db.select().from(shops).where(eq(shops.slug, slug)).get();
  if (!row) throw AppError.notFound('That shop');
  return row;
}

/** Fitted reports the shop's accounts made, newest first: only those readers see (not held, not hidden). */
function shopFittedReports(db: Db, shopId: number, limit = 50): ShopFittedReport[] {
  return db
    .select({
      slug: swaps.slug,
      title: sql<string>`json_extract(${revisions.data}, '$.title')`,
      wheel: fittedReports.wheel,
      note: fittedReports.note,
      createdAt: fittedReports.createdAt,
    })
    .from(fittedReports)
    .innerJoin(users, eq(users.id, fittedReports.userId))
    .innerJoin(swaps, eq(swaps.id, fittedReports.swapId))
    .innerJoin(revisions, eq(revisions.id, swaps.currentRevisionId))
    .where(and(eq(users.shopId, shopId), eq(fittedReports.state, 'live'), isNull(fittedReports.hiddenAt)))
    .orderBy(desc(fittedReports.createdAt), desc(fittedReports.id))
    .limit(limit)
    .all()
    .map((r) => ({
      swap: { slug: r.slug, title: r.title },
      wheel: `${r.wheel.diameterIn}×${r.wheel.widthIn} in, ET${r.wheel.offsetMm}${r.wheel.spacerMm ? ` with a ${r.wheel.spacerMm} mm spacer` : ''}`,
      note: r.note,
      createdAt: r.createdAt.toISOString(),
    }));
}

export function getShopPage(db: Db, clock: Clock, slug: string, viewer: SessionUser | undefined): ShopPageView {
  const shop = shopBySlug(db, slug);
  const now = clock.now();
  const linked = db
    .selectDistinct({ swapId: shopLinks.swapId })
    .from(shopLinks)
    .where(
      and(
        eq(shopLinks.shopId, shop.id),
        isNull(shopLinks.retiredAt),
        or(isNull(shopLinks.expiresAt), gt(shopLinks.expiresAt, now)),
      ),
    )
    .all()
    .map((r) => r.swapId);
  const members = db
    .select({ id: users.id })
    .from(users)
    .where(eq(users.shopId, shop.id))
    .all()
    .map((u) => u.id);
  return {
    shop: shopView(shop),
    swaps: linked.length ? swapCards(db, and(inArray(swaps.id, linked), isNotNull(swaps.currentRevisionId))) : [],
    written: members.length ? swapCards(db, inArray(swaps.authorId, members)) : [],
    fittedReports: shopFittedReports(db, shop.id),
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
  if (input.contact !== undefined) {
    changes.phone = input.contact.phone;
    changes.email = input.contact.email;
    changes.address = stripHtml(input.contact.address).trim();
    changes.hoursNote = stripHtml(input.contact.hoursNote).trim();
  }
  if (input.openingHours !== undefined)
    changes.openingHours = [...input.openingHours].sort(
      (a, b) => weekdays.indexOf(a.day) - weekdays.indexOf(b.day) || a.opens.localeCompare(b.opens),
    );
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
  { now, viewer }: { now: Date; viewer: SessionUser },
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
    publicNote: link.publicNote,
    private: actsFor(viewer, link.shopId) ? privatePart(link) : null,
    expired: isExpired(link, now),
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
export function listShopLinks(db: Db, clock: Clock, appUrl: string, viewer: SessionUser, shopSlug?: string): ShopLinkList {
  const now = clock.now();
  if (viewer.role === 'admin') {
    const where = shopSlug ? eq(shopLinks.shopId, shopBySlug(db, shopSlug).id) : undefined;
    return { items: linkItems(db, { now, viewer }, appUrl, linkRows(db, where)), canManage: false };
  }
  if (!can(viewer.role, 'manage_shop_links')) throw AppError.forbidden('Shop links belong to shop accounts.');
  if (viewer.shopId === null) throw AppError.forbidden('Your account is not linked to a shop yet; ask an admin to link it.');
  return { items: linkItems(db, { now, viewer }, appUrl, linkRows(db, eq(shopLinks.shopId, viewer.shopId))), canManage: true };
}

function linkByCode(db: Db, code: string) {
  const row = linkRows(db, eq(shopLinks.code, code))[0];
  if (!row) throw AppError.notFound('That shop link');
  return row;
}

const expiryField = (expiresAt: string | null, now: Date) => {
  if (expiresAt === null) return null;
  const at = new Date(expiresAt);
  if (at <= now) throw AppError.invalid('The expiry is in the past.', { expiresAt: 'Pick a moment after now' });
  return at;
};

/** The columns an input sets, cleaned as stored text is; fields left out stay as they are. */
function linkColumns(input: Partial<UpdateShopLink>, now: Date): Partial<LinkRow> {
  const set: Partial<LinkRow> = {};
  if (input.publicNote !== undefined) set.publicNote = stripHtml(input.publicNote).trim();
  if (input.note !== undefined) set.note = stripHtml(input.note).trim();
  if (input.customerRef !== undefined) set.customerRef = stripHtml(input.customerRef).trim();
  if (input.quotedPrice !== undefined) {
    set.quotedPriceMinor = input.quotedPrice?.amountMinor ?? null;
    set.quotedCurrency = input.quotedPrice?.currency ?? null;
  }
  if (input.expiresAt !== undefined) set.expiresAt = expiryField(input.expiresAt, now);
  return set;
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
  const columns = linkColumns(input, now);
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
          ...columns,
          createdAt: now,
          updatedAt: now,
        })
        .run();
      return linkItems(db, { now, viewer }, appUrl, [linkByCode(db, code)])[0]!;
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

export function updateShopLink(
  db: Db,
  clock: Clock,
  appUrl: string,
  viewer: SessionUser,
  code: string,
  input: UpdateShopLink,
): ShopLinkItem {
  const row = managedLink(db, viewer, code);
  const now = clock.now();
  db.update(shopLinks)
    .set({ ...linkColumns(input, now), updatedAt: now })
    .where(eq(shopLinks.id, row.link.id))
    .run();
  return linkItems(db, { now, viewer }, appUrl, [linkByCode(db, code)])[0]!;
}

export function retireShopLink(db: Db, clock: Clock, appUrl: string, viewer: SessionUser, code: string): ShopLinkItem {
  const row = managedLink(db, viewer, code);
  const now = clock.now();
  if (!row.link.retiredAt) {
    db.update(shopLinks).set({ retiredAt: now, updatedAt: now }).where(eq(shopLinks.id, row.link.id)).run();
  }
  return linkItems(db, { now, viewer }, appUrl, [linkByCode(db, code)])[0]!;
}

/** The address a QR code carries; any existing link has one (the page behind it says when it was retired). */
export function shopLinkUrl(db: Db, appUrl: string, code: string) {
  return linkUrl(appUrl, linkByCode(db, code).link.code);
}

/**
 * For the client: the shop's banner over the pinned revision, and whether a newer one exists. The public
 * note goes to everyone; the private part (a customer's reference, the price quoted, the expiry) only to
 * the shop's accounts. An expired link answers as a retired one does.
 */
export function getPinnedSheet(
  db: Db,
  clock: Clock,
  appUrl: string,
  code: string,
  viewer: SessionUser | undefined,
): PinnedSheetView {
  const { link, shop, swap, revision } = linkByCode(db, code);
  if (isRetired(link, clock.now()))
    throw new AppError('link_retired', `${shop.name} has retired this link. The swap it pointed to is still on Swapyard.`, 410);
  return {
    link: {
      code: link.code,
      url: linkUrl(appUrl, link.code),
      publicNote: link.publicNote,
      private: actsFor(viewer, link.shopId) ? privatePart(link) : null,
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

/** GET /l/:code: counts the visit (unless the shop's own people open it) and says where to send the reader. */
export function visitShopLink(db: Db, clock: Clock, code: string, viewer: SessionUser | undefined): LinkVisit {
  const row = db
    .select({ link: shopLinks, shop: shops, swap: swaps, number: revisions.number })
    .from(shopLinks)
    .innerJoin(shops, eq(shops.id, shopLinks.shopId))
    .innerJoin(swaps, eq(swaps.id, shopLinks.swapId))
    .innerJoin(revisions, eq(revisions.id, shopLinks.revisionId))
    .where(eq(shopLinks.code, code))
    .get();
  if (!row) return { kind: 'unknown' };
  if (isRetired(row.link, clock.now())) {
    const current = row.swap.currentRevisionId
      ? db.select({ data: revisions.data }).from(revisions).where(eq(revisions.id, row.swap.currentRevisionId)).get()
      : undefined;
    return {
      kind: 'retired',
      shopName: row.shop.name,
      swap: current ? { slug: row.swap.slug, title: current.data.title } : null,
    };
  }
  if (!isShopMember(viewer, row.link.shopId)) {
    db.update(shopLinks)
      .set({ visits: sql`${shopLinks.visits} + 1` })
      .where(eq(shopLinks.id, row.link.id))
      .run();
  }
  return { kind: 'redirect', location: `/swaps/${row.swap.slug}/r/${row.number}?via=${encodeURIComponent(row.link.code)}` };
}
