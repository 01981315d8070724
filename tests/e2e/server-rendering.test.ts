import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, ConsoleMessage, Page } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';

// Public pages arrive drawn by the server and the browser takes them over (hydration) from the data that
// came with the HTML: no second fetch of that data, no console error, no hydration warning.

let server: RunningServer;
let browser: Browser;
const sheet = '/swaps/h31-front-vela-four-piston-330';

beforeAll(async () => {
  server = await startServer({ SEED_DEMO: 'auto' });
  // the server's first render loads the page modules; on a busy machine that first answer is slow
  await fetch(server.url + sheet);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

/** A page opened with everything it asks the API for and everything the console says. */
async function openWatched(url: string, init?: (page: Page) => Promise<unknown>) {
  // wide enough for the header's units switch
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  const api: string[] = [];
  const said: string[] = [];
  page.on('request', (r) => {
    const { pathname } = new URL(r.url());
    if (pathname.startsWith('/api/')) api.push(pathname);
  });
  page.on('console', (m: ConsoleMessage) => {
    if (m.type() === 'error' || m.type() === 'warning') said.push(`${m.type()}: ${m.text()}`);
  });
  page.on('pageerror', (e) => said.push(`page error: ${e.message}`));
  await init?.(page);
  await page.goto(server.url + url, { waitUntil: 'networkidle' });
  return { page, api, said };
}

describe('server-drawn pages in the browser', () => {
  it('when the sheet is opened with scripts off, then its title, parts and caution are already there', async () => {
    const context = await browser.newContext({ javaScriptEnabled: false });
    const page = await context.newPage();
    await page.goto(server.url + sheet);
    await expect(page.locator('main h1').textContent()).resolves.toContain('Vela');
    expect(await page.locator('table:has(caption:text("Parts of this swap")) tbody tr').count()).toBeGreaterThan(0);
    await expect(page.getByRole('note', { name: 'Safety caution' }).textContent()).resolves.toContain('Brakes are safety critical');
    await context.close();
  });

  it('when the sheet is hydrated, then it asks nothing again for the sheet, says nothing in the console and answers clicks', async () => {
    const { page, api, said } = await openWatched(sheet);
    expect(api.filter((p) => p.startsWith('/api/swaps/')), 'the sheet data came with the HTML').toEqual([]);
    expect(api, 'who is signed in came with the HTML too').not.toContain('/api/me');
    expect(said).toEqual([]);
    // hydrated: the units switch works and the figures follow it
    await page.getByRole('group', { name: 'Units' }).getByRole('button', { name: 'in · lbf·ft' }).click();
    await expect.poll(() => page.locator('main').textContent()).toMatch(/\d in\b/);
    await page.close();
  });

  it('when a reader who chose imperial units opens the sheet, then it hydrates without a warning and shows their units', async () => {
    const { page, said } = await openWatched(sheet, (p) => p.addInitScript(() => localStorage.setItem('swapyard.units', 'imperial')));
    expect(said).toEqual([]);
    const imperial = page.getByRole('group', { name: 'Units' }).getByRole('button', { name: 'in · lbf·ft' });
    await expect.poll(() => imperial.getAttribute('aria-pressed')).toBe('true');
    await expect.poll(() => page.locator('main').textContent()).toMatch(/\d in\b/);
    await page.close();
  });

  it('when the home, chassis, part, shop, pinned-revision and search pages are opened, then none fetches its data again or warns', async () => {
    for (const url of ['/', '/chassis/halden-h31', '/shops/ridgeway-performance', '/l/rp-h31vela', '/search?q=vela']) {
      const { page, api, said } = await openWatched(url);
      const refetched = api.filter((p) => !p.startsWith('/api/search-index') && !p.endsWith('/qr.svg'));
      expect(refetched, url).toEqual([]);
      expect(said, url).toEqual([]);
      await page.close();
    }
  });
});
