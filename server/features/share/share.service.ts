import { eq, isNotNull } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, parts, revisions, shops, swaps } from '../../db/schema/index';
import type { ChassisPageView, PartPageView, PhotoView, SwapSheetView } from '../../../shared/schemas/views';
import type { ShopPageView } from '../../../shared/schemas/shops';
import type { PageName } from '../../../shared/page-routes';
import { categoryLabels } from '../../../shared/schemas/enums';
import { chassisLabel } from '../../../shared/chassis-label';
import { THUMB_EDGE_PX } from '../photos/photo-processing';
import { shortDescription, type PageHead } from '../../lib/page-head';

// What each public page says about itself to search engines and link previews (title, description, canonical
// address, preview image) and, as JSON-LD in the schema.org vocabulary, what it is about.

export const SITE_DESCRIPTION =
  'Swapyard: reviewed records of which brake, wheel and suspension parts fit which car, with the adapters, shims, spacers, machining and torque each swap needs.';

/** The app's own preview card (public/share-card.png), for pages without a photo of their own. */
const card = (appUrl: string): PageHead['image'] => ({
  url: `${appUrl}/share-card.png`,
  width: 1200,
  height: 630,
  alt: 'Swapyard — what fits your car',
});

/** A photo's thumbnail: the stored photo scaled to fit THUMB_EDGE_PX, never enlarged (as photo processing makes it). */
export function thumbImage(appUrl: string, photo: PhotoView, alt: string): PageHead['image'] {
  const scale = Math.min(1, THUMB_EDGE_PX / Math.max(photo.width, photo.height));
  return {
    url: `${appUrl}${photo.thumbUrl}`,
    width: Math.round(photo.width * scale),
    height: Math.round(photo.height * scale),
    alt: photo.caption || alt,
  };
}

const vocabulary = 'https://schema.org';

const carOf = (c: ChassisPageView['chassis'], url?: string) => ({
  '@type': 'Car',
  name: chassisLabel(c),
  manufacturer: { '@type': 'Organization', name: c.make },
  model: c.model,
  vehicleModelDate: String(c.yearFrom),
  ...(c.body ? { bodyType: c.body } : {}),
  ...(url ? { url } : {}),
});

export function swapHead(appUrl: string, view: SwapSheetView): PageHead {
  const { swap, chassis: c, revision } = view;
  const current = `${appUrl}/swaps/${encodeURIComponent(swap.slug)}`;
  const isCurrent = revision.number === view.currentNumber;
  // an older revision is its own page (what a shop pinned); the current one is read at the swap's address
  const canonical = isCurrent ? current : `${current}/r/${revision.number}`;
  const title = revision.data.title;
  const description = shortDescription(
    revision.data.summary ||
      `${categoryLabels[swap.category]} swap on the ${swap.axle} axle of the ${chassisLabel(c)}: parts, adapters, machining and torque specs.`,
  );
  const first = revision.photos[0];
  const image = first ? thumbImage(appUrl, first, title) : card(appUrl);
  return {
    title,
    description,
    canonical,
    type: 'article',
    image,
    structuredData: {
      '@context': vocabulary,
      '@type': 'TechArticle',
      headline: title,
      description,
      url: canonical,
      image: image.url,
      author: { '@type': 'Person', name: revision.author.name },
      ...(revision.approvedAt ? { dateModified: revision.approvedAt } : {}),
      datePublished: swap.createdAt,
      about: carOf(c, `${appUrl}/chassis/${encodeURIComponent(c.slug)}`),
      publisher: { '@type': 'Organization', name: 'Swapyard', url: appUrl },
    },
  };
}

export function chassisHead(appUrl: string, view: ChassisPageView): PageHead {
  const c = view.chassis;
  const url = `${appUrl}/chassis/${encodeURIComponent(c.slug)}`;
  const count = view.swaps.length;
  const description = shortDescription(
    `${count} reviewed ${count === 1 ? 'swap' : 'swaps'} for the ${chassisLabel(c)}. Hub: ${c.lugCount}×${c.pcdMm}, centre bore ${c.centreBoreMm} mm, wheel bolts ${c.wheelBoltThread}.`,
  );
  return {
    title: chassisLabel(c),
    description,
    canonical: url,
    type: 'website',
    image: card(appUrl),
    structuredData: { '@context': vocabulary, ...carOf(c, url), description },
  };
}

