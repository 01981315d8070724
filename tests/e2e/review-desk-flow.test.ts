import path from 'node:path';
import { eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';
import { signedInPage } from './support/sign-in';
import { closeDb, openDb, type Db } from '../../server/db/client';
import { reviewClaims, revisions } from '../../server/db/schema/index';
import { addUser } from '../api/support/auth-helpers';
import { addChassis } from '../api/support/swap-fixtures';
import { addSwap, swapData } from '../api/support/swap-rows';

// A moderator works through five submissions the way the desk is meant to be used: filter, claim the next with a
// key, decide and open the next, while a colleague's claimed submission stays theirs.

let server: RunningServer;
let browser: Browser;
let db: Db;
let mine: number[];
let colleagues: number;
let otherChassis: number;

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
  db = openDb(path.join(server.dir, 'e2e.db'));
  const h31 = addChassis(db).id;
  const h40 = addChassis(db, 'halden-h40', { model: 'H40', code: 'H40' }).id;
  const rosa = addUser(db, 'rivet_rosa');
  addUser(db, 'gauge_mo', 'moderator');
  const ada = addUser(db, 'ada_admin', 'admin');
  const add = (slug: string, title: string, chassisId: number, minutesAgo: number) => {
    const id = addSwap(db, { slug, chassisId, authorId: rosa.id, revisions: [{ status: 'in_review', data: swapData(title) }] })
      .revisionIds[0]!;
    db.update(revisions)
      .set({ submittedAt: new Date(Date.now() - minutesAgo * 60_000) })
      .where(eq(revisions.id, id))
      .run();
    return id;
  };
  mine = [1, 2, 3, 4, 5].map((n) => add(`h31-desk-${n}`, `H31 front brakes, submission ${n}`, h31, 600 - n));
  // the oldest of all, already taken by a colleague
  colleagues = add('h31-desk-taken', 'H31 front brakes, taken by a colleague', h31, 900);
  otherChassis = add('h40-desk-other', 'H40 front brakes, outside the filter', h40, 1000);
  db.insert(reviewClaims)
    .values({ revisionId: colleagues, moderatorId: ada.id, claimedAt: new Date(), expiresAt: new Date(Date.now() + 20 * 60_000) })
    .run();
});
afterAll(async () => {
  closeDb(db);
  await browser?.close();
  await server?.stop();
});

describe('the review desk for a long queue', () => {
  it('when a moderator filters the desk and works five submissions with claim and “decide and open the next”, then each is decided in turn and the colleague’s stays theirs', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const { page, errors } = await signedInPage(context, server.url, 'gauge_mo', '/review');
    await page.getByRole('combobox', { name: 'Chassis' }).selectOption('halden-h31');
    await page.waitForURL(/chassis=halden-h31/);
    // the filtered queue has arrived once the other chassis' row is gone
    await page.getByRole('row', { name: /outside the filter/ }).waitFor({ state: 'detached' });
    const taken = page.getByRole('row', { name: /taken by a colleague/ });
    await taken.waitFor();
    expect(await taken.innerText()).toMatch(/Taken by @ada_admin until \d\d:\d\d/);
    expect(await page.getByTestId('shortcuts').innerText()).toMatch(/n\s+Claim and open the next unclaimed submission/);

    // a key opens the oldest unclaimed one in the filter and claims it; typing in the search box is not a shortcut
    await page.getByRole('searchbox', { name: 'Search the queue' }).fill('n');
    expect(page.url()).toMatch(/\/review\?/);
    await page.getByRole('searchbox', { name: 'Search the queue' }).fill('');
    await page.locator('body').click({ position: { x: 5, y: 5 } });
    await page.keyboard.press('n');
    await page.waitForURL(new RegExp(`/review/${mine[0]}\\?chassis=halden-h31`));

    for (let i = 0; i < mine.length; i++) {
      await page
        .getByRole('heading', { level: 1, name: `H31 front brakes, submission ${i + 1}` })
        .first()
        .waitFor();
      await page
        .getByTestId('claim-bar')
        .getByText(/You are working on this until/)
        .waitFor();
      if (i % 2 === 0) {
        await page.keyboard.press('2'); // chooses "Send back for rework"; saving still takes the button
        expect(await page.getByRole('radio', { name: /^Send back for rework/ }).isChecked()).toBe(true);
        await page.getByRole('textbox', { name: 'Reasons (the author reads these)' }).fill('Add the torque of the wheel bolts');
        await page.getByRole('button', { name: 'Send back for rework and open the next' }).click();
      } else {
        await page.getByRole('radio', { name: /^Publish/ }).check();
        await page.getByRole('button', { name: 'Publish and open the next' }).click();
      }
      if (i < mine.length - 1) await page.waitForURL(new RegExp(`/review/${mine[i + 1]}\\?chassis=halden-h31`));
    }
    await page.getByRole('status').filter({ hasText: 'Nothing unclaimed is left in this filter' }).waitFor();

    const statuses = db
      .select({ id: revisions.id, status: revisions.status })
      .from(revisions)
      .where(inArray(revisions.id, [...mine, colleagues, otherChassis]))
      .all();
    const byId = Object.fromEntries(statuses.map((r) => [r.id, r.status]));
    expect(mine.map((id) => byId[id])).toEqual(['sent_back', 'approved', 'sent_back', 'approved', 'sent_back']);
    expect(byId[colleagues]).toBe('in_review');
    expect(byId[otherChassis]).toBe('in_review');
    // decisions end claims; the colleague's holds
    expect(
      db
        .select()
        .from(reviewClaims)
        .all()
        .map((c) => c.revisionId),
    ).toEqual([colleagues]);

    // the colleague's submission says who has it, and deciding on it waits
    await page.goto(`${server.url}/review/${colleagues}`);
    await page
      .getByTestId('claim-bar')
      .getByText(/Taken: @ada_admin is working on this until/)
      .waitFor();
    await page.getByRole('radio', { name: /^Publish/ }).check();
    expect(await page.getByRole('button', { name: 'Publish', exact: true }).isDisabled()).toBe(true);
    expect(errors).toEqual([]);
    await context.close();
  });
});
