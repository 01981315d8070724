import path from 'node:path';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';
import { signedInPage } from './support/sign-in';
import { closeDb, openDb, type Db } from '../../server/db/client';
import { flags } from '../../server/db/schema/index';
import { addUser } from '../api/support/auth-helpers';
import { addChassis } from '../api/support/swap-fixtures';
import { addSwap, swapData } from '../api/support/swap-rows';

// A reader flags a questioned torque figure in a real browser; every reader of the sheet is told about
// it (without the reporter's name) until a moderator settles it on the desk, and then the notice goes.

let server: RunningServer;
let browser: Browser;
let db: Db;
const slug = 'h31-front-vela-flagged';

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
  db = openDb(path.join(server.dir, 'e2e.db'));
  const chassisId = addChassis(db).id;
  const author = addUser(db, 'rivet_rosa');
  addUser(db, 'gauge_mo', 'moderator');
  addUser(db, 'camber_kai');
  addSwap(db, {
    slug,
    chassisId,
    authorId: author.id,
    revisions: [{ status: 'approved', data: swapData('Vela four-piston calipers on the H31 front') }],
  });
});
afterAll(async () => {
  closeDb(db);
  await browser?.close();
  await server?.stop();
});

const notice = 'A reader questions a figure on this sheet';

describe('an open flag about a safety figure', () => {
  it('when a member flags a wrong figure, then a visitor reading the sheet is told its gist, and a moderator’s outcome clears it', async () => {
    // a member flags the figure from the sheet
    const member = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const { page: kai, errors: kaiErrors } = await signedInPage(member, server.url, 'camber_kai', `/swaps/${slug}`);
    await kai.getByRole('button', { name: 'Flag a problem' }).click();
    await kai.getByRole('button', { name: 'Send to the moderators' }).click();
    // nothing picked: the form says what is missing, nothing is stored
    await kai.getByText('Pick what kind of problem it is').waitFor();
    expect(db.select().from(flags).all()).toEqual([]);
    await kai.getByLabel('What kind of problem?').selectOption({ label: 'A figure looks wrong' });
    await kai.getByLabel('What is wrong?').fill('The bracket bolt torque of 35 N·m looks far too low for M12 bolts.');
    await kai.getByRole('button', { name: 'Send to the moderators' }).click();
    await kai.getByRole('status').filter({ hasText: 'a moderator will look at it' }).waitFor();
    await kai.getByRole('heading', { name: notice }).waitFor();
    expect(kaiErrors).toEqual([]);
    await member.close();

    // a visitor on a phone sees the notice with the gist, never the reporter
    const visitor = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const reader = await visitor.newPage();
    await reader.goto(`${server.url}/swaps/${slug}`);
    const region = reader.getByRole('region', { name: notice });
    await region.waitFor();
    const text = await region.innerText();
    expect(text).toContain('The bracket bolt torque of 35 N·m looks far too low for M12 bolts.');
    expect(text).toMatch(/manufacturer’s specification/);
    expect(text).not.toMatch(/camber/i);
    await visitor.close();

    // a moderator settles it on the desk with one outcome
    const mod = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const { page: mo, errors: moErrors } = await signedInPage(mod, server.url, 'gauge_mo', '/review');
    const card = mo.getByRole('listitem').filter({ hasText: 'looks far too low for M12 bolts' });
    await card.waitFor();
    expect(await card.innerText()).toMatch(/A figure looks wrong/);
    const form = card.getByRole('form', { name: /Resolve the flag/ });
    await form.getByRole('button', { name: 'Resolve flag' }).click();
    await form.getByText('Pick how this flag was settled').waitFor();
    expect(db.select().from(flags).get()!.status).toBe('open');
    // a published correction is needed before "fixed by a correction" can be picked
    expect(await form.locator('option[value="fixed_by_correction"]').isDisabled()).toBe(true);
    await form.getByLabel('Outcome').selectOption({ label: 'Not a problem' });
    await form.getByLabel('Note to the reporter (optional)').fill('35 N·m is the bracket maker’s figure for these M10 bolts.');
    await form.getByRole('button', { name: 'Resolve flag' }).click();
    await card.waitFor({ state: 'detached' });
    expect(db.select().from(flags).where(eq(flags.status, 'resolved')).get()!.outcome).toBe('not_a_problem');
    expect(moErrors).toEqual([]);
    await mod.close();

    // the reader's notice is gone
    const again = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const later = await again.newPage();
    await later.goto(`${server.url}/swaps/${slug}`);
    await later.getByRole('heading', { level: 1, name: 'Vela four-piston calipers on the H31 front' }).waitFor();
    expect(await later.getByRole('region', { name: notice }).count()).toBe(0);
    await again.close();
  });
});
