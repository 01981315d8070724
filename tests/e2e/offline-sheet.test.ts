import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { launchBrowser } from './support/browser';
import { signedInPage } from './support/sign-in';

// Reading in the garage: a member keeps a sheet on the phone, the connection goes, and the sheet still
// reads, with its photo and its computed checks, and so do the member's cars. The server is stopped as
// well as the browser set offline, so nothing can come from the network (a browser's offline switch does
// not reach a service worker's own requests).

let server: RunningServer;
let browser: Browser;

beforeAll(async () => {
  server = await startServer({ SEED_DEMO: 'auto', SERVICE_WORKER: 'on' });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const sheet = '/swaps/h31-rear-regent-300-drum-in-hat';

describe('reading offline', () => {
  it('when a member keeps a sheet and the connection goes, then a reload still shows the sheet with its photo, its checks and the offline banner, and their cars', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const { page, errors } = await signedInPage(context, server.url, 'rivet_rosa', '/me/cars');
    await page.getByText('Green coupe').first().waitFor();

    await page.goto(`${server.url}${sheet}`);
    await page.getByRole('heading', { level: 1 }).waitFor();
    const heading = await page.getByRole('heading', { level: 1 }).innerText();
    // the service worker is installed (the app's files are kept) and answers this page
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
    await expect.poll(() => page.evaluate(() => Boolean(navigator.serviceWorker.controller)), { timeout: 20_000 }).toBe(true);

    await page.getByRole('button', { name: 'Keep offline' }).click();
    await page.getByText('✓ Kept on this device').waitFor();
    const balance = page.locator('#balance [data-balance]');
    await expect.poll(() => balance.getAttribute('data-severity')).toMatch(/\w/);
    const severityOnline = await balance.getAttribute('data-severity');
    const checkOnline = await balance.innerText();
    expect(checkOnline).toMatch(/locks first/);
    expect(await page.getByRole('status').filter({ hasText: 'You are offline' }).count()).toBe(0);

    await context.setOffline(true);
    await server.stop();
    await page.reload();
    await page.getByRole('heading', { level: 1, name: heading }).waitFor();
    expect(heading.length).toBeGreaterThan(0);
    await page.getByRole('status').filter({ hasText: 'You are offline' }).waitFor();
    // the computed check, worked out again on the device from the kept sheet
    await expect.poll(() => balance.getAttribute('data-severity')).toBe(severityOnline);
    expect(await balance.innerText()).toBe(checkOnline);
    // the photo came from the kept copy
    const photo = page.locator('img[src^="/media/"]').first();
    await photo.scrollIntoViewIfNeeded();
    await expect.poll(() => photo.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true);
    await page.getByText('✓ Kept on this device').waitFor();

    // the member's cars, from this device's copy
    await page.goto(`${server.url}/me/cars`);
    await page.getByText('Green coupe').first().waitFor();
    await page.getByRole('status').filter({ hasText: 'You are offline' }).waitFor();

    // a sheet nobody kept is not there
    await page.goto(`${server.url}/swaps/h40-front-vela-four-piston-330`);
    await page
      .getByText(/No connection/)
      .first()
      .waitFor();
    expect(errors).toEqual([]);
    await context.close();
  });
});
