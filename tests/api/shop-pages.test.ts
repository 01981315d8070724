import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addShop, addUser, csrfToken, listen, signIn, type Agent } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, swapData } from './support/swap-rows';
import { fittedReports, shopLinks } from '../../server/db/schema/index';
import type { ShopLinkList, ShopPageView } from '../../shared/schemas/shops';

// The shop page (contact, hours, the swaps the shop wrote, the fitted reports it made) and a shop link's
// private part: the customer reference, the quoted price and the expiry are the shop's alone.

let t: TestApp;
let server: Server;
let agent: () => Agent;
const clock = {
  time: new Date('2026-06-01T10:00:00Z'),
  now() {
    return new Date(this.time);
  },
};
const sessions = new Map<string, { a: Agent; token: string }>();

async function as(login: string) {
  if (!sessions.has(login)) {
    const a = agent();
    await signIn(a, login);
    sessions.set(login, { a, token: await csrfToken(a) });
  }
  return sessions.get(login)!;
}

const privateLink = {
  swapSlug: 'h31-front-vela',
  publicNote: 'Fixed price includes **bleeding and bed-in**.',
  note: 'Call back after the roadworthiness inspection.',
  customerRef: 'Mr Quill, job 2606-03',
  quotedPrice: { amountMinor: 98_750, currency: 'EUR' },
  expiresAt: '2026-06-15T00:00:00Z',
};

async function makeLink(body: object = privateLink) {
  const { a, token } = await as('ridgeway_shop');
  const res = await a.post('/api/shop-links').set('x-csrf-token', token).send(body);
  expect(res.status).toBe(201);
  return res.body.link.code as string;
}

beforeAll(async () => {
  t = await makeTestApp({}, clock);
  ({ server, agent } = listen(t.app));
  const ridgeway = addShop(t.db, 'ridgeway-performance', 'Ridgeway Performance');
  const lathe = addShop(t.db, 'lathe-and-lug', 'Lathe & Lug');
  const shopUser = addUser(t.db, 'ridgeway_shop', 'shop', { shopId: ridgeway.id });
  addUser(t.db, 'lathe_shop', 'shop', { shopId: lathe.id });
  const rosa = addUser(t.db, 'rivet_rosa');
  addUser(t.db, 'ada_admin', 'admin');
  addUser(t.db, 'gauge_mo', 'moderator');
  const h31 = addChassis(t.db);
  addSwap(t.db, { slug: 'h31-front-vela', chassisId: h31.id, authorId: rosa.id, revisions: [{ status: 'approved' }] });
  // a swap the shop's account wrote, one it has in review, and a fitted report it made (plus a hidden one)
  addSwap(t.db, {
    slug: 'h31-rear-by-ridgeway',
    chassisId: h31.id,
    authorId: shopUser.id,
    revisions: [{ status: 'approved', data: swapData('Rear drum-in-hat written by the shop') }],
  });
  addSwap(t.db, {
    slug: 'h31-draft-by-ridgeway',
    chassisId: h31.id,
    authorId: shopUser.id,
    revisions: [{ status: 'in_review' }],
  });
  const other = addSwap(t.db, { slug: 'h31-other', chassisId: h31.id, authorId: rosa.id, revisions: [{ status: 'approved' }] });
  const now = clock.now();
  t.db
    .insert(fittedReports)
    .values([
      {
        swapId: other.swapId,
        userId: shopUser.id,
        revisionId: other.revisionIds[0]!,
        wheel: { diameterIn: 17, widthIn: 7.5, offsetMm: 35, spacerMm: 5 },
        note: 'Fitted for a customer in May.',
        createdAt: now,
        updatedAt: now,
      },
    ])
    .run();
});
afterAll(() => {
  server.close();
  t.close();
});

describe('the shop page', () => {
  it('when the shop saves its contact details and hours, then anyone reads them, with the swaps it wrote and the fitted reports it made', async () => {
    const { a, token } = await as('ridgeway_shop');
    const save = await a
      .patch('/api/shops/ridgeway-performance')
      .set('x-csrf-token', token)
      .send({
        contact: {
          phone: '01632 960418',
          email: 'workshop@ridgeway.example',
          address: 'Unit 4, Tanner’s Yard',
          hoursNote: 'By appointment on Saturdays',
        },
        openingHours: [
          { day: 'sat', opens: '09:00', closes: '12:30' },
          { day: 'mon', opens: '08:00', closes: '17:30' },
        ],
      });
    expect(save.status).toBe(200);
    const page = (await request(server).get('/api/shops/ridgeway-performance')).body as ShopPageView;
    expect(page.shop.contact).toEqual({
      phone: '01632 960418',
      email: 'workshop@ridgeway.example',
      address: 'Unit 4, Tanner’s Yard',
      hoursNote: 'By appointment on Saturdays',
    });
    expect(page.shop.openingHours.map((p) => p.day)).toEqual(['mon', 'sat']);
    expect(page.written.map((s) => s.slug)).toEqual(['h31-rear-by-ridgeway']);
    expect(page.fittedReports).toEqual([
      {
        swap: { slug: 'h31-other', title: 'h31-other revision 1' },
        wheel: '17×7.5 in, ET35 with a 5 mm spacer',
        note: 'Fitted for a customer in May.',
        createdAt: clock.now().toISOString(),
      },
    ]);
  });

  it('when the hours or contact are not well formed, then it is 400 naming the field and nothing changes', async () => {
    const { a, token } = await as('ridgeway_shop');
    const res = await a
      .patch('/api/shops/ridgeway-performance')
      .set('x-csrf-token', token)
      .send({
        openingHours: [{ day: 'mon', opens: '17:00', closes: '08:00' }],
        contact: { phone: 'call us', email: 'x', address: '', hoursNote: '' },
      });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['contact.email', 'contact.phone', 'openingHours.0.closes']);
    const page = (await request(server).get('/api/shops/ridgeway-performance')).body as ShopPageView;
    expect(page.shop.contact.phone).toBe('01632 960418');
  });
});

