import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import { makeTestApp, type TestApp } from './support/test-app';
import { sharedCacheMayStore } from '../../server/middleware/shared-cache';
import { addShop, addUser, csrfToken, signIn, type Agent } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import { unsubscribeToken } from '../../server/features/following/following.service';
import { swapData } from './support/swap-rows';
import type { SearchHead } from '../../shared/search/shard-plan';
import {
  cars,
  follows,
  fittedReports,
  flags,
  parts,
  planSwaps,
  plans,
  revisionPhotos,
  reviewReasonTemplates,
  shopLinks,
  takedowns,
} from '../../server/db/schema/index';

// Every route the Express app really has, checked for every kind of visitor against the table below.
// A route that is added without a row here fails the first test, so none can be forgotten.

type Actor = 'anon' | 'member' | 'owner' | 'shop' | 'otherShop' | 'moderator' | 'admin';
const actors: Actor[] = ['anon', 'member', 'owner', 'shop', 'otherShop', 'moderator', 'admin'];
/** ok: authorized and found (not 401/403/404) · any: authorized (404 allowed: the actor may have nothing there) · deny: 403 or 404 (not theirs) */
type Expect = 'ok' | 'any' | 401 | 403 | 404 | 'deny';
type Row = Partial<Record<Actor, Expect>> & { all?: Expect };

// owner = the member who wrote the swap, the draft, the review item, the car; shop = a user of the shop that owns the link
const signedIn = (rest: Row = {}): Row => ({
  anon: 401,
  member: 'ok',
  owner: 'ok',
  shop: 'ok',
  otherShop: 'ok',
  moderator: 'ok',
  admin: 'ok',
  ...rest,
});
const reviewers = (rest: Row = {}): Row => ({
  anon: 401,
  member: 403,
  owner: 403,
  shop: 403,
  otherShop: 403,
  moderator: 'ok',
  admin: 'ok',
  ...rest,
});
const ownerOnly: Row = {
  anon: 401,
  member: 'deny',
  owner: 'ok',
  shop: 'deny',
  otherShop: 'deny',
  moderator: 'deny',
  admin: 'deny',
};
const admins: Row = { anon: 401, member: 403, owner: 403, shop: 403, otherShop: 403, moderator: 403, admin: 'ok' };
const ownShop: Row = { anon: 401, member: 403, owner: 403, shop: 'ok', otherShop: 'deny', moderator: 403, admin: 403 };
const publicRoute: Row = { all: 'ok' };

