import { z } from 'zod';
import { markdownText, multiLine, singleLine } from './text';
import type { SwapCard, SwapSheetView } from './views';

// API contract of shop pages and shop links (a short link pinned to the revision a shop quoted).

const noteField = markdownText().trim().max(4000, 'A note may be at most 4,000 characters');

export const weekdays = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'] as const;
export type Weekday = (typeof weekdays)[number];
export const weekdayLabels: Record<Weekday, string> = {
  mon: 'Monday',
  tue: 'Tuesday',
  wed: 'Wednesday',
  thu: 'Thursday',
  fri: 'Friday',
  sat: 'Saturday',
  sun: 'Sunday',
};

const clockTime = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'A time like 08:30');
/** one opening period; a day with none is closed, a day with two has a lunch break */
export const openingPeriodSchema = z
  .object({ day: z.enum(weekdays), opens: clockTime, closes: clockTime })
  .refine((p) => p.opens < p.closes, { message: 'Closes after it opens', path: ['closes'] });
export type OpeningPeriod = z.infer<typeof openingPeriodSchema>;

/** the shop's contact details, all optional; what is empty is not shown */
export const shopContactSchema = z.object({
  phone: singleLine()
    .trim()
    .max(40)
    .refine((v) => v === '' || /^\+?[0-9 ()./-]{5,40}$/.test(v), 'A phone number: digits, spaces and + ( ) - . /'),
  email: singleLine()
    .trim()
    .max(200)
    .refine((v) => v === '' || z.email().safeParse(v).success, 'An e-mail address like workshop@example.org'),
  address: multiLine().trim().max(300, 'At most 300 characters'),
  hoursNote: singleLine().trim().max(200, 'At most 200 characters'),
});
export type ShopContact = z.infer<typeof shopContactSchema>;

export const updateShopSchema = z
  .object({
    name: singleLine().trim().min(2, 'Give the shop’s name').max(80),
    town: singleLine().trim().max(80),
    website: singleLine()
      .trim()
      .max(200)
      .refine((v) => v === '' || /^https?:\/\/[^\s/]+\.[^\s]+$/i.test(v), 'A web address starting with http:// or https://'),
    about: markdownText().trim().max(4000, 'At most 4,000 characters'),
    contact: shopContactSchema,
    openingHours: z.array(openingPeriodSchema).max(21, 'At most three periods a day'),
  })
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Send at least one field to change' });
export type UpdateShop = z.infer<typeof updateShopSchema>;

/** a price the shop quoted, in minor units (cents) of its currency */
export const quotedPriceSchema = z.object({
  amountMinor: z.number().int('Whole cents').min(0, 'Not below zero').max(100_000_000, 'Too large'),
  currency: z.string().regex(/^[A-Z]{3}$/, 'A three-letter currency code'),
});
export type QuotedPrice = z.infer<typeof quotedPriceSchema>;

/**
 * What a shop link carries. The public note is shown to everyone who opens the link; the rest is the
 * shop's own record of the quote and is seen only by the shop's accounts.
 */
const shopLinkFields = {
  publicNote: noteField,
  /** private: the shop's own note (before public notes existed, the only note) */
  note: noteField,
  /** private */
  customerRef: singleLine().trim().max(120, 'At most 120 characters'),
  /** private */
  quotedPrice: quotedPriceSchema.nullable(),
  /** private: from this moment the link answers as retired */
  expiresAt: z.iso.datetime({ offset: true, message: 'A date and time' }).nullable(),
};

export const createShopLinkSchema = z.object({
  swapSlug: z.string().trim().min(1, 'Pick the swap').max(120),
  publicNote: shopLinkFields.publicNote.default(''),
  note: shopLinkFields.note.default(''),
  customerRef: shopLinkFields.customerRef.default(''),
  quotedPrice: shopLinkFields.quotedPrice.default(null),
  expiresAt: shopLinkFields.expiresAt.default(null),
});
export type CreateShopLink = z.infer<typeof createShopLinkSchema>;
/** what a client sends: fields with defaults may be left out */
export type CreateShopLinkInput = z.input<typeof createShopLinkSchema>;

export const updateShopLinkSchema = z
  .object(shopLinkFields)
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Send at least one field to change' });
export type UpdateShopLink = z.infer<typeof updateShopLinkSchema>;
export type UpdateShopLinkInput = z.input<typeof updateShopLinkSchema>;

/** the private part of a link, present only for the shop's own accounts */
export type ShopLinkPrivate = { note: string; customerRef: string; quotedPrice: QuotedPrice | null; expiresAt: string | null };

export const shopLinkCodeSchema = z.string().regex(/^[a-z0-9-]{4,32}$/, 'Not a link code');

export type ShopView = {
  slug: string;
  name: string;
  town: string;
  website: string;
  about: string;
  contact: ShopContact;
  openingHours: OpeningPeriod[];
};

/** a fitted report a member of the shop made, as the shop page lists it */
export type ShopFittedReport = {
  swap: { slug: string; title: string };
  wheel: string;
  note: string;
  createdAt: string;
};

/** GET /api/shops/:slug */
export type ShopPageView = {
  shop: ShopView;
  /** swaps the shop links customers to */
  swaps: SwapCard[];
  /** published swaps written by the shop's accounts */
  written: SwapCard[];
  fittedReports: ShopFittedReport[];
  canEdit: boolean;
};

export type NewerRevision = { number: number; summary: string };

/** one row of GET /api/shop-links */
export type ShopLinkItem = {
  code: string;
  /** the short address to give customers */
  url: string;
  shop: { slug: string; name: string };
  swap: { slug: string; title: string };
  revision: { number: number };
  publicNote: string;
  /** the shop's own record of the quote: null for anyone else (an admin looking over the links) */
  private: ShopLinkPrivate | null;
  /** whether the expiry has passed: the link answers as retired */
  expired: boolean;
  /** visits by anyone but the shop's own accounts */
  visits: number;
  createdAt: string;
  retiredAt: string | null;
  newerRevision: NewerRevision | null;
};
export type ShopLinkList = { items: ShopLinkItem[]; canManage: boolean };

/** GET /api/l/:code — what the client shows above a pinned sheet */
export type PinnedSheetView = {
  /** `private` is the shop's own record of the quote: null for everyone but the shop's own accounts */
  link: { code: string; url: string; publicNote: string; private: ShopLinkPrivate | null; createdAt: string };
  shop: ShopView;
  sheet: SwapSheetView;
  newerRevision: NewerRevision | null;
};
