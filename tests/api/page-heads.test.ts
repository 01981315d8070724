import type { Server } from 'node:http';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { JSDOM } from 'jsdom';
import { makeTestApp, type TestApp } from './support/test-app';
import { addShop, addUser, listen } from './support/auth-helpers';
import { addChassis, addPart } from './support/swap-fixtures';
import { addSwap, swapData } from './support/swap-rows';
import { staticClient } from '../../server/client';
import { revisionPhotos } from '../../server/db/schema/index';

// What a crawler or a chat app's link preview reads in a page's HTML before any script runs: the page's own
// title, description, canonical address, Open Graph and card tags with an image, and schema.org JSON-LD;
// plus /sitemap.xml and /robots.txt.

const APP_URL = 'http://swapyard.test';
let t: TestApp;
let server: Server;
let dist: string;
let authorId: number;
let chassisId: number;

const get = (url: string) => request(server).get(url);

/** The page's head as a parser reads it (scripts never run), with the tags a preview looks at. */
async function headOf(url: string, status = 200) {
  const res = await get(url);
  expect(res.status, url).toBe(status);
  const doc = new JSDOM(res.text).window.document;
  const meta = (key: string) =>
    doc.querySelector(`meta[property="${key}"], meta[name="${key}"]`)?.getAttribute('content') ?? null;
  const ld = doc.querySelector('script[type="application/ld+json"]');
  return {
    res,
    doc,
    title: doc.title,
    titles: doc.querySelectorAll('title').length,
    descriptions: doc.querySelectorAll('meta[name="description"]').length,
    canonical: doc.querySelector('link[rel="canonical"]')?.getAttribute('href') ?? null,
    meta,
    jsonLd: ld ? (JSON.parse(ld.textContent!) as Record<string, unknown>) : null,
    scripts: [...doc.querySelectorAll('script')].map((s) => s.getAttribute('type') ?? 'classic'),
  };
}

beforeAll(async () => {
  // a built client shaped like the real one: a default title and description in the head
  dist = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-dist-'));
  fs.mkdirSync(path.join(dist, 'assets'));
  fs.writeFileSync(
    path.join(dist, 'index.html'),
    '<!doctype html><html><head><meta charset="UTF-8" /><meta name="description" content="Built default." /><title>Swapyard — what fits your car</title></head><body><div id="root"></div><script type="module" src="/assets/app.js"></script></body></html>',
  );
  t = await makeTestApp({ APP_URL }, undefined, { client: staticClient(dist) });
  ({ server } = listen(t.app));
  authorId = addUser(t.db, 'rivet_rosa').id;
  chassisId = addChassis(t.db).id;
});
afterAll(() => {
  server.close();
  t.close();
  fs.rmSync(dist, { recursive: true, force: true });
});