const table: Record<string, Row> = {
  'GET /api/health': publicRoute,
  'GET /auth/fake/authorize': publicRoute,
  'GET /auth/github': publicRoute,
  'GET /auth/github/callback': publicRoute,
  'POST /auth/logout': { all: 'ok' },
  'POST /auth/logout/everywhere': signedIn(),
  // anyone may ask for a sign-in link (202) or open one (a redirect, here to the failure page for no token)
  'POST /auth/email': publicRoute,
  'GET /auth/email/callback': publicRoute,
  'GET /api/me': publicRoute,
  'PATCH /api/me': signedIn(),
  'GET /api/admin/users': admins,
  'PATCH /api/admin/users/:id': admins,
  'GET /api/admin/users/:id/changes': admins,
  'GET /api/admin/shops': admins,
  'GET /api/admin/catalogue/chassis': admins,
  'PATCH /api/admin/catalogue/chassis/:id': admins,
  'POST /api/admin/catalogue/chassis/:id/approve': admins,
  'POST /api/admin/catalogue/chassis/:id/merge': admins,
  'GET /api/admin/catalogue/parts': admins,
  'PATCH /api/admin/catalogue/parts/:id': admins,
  'POST /api/admin/catalogue/parts/:id/merge': admins,
  'GET /api/admin/catalogue/changes': admins,
  'GET /api/swaps': publicRoute,
  'GET /api/swaps/:slug': publicRoute,
  'GET /api/swaps/:slug/revisions/:n': publicRoute,
  'GET /api/chassis': publicRoute,
  'GET /api/chassis/:slug': publicRoute,
  'PATCH /api/chassis/:slug/vehicle': reviewers(),
  'GET /api/parts/:id': publicRoute,
  'GET /api/parts': publicRoute,
  'GET /api/parts/match': publicRoute,
  'GET /api/search-index': publicRoute,
  'GET /api/graph/parts/:id': publicRoute,
  'GET /api/graph/chassis/:slug': publicRoute,
  // without a number it is a 400 naming the field, for everyone alike
  'GET /api/graph/where-else': publicRoute,
  'GET /api/search-index/head': publicRoute,
  'GET /api/search-index/shards/:shard/:hash': publicRoute,
  'GET /api/search-index/terms/:generation/:key': publicRoute,
  'GET /api/export/swaps.json': publicRoute,
  'GET /api/export/swaps.csv': publicRoute,
  'GET /api/openapi.json': publicRoute,
  'POST /api/submissions': signedIn(),
  // the world's revision is a never-submitted draft: private to its author, even from the review desk
  // (reviewers read a revision once it is sent to review; tests/api/drafts-private.test.ts)
  'GET /api/submissions/:id': ownerOnly,
  'PATCH /api/submissions/:id': ownerOnly,
  'POST /api/submissions/:id/submit': ownerOnly,
  'GET /api/submissions/:id/rebase': ownerOnly,
  'POST /api/submissions/:id/rebase': ownerOnly,
  'DELETE /api/submissions/:id': ownerOnly,
  'POST /api/submissions/:id/keep': ownerOnly,
  'POST /api/submissions/:id/withdraw': ownerOnly,
  'POST /api/submissions/:id/photos': ownerOnly,
  'PATCH /api/submissions/:id/photos': ownerOnly,
  'DELETE /api/submissions/:id/photos/:photoId': ownerOnly,
  'GET /api/me/submissions': signedIn(),
  'GET /api/me/storage': signedIn(),
  'GET /api/review/queue': reviewers(),
  'GET /api/review/templates': reviewers(),
  'POST /api/review/templates': reviewers(),
  'PATCH /api/review/templates/:id': reviewers(),
  'DELETE /api/review/templates/:id': reviewers(),
  'POST /api/review/bulk-decline': reviewers(),
  'GET /api/review/flags': reviewers(),
  'POST /api/review/flags/bulk-resolve': reviewers(),
  'POST /api/review/flags/:id/resolve': reviewers(),
  'POST /api/review/flags/:id/link': reviewers(),
  'GET /api/review/takedowns': reviewers(),
  // the world's revisionId is in review: the route is the desk's, and it answers 409 (nothing public to take down)
  'POST /api/review/revisions/:revisionId/takedowns': reviewers(),
  'POST /api/review/takedowns/:id/revert': admins,
  'GET /api/review/:revisionId': reviewers(),
  'POST /api/review/:revisionId/approve': reviewers(),
  'POST /api/review/next': reviewers(),
  'POST /api/review/:revisionId/claim': reviewers(),
  'DELETE /api/review/:revisionId/claim': reviewers(),
  'POST /api/review/:revisionId/send-back': reviewers(),
  'POST /api/review/:revisionId/decline': reviewers(),
  'POST /api/swaps/:slug/flags': signedIn(),
  'GET /api/outbox': reviewers(),
  'GET /api/swaps/:slug/fitted-reports': publicRoute,
  // the author cannot report their own swap
  'POST /api/swaps/:slug/fitted-reports': signedIn({ owner: 403 }),
  'PATCH /api/swaps/:slug/fitted-reports/mine': signedIn({
    member: 'any',
    owner: 'any',
    shop: 'any',
    otherShop: 'any',
    moderator: 'any',
    admin: 'any',
  }),
  'DELETE /api/swaps/:slug/fitted-reports/mine': signedIn({
    member: 'any',
    owner: 'any',
    shop: 'any',
    otherShop: 'any',
    moderator: 'any',
    admin: 'any',
  }),
  'POST /api/fitted-reports/:id/hide': reviewers(),
  'POST /api/fitted-reports/:id/unhide': reviewers(),
  'POST /api/fitted-reports/:id/release': reviewers(),
  'GET /api/fitted-reports': reviewers(),
  'GET /api/cars': signedIn(),
  'POST /api/cars': signedIn(),
  'PATCH /api/cars/:id': ownerOnly,
  'DELETE /api/cars/:id': ownerOnly,
  'GET /api/me/follows': signedIn(),
  'POST /api/me/follows': signedIn(),
  'PATCH /api/me/follows/:id': ownerOnly,
  'DELETE /api/me/follows/:id': ownerOnly,
  // the signed token is the only authority: anyone holding the link may see (GET) and use (POST) it
  'GET /unsubscribe/:token': publicRoute,
  'POST /unsubscribe/:token': publicRoute,
  // anyone makes a plan (a visitor's is kept by their device) and anyone with its address reads it;
  // only its owner (or the device that made it) changes it
  'POST /api/plans': publicRoute,
  'GET /api/plans/:id': publicRoute,
  'PATCH /api/plans/:id': { ...ownerOnly, anon: 'deny' },
  'POST /api/plans/:id/refresh': { ...ownerOnly, anon: 'deny' },
  'DELETE /api/plans/:id': { ...ownerOnly, anon: 'deny' },
  'GET /api/me/plans': signedIn(),
  'POST /api/me/plans/adopt': signedIn(),
  'GET /api/shops/:slug': publicRoute,
  'PATCH /api/shops/:slug': ownShop,
  'GET /api/shop-links': { ...ownShop, otherShop: 'ok', admin: 'ok' },
  'POST /api/shop-links': { ...ownShop, otherShop: 'ok' },
  'PATCH /api/shop-links/:code': ownShop,
  'POST /api/shop-links/:code/retire': ownShop,
  // the QR only encodes the public /l/ address, and the printed sheet shows it to anyone
  'GET /api/shop-links/:code/qr.png': publicRoute,
  'GET /api/shop-links/:code/qr.svg': publicRoute,
  'GET /api/l/:code': publicRoute,
  // the photo in the world belongs to the owner's never-submitted draft: only its author may see it
  'GET /media/:id': { anon: 404, member: 404, owner: 'ok', shop: 404, otherShop: 404, moderator: 404, admin: 404 },
  'GET /l/:code': publicRoute,
  // the same for everyone: approved swaps and the catalogue only
  'GET /sitemap.xml': publicRoute,
  'GET /robots.txt': publicRoute,
};

