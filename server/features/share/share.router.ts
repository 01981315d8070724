import { Router, type RequestHandler } from 'express';
import type { AppDeps } from '../../app';
import { matchPage, pageRoutes } from '../../../shared/page-routes';
import { escapeHtml } from '../../lib/html';
import type { PageHead } from '../../lib/page-head';
import type { ChassisPageView, PartPageView } from '../../../shared/schemas/views';
import type { ShopPageView } from '../../../shared/schemas/shops';
import { getSwapSheet } from '../swaps/swaps.service';
import { chassisHead, partHead, plainHead, shopHead, sitemapEntries, swapHead } from './share.service';

const origin = (appUrl: string) => appUrl.replace(/\/$/, '');

/** Addresses crawlers are kept out of: the API and every member's or the desk's own pages. */
const privatePrefixes = ['/api/', '/review', '/me/', '/submissions/', '/outbox', '/admin', '/submit', '/signin', '/shop/links', '/auth/', '/l/'];

/** GET /sitemap.xml and GET /robots.txt: the same for everyone, so a shared cache may keep them. */
export function shareRouter({ db, config }: AppDeps) {
  const router = Router();
  const appUrl = origin(config.appUrl);
  router.get('/sitemap.xml', (_req, res) => {
    const urls = sitemapEntries(db).map(
      (e) => `  <url><loc>${escapeHtml(appUrl + e.path)}</loc><lastmod>${e.lastmod.toISOString()}</lastmod></url>`,
    );
    res
      .type('application/xml')
      .set('Cache-Control', 'public, max-age=3600')
      .send(
        `<?xml version="1.0" encoding="UTF-8"?>\n<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">\n${urls.join('\n')}\n</urlset>\n`,
      );
  });
  router.get('/robots.txt', (_req, res) => {
    const lines = ['User-agent: *', 'Allow: /', ...privatePrefixes.map((p) => `Disallow: ${p}`), '', `Sitemap: ${appUrl}/sitemap.xml`];
    res.type('text/plain').set('Cache-Control', 'public, max-age=86400').send(`${lines.join('\n')}\n`);
  });
  return router;
}

/**
 * In front of the client, after the page routers: the head each page's HTML carries (`res.locals.pageHead`),
 * from the record the page shows (a page router leaves what it loaded in `res.locals.pageView`).
 */
export function pageHeadsRouter({ db, config }: AppDeps) {
  const router = Router();
  const appUrl = origin(config.appUrl);
  const found = (res: { locals: Record<string, unknown> }) => res.locals.pageStatus !== 404;
  const headFor =
    (make: (req: Parameters<RequestHandler>[0], view: unknown) => PageHead | null): RequestHandler =>
    (req, res, next) => {
      if (found(res)) res.locals.pageHead = make(req, res.locals.pageView) ?? undefined;
      next();
    };
  router.get(
    [pageRoutes.swap, pageRoutes.swapRevision],
    headFor((req) => {
      const n = req.params.n === undefined ? undefined : Number(req.params.n);
      return swapHead(appUrl, getSwapSheet(db, String(req.params.slug), n));
    }),
  );
  // a proposed chassis is open to its author and the desk only: nothing about it goes into the page's head
  router.get(
    pageRoutes.chassis,
    headFor((_req, view) => ((view as ChassisPageView).proposed ? null : chassisHead(appUrl, view as ChassisPageView))),
  );
  router.get(
    pageRoutes.part,
    headFor((_req, view) => partHead(appUrl, view as PartPageView)),
  );
  router.get(
    pageRoutes.shop,
    headFor((_req, view) => shopHead(appUrl, view as ShopPageView)),
  );
  router.get('/{*splat}', (req, res, next) => {
    if (!res.locals.pageHead) {
      const page = found(res) ? matchPage(req.path) : null;
      res.locals.pageHead = plainHead(appUrl, page?.name ?? null, req.path);
    }
    next();
  });
  return router;
}
