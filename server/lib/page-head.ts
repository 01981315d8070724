import { escapeHtml, jsonForScript } from './html';

/** What a page tells search engines and link previews, written into the client's index.html by the server. */
export type PageHead = {
  /** the page's own title, without the site name (the client's `Page` adds " · Swapyard" the same way) */
  title: string;
  description: string;
  /** absolute; absent on pages that should not be indexed under an address of their own */
  canonical?: string;
  /** Open Graph type: `article` for a swap sheet, `website` otherwise */
  type: 'website' | 'article';
  image: { url: string; width: number; height: number; alt: string };
  noindex?: boolean;
  /** schema.org objects, written as JSON-LD */
  structuredData?: object;
};

export const SITE_NAME = 'Swapyard';

/** A description fits a search result and a link preview: whitespace folded, cut at a word near 200 characters. */
export function shortDescription(text: string, max = 200): string {
  const flat = text.replace(/\s+/g, ' ').trim();
  if (flat.length <= max) return flat;
  const cut = flat.slice(0, max - 1);
  const atWord = cut.lastIndexOf(' ');
  return `${(atWord > max / 2 ? cut.slice(0, atWord) : cut).replace(/[\s,;:.–-]+$/, '')}…`;
}

export function renderPageHead(head: PageHead): string {
  const fullTitle = head.title === SITE_NAME ? SITE_NAME : `${head.title} · ${SITE_NAME}`;
  const meta = (attr: 'name' | 'property', key: string, value: string | number) =>
    `<meta ${attr}="${key}" content="${escapeHtml(String(value))}" />`;
  const lines = [
    `<title>${escapeHtml(fullTitle)}</title>`,
    meta('name', 'description', head.description),
    head.noindex ? meta('name', 'robots', 'noindex') : '',
    head.canonical ? `<link rel="canonical" href="${escapeHtml(head.canonical)}" />` : '',
    meta('property', 'og:site_name', SITE_NAME),
    meta('property', 'og:type', head.type),
    meta('property', 'og:title', head.title),
    meta('property', 'og:description', head.description),
    head.canonical ? meta('property', 'og:url', head.canonical) : '',
    meta('property', 'og:image', head.image.url),
    meta('property', 'og:image:width', head.image.width),
    meta('property', 'og:image:height', head.image.height),
    meta('property', 'og:image:alt', head.image.alt),
    meta('name', 'twitter:card', 'summary_large_image'),
    meta('name', 'twitter:title', head.title),
    meta('name', 'twitter:description', head.description),
    meta('name', 'twitter:image', head.image.url),
    meta('name', 'twitter:image:alt', head.image.alt),
    head.structuredData ? `<script type="application/ld+json">${jsonForScript(head.structuredData)}</script>` : '',
  ];
  return lines.filter(Boolean).join('\n    ');
}

/**
 * The client's index.html with the page's head: its own title and description replace the built ones, and
 * the rest is written where the title was (before </head> when the page has no title).
 */
export function withPageHead(html: string, head: PageHead): string {
  const tags = renderPageHead(head);
  const bare = html.replace(/<meta\s+name="description"[^>]*>\s*/i, '');
  if (/<title>[\s\S]*?<\/title>/i.test(bare)) return bare.replace(/<title>[\s\S]*?<\/title>/i, () => tags);
  return bare.replace(/<\/head>/i, () => `${tags}\n  </head>`);
}
