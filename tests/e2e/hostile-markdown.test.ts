import path from 'node:path';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';
import { signedInPage } from './support/sign-in';
import { closeDb, openDb, type Db } from '../../server/db/client';
import { shopLinks, shops, users } from '../../server/db/schema/index';
import { addChassis } from '../api/support/swap-fixtures';
import { addSwap } from '../api/support/swap-rows';

// Markdown that would hang or crash the page, rendered in Chromium: the review desk stays usable with a
// write-up stored before nesting was limited, and with one that is valid but takes the parser minutes;
// an image written to climb out of /media/ never makes the reader's browser visit a shop link.

let server: RunningServer;
let browser: Browser;
let db: Db;
let chassisId: number;

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
  // the test arranges its rows in the server's own database file (WAL lets both processes use it)
  db = openDb(path.join(server.dir, 'e2e.db'));
  chassisId = addChassis(db).id;
});
afterAll(async () => {
  closeDb(db);
  await browser?.close();
  await server?.stop();
});

async function moderatorPage(returnTo: string) {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  // the first sign-in makes the member; the role is then set the way an admin would
  const first = await signedInPage(context, server.url, 'gauge_mo', '/');
  await first.page.close();
  db.update(users).set({ role: 'moderator' }).where(eq(users.login, 'gauge_mo')).run();
  return signedInPage(context, server.url, 'gauge_mo', returnTo);
}

describe('hostile markdown in the browser', () => {
  it('when the desk opens revisions whose write-ups nest 39,000 quotes or take the parser minutes, then the page stays usable and shows them as written', async () => {
    const author = db
      .insert(users)
      .values({
        provider: 'github',
        providerId: 'demo-camber_kai',
        login: 'camber_kai',
        createdAt: new Date(),
        updatedAt: new Date(),
      })
      .returning()
      .get();
    // stored before the nesting rule existed; nothing accepts it any more
    const deep = addSwap(db, {
      slug: 'h31-deep-quotes',
      chassisId,
      authorId: author.id,
      revisions: [{ status: 'in_review', body: `Fitted over a weekend.\n${'>'.repeat(39_000)} x` }],
    });
    // valid today (no nesting at all), yet the markdown parser needs on the order of a minute for it
    const slow = addSwap(db, {
      slug: 'h31-slow-emphasis',
      chassisId,
      authorId: author.id,
      revisions: [{ status: 'in_review', body: '*a'.repeat(19_000) }],
    });

    const { page, errors } = await moderatorPage(`/review/${deep.revisionIds[0]}`);
    await page.getByRole('heading', { name: 'Decision' }).waitFor();
    await page.getByText('Shown as written: its quotes and lists nest too deeply to format.').waitFor();
    await page.getByRole('radio', { name: /Send back/ }).check();

    const started = Date.now();
    await page.goto(`${server.url}/review/${slow.revisionIds[0]}`);
    await page.getByText('Shown as written: formatting this text takes too long.').waitFor({ timeout: 15_000 });
    // the page answers while the text would still be parsing
    await page.getByRole('radio', { name: /Send back/ }).check();
    expect(await page.getByRole('radio', { name: /Send back/ }).isChecked()).toBe(true);
    expect(Date.now() - started).toBeLessThan(15_000);
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('when a published write-up has an image pointing through /media/.. at a shop link, then the reader’s browser never requests the link', async () => {
    const author = db.select().from(users).where(eq(users.login, 'camber_kai')).get()!;
    const now = new Date();
    const shop = db
      .insert(shops)
      .values({ slug: 'ridgeway-performance', name: 'Ridgeway Performance', createdAt: now, updatedAt: now })
      .returning()
      .get();
    const target = addSwap(db, { slug: 'h31-linked', chassisId, authorId: author.id, revisions: [{ status: 'approved' }] });
    db.insert(shopLinks)
      .values({
        code: 'k7mpq2x',
        shopId: shop.id,
        swapId: target.swapId,
        revisionId: target.revisionIds[0]!,
        createdById: author.id,
        createdAt: now,
        updatedAt: now,
      })
      .run();
    const hostile = addSwap(db, {
      slug: 'h31-hostile-image',
      chassisId,
      authorId: author.id,
      revisions: [
        {
          status: 'approved',
          body: 'Photos:\n\n![a](/media/../l/k7mpq2x)\n\n![b](/media/%2e%2e/l/k7mpq2x)\n\n![c](/media\\..\\l\\k7mpq2x)',
        },
      ],
    });

    const context = await browser.newContext();
    const page = await context.newPage();
    const requested: string[] = [];
    page.on('request', (r) => requested.push(new URL(r.url()).pathname));
    await page.goto(`${server.url}/swaps/${hostile.slug}`);
    await page.getByRole('heading', { level: 1 }).waitFor();
    await page.getByText('Photos:').waitFor();
    await page.waitForLoadState('networkidle');
    expect(requested.filter((p) => p.startsWith('/l/') || p.startsWith('/media/'))).toEqual([]);
    expect(await page.locator('main img[src*="/l/"]').count()).toBe(0);
    expect(db.select().from(shopLinks).where(eq(shopLinks.code, 'k7mpq2x')).get()!.visits).toBe(0);
    await context.close();
  });
});