describe('a swap page carries its own head in the HTML', () => {
  it('when a swap with a photo is opened, then its title, description, canonical, preview tags with the photo thumbnail and TechArticle JSON-LD are in the HTML', async () => {
    const swap = addSwap(t.db, {
      slug: 'h31-front-vela-calipers',
      chassisId,
      authorId,
      revisions: [{ status: 'approved', data: swapData('Vela calipers on the H31', { summary: 'Bolt-on with a bracket and a 10 mm spacer.' }) }],
    });
    t.db
      .insert(revisionPhotos)
      .values({ revisionId: swap.revisionIds[0], fileId: 'photoabcdefghijk', width: 2048, height: 1536, bytes: 10, sha256: 'a', createdAt: new Date() })
      .run();

    const h = await headOf('/swaps/h31-front-vela-calipers');
    expect(h.title).toBe('Vela calipers on the H31 · Swapyard');
    expect(h.titles).toBe(1);
    expect(h.descriptions).toBe(1);
    expect(h.meta('description')).toBe('Bolt-on with a bracket and a 10 mm spacer.');
    expect(h.canonical).toBe(`${APP_URL}/swaps/h31-front-vela-calipers`);
    expect(h.meta('og:type')).toBe('article');
    expect(h.meta('og:title')).toBe('Vela calipers on the H31');
    expect(h.meta('og:url')).toBe(`${APP_URL}/swaps/h31-front-vela-calipers`);
    // the thumbnail is the photo fitted inside 480 px: 2048 × 1536 → 480 × 360
    expect(h.meta('og:image')).toBe(`${APP_URL}/media/photoabcdefghijk?size=thumb`);
    expect(h.meta('og:image:width')).toBe('480');
    expect(h.meta('og:image:height')).toBe('360');
    expect(h.meta('twitter:card')).toBe('summary_large_image');
    expect(h.meta('twitter:image')).toBe(h.meta('og:image'));
    expect(h.jsonLd).toMatchObject({
      '@context': 'https://schema.org',
      '@type': 'TechArticle',
      headline: 'Vela calipers on the H31',
      author: { '@type': 'Person', name: 'rivet rosa' },
      about: { '@type': 'Car', manufacturer: { name: 'Halden' } },
    });
    // the client's script still loads, and the answer is a page any cache may revalidate
    expect(h.doc.getElementById('root')).not.toBeNull();
    expect(h.res.headers['set-cookie']).toBeUndefined();
  });

  it('when a pinned older revision and the current one are opened, then each is titled by its own record and the older one is its own canonical page', async () => {
    addSwap(t.db, {
      slug: 'h31-front-two-revisions',
      chassisId,
      authorId,
      revisions: [
        { status: 'superseded', data: swapData('First take on the H31 calipers') },
        { status: 'approved', data: swapData('Second take on the H31 calipers') },
      ],
    });
    const old = await headOf('/swaps/h31-front-two-revisions/r/1');
    expect(old.title).toBe('First take on the H31 calipers · Swapyard');
    expect(old.canonical).toBe(`${APP_URL}/swaps/h31-front-two-revisions/r/1`);
    // no photo: the app's own card
    expect(old.meta('og:image')).toBe(`${APP_URL}/share-card.png`);
    expect(old.meta('og:image:width')).toBe('1200');
    const current = await headOf('/swaps/h31-front-two-revisions/r/2');
    expect(current.title).toBe('Second take on the H31 calipers · Swapyard');
    expect(current.canonical).toBe(`${APP_URL}/swaps/h31-front-two-revisions`);
  });

  it('when a member-written title carries markup, then every tag holds it as text and no script or element escapes', async () => {
    const hostile = `</title><script>alert(1)</script>"><img src=x onerror=alert(2)> </script>&amp;`;
    addSwap(t.db, {
      slug: 'h31-front-hostile',
      chassisId,
      authorId,
      revisions: [{ status: 'approved', data: swapData(hostile, { summary: `"/><script>alert(3)</script>` }) }],
    });
    const h = await headOf('/swaps/h31-front-hostile');
    expect(h.title).toBe(`${hostile} · Swapyard`);
    expect(h.meta('og:title')).toBe(hostile);
    expect(h.meta('description')).toBe(`"/><script>alert(3)</script>`);
    expect((h.jsonLd as { headline: string }).headline).toBe(hostile);
    // only the JSON-LD and the client's own module: nothing the title brought
    expect(h.scripts.sort()).toEqual(['application/ld+json', 'module']);
    expect(h.doc.querySelector('img')).toBeNull();
    expect(h.res.text).not.toContain('<script>alert');
  });

  it('when a swap does not exist or is still a draft, then the page answers 404 with no canonical and asks not to be indexed', async () => {
    addSwap(t.db, { slug: 'h31-front-draft-only', chassisId, authorId, revisions: [{ status: 'draft', data: swapData('A draft title nobody may read') }] });
    for (const url of ['/swaps/h31-front-nobody-wrote', '/swaps/h31-front-draft-only', '/swaps/h31-front-vela-calipers/r/9']) {
      const h = await headOf(url, 404);
      expect(h.title).toBe('Not found · Swapyard');
      expect(h.canonical).toBeNull();
      expect(h.meta('robots')).toBe('noindex');
      expect(h.res.text).not.toContain('A draft title nobody may read');
    }
  });
});

