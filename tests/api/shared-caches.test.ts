import fs from 'node:fs';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser, csrfToken, signIn } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import { createApp } from '../../server/app';
import { staticClient } from '../../server/client';
import { sharedCacheMayStore } from '../../server/middleware/shared-cache';
import sharp from 'sharp';
import { addPart } from './support/swap-fixtures';
import { addShop, listen, signedInMember } from './support/auth-helpers';
import { cacheDirectives, expectSharedAnswer, expectYearLong } from './support/cache-headers';
import { revisionPhotos, shopLinks } from '../../server/db/schema/index';
import { processPhoto } from '../../server/features/photos/photo-processing';

// The built client's files go to everyone and are cached by browsers and any proxy in front:
// a signed-in reader's copy must not carry their session cookie.

const apps: TestApp[] = [];
afterAll(async () => {
  for (const t of apps) await t.close();
});

describe('the built client behind a shared cache', () => {
  it('when a signed-in member loads the client’s files, then none carries a cookie and each says how long it may be kept', async () => {
    const t = await makeTestApp();
    apps.push(t);
    const dist = path.join(t.dir, 'dist');
    fs.mkdirSync(path.join(dist, 'assets'), { recursive: true });
    fs.writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>Swapyard</title><div id="root"></div>');
    fs.writeFileSync(path.join(dist, 'assets', 'index-a1b2c3d4.js'), 'console.log(1)');
    fs.writeFileSync(path.join(dist, 'favicon.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
    const app = createApp({
      db: t.db,
      mailer: t.mailer,
      storage: t.storage,
      clock: { now: () => new Date() },
      config: t.config,
      logger: t.logger,
      client: staticClient(dist),
    });
    const server = app.listen(0);
    try {
      const moderator = addUser(t.db, 'gauge_mo', 'moderator');
      // a swap page answers 404 unless the swap exists
      addSwap(t.db, {
        slug: 'h31-vela-front',
        chassisId: addChassis(t.db).id,
        authorId: moderator.id,
        revisions: [{ status: 'approved' }],
      });
      const mo = request.agent(server);
      await signIn(mo, 'gauge_mo');
      await csrfToken(mo);
      for (const url of ['/', '/swaps/h31-vela-front', '/favicon.svg', '/assets/index-a1b2c3d4.js']) {
        const res = await mo.get(url);
        expect(res.status, url).toBe(200);
        expect(res.headers['set-cookie'], url).toBeUndefined();
        expect(res.headers['cache-control'], url).toBeTruthy();
        expect(sharedCacheMayStore(res.headers['cache-control']), url).toBe(true);
      }
      // the answers that carry the session say so to every cache
      const me = await mo.get('/api/me');
      expect(me.headers['set-cookie']).toBeDefined();
      expect(sharedCacheMayStore(me.headers['cache-control'])).toBe(false);
    } finally {
      server.close();
    }
  });
});

describe('the API behind a CDN', () => {
  it('when a visitor reads public answers, then each is public with a shared lifetime and a stale window, a strong ETag, no cookie, and a 304 when unchanged', async () => {
    const t = await makeTestApp();
    apps.push(t);
    const { server, agent } = listen(t.app);
    try {
      const author = addUser(t.db, 'rivet_rosa');
      const chassis = addChassis(t.db);
      const part = addPart(t.db, 'ov-355-104-l');
      const swap = addSwap(t.db, {
        slug: 'h31-vela-front',
        chassisId: chassis.id,
        authorId: author.id,
        revisions: [{ status: 'superseded' }, { status: 'approved' }],
      });
      const shop = addShop(t.db, 'ridgeway', 'Ridgeway Performance');
      t.db
        .insert(shopLinks)
        .values({
          code: 'rdg-h31-1',
          shopId: shop.id,
          swapId: swap.swapId,
          revisionId: swap.revisionIds[0]!,
          createdById: author.id,
          createdAt: new Date(),
          updatedAt: new Date(),
        })
        .run();

      const visitor = agent();
      const urls = [
        '/api/swaps?limit=5',
        '/api/swaps/h31-vela-front',
        '/api/swaps/h31-vela-front/revisions/1',
        '/api/chassis',
        '/api/chassis/halden-h31',
        `/api/parts/${part.id}`,
        '/api/search-index',
        '/api/search-index/head',
        `/api/graph/parts/${part.id}`,
        '/api/openapi.json',
        '/api/shops/ridgeway',
        '/api/l/rdg-h31-1',
        '/api/swaps/h31-vela-front/fitted-reports',
      ];
      for (const url of urls) {
        const res = await visitor.get(url);
        expectSharedAnswer(res, url);
        const again = await visitor.get(url).set('if-none-match', res.headers.etag);
        expect(again.status, `${url} revalidated`).toBe(304);
      }
      // what differs for a member says so to every cache in front, and a visitor's copy is keyed by the absent cookie
      for (const url of ['/api/shops/ridgeway', '/api/l/rdg-h31-1', '/api/swaps/h31-vela-front/fitted-reports']) {
        const anonymous = await visitor.get(url);
        expect(anonymous.headers.vary, url).toMatch(/cookie/i);
      }
      const member = await signedInMember(t.db, agent, 'camber_kai');
      for (const url of ['/api/shops/ridgeway', '/api/l/rdg-h31-1', '/api/swaps/h31-vela-front/fitted-reports']) {
        const mine = await member.agent.get(url);
        expect(mine.status, url).toBe(200);
        expect(sharedCacheMayStore(mine.headers['cache-control']), `${url} for a member`).toBe(false);
      }
      // the sheet is the same for a member: still public, and still no cookie
      expectSharedAnswer(await member.agent.get('/api/swaps/h31-vela-front'), 'sheet for a member');
      // an unknown sheet is an answer no cache keeps
      const missing = await visitor.get('/api/swaps/no-such-swap');
      expect(missing.status).toBe(404);
      expect(cacheDirectives(missing.headers['cache-control'])['no-store']).toBe(true);
    } finally {
      server.close();
    }
  });

  it('when a visitor loads a published photo, then it is kept a year by the browser and for five minutes by a shared cache, which a takedown reaches', async () => {
    const t = await makeTestApp();
    apps.push(t);
    const author = addUser(t.db, 'rivet_rosa');
    const swap = addSwap(t.db, {
      slug: 'h31-vela-photo',
      chassisId: addChassis(t.db).id,
      authorId: author.id,
      revisions: [{ status: 'approved' }],
    });
    const png = await sharp({ create: { width: 120, height: 90, channels: 3, background: '#1d4d3a' } })
      .png()
      .toBuffer();
    const p = await processPhoto(png);
    const fileId = 'cdnphotoaaaaaaaaaaaaaaaa';
    await t.storage.put(fileId, p.full);
    t.db
      .insert(revisionPhotos)
      .values({
        revisionId: swap.revisionIds[0]!,
        fileId,
        width: p.width,
        height: p.height,
        bytes: p.full.length,
        sha256: p.sha256,
        createdAt: new Date(),
      })
      .run();
    const res = await request(t.app).get(`/media/${fileId}`);
    expect(res.status).toBe(200);
    expectYearLong(res);
    expect(cacheDirectives(res.headers['cache-control'])['s-maxage']).toBe(300);
    expect(res.headers.etag).toMatch(/^"[^"]+"$/);
  });
});