type Layer = { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] }; rawPath?: unknown };

/** Reads method + path of every route from the app's own router stack, nested routers included. */
function routesOf(app: Express): string[] {
  const out: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const m of Object.keys(layer.route.methods))
          if (m !== '_all') out.push(`${m.toUpperCase()} ${prefix}${layer.route.path}`);
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, prefix + (typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : ''));
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return [...new Set(out)];
}

/** A world where every kind of row a route can name exists, owned by `owner` and shop A. */
async function world() {
  const t = await makeTestApp({ SUBMISSION_RATE_LIMIT: '100000', UPLOAD_RATE_LIMIT: '100000', AUTH_RATE_LIMIT: '100000' });
  const shopA = addShop(t.db, 'ridgeway-performance', 'Ridgeway Performance');
  const shopB = addShop(t.db, 'lathe-and-lug', 'Lathe & Lug');
  const users = {
    member: addUser(t.db, 'pistonpaul'),
    owner: addUser(t.db, 'rivet_rosa'),
    shop: addUser(t.db, 'ridgeway_shop', 'shop', { shopId: shopA.id }),
    otherShop: addUser(t.db, 'lathe_shop', 'shop', { shopId: shopB.id }),
    moderator: addUser(t.db, 'gauge_mo', 'moderator'),
    admin: addUser(t.db, 'ada_admin', 'admin'),
  };
  const c = addChassis(t.db);
  const now = new Date();
  const part = t.db
    .insert(parts)
    .values({
      slug: 'ov-caliper',
      kind: 'caliper',
      name: 'Vela caliper',
      partNumbers: ['OV-355-104-L'],
      specs: {},
      cameOn: [],
      createdAt: now,
      updatedAt: now,
    })
    .returning()
    .get();
  const approved = addSwap(t.db, {
    slug: 'h31-vela-front',
    chassisId: c.id,
    authorId: users.owner.id,
    revisions: [{ status: 'approved' }],
  });
  const inReview = addSwap(t.db, {
    slug: 'h31-review-item',
    chassisId: c.id,
    authorId: users.owner.id,
    revisions: [{ status: 'in_review' }],
  });
  const draft = addSwap(t.db, { slug: 'h31-draft', chassisId: c.id, authorId: users.owner.id, revisions: [{ status: 'draft' }] });
  await t.storage.put('abcdefghijklmnop', Buffer.from('RIFF0000WEBPVP8 '));
  const photo = t.db
    .insert(revisionPhotos)
    .values({
      revisionId: draft.revisionIds[0],
      fileId: 'abcdefghijklmnop',
      width: 10,
      height: 10,
      bytes: 10,
      sha256: 'x',
      createdAt: now,
    })
    .returning()
    .get();
  const link = t.db
    .insert(shopLinks)
    .values({
      code: 'rp-h31vela',
      shopId: shopA.id,
      swapId: approved.swapId,
      revisionId: approved.revisionIds[0],
      createdById: users.shop.id,
      createdAt: now,
      updatedAt: now,
    })
    .returning()
    .get();
  const car = t.db
    .insert(cars)
    .values({
      userId: users.owner.id,
      chassisId: c.id,
      nickname: 'Daily',
      wheelDiameterIn: 16,
      wheelWidthIn: 7,
      wheelOffsetMm: 38,
      createdAt: now,
      updatedAt: now,
    })
    .returning()
    .get();
  const follow = t.db
    .insert(follows)
    .values({ userId: users.owner.id, chassisId: c.id, frequency: 'daily', since: now, createdAt: now, updatedAt: now })
    .returning()
    .get();
  t.db
    .insert(plans)
    .values({ id: 'plan-owned-1', chassisId: c.id, carId: car.id, ownerId: users.owner.id, createdAt: now, updatedAt: now })
    .run();
  t.db
    .insert(planSwaps)
    .values({ planId: 'plan-owned-1', swapId: approved.swapId, revisionId: approved.revisionIds[0]!, position: 0 })
    .run();
  const report = t.db
    .insert(fittedReports)
    .values({
      swapId: approved.swapId,
      userId: users.member.id,
      revisionId: approved.revisionIds[0],
      wheel: { diameterIn: 16, widthIn: 7, offsetMm: 38, spacerMm: 10 },
      createdAt: now,
      updatedAt: now,
    })
    .returning()
    .get();
  const flag = t.db
    .insert(flags)
    .values({
      swapId: approved.swapId,
      reporterId: users.member.id,
      reason: 'Torque figure looks wrong',
      createdAt: now,
      updatedAt: now,
    })
    .returning()
    .get();
  const takedown = t.db
    .insert(takedowns)
    .values({
      swapId: approved.swapId,
      revisionId: approved.revisionIds[0]!,
      target: 'body',
      reason: 'Personal details',
      createdById: users.moderator.id,
      createdAt: now,
    })
    .returning()
    .get();
  const template = t.db
    .insert(reviewReasonTemplates)
    .values({ label: 'Photo', text: 'Add a photo', createdAt: now, updatedAt: now })
    .returning()
    .get();
  // the search index's addresses carry hashes of their content: read them from the first index
  const searchHead = (await request(t.app).get('/api/search-index/head')).body as SearchHead;
  const params: Record<string, Record<string, string | number>> = {
    default: {
      slug: approved.slug,
      n: 1,
      revisionId: inReview.revisionIds[0],
      photoId: photo.fileId,
      code: link.code,
      token: unsubscribeToken(t.config.sessionSecret, follow.id),
    },
    follows: { id: follow.id },
    chassis: { slug: c.slug },
    shops: { slug: shopA.slug },
    parts: { id: part.id },
    admin: { id: users.member.id },
    submissions: { id: draft.revisionIds[0] },
    cars: { id: car.id },
    plans: { id: 'plan-owned-1' },
    templates: { id: template.id },
    flags: { id: flag.id },
    takedowns: { id: takedown.id },
    'fitted-reports': { id: report.id },
    media: { id: photo.fileId },
    // the approved swap is on a Halden: the search index keeps each make's swaps in a shard named after it
    shards: { shard: 'halden', hash: searchHead.shards.find((s) => s.id === 'halden')!.hash },
    terms: { generation: searchHead.generation, key: 'h3' },
  };
  return { t, users, params, approvedRevisionId: approved.revisionIds[0] };
}