export function partHead(appUrl: string, view: PartPageView): PageHead {
  const p = view.part;
  const url = `${appUrl}/parts/${p.id}`;
  const count = view.swaps.length;
  const description = shortDescription(
    `${p.name}${p.maker ? ` by ${p.maker}` : ''}: specs, part numbers and ${count} reviewed ${count === 1 ? 'swap' : 'swaps'} that use it.${p.notes ? ` ${p.notes}` : ''}`,
  );
  return {
    title: p.name,
    description,
    canonical: url,
    type: 'website',
    image: card(appUrl),
    structuredData: {
      '@context': vocabulary,
      '@type': 'Product',
      name: p.name,
      description,
      url,
      category: p.kind,
      ...(p.maker ? { manufacturer: { '@type': 'Organization', name: p.maker } } : {}),
      ...(p.partNumbers[0] ? { mpn: p.partNumbers[0] } : {}),
    },
  };
}

export function shopHead(appUrl: string, view: ShopPageView): PageHead {
  const s = view.shop;
  const url = `${appUrl}/shops/${encodeURIComponent(s.slug)}`;
  const description = shortDescription(s.about || `${s.name}${s.town ? `, ${s.town}` : ''}: swaps this shop fits, on Swapyard.`);
  return {
    title: s.name,
    description,
    canonical: url,
    type: 'website',
    image: card(appUrl),
    structuredData: {
      '@context': vocabulary,
      '@type': 'AutoRepair',
      name: s.name,
      description,
      url,
      ...(s.website ? { sameAs: s.website } : {}),
      ...(s.town ? { address: { '@type': 'PostalAddress', addressLocality: s.town } } : {}),
    },
  };
}

/** Titles of the pages without a record of their own, as the client names them. */
const plainTitles: Partial<Record<PageName, string>> = {
  home: 'What fits your car',
  search: 'Search swaps',
  tools: 'Fitment calculators',
  whereElse: 'Where else',
};

/** Pages anyone may read and search engines may list; the rest are a member's or the desk's own. */
const indexable = new Set<PageName>(['home', 'search', 'tools', 'whereElse', 'swap', 'swapRevision', 'chassis', 'part', 'shop']);

/** The head of a page without a record (or one answering 404): the site's card, and no index for private pages. */
export function plainHead(appUrl: string, page: PageName | null, pathname: string): PageHead {
  const listed = page !== null && indexable.has(page);
  return {
    title: (page && plainTitles[page]) ?? (page ? 'Swapyard' : 'Not found'),
    description: SITE_DESCRIPTION,
    ...(listed && page in plainTitles ? { canonical: `${appUrl}${pathname}` } : {}),
    type: 'website',
    image: card(appUrl),
    noindex: !listed || !(page in plainTitles),
    ...(page === 'home'
      ? { structuredData: { '@context': vocabulary, '@type': 'WebSite', name: 'Swapyard', url: appUrl, description: SITE_DESCRIPTION } }
      : {}),
  };
}

export type SitemapEntry = { path: string; lastmod: Date };

/** Every public page worth listing: approved swaps (at their current revision), catalogue chassis, parts, shops. */
export function sitemapEntries(db: Db): SitemapEntry[] {
  const swapRows = db
    .select({ slug: swaps.slug, approvedAt: revisions.reviewedAt, updatedAt: swaps.updatedAt })
    .from(swaps)
    .innerJoin(revisions, eq(revisions.id, swaps.currentRevisionId))
    .where(isNotNull(swaps.currentRevisionId))
    .orderBy(swaps.slug)
    .all();
  const later = (a: Date | null, b: Date) => (a && a > b ? a : b);
  return [
    ...swapRows.map((s) => ({ path: `/swaps/${encodeURIComponent(s.slug)}`, lastmod: later(s.approvedAt, s.updatedAt) })),
    ...db
      .select({ slug: chassis.slug, updatedAt: chassis.updatedAt })
      .from(chassis)
      .where(eq(chassis.proposed, false))
      .orderBy(chassis.slug)
      .all()
      .map((c) => ({ path: `/chassis/${encodeURIComponent(c.slug)}`, lastmod: c.updatedAt })),
    ...db
      .select({ id: parts.id, updatedAt: parts.updatedAt })
      .from(parts)
      .orderBy(parts.id)
      .all()
      .map((p) => ({ path: `/parts/${p.id}`, lastmod: p.updatedAt })),
    ...db
      .select({ slug: shops.slug, updatedAt: shops.updatedAt })
      .from(shops)
      .orderBy(shops.slug)
      .all()
      .map((s) => ({ path: `/shops/${encodeURIComponent(s.slug)}`, lastmod: s.updatedAt })),
  ];
}
