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
      addSwap(t.db, { slug: 'h31-vela-front', chassisId: addChassis(t.db).id, authorId: moderator.id, revisions: [{ status: 'approved' }] });
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