describe('chassis, part, shop and other pages', () => {
  it('when a chassis, a part and a shop are opened, then each has its title, canonical and schema.org type', async () => {
    const part = addPart(t.db, 'vela-caliper-left', { name: 'Vela four-piston caliper, left', maker: 'Orsino', partNumbers: ['OV-355-104-L'] });
    addShop(t.db, 'lathe-and-lug', 'Lathe & Lug <b>');

    const c = await headOf('/chassis/halden-h31');
    expect(c.title).toMatch(/^Halden .* · Swapyard$/);
    expect(c.canonical).toBe(`${APP_URL}/chassis/halden-h31`);
    expect(c.jsonLd).toMatchObject({ '@context': 'https://schema.org', '@type': 'Car', manufacturer: { name: 'Halden' } });

    const p = await headOf(`/parts/${part.id}`);
    expect(p.title).toBe('Vela four-piston caliper, left · Swapyard');
    expect(p.canonical).toBe(`${APP_URL}/parts/${part.id}`);
    expect(p.jsonLd).toMatchObject({ '@type': 'Product', mpn: 'OV-355-104-L', manufacturer: { name: 'Orsino' } });

    const s = await headOf('/shops/lathe-and-lug');
    expect(s.title).toBe('Lathe & Lug <b> · Swapyard');
    expect(s.doc.querySelector('b')).toBeNull();
    expect(s.jsonLd).toMatchObject({ '@type': 'AutoRepair', name: 'Lathe & Lug <b>' });
  });

  it('when a proposed chassis, an unknown part or shop is opened by a visitor, then it is a 404 whose head names nothing', async () => {
    addChassis(t.db, 'tamsin-regent-proposed', { code: 'TR9', model: 'Secret Regent', proposed: true });
    const proposed = await headOf('/chassis/tamsin-regent-proposed', 404);
    expect(proposed.res.text).not.toContain('Secret Regent');
    expect(proposed.meta('robots')).toBe('noindex');
    await headOf('/parts/999999', 404);
    await headOf('/shops/no-such-shop', 404);
  });

  it('when the home page, search and a member page are opened, then public pages get the site head with a canonical and private pages are kept out of the index', async () => {
    const home = await headOf('/');
    expect(home.title).toBe('What fits your car · Swapyard');
    expect(home.canonical).toBe(`${APP_URL}/`);
    expect(home.meta('og:image')).toBe(`${APP_URL}/share-card.png`);
    expect(home.jsonLd).toMatchObject({ '@type': 'WebSite', url: APP_URL });
    expect(home.meta('robots')).toBeNull();
    const search = await headOf('/search?q=calipers');
    expect(search.canonical).toBe(`${APP_URL}/search`);
    for (const url of ['/me/cars', '/review', '/submit', '/outbox']) {
      const h = await headOf(url);
      expect(h.meta('robots'), url).toBe('noindex');
      expect(h.canonical, url).toBeNull();
      expect(h.title, url).toBe('Swapyard');
    }
  });
});

describe('sitemap.xml and robots.txt', () => {
  it('when the sitemap is read, then it lists approved swaps, catalogue chassis, parts and shops with absolute addresses and lastmod, and no draft or proposed chassis', async () => {
    const res = await get('/sitemap.xml');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/xml/);
    expect(res.headers['cache-control']).toMatch(/public/);
    expect(res.headers['set-cookie']).toBeUndefined();
    const doc = new JSDOM(res.text, { contentType: 'application/xml' }).window.document;
    const entries = [...doc.getElementsByTagName('url')].map((u) => ({
      loc: u.getElementsByTagName('loc')[0].textContent!,
      lastmod: u.getElementsByTagName('lastmod')[0].textContent!,
    }));
    const locs = entries.map((e) => e.loc);
    expect(locs).toContain(`${APP_URL}/swaps/h31-front-vela-calipers`);
    expect(locs).toContain(`${APP_URL}/swaps/h31-front-two-revisions`);
    expect(locs).toContain(`${APP_URL}/chassis/halden-h31`);
    expect(locs).toContain(`${APP_URL}/shops/lathe-and-lug`);
    expect(locs.some((l) => l.startsWith(`${APP_URL}/parts/`))).toBe(true);
    expect(locs).not.toContain(`${APP_URL}/swaps/h31-front-draft-only`);
    expect(locs).not.toContain(`${APP_URL}/chassis/tamsin-regent-proposed`);
    // only the current revision's address, never a pinned one
    expect(locs.filter((l) => l.includes('/r/'))).toEqual([]);
    for (const e of entries) expect(Number.isNaN(Date.parse(e.lastmod)), e.loc).toBe(false);
    // the approval date of the demo-style rows (2026-03-01) is the swap's lastmod
    expect(entries.find((e) => e.loc.endsWith('/swaps/h31-front-two-revisions'))!.lastmod).toBe('2026-03-01T10:00:00.000Z');
  });

  it('when robots.txt is read, then public pages are allowed, the private ones disallowed and the sitemap named', async () => {
    const res = await get('/robots.txt');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/plain/);
    expect(res.headers['set-cookie']).toBeUndefined();
    const lines = res.text.split('\n');
    expect(lines).toContain('Allow: /');
    for (const p of ['/api/', '/review', '/me/', '/submissions/', '/outbox', '/admin']) expect(lines).toContain(`Disallow: ${p}`);
    expect(lines).toContain(`Sitemap: ${APP_URL}/sitemap.xml`);
  });
});
