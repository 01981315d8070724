import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addShop, addUser, csrfToken, listen, signIn, type Agent } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, approveNewRevision, swapData } from './support/swap-rows';
import { shopLinks } from '../../server/db/schema/index';
import type { PinnedSheetView, ShopLinkItem, ShopLinkList, ShopPageView } from '../../shared/schemas/shops';

let t: TestApp;
let server: Server;
let agent: () => Agent;
const signedIn = new Map<string, { a: Agent; token: string }>();
let swap: { swapId: number; slug: string };
let authorId: number;

async function as(login: string) {
  if (!signedIn.has(login)) {
    const a = agent();
    await signIn(a, login);
    signedIn.set(login, { a, token: await csrfToken(a) });
  }
  return signedIn.get(login)!;
}

const rev1 = swapData('Vela four-piston calipers on the H31 front', {
  summary: 'First write-up',
  installHours: 6,
  fasteners: [{ id: 'caliper-bolts', kind: 'caliper_mount', label: 'Caliper to bracket', thread: 'M12x1.5' }],
  torque: [{ fastenerId: 'caliper-bolts', nm: 85 }],
});

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  const ridgeway = addShop(t.db, 'ridgeway-performance', 'Ridgeway Performance');
  const lathe = addShop(t.db, 'lathe-and-lug', 'Lathe & Lug');
  addUser(t.db, 'ridgeway_shop', 'shop', { shopId: ridgeway.id });
  addUser(t.db, 'lathe_shop', 'shop', { shopId: lathe.id });
  addUser(t.db, 'unlinked_shop', 'shop');
  authorId = addUser(t.db, 'rivet_rosa').id;
  addUser(t.db, 'ada_admin', 'admin');
  addUser(t.db, 'gauge_mo', 'moderator');
  const h31 = addChassis(t.db);
  swap = addSwap(t.db, {
    slug: 'h31-front-vela',
    chassisId: h31.id,
    authorId,
    revisions: [{ status: 'approved', data: rev1, body: 'Bleed twice.' }],
  });
  addSwap(t.db, { slug: 'h31-pending', chassisId: h31.id, authorId, revisions: [{ status: 'in_review' }] });
});
afterAll(() => {
  server.close();
  t.close();
});

async function makeLink(login = 'ridgeway_shop', note = 'Our **fixed price** covers spacers and bolts.') {
  const { a, token } = await as(login);
  return a.post('/api/shop-links').set('x-csrf-token', token).send({ swapSlug: 'h31-front-vela', note });
}

