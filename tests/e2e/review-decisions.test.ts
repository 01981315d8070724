import path from 'node:path';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';
import { signedInPage } from './support/sign-in';
import { closeDb, openDb, type Db } from '../../server/db/client';
import { userChanges, users } from '../../server/db/schema/index';
import { addUser } from '../api/support/auth-helpers';
import { addChassis } from '../api/support/swap-fixtures';
import { addSwap, swapData } from '../api/support/swap-rows';

// The review desk's decisions and words in a real browser: nothing is chosen for the moderator, the
// checks and states read in Swapyard's own words, the reasons box does not jump, and an admin's
// role change waits for a confirmation that says what the role grants.

let server: RunningServer;
let browser: Browser;
let db: Db;
let revisionId: number;

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
  db = openDb(path.join(server.dir, 'e2e.db'));
  const chassisId = addChassis(db).id;
  const author = addUser(db, 'rivet_rosa');
  addUser(db, 'gauge_mo', 'moderator');
  addUser(db, 'ada_admin', 'admin');
  addUser(db, 'camber_kai');
  // a brake record with no fasteners: the fastener check has something to say
  revisionId = addSwap(db, {
    slug: 'h31-front-vela',
    chassisId,
    authorId: author.id,
    revisions: [{ status: 'in_review', data: swapData('Vela four-piston calipers on the H31 front') }],
  }).revisionIds[0]!;
});
afterAll(async () => {
  closeDb(db);
  await browser?.close();
  await server?.stop();
});

const forbiddenWords = /\b(approved?|changes requested|all pass|failing|fails|pass)\b/i;

describe('review decisions and words', () => {
  it('when a moderator opens a revision at the desk, then nothing is chosen, the button waits for a choice and the checks read in our words', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const { page, errors } = await signedInPage(context, server.url, 'gauge_mo', '/review');
    const row = page.getByRole('row', { name: /Vela four-piston calipers/ });
    await row.waitFor();
    expect(await row.innerText()).toMatch(/At the desk/);
    expect(await row.innerText()).toMatch(/\d+ fix needed|In order/);
    expect(await row.innerText()).not.toMatch(forbiddenWords);

    await page.goto(`${server.url}/review/${revisionId}`);
    await page.getByRole('heading', { name: 'Decision' }).waitFor();
    for (const name of ['Publish', 'Send back for rework', 'Don’t publish'])
      expect(await page.getByRole('radio', { name: new RegExp(`^${name}`) }).isChecked()).toBe(false);
    const send = page.getByRole('button', { name: 'Choose a decision above' });
    expect(await send.isDisabled()).toBe(true);

    const checks = await page.getByRole('region', { name: 'Automatic checks' }).innerText();
    expect(checks).toMatch(/\d+ fix needed/);
    expect(checks).toMatch(/\d+ in order/);
    expect(checks).not.toMatch(forbiddenWords);
    expect(await page.getByText('At the desk', { exact: true }).count()).toBeGreaterThan(0);

    await page.getByRole('radio', { name: /^Publish/ }).check();
    expect(await page.getByRole('button', { name: 'Publish', exact: true }).isEnabled()).toBe(true);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('when the moderator sends back without reasons, then the reason shows after leaving the box, clears as it is typed and nothing moves', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const { page, errors } = await signedInPage(context, server.url, 'gauge_mo', `/review/${revisionId}`);
    await page.getByRole('radio', { name: /^Send back for rework/ }).check();
    const box = page.getByRole('textbox', { name: 'Reasons (the author reads these)' });
    const button = page.getByRole('button', { name: 'Send back for rework', exact: true });
    const alert = page.getByRole('alert').filter({ hasText: 'Give the reason the member will read' });
    // its place on the page, not on the screen: focus may scroll the page, which is no layout move
    const buttonTop = () => button.evaluate((el) => el.getBoundingClientRect().top + window.scrollY);
    const before = await buttonTop();

    await box.focus();
    expect(await alert.count()).toBe(0); // not before the box was left
    await box.press('Tab');
    await alert.waitFor();
    expect(await buttonTop()).toBe(before);

    await box.fill('Add the torque of the wheel bolts');
    expect(await alert.count()).toBe(0); // gone while typing, not on the next blur
    expect(await buttonTop()).toBe(before);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('when an admin picks a new role, then nothing changes until they confirm what the role grants, and the change is recorded', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const { page, errors } = await signedInPage(context, server.url, 'ada_admin', '/admin');
    const kai = () => db.select().from(users).where(eq(users.login, 'camber_kai')).get()!;
    await page.getByRole('combobox', { name: 'Role of camber_kai' }).selectOption('moderator');
    const confirm = page.getByTestId('role-confirm');
    await confirm.waitFor();
    const text = await confirm.innerText();
    expect(text).toContain('Make camber kai (@camber_kai) a Moderator instead of Member?');
    expect(text).toContain('decide at the review desk');
    expect(kai().role).toBe('member');

    // changing one's mind leaves the role as it was
    await page.getByRole('button', { name: 'Keep Member' }).click();
    expect(await confirm.count()).toBe(0);
    expect(await page.getByRole('combobox', { name: 'Role of camber_kai' }).inputValue()).toBe('member');
    expect(kai().role).toBe('member');

    await page.getByRole('combobox', { name: 'Role of camber_kai' }).selectOption('moderator');
    await page.getByRole('button', { name: 'Yes, make them Moderator' }).click();
    await page.getByRole('status').filter({ hasText: 'camber_kai is now Moderator.' }).waitFor();
    expect(kai().role).toBe('moderator');
    const recorded = db.select().from(userChanges).where(eq(userChanges.userId, kai().id)).all();
    expect(recorded.map((c) => [c.field, c.fromValue, c.toValue])).toEqual([['role', 'member', 'moderator']]);

    // taking a role away says what is lost
    await page.getByRole('combobox', { name: 'Role of camber_kai' }).selectOption('member');
    expect(await confirm.innerText()).toMatch(/They may no longer: decide at the review desk/);
    expect(errors).toEqual([]);
    await context.close();
  });
});
