import express, { type Request, type RequestHandler, type Response } from 'express';
import path from 'node:path';
import fs from 'node:fs';
import { matchPage, type PageName } from '../shared/page-routes';
import { withPageHead, type PageHead } from './lib/page-head';
import { jsonForScript } from './lib/html';
import type { ApiContext, renderPage } from '../src/entry-server';

const root = path.resolve(import.meta.dirname, '..');

/**
 * The status a client page answers with: 404 for an address outside the page table, or whatever a page
 * handler before the client decided (`res.locals.pageStatus`, e.g. 404 for a swap that does not exist).
 */
export function pageStatus(req: Request, res: Response): number {
  const decided = res.locals.pageStatus as number | undefined;
  if (decided) return decided;
  return matchPage(req.path) ? 200 : 404;
}

/** The page's HTML with its own head, when the pages in front of the client decided one. */
function pageHtml(res: Response, html: string): string {
  const head = res.locals.pageHead as PageHead | undefined;
  return head ? withPageHead(html, head) : html;
}

/** Public pages arrive as HTML with their data, for visitors; members' own pages and the desk are drawn by the browser. */
const renderedPages = new Set<PageName>(['home', 'search', 'swap', 'swapRevision', 'chassis', 'part', 'shop']);

type Render = typeof renderPage;

/** The render reaches the API on the socket the request came in on, as a visitor from the reader's address. */
function apiContextFor(req: Request): ApiContext {
  const address = (req.socket.localAddress ?? '127.0.0.1').replace(/^::ffff:(?=\d+\.)/, '');
  const host = address.includes(':') ? `[${address}]` : address;
  const headers: Record<string, string> = { 'x-forwarded-for': req.ip ?? '' };
  return { origin: `http://${host}:${req.socket.localPort}`, headers };
}

/**
 * The page as HTML when it is one the server draws: the app's markup inside #root and the query cache it
 * was drawn from as JSON beside it. A page that cannot be drawn goes out as the client's shell, as before.
 */
async function renderedHtml(req: Request, html: string, status: number, render: () => Promise<Render | null>) {
  const page = matchPage(req.path);
  // a member's pages stay the browser's to draw: what the server sends can then be shared by any cache
  if (status !== 200 || !page || !renderedPages.has(page.name) || req.user) return html;
  try {
    const renderPage = await render();
    if (!renderPage) return html;
    const url = new URL(req.originalUrl, 'http://swapyard.invalid');
    const rendered = await renderPage(new Request(url, { headers: { accept: 'text/html' } }), apiContextFor(req));
    if (!rendered) return html;
    const state = `<script type="application/json" id="server-state">${jsonForScript(rendered.state)}</script>`;
    return html.replace(/<div id="root"><\/div>/, () => `<div id="root">${rendered.html}</div>\n    ${state}`);
  } catch (err) {
    req.log?.warn({ err }, 'page not drawn by the server; the browser draws it');
    return html;
  }
}

/**
 * Production: the built files, long-cached when hashed, and index.html for every client route, with the
 * public pages drawn by the built server entry (`dist-server/` beside `dist/`, or `renderPage` when given, as tests do).
 */
export function staticClient(
  dist = path.join(root, 'dist'),
  { renderPage, serverEntry = path.join(path.dirname(dist), 'dist-server', 'entry-server.js') }: { renderPage?: Render; serverEntry?: string } = {},
): RequestHandler[] {
  const indexFile = path.join(dist, 'index.html');
  if (!fs.existsSync(indexFile)) throw new Error('No built client in dist/. Run `npm run build` first.');
  let entry: Promise<Render | null> | undefined;
  const render = () =>
    (entry ??= renderPage
      ? Promise.resolve(renderPage)
      : fs.existsSync(serverEntry)
        ? import(serverEntry).then((m: { renderPage: Render }) => m.renderPage)
        : Promise.resolve(null));
  // re-read when a new build replaces it, so a running server never points at deleted asset files
  let index = { mtimeMs: 0, html: '' };
  const currentIndex = () => {
    const { mtimeMs } = fs.statSync(indexFile);
    if (mtimeMs !== index.mtimeMs) index = { mtimeMs, html: fs.readFileSync(indexFile, 'utf8') };
    return index.html;
  };
  const router = express.Router();
  router.use(
    '/assets',
    express.static(path.join(dist, 'assets'), { immutable: true, maxAge: '1y', index: false, fallthrough: false }),
  );
  router.use(express.static(dist, { index: false, maxAge: '1h' }));
  router.get('/{*splat}', async (req, res) => {
    const status = pageStatus(req, res);
    res.set('Cache-Control', 'no-cache');
    const html = await renderedHtml(req, pageHtml(res, currentIndex()), status, render);
    res.status(status).type('html').send(html);
  });
  return [router];
}

/** Development: Vite in middleware mode on the same port, with hot reload. */
export async function viteClient(): Promise<{ handlers: RequestHandler[]; close: () => Promise<void> }> {
  const { createServer } = await import('vite');
  const vite = await createServer({ root, server: { middlewareMode: true }, appType: 'custom' });
  const indexFile = path.join(root, 'index.html');
  const router = express.Router();
  router.use(vite.middlewares);
  router.get('/{*splat}', async (req, res, next) => {
    try {
      const status = pageStatus(req, res);
      const shell = await vite.transformIndexHtml(req.originalUrl, fs.readFileSync(indexFile, 'utf8'));
      const render = async () => ((await vite.ssrLoadModule('/src/entry-server.tsx')) as { renderPage: Render }).renderPage;
      const html = await renderedHtml(req, pageHtml(res, shell), status, render);
      res.status(status).type('html').send(html);
    } catch (err) {
      vite.ssrFixStacktrace(err as Error);
      next(err);
    }
  });
  return { handlers: [router], close: () => vite.close() };
}
