import type { Server } from 'node:http';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addShop, addUser, listen, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { addChassis, addPart, swapRecord } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import { staticClient } from '../../server/client';
import { shopLinks, swaps } from '../../server/db/schema/index';
import { pageRoutes } from '../../shared/page-routes';

// What a browser gets for a page address: the client's page with a real status (404 outside the page
// table, 404 for a swap nobody can read), and a redirect from an address a swap had before its title changed.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let dist: string;
let chassisId: number;
let rosa: Member;
let kai: Member;
let mo: Member;

const post = (m: Member, url: string, body?: object) => m.agent.post(url).set('x-csrf-token', m.token).send(body);
const get = (url: string) => request(server).get(url);

beforeAll(async () => {
  // a built client of one page is all the server needs to answer page addresses
  dist = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-dist-'));
  fs.mkdirSync(path.join(dist, 'assets'));
  fs.writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>Swapyard</title><div id="root"></div>');
  t = await makeTestApp({ SUBMISSION_RATE_LIMIT: '1000' }, undefined, { client: staticClient(dist) });
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await signedInMember(t.db, agent, 'rivet_rosa');
  kai = await signedInMember(t.db, agent, 'camber_kai');
  mo = await signedInMember(t.db, agent, 'gauge_mo', 'moderator');
});
afterAll(() => {
  server.close();
  t.close();
  fs.rmSync(dist, { recursive: true, force: true });
});

/** A swap written, sent and approved through the API; returns its draft's revision id and address. */
async function publishedSwap(title: string) {
  const created = await post(rosa, '/api/submissions', { chassisId, axle: 'front', category: 'brakes', data: swapRecord({ title }) });
  expect(created.status).toBe(201);
  expect((await post(rosa, `/api/submissions/${created.body.id}/submit`)).status).toBe(200);
  expect((await post(mo, `/api/review/${created.body.id}/approve`, {})).status).toBe(200);
  const slug = t.db.select({ slug: swaps.slug }).from(swaps).where(eq(swaps.id, created.body.swapId)).get()!.slug;
  return { id: created.body.id as number, swapId: created.body.swapId as number, slug };
}

/** A correction by Kai with `title`, approved; returns the swap's address afterwards. */
async function approvedCorrection(slug: string, title: string) {
  const corr = await post(kai, '/api/submissions', { swapSlug: slug, changeNote: 'Re-measured on the car; the figures now match the parts.', data: swapRecord({ title }) });
  expect(corr.status).toBe(201);
  expect((await post(kai, `/api/submissions/${corr.body.id}/submit`)).status).toBe(200);
  expect((await post(mo, `/api/review/${corr.body.id}/approve`, {})).status).toBe(200);
  return t.db.select({ slug: swaps.slug }).from(swaps).where(eq(swaps.id, corr.body.swapId)).get()!.slug;
}

