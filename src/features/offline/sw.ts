/// <reference lib="webworker" />
import { clientsClaim } from 'workbox-core';
import { cleanupOutdatedCaches, matchPrecache, precacheAndRoute } from 'workbox-precaching';
import { registerRoute } from 'workbox-routing';
import { KEPT_CACHE, keepablePath } from './kept-sheets';

// The service worker: the app's own files for reading without a connection, pages from the network
// first, and the sheets a reader kept. It never stores an answer on its own: only what the page kept,
// and only answers a shared cache may keep (never a member's private data).

declare const self: ServiceWorkerGlobalScope & { __WB_MANIFEST: Array<{ url: string; revision: string | null }> };

const SHELL = '/index.html';

self.skipWaiting();
clientsClaim();
cleanupOutdatedCaches();
// hashed assets and the page shell; the shell is never answered for an address by itself (no
// directory index, no clean URLs): pages come from the server, which sets their status and head
precacheAndRoute(self.__WB_MANIFEST, { directoryIndex: '', cleanURLs: false });

const sharedMayStore = (res: Response) =>
  res.ok && !/(^|[\s,])(private|no-store)([\s,=]|$)/i.test(res.headers.get('cache-control') ?? '');

// pages: the network's answer, or, without a connection, the shell that draws the page from kept data
registerRoute(
  ({ request }) => request.mode === 'navigate',
  async ({ request }) => {
    try {
      return await fetch(request);
    } catch (offline) {
      const shell = await matchPrecache(SHELL);
      if (shell) return shell;
      throw offline;
    }
  },
);

// kept sheets and photos: the network first (refreshing the kept copy), the kept copy when it fails
registerRoute(
  ({ url, request }) => url.origin === self.location.origin && request.method === 'GET' && keepablePath.test(url.pathname),
  async ({ request }) => {
    const cache = await caches.open(KEPT_CACHE);
    try {
      const res = await fetch(request);
      if (sharedMayStore(res) && (await cache.match(request.url, { ignoreVary: true })))
        await cache.put(request.url, res.clone());
      return res;
    } catch (offline) {
      const kept = await cache.match(request.url, { ignoreVary: true });
      if (kept) return kept;
      throw offline;
    }
  },
);
