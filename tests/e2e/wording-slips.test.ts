import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';

// The small slips a new reader meets on the demo: names that repeat, dates and cautions that look different from
// place to place, pictures cut at their edges, examples that disagree, notes in the wrong units.

let server: RunningServer;
let browser: Browser;
beforeAll(async () => {
  server = await startServer({ SEED_DEMO: 'auto' });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

async function open(path: string, width = 1280): Promise<{ page: Page; console: string[] }> {
  const page = await browser.newPage({ viewport: { width, height: 900 } });
  const console: string[] = [];
  page.on('console', (m) => (m.type() === 'error' || m.type() === 'warning') && console.push(m.text()));
  page.on('pageerror', (e) => console.push(e.message));
  await page.goto(`${server.url}${path}`);
  await page.locator('h1').first().waitFor();
  return { page, console };
}

describe('wording and look slips', () => {
  it('when the chassis page opens first, then its name is said once and no warning is logged', async () => {
    const { page, console } = await open('/chassis/halden-h31');
    expect(await page.locator('h1').first().innerText()).toBe('Halden H31');
    const text = await page.locator('main').innerText();
    expect(text).not.toMatch(/H31 · H31|Halden H31 H31|\.,/);
    expect(console).toEqual([]);
    await page.close();
  });

  it('when the sheet is read, then its dates share one format and its safety block is a caution, not a quotation', async () => {
    const { page } = await open('/swaps/h31-front-vela-four-piston-330');
    const published = await page.locator('dt', { hasText: 'Published' }).locator('xpath=following-sibling::dd').innerText();
    expect(published).toMatch(/^\d{1,2} [A-Z][a-z]{2,3} \d{4}$/);
    const history = await page.locator('#history').innerText();
    expect(history).toContain(published);
    expect(history).not.toMatch(/\d{2}\/\d{2}\/\d{4}/);

    const caution = page.getByRole('note', { name: 'Safety caution' });
    const borders = await caution.evaluate((el) => {
      const s = getComputedStyle(el);
      return [s.borderTopWidth, s.borderRightWidth, s.borderBottomWidth, s.borderLeftWidth];
    });
    expect(new Set(borders).size).toBe(1);
    expect(await caution.locator('svg[data-icon]').count()).toBe(1);
    // the write-up's "> **Safety:** …" reads as a caution too
    const writeUpCaution = page.locator('#write-up aside[data-caution]');
    expect(await writeUpCaution.innerText()).toMatch(/^Safety:/);
    expect(await page.locator('#write-up blockquote').count()).toBe(0);
    await page.close();
  });

  it('when the search filters and the home cards are shown, then headings share one case and pictures are whole', async () => {
    const { page } = await open('/search');
    const headings = page.locator('fieldset > legend');
    await headings.first().waitFor();
    const transforms = await headings.evaluateAll((ls) => ls.map((l) => getComputedStyle(l).textTransform));
    expect(new Set(transforms)).toEqual(new Set(['none']));
    const label = page.locator('label', { hasText: 'Your chassis' });
    expect(await label.evaluate((l) => getComputedStyle(l).textTransform)).toBe('none');
    await page.goto(server.url);
    const img = page.locator('article img').first();
    await img.waitFor();
    expect(await img.evaluate((i) => getComputedStyle(i).objectFit)).toBe('contain');
    await page.close();
  });

  it('when the bolt-pattern calculator is opened, then the stud spacing example is the PCD example’s spacing', async () => {
    const { page } = await open('/tools');
    const panel = page.locator('#bolt-pattern');
    const studs = await panel.getByLabel(/^Adjacent stud spacing/).getAttribute('placeholder');
    const pcd = await panel.getByLabel(/^Or: PCD/).getAttribute('placeholder');
    // plane geometry: 5 studs on a 112 mm circle are 112 × sin(36°) = 65.83 mm apart
    expect(pcd).toBe('112');
    expect(Number(studs)).toBeCloseTo(Number(pcd) * Math.sin(Math.PI / 5), 2);
    await page.close();
  });

  it('when the wheel check runs in imperial units, then its notes carry no millimetres', async () => {
    const { page } = await open('/swaps/h31-front-vela-four-piston-330');
    await page.evaluate(() => localStorage.setItem('swapyard.units', 'imperial'));
    await page.reload();
    const panel = page.locator('#check');
    await panel.getByLabel('Diameter (in)').fill('16');
    await panel.getByLabel('Width (in)').fill('7');
    await panel.getByLabel('Offset ET (mm)').fill('38');
    await panel.getByLabel('Spacer (in)').fill('0.4');
    const bolt = panel.locator('div', { hasText: /^Wheel-bolt length/ }).last();
    await expect.poll(() => bolt.innerText()).toContain('1.42 in to keep the stock engagement');
    expect(await bolt.innerText()).toContain('A slip-on spacer needs wheel bolts longer than stock by its own thickness');
    expect(await bolt.innerText()).not.toMatch(/\d mm/);
    await page.close();
  });
});