function fill(route: string, params: Record<string, Record<string, string | number>>) {
  const [, path] = route.split(' ');
  const scope = Object.keys(params).find((k) => k !== 'default' && path.includes(`/${k}/`)) ?? 'default';
  return path.replace(/:([A-Za-z]+)/g, (_m, name: string) => String(params[scope][name] ?? params.default[name]));
}

/** Valid bodies, so a call gets past validation and reaches the ownership rule it is meant to test. */
const bodies: Record<string, object> = {
  'POST /auth/email': { email: 'matrix@example.com' },
  'PATCH /api/me': { name: 'New name' },
  'PATCH /api/admin/users/:id': { role: 'member' },
  'PATCH /api/admin/catalogue/chassis/:id': { notes: 'Checked against the workshop manual' },
  'PATCH /api/admin/catalogue/parts/:id': { notes: 'Checked against the box label' },
  'POST /api/admin/catalogue/chassis/:id/merge': { intoId: 999999 },
  'POST /api/admin/catalogue/parts/:id/merge': { intoId: 999999 },
  'POST /api/submissions': {
    chassisId: 1,
    axle: 'front',
    category: 'brakes',
    data: swapData('A new draft from the matrix'),
    body: '',
  },
  'PATCH /api/submissions/:id': { data: swapData('An edited draft title'), body: 'Edited' },
  'PATCH /api/submissions/:id/photos': { photos: [{ id: 'abcdefghijklmnop', caption: 'Caliper' }] },
  'POST /api/submissions/:id/rebase': { currentRevisionId: 1, choices: {} },
  'POST /api/review/templates': { label: 'Torque', text: 'Add the torque figures' },
  'PATCH /api/review/templates/:id': { label: 'Photo', text: 'Add a photo of the caliper' },
  'POST /api/review/bulk-decline': { revisionIds: [999], note: 'Spam' },
  'POST /api/review/flags/:id/resolve': { outcome: 'not_a_problem', note: 'Checked the figure' },
  'POST /api/review/flags/:id/link': { revisionId: null },
  'POST /api/review/flags/bulk-resolve': { ids: [1], outcome: 'not_a_problem', note: 'Checked the figures' },
  'POST /api/review/revisions/:revisionId/takedowns': { target: 'body', reason: 'Personal details' },
  'POST /api/review/:revisionId/send-back': { note: 'Add photos' },
  'POST /api/review/:revisionId/decline': { note: 'Duplicate' },
  'POST /api/swaps/:slug/flags': { kind: 'wrong_figure', reason: 'The torque figure looks wrong' },
  'POST /api/swaps/:slug/fitted-reports': { diameterIn: 16, widthIn: 7, offsetMm: 38, spacerMm: 10, note: 'Fits' },
  'PATCH /api/swaps/:slug/fitted-reports/mine': { note: 'Still fine' },
  'POST /api/cars': { chassisId: 1, nickname: 'Weekend car', wheelDiameterIn: 16, wheelWidthIn: 7, wheelOffsetMm: 38 },
  'PATCH /api/cars/:id': { nickname: 'Renamed' },
  'POST /api/me/follows': { chassisSlug: 'halden-h31', frequency: 'weekly' },
  'PATCH /api/me/follows/:id': { frequency: 'weekly' },
  'PATCH /api/chassis/:slug/vehicle': { vehicle: null },
  'POST /api/plans': { chassisId: 1, swapSlugs: ['h31-vela-front'] },
  'PATCH /api/plans/:id': { title: 'Both axles' },
  'POST /api/me/plans/adopt': { plans: [{ id: 'plan-visitor-1', deviceKey: 'k'.repeat(24) }] },
  'PATCH /api/shops/:slug': { about: 'Brake work since 1998' },
  'POST /api/shop-links': { swapSlug: 'h31-vela-front', note: 'As quoted' },
  'PATCH /api/shop-links/:code': { note: 'Updated note' },
};

