import { execFile } from 'node:child_process';
import path from 'node:path';
import { promisify } from 'node:util';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { hydrated, launchBrowser } from './support/browser';
import { signedInPage } from './support/sign-in';

// The community loop in a real browser against the real server on an empty database:
// a member records a swap with a photo and sends it; a moderator checks and approves it;
// it is then found by search, and the member's message is in the outbox.

const root = path.resolve(import.meta.dirname, '../..');
const run = promisify(execFile);

let server: RunningServer;
let browser: Browser;

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const signIn = (context: BrowserContext, login: string, returnTo: string) => signedInPage(context, server.url, login, returnTo);

/** the role command an operator runs; it changes the database the server is using */
async function setRole(login: string, role: string) {
  await run(process.execPath, ['--import', 'tsx', 'server/auth/user-role-cli.ts', login, role], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: path.join(server.dir, 'e2e.db') },
  });
}

/** a real photo of noise, large enough that a throttled upload shows its progress */
function photo(): Promise<Buffer> {
  const width = 900;
  const height = 600;
  const raw = Buffer.alloc(width * height * 3);
  for (let i = 0; i < raw.length; i++) raw[i] = (i * 7919 + (i >> 5) * 104729) % 251;
  return sharp(raw, { raw: { width, height, channels: 3 } })
    .jpeg({ quality: 95 })
    .toBuffer();
}

const title = 'Orsino Vela calipers on the Halden H31 front';

