import type { Server } from 'node:http';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { JSDOM } from 'jsdom';
import { makeTestApp, type TestApp } from './support/test-app';
import { addShop, addUser, listen } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, swapData } from './support/swap-rows';
import { staticClient } from '../../server/client';
import { shopLinks } from '../../server/db/schema/index';
import { renderPage } from '../../src/entry-server';

// Public pages arrive as HTML with their data: what a reader on a slow phone, a crawler or a link preview
// gets before any script runs. The page is read by a parser that runs no script.

let t: TestApp;
let server: Server;
let dist: string;
let swapRevisionIds: number[];

beforeAll(async () => {
  // a built client shaped like the real one: the empty root the browser would draw into
  dist = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-dist-'));
  fs.mkdirSync(path.join(dist, 'assets'));
  fs.writeFileSync(
    path.join(dist, 'index.html'),
    '<!doctype html><html><head><meta charset="UTF-8" /><title>Swapyard — what fits your car</title></head><body><div id="root"></div><script type="module" src="/assets/app.js"></script></body></html>',
  );
  t = await makeTestApp({ APP_URL: 'http://swapyard.test' }, undefined, { client: staticClient(dist, { renderPage }) });
  ({ server } = listen(t.app));
  const authorId = addUser(t.db, 'rivet_rosa').id;
  const chassisId = addChassis(t.db).id;
  swapRevisionIds = addSwap(t.db, {
    slug: 'h31-front-vela-calipers',
    chassisId,
    authorId,
    revisions: [
      { status: 'superseded', data: swapData('Vela calipers on the H31, first record') },
      { status: 'approved', data: swapData('Vela calipers on the H31') },
    ],
  }).revisionIds;
}, 60_000);
afterAll(() => {
  server.close();
  t.close();
  fs.rmSync(dist, { recursive: true, force: true });
});

/** The page as a parser reads it, scripts never run. */
async function pageOf(url: string, status = 200) {
  const res = await request(server).get(url);
  expect(res.status, url).toBe(status);
  const doc = new JSDOM(res.text).window.document;
  const state = doc.getElementById('server-state');
  return { res, doc, root: doc.getElementById('root')!, state: state ? (JSON.parse(state.textContent!) as ServerStateJson) : null };
}

type ServerStateJson = { queries: { queries: { queryKey: unknown[]; state: { status: string } }[] } };

describe('a swap sheet is drawn by the server', () => {
  it('when the sheet is opened, then its HTML holds the title, the parts table and the safety caution, with the data it was drawn from', async () => {
    const { doc, root, state } = await pageOf('/swaps/h31-front-vela-calipers');
    expect(doc.title).toBe('Vela calipers on the H31 · Swapyard');
    expect(root.querySelector('h1')?.textContent).toBe('Vela calipers on the H31');
    const parts = [...root.querySelectorAll('table')].find((tb) => tb.querySelector('caption')?.textContent === 'Parts of this swap');
    expect(parts, 'the parts table').toBeDefined();
    const cells = [...parts!.querySelectorAll('td, th')].map((c) => c.textContent);
    expect(cells).toContain('Front caliper');
    expect(cells.some((c) => c?.includes('Vela four-piston fixed caliper'))).toBe(true);
    expect(cells.some((c) => c?.includes('OV-355-104-L'))).toBe(true);
    const caution = root.querySelector('[aria-label="Safety caution"]');
    expect(caution?.textContent).toContain('Brakes are safety critical');
    expect(caution?.textContent).toContain('Have the work inspected by a qualified technician');
    // the browser starts from the same data: the sheet's query is handed over, not asked for again
    const keys = state!.queries.queries.map((q) => JSON.stringify(q.queryKey));
    expect(keys).toContain(JSON.stringify(['swaps', 'detail', 'h31-front-vela-calipers']));
    expect(state!.queries.queries.every((q) => q.state.status === 'success')).toBe(true);
  });

  it('when a pinned revision is opened, then the HTML shows that revision and says a newer one exists', async () => {
    const { root } = await pageOf('/swaps/h31-front-vela-calipers/r/1');
    expect(root.querySelector('h1')?.textContent).toBe('Vela calipers on the H31, first record');
    expect(root.textContent).toContain('You are reading revision 1');
  });

  it('when the chassis and the home page are opened, then they arrive with the swap listed', async () => {
    const chassis = await pageOf('/chassis/halden-h31');
    expect(chassis.root.querySelector(`a[href="/swaps/h31-front-vela-calipers"]`)).not.toBeNull();
    const home = await pageOf('/');
    expect(home.root.textContent).toContain('Vela calipers on the H31');
  });

  it('when an unknown swap or page is opened, then it answers 404 and leaves the page to the browser', async () => {
    const swap = await pageOf('/swaps/no-such-swap', 404);
    expect(swap.root.innerHTML).toBe('');
    expect(swap.state).toBeNull();
    expect((await pageOf('/swaps/h31-front-vela-calipers/r/9', 404)).state).toBeNull();
    expect((await pageOf('/no/such/page', 404)).state).toBeNull();
  });
});

describe('a shop link', () => {
  it('when a shop has retired its link, then the link answers 410', async () => {
    const shop = addShop(t.db, 'ridgeway-performance', 'Ridgeway Performance');
    const createdById = addUser(t.db, 'ridgeway_shop').id;
    const now = new Date();
    t.db
      .insert(shopLinks)
      .values({
        code: 'rp-retired',
        shopId: shop.id,
        swapId: 1,
        revisionId: swapRevisionIds[1]!,
        createdById,
        retiredAt: now,
        createdAt: now,
        updatedAt: now,
      })
      .run();
    const res = await request(server).get('/l/rp-retired');
    expect(res.status).toBe(410);
    expect(res.text).toContain('Ridgeway Performance has retired this link');
  });
});
