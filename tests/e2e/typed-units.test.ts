import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { hydrated, launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';
import { signedInPage } from './support/sign-in';
import { closeDb, openDb, type Db } from '../../server/db/client';
import { addUser } from '../api/support/auth-helpers';
import { addChassis } from '../api/support/swap-fixtures';
import { addSwap, swapData } from '../api/support/swap-rows';

// Figures already typed keep their meaning when the units toggle flips: 0.4 in becomes 10.16 mm in the
// field (NIST SP 811 B.8: 1 in = 25.4 mm exactly), and the verdicts stay what they were.

let server: RunningServer;
let browser: Browser;
let db: Db;

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
  db = openDb(path.join(server.dir, 'e2e.db'));
  const chassisId = addChassis(db).id; // wheel bolts M12×1.5
  const author = addUser(db, 'rivet_rosa');
  addUser(db, 'camber_kai');
  addSwap(db, {
    slug: 'h31-front-vela-units',
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

const toggle = (page: Page, choice: 'mm · N·m' | 'in · lbf·ft') =>
  page.getByRole('group', { name: 'Units' }).getByRole('button', { name: choice }).click();

const verdicts = (page: Page) =>
  page
    .locator('#check [data-verdict]')
    .evaluateAll((els) => els.map((e) => `${e.querySelector('p')?.textContent}: ${e.getAttribute('data-verdict')}`));

describe('typed figures and the units toggle', () => {
  it('when a reader types their wheel in inches and switches to mm, then the figures convert and the verdicts do not flip', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(`${server.url}/swaps/h31-front-vela-units`);
    await hydrated(page);
    await toggle(page, 'in · lbf·ft');
    const panel = page.locator('#check');
    await panel.getByLabel('Diameter (in)').fill('16');
    await panel.getByLabel('Width (in)').fill('7');
    await panel.getByLabel('Offset ET (mm)').fill('35');
    await panel.getByRole('button', { name: 'I have measured my wheel and bolts' }).click();
    await panel.getByLabel('Spacer (in)').fill('0.4');
    await panel.getByLabel('Wheel-bolt length (in)').fill('1');
    await panel.getByLabel(/^Wheel thickness at the .* \(in\)/).fill('0.3');

    await expect.poll(async () => (await verdicts(page)).length).toBeGreaterThan(0);
    const inImperial = await verdicts(page);

    await toggle(page, 'mm · N·m');
    expect(await panel.getByLabel('Spacer (mm)').inputValue()).toBe('10.16');
    expect(await panel.getByLabel('Wheel-bolt length (mm)').inputValue()).toBe('25.4');
    expect(await panel.getByLabel(/^Wheel thickness at the .* \(mm\)/).inputValue()).toBe('7.62');
    expect(await panel.getByLabel('Offset ET (mm)').inputValue()).toBe('35');
    expect(await verdicts(page)).toEqual(inImperial);

    // and back: exactly what was typed, no rounding drift
    await toggle(page, 'in · lbf·ft');
    expect(await panel.getByLabel('Spacer (in)').inputValue()).toBe('0.4');
    expect(await verdicts(page)).toEqual(inImperial);
    expect(errors).toEqual([]);
    await page.close();
  });

  it('when a member types a spacer in inches for a car and switches to mm, then the spacer field converts', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const { page, errors } = await signedInPage(context, server.url, 'camber_kai', '/me/cars');
    await toggle(page, 'in · lbf·ft');
    const form = page.getByRole('form', { name: 'Add a car' });
    await form.getByLabel('Spacer fitted (in)').fill('0.4');
    await toggle(page, 'mm · N·m');
    expect(await form.getByLabel('Spacer fitted (mm)').inputValue()).toBe('10.16');
    expect(errors).toEqual([]);
    await context.close();
  });
});
