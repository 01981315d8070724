import './lib/zod-jitless';
import { AsyncLocalStorage } from 'node:async_hooks';
import { StrictMode } from 'react';
import { PassThrough } from 'node:stream';
import { renderToPipeableStream } from 'react-dom/server';
import { createStaticHandler, createStaticRouter, StaticRouterProvider } from 'react-router';
import { dehydrate, QueryClient } from '@tanstack/react-query';
import { routes } from './app/router';
import { AppProvider } from './app/provider';
import { makeQueryClient } from './lib/query-client';
import { setApiTransport } from './lib/api-client';
import type { ServerState } from './app/server-state';

// The server's side of the client: a public page rendered to HTML with the data it shows, through React
// Router's static handler and the same route table and query functions the browser uses.

/** How one render reaches the API: the server's own address and the reader's cookie, so answers are theirs. */
export type ApiContext = { origin: string; headers: Record<string, string> };

const apiContext = new AsyncLocalStorage<ApiContext>();

setApiTransport((input, init) => {
  const ctx = apiContext.getStore();
  if (!ctx) return Promise.reject(new Error('the API is reached from a page render only'));
  const headers = new Headers(init?.headers);
  for (const [name, value] of Object.entries(ctx.headers)) headers.set(name, value);
  return fetch(new URL(String(input), ctx.origin), { ...init, headers });
});

const handler = createStaticHandler(routes);

/** A page's queries are found by rendering it: each pass fetches what the last one asked for, then renders again. */
const MAX_PASSES = 4;

/**
 * The page's markup once everything in it is ready (lazy components included), so every Suspense boundary
 * is written complete in place: no streaming scripts, which the CSP would refuse anyway.
 */
function toHtml(element: React.ReactElement): Promise<string> {
  return new Promise((resolve, reject) => {
    let failure: unknown;
    const stream = renderToPipeableStream(element, {
      // a large finished boundary would otherwise be sent apart and moved into place by an inline script
      progressiveChunkSize: Number.POSITIVE_INFINITY,
      onShellError: reject,
      onError: (err) => {
        failure ??= err;
      },
      onAllReady() {
        if (failure) return reject(failure instanceof Error ? failure : new Error(String(failure)));
        const sink = new PassThrough();
        let html = '';
        sink.on('data', (chunk: Buffer) => (html += chunk.toString('utf8')));
        sink.on('end', () => resolve(html));
        stream.pipe(sink);
      },
    });
  });
}

type CachedQuery = ReturnType<ReturnType<QueryClient['getQueryCache']>['getAll']>[number];

/** A query the server may run: not switched off, and not one that needs the browser (`meta.browserOnly`, e.g. the search worker). */
const runsOnServer = (q: CachedQuery) => (q.options as { enabled?: unknown }).enabled !== false && !q.meta?.browserOnly;

/** Queries a render asked for and nobody fetched yet (the server runs no effects, so useQuery only registers them). */
function waitingQueries(client: QueryClient, tried: Set<string>) {
  return client
    .getQueryCache()
    .getAll()
    .filter((q) => q.state.status === 'pending' && !tried.has(q.queryHash) && runsOnServer(q));
}

/**
 * The page's HTML and the query cache it was drawn from; null when the address redirects. Throws when a query
 * did not succeed: the page is then left to the browser, which shows its own loading and error states.
 */
export async function renderPage(request: Request, api: ApiContext): Promise<{ html: string; state: ServerState } | null> {
  return apiContext.run(api, async () => {
    const context = await handler.query(request);
    if (context instanceof Response) return null;
    const router = createStaticRouter(handler.dataRoutes, context);
    const client = makeQueryClient({ server: true });
    const page = (
      <StrictMode>
        <AppProvider client={client}>
          <StaticRouterProvider router={router} context={context} hydrate={false} />
        </AppProvider>
      </StrictMode>
    );
    const tried = new Set<string>();
    let html = await toHtml(page);
    for (let pass = 1; pass < MAX_PASSES; pass++) {
      const waiting = waitingQueries(client, tried);
      if (waiting.length === 0) break;
      waiting.forEach((q) => tried.add(q.queryHash));
      await Promise.all(waiting.map((q) => q.fetch().catch(() => undefined)));
      html = await toHtml(page);
    }
    // the browser starts from the same states: what is still waiting there is waiting here too
    const unfinished = client
      .getQueryCache()
      .getAll()
      .filter((q) => q.state.status === 'error' || (q.state.status === 'pending' && runsOnServer(q)));
    if (unfinished.length > 0)
      throw new Error(
        `queries did not succeed: ${unfinished.map((q) => `${q.queryHash} (${String(q.state.error ?? q.state.status)})`).join(', ')}`,
      );
    return { html, state: { queries: dehydrate(client) } };
  });
}
