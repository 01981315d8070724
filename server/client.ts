import express, { type Request, type RequestHandler, type Response } from 'express';
import path from 'node:path';
import fs from 'node:fs';
import { matchPage } from '../shared/page-routes';
import { withPageHead, type PageHead } from './lib/page-head';

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

/** Production: the built files, long-cached when hashed, and index.html for every client route. */
export function staticClient(dist = path.join(root, 'dist')): RequestHandler[] {
  const indexFile = path.join(dist, 'index.html');
  if (!fs.existsSync(indexFile)) throw new Error('No built client in dist/. Run `npm run build` first.');
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
  router.get('/{*splat}', (req, res) => {
    res.status(pageStatus(req, res)).set('Cache-Control', 'no-cache').type('html').send(pageHtml(res, currentIndex()));
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
      const html = await vite.transformIndexHtml(req.originalUrl, fs.readFileSync(indexFile, 'utf8'));
      res.status(pageStatus(req, res)).type('html').send(pageHtml(res, html));
    } catch (err) {
      vite.ssrFixStacktrace(err as Error);
      next(err);
    }
  });
  return { handlers: [router], close: () => vite.close() };
}
