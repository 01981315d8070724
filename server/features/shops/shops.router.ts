import { Router, type RequestHandler } from 'express';
import QRCode from 'qrcode';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { requirePermission, requireRole, requireUser } from '../../middleware/require-role';
import { slugSchema } from '../../../shared/schemas/params';
import { createShopLinkSchema, shopLinkCodeSchema, updateShopLinkSchema, updateShopSchema } from '../../../shared/schemas/shops';
import {
  createShopLink,
  getPinnedSheet,
  getShopPage,
  listShopLinks,
  retireShopLink,
  shopLinkUrl,
  updateShop,
  updateShopLink,
  visitShopLink,
} from './shops.service';
import { pageFound } from '../../lib/page-status';
import { pageRoutes } from '../../../shared/page-routes';
import { retiredLinkPage, tooManyLookupsPage, unknownLinkPage } from './link-pages';
import { perAddressLimit } from '../../middleware/rate-limit';
import type { Config } from '../../config';
import { cacheByReader } from '../../lib/cache-policy';

const codeParams = z.object({ code: shopLinkCodeSchema });
const qrQuery = z.object({ download: z.enum(['0', '1']).default('0') });
// the ink green on white keeps the contrast scanners need
const qrColours = { dark: '#1d4d3a', light: '#ffffff' };

/**
 * Looking up a link code, on any route that takes one (/l/:code, /api/l/:code, the QR images), counts
 * against the caller's address when the code is unknown or retired: guessing codes is held to a handful
 * per quarter hour, while following real links is never held back. One limiter per app, so misses on
 * every route add up.
 */
const lookupLimits = new WeakMap<Config, RequestHandler>();
function linkLookupLimit(config: Config): RequestHandler {
  let limit = lookupLimits.get(config);
  if (!limit) {
    limit = perAddressLimit({
      limit: config.rateLimits.linkMissesPer15Min,
      windowMs: 15 * 60 * 1000,
      what: 'shop-link lookups',
      message: 'Too many unknown shop-link codes from your address. Check the code and try again in 15 minutes.',
      countOnlyFailures: true,
      respond: (req, res, message) => {
        if (!req.originalUrl.startsWith('/l/')) return false;
        res.status(429).type('html').send(tooManyLookupsPage(message));
        return true;
      },
    });
    lookupLimits.set(config, limit);
  }
  return limit;
}

/** Shop pages and shop links under /api. */
export function shopsRouter({ db, clock, config }: AppDeps) {
  const router = Router();
  const appUrl = config.appUrl;
  const lookups = linkLookupLimit(config);

  router.get(
    '/shops/:slug',
    validated({ params: z.object({ slug: slugSchema }) }, ({ params }, req, res) => {
      cacheByReader(req, res);
      res.json(getShopPage(db, clock, params.slug, req.user));
    }),
  );

  router.patch(
    '/shops/:slug',
    requireRole('shop'),
    validated({ params: z.object({ slug: slugSchema }), body: updateShopSchema }, ({ params, body }, req, res) => {
      res.json({ shop: updateShop(db, clock, params.slug, req.user!, body) });
    }),
  );

  router.get(
    '/shop-links',
    requireUser,
    validated({ query: z.object({ shop: slugSchema.optional() }) }, ({ query }, req, res) => {
      res.set('Cache-Control', 'private, no-store').json(listShopLinks(db, clock, appUrl, req.user!, query.shop));
    }),
  );

  router.post(
    '/shop-links',
    requirePermission('manage_shop_links'),
    validated({ body: createShopLinkSchema }, ({ body }, req, res) => {
      const link = createShopLink(db, clock, appUrl, req.user!, body);
      req.log?.info({ event: 'shop_link_created', code: link.code, userId: req.user!.id }, 'shop link created');
      res.status(201).json({ link });
    }),
  );

  router.patch(
    '/shop-links/:code',
    requirePermission('manage_shop_links'),
    validated({ params: codeParams, body: updateShopLinkSchema }, ({ params, body }, req, res) => {
      res.json({ link: updateShopLink(db, clock, appUrl, req.user!, params.code, body) });
    }),
  );

  router.post(
    '/shop-links/:code/retire',
    requirePermission('manage_shop_links'),
    validated({ params: codeParams }, ({ params }, req, res) => {
      res.json({ link: retireShopLink(db, clock, appUrl, req.user!, params.code) });
    }),
  );

  router.get(
    '/shop-links/:code/qr.png',
    lookups,
    validated({ params: codeParams, query: qrQuery }, async ({ params, query }, _req, res) => {
      const png = await QRCode.toBuffer(shopLinkUrl(db, appUrl, params.code), {
        type: 'png',
        width: 600,
        margin: 2,
        errorCorrectionLevel: 'M',
        color: qrColours,
      });
      res.set(qrHeaders('image/png', params.code, 'png', query.download === '1')).send(png);
    }),
  );

  router.get(
    '/shop-links/:code/qr.svg',
    lookups,
    validated({ params: codeParams, query: qrQuery }, async ({ params, query }, _req, res) => {
      const svg = await QRCode.toString(shopLinkUrl(db, appUrl, params.code), {
        type: 'svg',
        margin: 2,
        errorCorrectionLevel: 'M',
        color: qrColours,
      });
      res.set(qrHeaders('image/svg+xml', params.code, 'svg', query.download === '1')).send(svg);
    }),
  );

  router.get(
    '/l/:code',
    lookups,
    validated({ params: codeParams }, ({ params }, req, res) => {
      cacheByReader(req, res);
      res.json(getPinnedSheet(db, clock, appUrl, params.code, req.user));
    }),
  );

  return router;
}

function qrHeaders(type: string, code: string, ext: string, download: boolean) {
  return {
    'Content-Type': type,
    'X-Content-Type-Options': 'nosniff',
    'Content-Disposition': `${download ? 'attachment' : 'inline'}; filename="swapyard-link-${code}.${ext}"`,
    'Cache-Control': 'public, max-age=3600',
  };
}

/** GET /l/:code — the short address customers type or scan: counts the visit and redirects to the pinned revision. */
export function shopLinkRedirectRouter({ db, clock, config }: AppDeps) {
  const router = Router();
  router.get('/l/:code', linkLookupLimit(config), (req, res) => {
    const code = String(req.params.code);
    const parsed = shopLinkCodeSchema.safeParse(code.toLowerCase());
    const visit = parsed.success ? visitShopLink(db, clock, parsed.data, req.user) : ({ kind: 'unknown' } as const);
    res.set('Cache-Control', 'no-store');
    if (visit.kind === 'redirect') return res.redirect(302, visit.location);
    if (visit.kind === 'retired') return res.status(410).type('html').send(retiredLinkPage(visit.shopName, visit.swap));
    res
      .status(404)
      .type('html')
      .send(unknownLinkPage(code.slice(0, 40)));
  });
  return router;
}

/** The shop page answers 404 for a shop that does not exist. */
export function shopPagesRouter({ db, clock }: AppDeps) {
  const router = Router();
  router.get(
    pageRoutes.shop,
    pageFound((req) => getShopPage(db, clock, String(req.params.slug), req.user)),
  );
  return router;
}