describe('a shop link’s private part', () => {
  it('when anyone but the shop opens the link, its page or the shop page, then the customer reference, price, expiry and private note are nowhere in the answer; the public note is', async () => {
    const code = await makeLink();
    const secrets = ['Quill', '98750', '98 750', '987.50', '2026-06-15', 'roadworthiness'];
    const readers = [
      request(server),
      (await as('rivet_rosa')).a,
      (await as('lathe_shop')).a,
      (await as('ada_admin')).a,
      (await as('gauge_mo')).a,
    ];
    for (const [i, r] of readers.entries()) {
      for (const url of [`/api/l/${code}`, '/api/shops/ridgeway-performance']) {
        const res = await r.get(url);
        expect(res.status, `${i} ${url}`).toBe(200);
        const body = JSON.stringify(res.body);
        for (const s of secrets) expect(body, `${i} ${url} ${s}`).not.toContain(s);
      }
      const pinned = await r.get(`/api/l/${code}`);
      expect(pinned.body.link.publicNote).toBe(privateLink.publicNote);
      expect(pinned.body.link.private).toBeNull();
    }
    // the admin looks over the links, without the private part
    const adminList = (await (await as('ada_admin')).a.get('/api/shop-links')).body as ShopLinkList;
    expect(adminList.items.find((l) => l.code === code)!.private).toBeNull();

    const own = await (await as('ridgeway_shop')).a.get(`/api/l/${code}`);
    expect(own.body.link.private).toEqual({
      note: privateLink.note,
      customerRef: privateLink.customerRef,
      quotedPrice: privateLink.quotedPrice,
      expiresAt: '2026-06-15T00:00:00.000Z',
    });
    const list = (await (await as('ridgeway_shop')).a.get('/api/shop-links')).body as ShopLinkList;
    expect(list.items.find((l) => l.code === code)).toMatchObject({
      expired: false,
      private: { customerRef: privateLink.customerRef },
    });
  });

  it('when the expiry is in the past or the price is not a whole amount, then it is 400 naming the field', async () => {
    const { a, token } = await as('ridgeway_shop');
    const res = await a
      .post('/api/shop-links')
      .set('x-csrf-token', token)
      .send({ ...privateLink, expiresAt: '2026-05-01T00:00:00Z' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.expiresAt).toMatch(/after now/);
    const price = await a
      .post('/api/shop-links')
      .set('x-csrf-token', token)
      .send({ ...privateLink, quotedPrice: { amountMinor: 12.5, currency: 'EUR' } });
    expect(price.body.error.fields['quotedPrice.amountMinor']).toBeTruthy();
  });

  it('when the expiry passes, then the link answers as a retired one (410 on the short address and the API) and drops off the shop page', async () => {
    const code = await makeLink({ ...privateLink, expiresAt: '2026-06-02T00:00:00Z' });
    expect((await request(server).get(`/l/${code}`)).status).toBe(302);
    expect(((await request(server).get('/api/shops/ridgeway-performance')).body as ShopPageView).swaps).toHaveLength(1);

    clock.time = new Date('2026-06-02T00:00:01Z');
    const page = await request(server).get(`/l/${code}`);
    expect(page.status).toBe(410);
    expect(page.text).toContain('Ridgeway Performance has retired this link');
    const api = await request(server).get(`/api/l/${code}`);
    expect(api.status).toBe(410);
    expect(api.body.error.code).toBe('link_retired');
    expect(JSON.stringify(api.body)).not.toContain('Quill');
    // the other link (expiring on the 15th) still stands, so the swap stays on the shop page
    expect(((await request(server).get('/api/shops/ridgeway-performance')).body as ShopPageView).swaps).toHaveLength(1);
    const list = (await (await as('ridgeway_shop')).a.get('/api/shop-links')).body as ShopLinkList;
    expect(list.items.find((l) => l.code === code)!.expired).toBe(true);

    // moving the expiry on brings it back
    const { a, token } = await as('ridgeway_shop');
    const moved = await a.patch(`/api/shop-links/${code}`).set('x-csrf-token', token).send({ expiresAt: '2026-07-01T00:00:00Z' });
    expect(moved.status).toBe(200);
    expect((await request(server).get(`/l/${code}`)).status).toBe(302);
    clock.time = new Date('2026-06-01T10:00:00Z');
  });
});

describe('visits', () => {
  it('when the shop’s own accounts open the link, then the visit is not counted; customers’ and other members’ visits are', async () => {
    const code = await makeLink({ swapSlug: 'h31-front-vela', publicNote: 'See you Monday' });
    const visits = () => t.db.select().from(shopLinks).where(eq(shopLinks.code, code)).get()!.visits;
    const own = await (await as('ridgeway_shop')).a.get(`/l/${code}`).redirects(0);
    expect(own.status).toBe(302);
    expect(visits()).toBe(0);
    await request(server).get(`/l/${code}`).redirects(0);
    await (await as('rivet_rosa')).a.get(`/l/${code}`).redirects(0);
    await (await as('lathe_shop')).a.get(`/l/${code}`).redirects(0);
    expect(visits()).toBe(3);
    await (await as('ridgeway_shop')).a.get(`/l/${code}`).redirects(0);
    expect(visits()).toBe(3);
  });
});