describe('submit and review journey', () => {
  it('when the form opens on a 390 px phone, then nothing is wider than the screen', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const { page, errors } = await signIn(context, 'camber_kai', '/submit');
    await page.getByRole('heading', { level: 1, name: 'Record a swap' }).waitFor();
    await page.getByRole('checkbox', { name: 'The swap limits which wheels fit' }).check();
    await page.getByRole('button', { name: 'Add a wheel we tried' }).click();
    await page.getByRole('checkbox', { name: 'The swap changes calipers or rotors' }).check();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('when a member records a swap and a moderator approves it, then it is searchable and the member is told', async () => {
    // ---- the member fills the form ----
    const memberContext = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const { page, errors } = await signIn(memberContext, 'rivet_rosa', '/submit');
    await page.getByRole('heading', { level: 1, name: 'Record a swap' }).waitFor();

    await page.getByRole('radio', { name: 'Not listed: propose it' }).check();
    const text = (name: string) => page.getByRole('textbox', { name, exact: true });
    await text('Make').fill('Halden');
    await text('Model').fill('H31');
    await text('Chassis code').fill('H31');
    await text('First year').fill('1991');
    await text('Last year').fill('1999');
    await text('Wheel bolts per hub').fill('5');
    await text('Bolt circle (PCD)').fill('112');
    await text('Centre bore').fill('66.6');
    await text('Wheel-bolt thread').fill('M12x1.5');
    await page.getByRole('combobox', { name: 'Axle' }).selectOption('front');
    await page.getByRole('combobox', { name: 'Category' }).selectOption('brakes');
    await text('Title').fill(title);

    // a server-side rule shown beside its field before anything is sent
    await text('Role in this swap').fill('front caliper, both sides');
    await text('Name').fill('V');
    await text('Name').blur();
    await expect.poll(() => page.getByRole('alert').filter({ hasText: 'Name the part' }).count()).toBe(1);
    await text('Name').fill('Vela four-piston fixed caliper');
    await text('Part numbers').fill('OV-355-104-L, OV-355-104-R');

    await page.getByRole('button', { name: 'Add a rotor' }).click();
    await text('Diameter').fill('280');
    await text('Thickness').fill('24');

    await page.getByRole('button', { name: 'Add a fastener' }).click();
    await page.getByRole('combobox', { name: 'Kind of fastener' }).selectOption('caliper_mount');
    await text('Fastener').fill('caliper to knuckle');
    await text('Torque').fill('85');

    await page.getByRole('checkbox', { name: 'The swap limits which wheels fit' }).check();
    await text('Smallest wheel that clears').fill('15');
    await text('Barrel inner diameter at the caliper').fill('360');
    await text('Caliper reach beyond the rotor edge').fill('12');
    await text('Caliper face outboard of the hub face').fill('40');
    await page.getByRole('button', { name: 'Add a wheel we tried' }).click();
    const tried = page.getByRole('group', { name: 'Wheel 1' });
    await tried.getByRole('textbox', { name: 'Diameter', exact: true }).fill('15');
    await tried.getByRole('textbox', { name: 'Width', exact: true }).fill('6');
    await tried.getByRole('textbox', { name: 'Offset', exact: true }).fill('38');
    await tried.getByRole('textbox', { name: 'Measured at the barrel', exact: true }).fill('28');
    await tried.getByRole('textbox', { name: 'Measured at the spokes', exact: true }).fill('6');

    await page.getByRole('button', { name: 'Add a cost line' }).click();
    await text('Item').fill('Two used calipers');
    await text('Amount').fill('240');

    await page
      .getByRole('textbox', { name: 'Write-up (markdown)' })
      .fill('## Fitting\n\nThe **bracket** bolts on without grinding.');
    await expect.poll(() => page.getByTestId('write-up-preview').locator('strong').innerText()).toBe('bracket');

    // live figures: the measured wheel held against the 3 mm rule (common practice, no source)
    const live = page.getByRole('region', { name: 'Figures from your entries' });
    await expect.poll(() => live.getByTestId('live-wheels').innerText()).toContain('15×6 ET38 · fits');
    await expect.poll(() => live.getByTestId('live-wheels').innerText()).toContain('Barrel 28 mm (at least 3 mm');
    await expect.poll(() => live.getByText('€240.00').count()).toBeGreaterThan(0);

    // the draft saves by itself and the address becomes the draft's own
    await page.waitForURL(/\/submissions\/\d+\/edit$/, { timeout: 15_000 });
    await expect.poll(() => page.locator('[data-save-state]').getAttribute('data-save-state'), { timeout: 15_000 }).toBe('saved');
    const revisionId = Number(/submissions\/(\d+)\/edit/.exec(page.url())![1]);
    // the draft's own page is in place (only it offers to delete the draft); the hand-over itself is tested in submit-handoff
    await page.getByRole('button', { name: 'Delete draft' }).waitFor();

    // a refused save keeps the input, shows the server's reason beside its field, and the next save goes through
    const saveState = () => page.locator('[data-save-state]').getAttribute('data-save-state');
    const refusal = {
      error: {
        code: 'validation',
        message: 'Check the marked fields.',
        fields: { 'data.parts.0.maker': 'Give the maker as printed on the casting' },
      },
    };
    await page.route('**/api/submissions/*', (route) =>
      route.request().method() === 'PATCH'
        ? route.fulfill({ status: 400, contentType: 'application/json', body: JSON.stringify(refusal) })
        : route.fallback(),
    );
    await text('Maker').fill('Ors');
    await expect.poll(saveState, { timeout: 10_000 }).toBe('error');
    await page.getByRole('alert').filter({ hasText: 'Give the maker as printed on the casting' }).waitFor();
    expect(await text('Maker').inputValue()).toBe('Ors');
    await page.unroute('**/api/submissions/*');
    await text('Maker').fill('Orsino');
    await expect.poll(saveState, { timeout: 10_000 }).toBe('saved');
    expect(await page.getByRole('alert').filter({ hasText: 'Give the maker as printed on the casting' }).count()).toBe(0);
    const stored = await page.evaluate(async (id) => (await fetch(`/api/submissions/${id}`)).json(), revisionId);
    expect(stored.data.parts[0].maker).toBe('Orsino');

    // ---- a photo, uploaded over a slow link so the progress bar is seen moving ----
    const cdp = await memberContext.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 20,
      downloadThroughput: -1,
      uploadThroughput: 96 * 1024,
    });
    const jpeg = await photo();
    expect(jpeg.length).toBeGreaterThan(150_000);
    await page.locator('input[type="file"]').setInputFiles({ name: 'fitted.jpg', mimeType: 'image/jpeg', buffer: jpeg });
    const bar = page.getByRole('progressbar', { name: 'Uploading fitted.jpg' });
    await bar.waitFor();
    await expect.poll(async () => Number(await bar.getAttribute('value')), { timeout: 15_000 }).toBeGreaterThan(0);
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 0,
      downloadThroughput: -1,
      uploadThroughput: -1,
    });
    const photos = page.getByRole('list', { name: 'Photos in this revision' });
    await photos.getByRole('listitem').first().waitFor({ timeout: 20_000 });
    await page.getByRole('textbox', { name: 'Caption for photo 1' }).fill('Caliper on the bracket, 28 mm to the barrel');
    await page.getByRole('textbox', { name: 'Caption for photo 1' }).blur();
    // the upload panel states the member's storage quota, and what the new photo takes of it
    const stored1 = await page.evaluate(async (id) => (await fetch(`/api/submissions/${id}`)).json(), revisionId);
    expect(stored1.photos).toHaveLength(1);
    await expect
      .poll(() => page.getByTestId('storage-use').innerText())
      .toMatch(/Your photos not yet published use 0\.[1-9] MB of your 200\.0 MB\./);

    // a wrong type is refused with a clear message and nothing is added
    await page
      .locator('input[type="file"]')
      .setInputFiles({ name: 'notes.txt', mimeType: 'text/plain', buffer: Buffer.from('not a photo') });
    await page.getByText('notes.txt: only JPEG, PNG or WebP photos can be added.').waitFor();
    expect(await photos.getByRole('listitem').count()).toBe(1);

    // the checks the reviewer will see all pass now
    await expect.poll(() => live.getByTestId('live-checks').locator('[data-status="fail"]').count()).toBe(0);

    await page.getByRole('button', { name: 'Send for review' }).click();
    await page.getByTestId('locked-status').waitFor();
    expect(await page.getByTestId('locked-status').innerText()).toContain('At the desk');
    expect(await page.getByTestId('locked-status').innerText()).toContain('Locked while at the desk');
    expect(errors).toEqual([]);

    // ---- a moderator decides ----
    const modContext = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const first = await signIn(modContext, 'gauge_mo', '/');
    await first.page.close();
    await setRole('gauge_mo', 'moderator');
    const mod = await modContext.newPage();
    const modErrors: string[] = [];
    mod.on('pageerror', (e) => modErrors.push(e.message));
    await mod.goto(`${server.url}/review`);
    await mod.getByRole('heading', { level: 1, name: 'Review desk' }).waitFor();
    await mod.getByRole('link', { name: title }).click();
    await mod.waitForURL(new RegExp(`/review/${revisionId}$`));

    const checks = mod.getByTestId('checks');
    await checks.waitFor();
    for (const id of ['required', 'photos', 'torque', 'clearance', 'costs']) {
      expect(await checks.locator(`[data-check="${id}"]`).getAttribute('data-status'), id).toBe('pass');
    }
    expect(
      await mod
        .getByRole('region', { name: 'The sheet as it will look' })
        .getByRole('heading', { level: 1, name: title })
        .count(),
    ).toBe(1);

    await mod.getByRole('textbox', { name: 'Note to the author (optional)' }).fill('Clear photos, thank you.');
    // nothing is chosen until the moderator chooses
    expect(await mod.getByRole('radio', { name: /^Publish/ }).isChecked()).toBe(false);
    await mod.getByRole('radio', { name: /^Publish/ }).check();
    await mod.getByRole('button', { name: 'Publish', exact: true }).click();
    await mod.getByTestId('cannot-decide').filter({ hasText: 'Published' }).waitFor();

    // ---- anyone finds it in search ----
    await page.goto(`${server.url}/search?q=Vela`);
    await hydrated(page);
    await page.getByRole('link', { name: title }).first().waitFor({ timeout: 15_000 });

    // ---- the member's message is in the outbox ----
    await mod.goto(`${server.url}/outbox`);
    const outbox = mod.getByTestId('outbox');
    await outbox.waitFor();
    const approved = outbox.getByRole('article').filter({ hasText: `Published: ${title}` });
    await approved.waitFor();
    // moderators see whom it was for and how delivery went, never the address
    expect(await approved.innerText()).toContain('@rivet_rosa');
    expect(await approved.innerText()).toContain('Kept here (no mail server)');
    expect(await approved.innerText()).not.toContain('rivet_rosa@members.swapyard.invalid');
    expect(await approved.locator('pre').innerText()).toContain('Clear photos, thank you.');
    expect(modErrors).toEqual([]);

    await memberContext.close();
    await modContext.close();
  });
});