describe('making shop links', () => {
  it('when a shop user makes a link, then it gets a short code pinned to the current revision, with the note kept as markdown minus HTML', async () => {
    const res = await makeLink(
      'ridgeway_shop',
      'Our **fixed price** <img src=x onerror=alert(1)>covers <script>steal()</script>spacers.',
    );
    expect(res.status).toBe(201);
    const link = res.body.link as ShopLinkItem;
    expect(link.code).toMatch(/^[a-z2-9]{7}$/);
    expect(link.url).toBe(`${t.config.appUrl}/l/${link.code}`);
    expect(link).toMatchObject({
      revision: { number: 1 },
      swap: { slug: 'h31-front-vela', title: rev1.title },
      visits: 0,
      newerRevision: null,
      retiredAt: null,
    });
    expect(link.private?.note).toBe('Our **fixed price** covers spacers.');
    const again = await makeLink();
    expect(again.body.link.code).not.toBe(link.code);
  });

  it('when a member, a moderator, an admin or a shop account without a shop tries, then it is 403 and no link is made', async () => {
    const before = t.db.select().from(shopLinks).all().length;
    for (const login of ['rivet_rosa', 'gauge_mo', 'ada_admin', 'unlinked_shop']) {
      const res = await makeLink(login);
      expect(res.status, login).toBe(403);
    }
    const anon = agent();
    const token = await csrfToken(anon);
    expect((await anon.post('/api/shop-links').set('x-csrf-token', token).send({ swapSlug: 'h31-front-vela' })).status).toBe(401);
    expect(t.db.select().from(shopLinks).all()).toHaveLength(before);
  });

  it('when the swap is not approved, then it is 400 naming the field', async () => {
    const { a, token } = await as('ridgeway_shop');
    const res = await a.post('/api/shop-links').set('x-csrf-token', token).send({ swapSlug: 'h31-pending' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.swapSlug).toMatch(/No approved swap/);
  });
});

describe('editing and listing a shop’s links', () => {
  it('when another shop edits or retires Ridgeway’s link, then it is 403 and the link is unchanged; Ridgeway may', async () => {
    const code = (await makeLink()).body.link.code as string;
    const lathe = await as('lathe_shop');
    expect(
      (await lathe.a.patch(`/api/shop-links/${code}`).set('x-csrf-token', lathe.token).send({ note: 'Hijacked' })).status,
    ).toBe(403);
    expect((await lathe.a.post(`/api/shop-links/${code}/retire`).set('x-csrf-token', lathe.token)).status).toBe(403);
    const admin = await as('ada_admin');
    expect(
      (await admin.a.patch(`/api/shop-links/${code}`).set('x-csrf-token', admin.token).send({ note: 'Admin edit' })).status,
    ).toBe(403);
    const row = t.db.select().from(shopLinks).where(eq(shopLinks.code, code)).get()!;
    expect(row.note).toBe('Our **fixed price** covers spacers and bolts.');
    expect(row.retiredAt).toBeNull();

    const ridgeway = await as('ridgeway_shop');
    const edit = await ridgeway.a
      .patch(`/api/shop-links/${code}`)
      .set('x-csrf-token', ridgeway.token)
      .send({ note: 'Price now includes *bed-in*.' });
    expect(edit.status).toBe(200);
    expect(edit.body.link.private.note).toBe('Price now includes *bed-in*.');
    expect(
      (await ridgeway.a.patch('/api/shop-links/nosuchcode').set('x-csrf-token', ridgeway.token).send({ note: 'x' })).status,
    ).toBe(404);
  });

  it('when each shop lists its links, then it sees only its own; an admin sees every shop’s but cannot manage them', async () => {
    await makeLink('lathe_shop', 'Knuckle machining quote');
    const ridgeway = (await (await as('ridgeway_shop')).a.get('/api/shop-links')).body as ShopLinkList;
    expect(ridgeway.canManage).toBe(true);
    expect(ridgeway.items.length).toBeGreaterThanOrEqual(3);
    expect(new Set(ridgeway.items.map((l) => l.shop.slug))).toEqual(new Set(['ridgeway-performance']));
    const lathe = (await (await as('lathe_shop')).a.get('/api/shop-links')).body as ShopLinkList;
    expect(lathe.items.map((l) => l.private?.note)).toEqual(['Knuckle machining quote']);
    const admin = (await (await as('ada_admin')).a.get('/api/shop-links')).body as ShopLinkList;
    expect(admin.canManage).toBe(false);
    expect(admin.items).toHaveLength(ridgeway.items.length + 1);
    expect((await (await as('rivet_rosa')).a.get('/api/shop-links')).status).toBe(403);
  });
});

describe('following a shop link', () => {
  it('when a customer opens /l/:code, then the visit is counted and they land on the pinned revision with ?via', async () => {
    const code = (await makeLink()).body.link.code as string;
    for (let i = 0; i < 3; i++) {
      const res = await request(server).get(`/l/${code}`);
      expect(res.status).toBe(302);
      expect(res.headers.location).toBe(`/swaps/h31-front-vela/r/1?via=${code}`);
    }
    expect(t.db.select().from(shopLinks).where(eq(shopLinks.code, code)).get()!.visits).toBe(3);
    const list = (await (await as('ridgeway_shop')).a.get('/api/shop-links')).body as ShopLinkList;
    expect(list.items.find((l) => l.code === code)!.visits).toBe(3);
    // the client's read of the link does not count as a visit
    const pinned = await request(server).get(`/api/l/${code}`);
    expect(pinned.status).toBe(200);
    expect(t.db.select().from(shopLinks).where(eq(shopLinks.code, code)).get()!.visits).toBe(3);
  });

  it('when revision 2 is approved later, then the link still shows revision 1, says a newer one exists and what changed, on the page and in the list', async () => {
    const code = (await makeLink('ridgeway_shop', 'Quoted on revision 1')).body.link.code as string;
    approveNewRevision(
      t.db,
      swap.swapId,
      { ...rev1, installHours: 8, torque: [{ ...rev1.torque[0], nm: 95 }] },
      authorId,
      'Bleed twice. Re-torque after 50 km.',
    );

    expect((await request(server).get(`/l/${code}`)).headers.location).toBe(`/swaps/h31-front-vela/r/1?via=${code}`);
    const pinned = (await request(server).get(`/api/l/${code}`)).body as PinnedSheetView;
    expect(pinned.sheet.revision.number).toBe(1);
    expect(pinned.sheet.revision.status).toBe('superseded');
    expect(pinned.sheet.revision.data.installHours).toBe(6);
    expect(pinned.sheet.currentNumber).toBe(2);
    // the note is the shop's own: a customer opening the link does not get it
    expect(pinned.link.private).toBeNull();
    expect(pinned.shop.name).toBe('Ridgeway Performance');
    expect(pinned.newerRevision).toEqual({
      number: 2,
      summary: 'Changed: fasteners and torque; install time and tools; write-up.',
    });

    const item = ((await (await as('ridgeway_shop')).a.get('/api/shop-links')).body as ShopLinkList).items.find(
      (l) => l.code === code,
    )!;
    expect(item.revision.number).toBe(1);
    expect(item.newerRevision).toEqual({
      number: 2,
      summary: 'Changed: fasteners and torque; install time and tools; write-up.',
    });
    // a link made now pins revision 2 and has no notice
    const fresh = (await makeLink()).body.link as ShopLinkItem;
    expect(fresh.revision.number).toBe(2);
    expect(fresh.newerRevision).toBeNull();
  });

  it('when the code is unknown, then /l/:code is a clear 404 page and the API says not found', async () => {
    const res = await request(server).get('/l/zzzzzzz');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toContain('We don’t know this link');
    expect(res.text).toContain('zzzzzzz');
    const odd = await request(server).get('/l/%3Cscript%3Ealert(1)%3C%2Fscript%3E');
    expect(odd.status).toBe(404);
    expect(odd.text).not.toContain('<script>alert');
    expect((await request(server).get('/api/l/zzzzzzz')).status).toBe(404);
  });

  it('when the shop retires a link, then /l/:code is a polite page pointing to the current sheet and no visit is counted', async () => {
    const code = (await makeLink()).body.link.code as string;
    const { a, token } = await as('ridgeway_shop');
    const retire = await a.post(`/api/shop-links/${code}/retire`).set('x-csrf-token', token);
    expect(retire.status).toBe(200);
    expect(retire.body.link.retiredAt).not.toBeNull();
    const res = await request(server).get(`/l/${code}`);
    expect(res.status).toBe(410);
    expect(res.text).toContain('Ridgeway Performance has retired this link');
    expect(res.text).toContain('href="/swaps/h31-front-vela"');
    expect(t.db.select().from(shopLinks).where(eq(shopLinks.code, code)).get()!.visits).toBe(0);
    const api = await request(server).get(`/api/l/${code}`);
    expect(api.status).toBe(410);
    expect(api.body.error.code).toBe('link_retired');
  });
});

describe('QR codes and the shop page', () => {
  it('when the QR is asked for, then PNG and SVG come back with the right type, and as a download when asked', async () => {
    const code = (await makeLink()).body.link.code as string;
    const pngRes = await request(server).get(`/api/shop-links/${code}/qr.png?download=1`).buffer(true);
    expect(pngRes.status).toBe(200);
    expect(pngRes.headers['content-type']).toBe('image/png');
    expect(pngRes.headers['content-disposition']).toBe(`attachment; filename="swapyard-link-${code}.png"`);
    expect((pngRes.body as Buffer).subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
    const svgRes = await request(server)
      .get(`/api/shop-links/${code}/qr.svg`)
      .buffer(true)
      .parse((res, cb) => {
        let text = '';
        res.on('data', (c: Buffer) => (text += c.toString()));
        res.on('end', () => cb(null, text));
      });
    expect(svgRes.status).toBe(200);
    expect(svgRes.headers['content-type']).toMatch(/^image\/svg\+xml/);
    expect(svgRes.body as string).toMatch(/^<svg[^>]+viewBox/);
    expect((await request(server).get('/api/shop-links/zzzzzzz/qr.png')).status).toBe(404);
  });

  it('when anyone opens the shop page, then it lists the swaps the shop links to; only its own shop users may edit it', async () => {
    const page = (await request(server).get('/api/shops/ridgeway-performance')).body as ShopPageView;
    expect(page.shop.name).toBe('Ridgeway Performance');
    expect(page.swaps.map((s) => s.slug)).toEqual(['h31-front-vela']);
    expect(page.canEdit).toBe(false);
    expect(((await (await as('ridgeway_shop')).a.get('/api/shops/ridgeway-performance')).body as ShopPageView).canEdit).toBe(
      true,
    );

    const lathe = await as('lathe_shop');
    expect(
      (await lathe.a.patch('/api/shops/ridgeway-performance').set('x-csrf-token', lathe.token).send({ about: 'Closed' })).status,
    ).toBe(403);
    const own = await as('ridgeway_shop');
    const bad = await own.a
      .patch('/api/shops/ridgeway-performance')
      .set('x-csrf-token', own.token)
      .send({ website: 'javascript:alert(1)' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.website).toMatch(/http/);
    const ok = await own.a
      .patch('/api/shops/ridgeway-performance')
      .set('x-csrf-token', own.token)
      .send({ town: 'Ashcombe Vale', about: 'Brakes <b>and</b> suspension.' });
    expect(ok.status).toBe(200);
    expect(ok.body.shop).toMatchObject({ town: 'Ashcombe Vale', about: 'Brakes and suspension.', name: 'Ridgeway Performance' });
    expect((await request(server).get('/api/shops/no-such-shop')).status).toBe(404);
  });
});

describe('shop-link privacy and lookup limits', () => {
  it('when a customer, another shop or an admin opens a pinned link, then the shop’s note is not in the answer; the shop’s own account sees it', async () => {
    const code = (await makeLink('ridgeway_shop', 'For J. Doe, quoted 1,240 with fitting')).body.link.code as string;
    const anonymous = await request(server).get(`/api/l/${code}`);
    expect(anonymous.status).toBe(200);
    expect(anonymous.body.link.private).toBeNull();
    expect(JSON.stringify(anonymous.body)).not.toContain('J. Doe');
    for (const login of ['lathe_shop', 'ada_admin', 'gauge_mo', 'rivet_rosa']) {
      const res = await (await as(login)).a.get(`/api/l/${code}`);
      expect(res.status, login).toBe(200);
      expect(JSON.stringify(res.body), login).not.toContain('J. Doe');
    }
    const own = await (await as('ridgeway_shop')).a.get(`/api/l/${code}`);
    expect(own.body.link.private.note).toBe('For J. Doe, quoted 1,240 with fitting');
    expect(own.headers['cache-control']).toMatch(/private/);
  });

  it('when one address looks up more unknown link codes than allowed, then it gets 429 on every link route until the window passes', async () => {
    const limited = await makeTestApp({ LINK_MISS_LIMIT: '5' });
    const l = listen(limited.app);
    try {
      const h31 = addChassis(limited.db);
      const rosa = addUser(limited.db, 'rivet_rosa');
      const ridgeway = addShop(limited.db, 'ridgeway-performance', 'Ridgeway Performance');
      const shopUser = addUser(limited.db, 'ridgeway_shop', 'shop', { shopId: ridgeway.id });
      const known = addSwap(limited.db, {
        slug: 'h31-front',
        chassisId: h31.id,
        authorId: rosa.id,
        revisions: [{ status: 'approved' }],
      });
      limited.db
        .insert(shopLinks)
        .values({
          code: 'knownone',
          shopId: ridgeway.id,
          swapId: known.swapId,
          revisionId: known.revisionIds[0]!,
          createdById: shopUser.id,
          createdAt: new Date(),
          updatedAt: new Date(),
        })
        .run();
      const visitor = request(l.server);
      // a hit does not use up the allowance for misses
      for (let i = 0; i < 8; i++) expect((await visitor.get('/l/knownone')).status).toBe(302);
      const guesses = ['aaaaaaa', 'aaaaaab', 'aaaaaac', 'aaaaaad', 'aaaaaae'];
      for (const [i, g] of guesses.entries()) {
        const res = i % 2 ? await visitor.get(`/api/l/${g}`) : await visitor.get(`/l/${g}`);
        expect(res.status).toBe(404);
      }
      const blocked = await visitor.get('/l/aaaaaaf');
      expect(blocked.status).toBe(429);
      expect(blocked.headers['content-type']).toMatch(/text\/html/);
      expect(blocked.text).toContain('Too many');
      const api = await visitor.get('/api/l/aaaaaag');
      expect(api.status).toBe(429);
      expect(api.body.error.code).toBe('rate_limited');
      expect((await visitor.get('/api/shop-links/aaaaaah/qr.png')).status).toBe(429);
      // the known link is held back too, and its count did not move while refused
      expect((await visitor.get('/l/knownone')).status).toBe(429);
      expect(limited.db.select().from(shopLinks).where(eq(shopLinks.code, 'knownone')).get()!.visits).toBe(8);
    } finally {
      l.server.close();
      limited.close();
    }
  });
});