describe('page addresses answer with a real status', () => {
  it('when an address is outside the page table, then it answers 404 with the app page, while every page of the table answers 200', async () => {
    for (const url of ['/no-such-page', '/swapz/h31', '/search/extra', '/me', '/parts']) {
      const res = await get(url);
      expect(res.status, url).toBe(404);
      expect(res.headers['content-type']).toMatch(/text\/html/);
      expect(res.text).toContain('<div id="root">');
    }
    for (const pattern of Object.values(pageRoutes).filter((p) => !/^\/(swaps|chassis|parts|shops)\//.test(p))) {
      const url = pattern.replace(/:[a-zA-Z]+/g, '7');
      expect((await get(url)).status, url).toBe(200);
    }
    // the API keeps its own JSON 404
    const api = await get('/api/no-such-thing');
    expect(api.status).toBe(404);
    expect(api.body.error.code).toBe('not_found');
  });

  it('when a swap page names a swap or revision nobody can read, then it answers 404; the swap and its revisions answer 200', async () => {
    addSwap(t.db, { slug: 'h31-front-shown', chassisId, authorId: rosa.id, revisions: [{ status: 'approved' }] });
    addSwap(t.db, { slug: 'h31-front-still-a-draft', chassisId, authorId: rosa.id, revisions: [{ status: 'draft' }] });
    expect((await get('/swaps/h31-front-shown')).status).toBe(200);
    expect((await get('/swaps/h31-front-shown/r/1')).status).toBe(200);
    expect((await get('/swaps/h31-front-shown/compare?a=1&b=1')).status).toBe(200);
    expect((await get('/swaps/h31-front-shown/r/2')).status).toBe(404);
    expect((await get('/swaps/h31-front-shown/r/one')).status).toBe(404);
    expect((await get('/swaps/h31-front-nobody-wrote')).status).toBe(404);
    expect((await get('/swaps/h31-front-still-a-draft')).status).toBe(404);
  });

  it('when a chassis, part or shop page names one that does not exist (or a chassis only its author may see), then it answers 404', async () => {
    const part = addPart(t.db, 'vela-four-piston-caliper');
    addShop(t.db, 'lathe-and-lug', 'Lathe & Lug');
    addChassis(t.db, 'tamsin-regent-proposed', { code: 'TR9', proposed: true });
    expect((await get('/chassis/halden-h31')).status).toBe(200);
    expect((await get(`/parts/${part.id}`)).status).toBe(200);
    expect((await get('/shops/lathe-and-lug')).status).toBe(200);
    expect((await get('/chassis/halden-h99')).status).toBe(404);
    expect((await get('/chassis/tamsin-regent-proposed')).status).toBe(404);
    expect((await get(`/parts/${part.id + 1000}`)).status).toBe(404);
    expect((await get('/parts/caliper')).status).toBe(404);
    expect((await get('/shops/no-such-shop')).status).toBe(404);
  });
});

describe('swap addresses', () => {
  it('when a new swap has a long title, then its address is cut at a word boundary, not inside a word', async () => {
    const title = 'Orsino Vela four-piston front calipers and 330 mm vented rotors on the Halden H31 saloon';
    const created = await post(rosa, '/api/submissions', { chassisId, axle: 'front', category: 'brakes', data: swapRecord({ title }) });
    expect(created.status).toBe(201);
    const slug = created.body.swapSlug as string;
    // "h31-front-orsino-vela-four-piston-front-calipers-and-330-mm-vented-rotors-on-the" is 80 characters; "halden" would not fit
    expect(slug).toBe('h31-front-orsino-vela-four-piston-front-calipers-and-330-mm-vented-rotors-on-the');
    expect(slug.length).toBeLessThanOrEqual(80);
  });

  it('when a draft is retitled before its first approval, then it is published under the approved title, with no old address kept', async () => {
    const created = await post(rosa, '/api/submissions', {
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: swapRecord({ title: 'Working title' }),
    });
    expect(created.body.swapSlug).toBe('h31-front-working-title');
    const edited = await rosa.agent
      .patch(`/api/submissions/${created.body.id}`)
      .set('x-csrf-token', rosa.token)
      .send({ data: swapRecord({ title: 'Vela calipers with the short bracket' }), body: '' });
    expect(edited.status).toBe(200);
    expect((await post(rosa, `/api/submissions/${created.body.id}/submit`)).status).toBe(200);
    expect((await post(mo, `/api/review/${created.body.id}/approve`, {})).status).toBe(200);
    expect((await get('/api/swaps/h31-front-vela-calipers-with-the-short-bracket')).status).toBe(200);
    // the working title was never public: nothing redirects from it, and another swap may take it
    expect((await get('/swaps/h31-front-working-title')).status).toBe(404);
    expect((await get('/api/swaps/h31-front-working-title')).status).toBe(404);
  });

  it('when a correction keeps the title, then the address stays as it is', async () => {
    addSwap(t.db, { slug: 'h31-front-hand-made-slug', chassisId, authorId: rosa.id, revisions: [{ status: 'approved' }] });
    const { title } = (await get('/api/swaps/h31-front-hand-made-slug')).body.revision.data;
    expect(await approvedCorrection('h31-front-hand-made-slug', title)).toBe('h31-front-hand-made-slug');
    expect((await get('/api/swaps/h31-front-hand-made-slug')).body.revision.number).toBe(2);
  });

  it('when an approved title changes, then the swap gets the new address and every old page, API and shop-link address still leads to it', async () => {
    const swap = await publishedSwap('Vela calipers on the long bracket');
    expect(swap.slug).toBe('h31-front-vela-calipers-on-the-long-bracket');
    const shop = addShop(t.db, 'ridgeway-performance', 'Ridgeway Performance');
    const shopUser = addUser(t.db, 'ridgeway_shop', 'shop', { shopId: shop.id });
    const at = new Date();
    t.db
      .insert(shopLinks)
      .values({ code: 'k7mpq2x', shopId: shop.id, swapId: swap.swapId, revisionId: swap.id, createdById: shopUser.id, createdAt: at, updatedAt: at })
      .run();

    const renamed = await approvedCorrection(swap.slug, 'Vela calipers on the Northgate radial bracket');
    expect(renamed).toBe('h31-front-vela-calipers-on-the-northgate-radial-bracket');

    // the page at the old address moves permanently, keeping the rest of the path and the query
    const page = await get(`/swaps/${swap.slug}?via=k7mpq2x`);
    expect(page.status).toBe(301);
    expect(page.headers.location).toBe(`/swaps/${renamed}?via=k7mpq2x`);
    const pinned = await get(`/swaps/${swap.slug}/r/1`);
    expect(pinned.status).toBe(301);
    expect(pinned.headers.location).toBe(`/swaps/${renamed}/r/1`);
    expect((await get(`/swaps/${swap.slug}/compare?a=1&b=2`)).headers.location).toBe(`/swaps/${renamed}/compare?a=1&b=2`);
    expect((await get(`/swaps/${renamed}`)).status).toBe(200);

    // the API answers an old address the same way, so the app can show the new one
    const api = await get(`/api/swaps/${swap.slug}`);
    expect(api.status).toBe(301);
    expect(api.headers.location).toBe(`/api/swaps/${renamed}`);
    const followed = await get(`/api/swaps/${swap.slug}/revisions/1`).redirects(1);
    expect(followed.status).toBe(200);
    expect(followed.body.swap.slug).toBe(renamed);
    expect(followed.body.revision.number).toBe(1);

    // the shop's link still lands on the revision it quoted, at the new address
    const link = await get('/l/k7mpq2x');
    expect(link.status).toBe(302);
    expect(link.headers.location).toBe(`/swaps/${renamed}/r/1?via=k7mpq2x`);

    // no other swap can take the old address
    const lookalike = await publishedSwap('Vela calipers on the long bracket');
    expect(lookalike.slug).toBe('h31-front-vela-calipers-on-the-long-bracket-2');

    // a title changed back takes back its own address, and the one in between now redirects
    const back = await approvedCorrection(renamed, 'Vela calipers on the long bracket');
    expect(back).toBe(swap.slug);
    expect((await get(`/swaps/${swap.slug}`)).status).toBe(200);
    expect((await get(`/swaps/${renamed}`)).headers.location).toBe(`/swaps/${swap.slug}`);
  });
});