function judge(expected: Expect, status: number): boolean {
  if (expected === 'ok') return ![401, 403, 404].includes(status) && status < 500;
  if (expected === 'any') return ![401, 403].includes(status) && status < 500;
  if (expected === 'deny') return status === 403 || status === 404;
  return status === expected;
}

const apps: TestApp[] = [];
afterAll(() => apps.forEach((a) => a.close()));

describe('authorization matrix', () => {
  it('when the app is built, then every route it has is in the table and the table has no stale rows', async () => {
    const t = await makeTestApp();
    apps.push(t);
    const routes = routesOf(t.app).sort();
    const missing = routes.filter((r) => !(r in table));
    const stale = Object.keys(table).filter((r) => !routes.includes(r));
    expect(missing, 'routes without an expected row').toEqual([]);
    expect(stale, 'rows for routes that no longer exist').toEqual([]);
    expect(routes.length).toBeGreaterThan(50);
  });

  it('when every route is called by every kind of visitor, then each answer matches the table', async () => {
    const probe = await makeTestApp();
    apps.push(probe);
    const routes = routesOf(probe.app);
    const failures: string[] = [];
    let checked = 0;
    for (const route of routes) {
      const row = table[route];
      for (const actor of actors) {
        const expected = row[actor] ?? row.all!;
        // a fresh world per call, so one visitor's allowed change never alters the next one's answer
        const w = await world();
        apps.push(w.t);
        const server = w.t.app.listen(0);
        const agent: Agent = request.agent(server);
        try {
          if (actor !== 'anon') await signIn(agent, w.users[actor].login);
          const token = await csrfToken(agent);
          const [method] = route.split(' ');
          const url = fill(route, w.params);
          const call = agent[method.toLowerCase() as 'get' | 'post' | 'patch' | 'delete'](url)
            .set('x-csrf-token', token)
            .redirects(0);
          const res = method === 'GET' ? await call : await call.send(bodies[route] ?? {});
          checked++;
          if (!judge(expected, res.status))
            failures.push(
              `${route} as ${actor}: expected ${expected}, got ${res.status} ${JSON.stringify(res.body?.error?.code ?? '')}`,
            );
        } finally {
          server.close();
          w.t.close();
        }
      }
    }
    console.log(`authorization matrix: ${routes.length} routes × ${actors.length} visitors = ${checked} calls checked`);
    expect(failures).toEqual([]);
  }, 900_000);

  it('when every public route is fetched signed in, then no answer a shared cache may store sets a cookie or differs from what a visitor gets', async () => {
    const w = await world();
    apps.push(w.t);
    const server = w.t.app.listen(0);
    try {
      const visitor = request(server);
      const readers: Record<string, Agent> = {};
      for (const actor of ['owner', 'moderator'] as const) {
        readers[actor] = request.agent(server);
        await signIn(readers[actor], w.users[actor].login);
        await csrfToken(readers[actor]); // the session now holds a token and a user, as a browser's does
      }
      const publicGets = routesOf(w.t.app).filter((r) => r.startsWith('GET ') && (table[r].anon ?? table[r].all) === 'ok');
      // the routes the issue named, and a photo of a public revision
      const approvedPhoto = w.t.db
        .insert(revisionPhotos)
        .values({
          revisionId: w.approvedRevisionId,
          fileId: 'publicphoto0001',
          width: 10,
          height: 10,
          bytes: 10,
          sha256: 'y',
          createdAt: new Date(),
        })
        .returning()
        .get();
      await w.t.storage.put(approvedPhoto.fileId, Buffer.from('RIFF0000WEBPVP8 '));
      const urls = [
        ...publicGets.map((r) => fill(r, w.params)),
        `/media/${approvedPhoto.fileId}`,
        `/media/${approvedPhoto.fileId}?size=thumb`,
      ];
      expect(urls).toEqual(
        expect.arrayContaining(['/api/search-index', `/api/swaps/${w.params.default.slug}`, '/api/shop-links/rp-h31vela/qr.png']),
      );

      const bytesOf = (r: request.Response) => (Buffer.isBuffer(r.body) ? r.body : Buffer.from(r.text ?? ''));
      const failures: string[] = [];
      for (const url of urls) {
        const anon = await visitor.get(url).redirects(0);
        for (const [actor, agent] of Object.entries(readers)) {
          const res = await agent.get(url).redirects(0);
          const cacheControl = String(res.headers['cache-control'] ?? '');
          const cookie = res.headers['set-cookie'];
          const shared = sharedCacheMayStore(cacheControl);
          if (!cacheControl) failures.push(`${url} as ${actor}: no Cache-Control`);
          if (shared && cookie) failures.push(`${url} as ${actor}: "${cacheControl}" with Set-Cookie`);
          if (shared && /cookie/i.test(String(res.headers.vary ?? '')))
            failures.push(`${url} as ${actor}: shared answer varies by cookie`);
          if (shared && (res.status !== anon.status || !bytesOf(res).equals(bytesOf(anon))))
            failures.push(`${url} as ${actor}: "${cacheControl}" but not the answer a visitor gets`);
        }
      }
      expect(failures).toEqual([]);
    } finally {
      server.close();
    }
  }, 60_000);
});
