import { z } from 'zod';
import { markdownText, singleLine } from './text';
import type { SwapCard, SwapSheetView } from './views';

// API contract of shop pages and shop links (a short link pinned to the revision a shop quoted).

const noteField = markdownText().trim().max(4000, 'A note may be at most 4,000 characters');

export const updateShopSchema = z
  .object({
    name: singleLine().trim().min(2, 'Give the shop’s name').max(80),
    town: singleLine().trim().max(80),
    website: singleLine()
      .trim()
      .max(200)
      .refine((v) => v === '' || /^https?:\/\/[^\s/]+\.[^\s]+$/i.test(v), 'A web address starting with http:// or https://'),
    about: markdownText().trim().max(4000, 'At most 4,000 characters'),
  })
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Send at least one field to change' });
export type UpdateShop = z.infer<typeof updateShopSchema>;

export const createShopLinkSchema = z.object({
  swapSlug: z.string().trim().min(1, 'Pick the swap').max(120),
  note: noteField.default(''),
});
export type CreateShopLink = z.infer<typeof createShopLinkSchema>;

export const updateShopLinkSchema = z.object({ note: noteField });

export const shopLinkCodeSchema = z.string().regex(/^[a-z0-9-]{4,32}$/, 'Not a link code');

export type ShopView = { slug: string; name: string; town: string; website: string; about: string };

/** GET /api/shops/:slug */
export type ShopPageView = { shop: ShopView; swaps: SwapCard[]; canEdit: boolean };

export type NewerRevision = { number: number; summary: string };

/** one row of GET /api/shop-links */
export type ShopLinkItem = {
  code: string;
  /** the short address to give customers */
  url: string;
  shop: { slug: string; name: string };
  swap: { slug: string; title: string };
  revision: { number: number };
  note: string;
  visits: number;
  createdAt: string;
  retiredAt: string | null;
  newerRevision: NewerRevision | null;
};
export type ShopLinkList = { items: ShopLinkItem[]; canManage: boolean };

/** GET /api/l/:code — what the client shows above a pinned sheet */
export type PinnedSheetView = {
  /** `note` is private to the shop: null for everyone but the shop's own accounts */
  link: { code: string; url: string; note: string | null; createdAt: string };
  shop: ShopView;
  sheet: SwapSheetView;
  newerRevision: NewerRevision | null;
};
