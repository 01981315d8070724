import type { SwapSheetView } from '@shared/schemas/views';

/**
 * Sheets a reader keeps for reading without a connection. The page stores them in a Cache Storage cache
 * that the service worker answers from when the network fails (`sw.ts`), and lists them on the device.
 * Only answers the same for every reader are kept: they are fetched without cookies and stored only when
 * the server says a shared cache may keep them, so a member's private data never lands here.
 */
export const KEPT_CACHE = 'swapyard-kept-v1';
const LIST_KEY = 'swapyard.kept-sheets';

/** Addresses the service worker may answer from the kept cache: sheets, their revisions, photos. */
export const keepablePath = /^\/(api\/swaps\/[a-z0-9-]+(\/revisions\/\d+)?|media\/[A-Za-z0-9_-]+)$/;

export type KeptSheet = { slug: string; number: number | null; title: string; keptAt: string; urls: string[] };

/** The API address of a sheet as the page reads it: the current revision, or a pinned one. */
export const sheetApiUrl = (slug: string, number: number | null) =>
  number === null ? `/api/swaps/${slug}` : `/api/swaps/${slug}/revisions/${number}`;

/** Everything the sheet needs beyond the app itself: its answer and each photo, full size and thumbnail. */
export function sheetUrls(view: SwapSheetView, number: number | null): string[] {
  const photos = view.revision.photos.flatMap((p) => [p.url, p.thumbUrl]);
  return [sheetApiUrl(view.swap.slug, number), ...new Set(photos)];
}

/** A cache that may be shared (a CDN) may store it: what never depends on who asked. */
const sharedMayStore = (res: Response) => !/(^|[\s,])(private|no-store)([\s,=]|$)/i.test(res.headers.get('cache-control') ?? '');

export const offlineStorageAvailable = () => typeof caches !== 'undefined' && typeof localStorage !== 'undefined';

export function keptSheets(): KeptSheet[] {
  try {
    return JSON.parse(localStorage.getItem(LIST_KEY) ?? '[]') as KeptSheet[];
  } catch {
    return [];
  }
}

const saveList = (list: KeptSheet[]) => localStorage.setItem(LIST_KEY, JSON.stringify(list));
const sameSheet = (a: Pick<KeptSheet, 'slug' | 'number'>, b: Pick<KeptSheet, 'slug' | 'number'>) =>
  a.slug === b.slug && a.number === b.number;

export const isKept = (slug: string, number: number | null) => keptSheets().some((k) => sameSheet(k, { slug, number }));

/** Fetches the sheet and its photos afresh (as a visitor) and stores them; all or nothing. */
export async function keepSheet(view: SwapSheetView, number: number | null): Promise<KeptSheet> {
  const urls = sheetUrls(view, number);
  const answers = await Promise.all(
    urls.map(async (url) => {
      const res = await fetch(url, { credentials: 'omit', cache: 'no-cache' });
      if (!res.ok || !sharedMayStore(res)) throw new Error(`Could not keep ${url} (HTTP ${res.status}).`);
      return [url, res] as const;
    }),
  );
  const cache = await caches.open(KEPT_CACHE);
  await Promise.all(answers.map(([url, res]) => cache.put(url, res)));
  const kept: KeptSheet = {
    slug: view.swap.slug,
    number,
    title: view.revision.data.title,
    keptAt: new Date().toISOString(),
    urls,
  };
  saveList([kept, ...keptSheets().filter((k) => !sameSheet(k, kept))]);
  return kept;
}

/** Removes a kept sheet and whatever no other kept sheet still needs. */
export async function forgetSheet(slug: string, number: number | null) {
  const list = keptSheets();
  const gone = list.find((k) => sameSheet(k, { slug, number }));
  const rest = list.filter((k) => k !== gone);
  saveList(rest);
  if (!gone) return;
  const stillNeeded = new Set(rest.flatMap((k) => k.urls));
  const cache = await caches.open(KEPT_CACHE);
  await Promise.all(gone.urls.filter((u) => !stillNeeded.has(u)).map((u) => cache.delete(u)));
}
