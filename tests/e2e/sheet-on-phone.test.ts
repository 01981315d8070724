import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { hydrated, launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';

// The flagship sheet on a 390 px phone: a way around it, tables that fit, the wheel check's verdict in one line,
// and negative figures typed on a phone keyboard.

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

const flagship = '/swaps/h31-front-vela-four-piston-330';

async function phonePage(path: string): Promise<{ page: Page; problems: string[] }> {
  const page = await browser.newPage({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
  const problems: string[] = [];
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  page.on('console', (m) => (m.type() === 'error' || m.type() === 'warning') && problems.push(`console: ${m.text()}`));
  await page.goto(`${server.url}${path}`);
  await page.locator('h1').first().waitFor();
  // a server-drawn sheet answers typing once the app has taken it over
  await hydrated(page);
  return { page, problems };
}

describe('the sheet on a phone', () => {
  it('when the reader scrolls deep into the sheet, then the section menu stays on screen and jumps to any section', async () => {
    const { page, problems } = await phonePage(flagship);
    const menu = page.getByRole('navigation', { name: 'Sections of this sheet' });
    await page.locator('#torque').scrollIntoViewIfNeeded();
    await page.evaluate(() => window.scrollBy(0, 200));
    const box = await menu.boundingBox();
    expect(box).not.toBeNull();
    expect(box!.y).toBeGreaterThanOrEqual(0);
    expect(box!.y).toBeLessThan(2);
    await expect.poll(() => page.getByTestId('section-in-view').innerText()).toBe('Torque specs');

    await menu.getByRole('button', { name: 'Sections' }).click();
    const links = menu.getByRole('link');
    const labels = await links.allInnerTexts();
    for (const s of ['Parts', 'Torque specs', 'Check my wheel', 'Cost by route', 'Write-up', 'Revision history'])
      expect(labels).toContain(s);
    await menu.getByRole('link', { name: 'Parts', exact: true }).click();
    await expect.poll(() => menu.getByRole('link').count()).toBe(1); // the list closed; "Top" stays
    await expect
      .poll(() => page.locator('#parts-h').evaluate((h) => Math.round(h.getBoundingClientRect().top)))
      .toBeLessThan(120);
    await expect.poll(() => page.getByTestId('section-in-view').innerText()).toBe('Parts');
    expect(problems).toEqual([]);
    await page.close();
  });

  it('when a spec table is shown on a phone, then each row reflows into labelled lines and nothing scrolls sideways', async () => {
    const { page } = await phonePage(flagship);
    const tables = page.locator('table[data-reflow="phone"]');
    expect(await tables.count()).toBeGreaterThanOrEqual(5);
    const wide = await tables.evaluateAll(
      (ts) => ts.filter((t) => t.scrollWidth > t.clientWidth + 1 || t.getBoundingClientRect().right > window.innerWidth).length,
    );
    expect(wide).toBe(0);
    const cell = page.locator('#torque tbody tr').first().locator('td').nth(2);
    expect(await cell.evaluate((td) => getComputedStyle(td, '::before').content)).toBe('"Torque"');
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await page.close();
  });

  it('when a wheel is typed into check my wheel, then a one-line verdict sits above the form and follows it', async () => {
    const { page, problems } = await phonePage(flagship);
    const panel = page.locator('#check');
    const verdict = panel.getByTestId('wheel-verdict');
    await panel.scrollIntoViewIfNeeded();
    expect(await verdict.getAttribute('data-tone')).toBe('none');
    const verdictBox = (await verdict.boundingBox())!;
    const formBox = (await panel.getByRole('form', { name: 'Your wheel' }).boundingBox())!;
    expect(verdictBox.y + verdictBox.height).toBeLessThanOrEqual(formBox.y);
    expect(verdictBox.height).toBeLessThan(48); // one line

    await panel.getByLabel('Diameter (in)').fill('15');
    await panel.getByLabel('Width (in)').fill('6');
    await panel.getByLabel('Offset ET (mm)').fill('38');
    await expect.poll(() => verdict.getAttribute('data-tone')).toBe('fail');
    expect(await verdict.innerText()).toBe('Does not fit: the wheel is below the 16″ minimum');
    expect((await verdict.boundingBox())!.height).toBeLessThan(48);

    // a wheel the record only lets us estimate: no pass, no fail
    await panel.getByLabel('Diameter (in)').fill('16');
    await panel.getByLabel('Width (in)').fill('7');
    await expect.poll(() => verdict.getAttribute('data-tone')).toBe('open');
    expect(await verdict.innerText()).toMatch(/^Not settled/);
    expect(problems).toEqual([]);
    await page.close();
  });

  it('when a negative offset or inset is typed on a phone, then the field offers a minus key and takes the figure', async () => {
    const { page, problems } = await phonePage(flagship);
    const panel = page.locator('#check');
    const offset = panel.getByLabel('Offset ET (mm)');
    expect(await offset.getAttribute('inputmode')).toBe('text');
    await panel.getByRole('button', { name: 'I have measured my wheel and bolts' }).click();
    expect(await panel.getByLabel(/Spoke inset/).getAttribute('inputmode')).toBe('text');
    // unsigned figures keep the decimal keypad
    expect(await panel.getByLabel('Width (in)').getAttribute('inputmode')).toBe('decimal');

    await panel.getByLabel('Diameter (in)').fill('16');
    await panel.getByLabel('Width (in)').fill('7');
    await offset.fill('−12');
    const newOffset = panel
      .locator('[data-verdict], div')
      .filter({ hasText: /^New offset/ })
      .last();
    await expect.poll(() => newOffset.innerText()).toContain('ET-12');
    expect(await panel.getByText('Enter a number').count()).toBe(0);
    await page.close();

    // the calculators' signed fields
    const tools = await phonePage('/tools');
    for (const label of ['Offset ET', 'Spoke inset', 'Caliper outboard face']) {
      const field = tools.page.getByLabel(new RegExp(`^${label}`)).first();
      expect({ label, mode: await field.getAttribute('inputmode') }).toEqual({ label, mode: 'text' });
    }
    expect([...problems, ...tools.problems]).toEqual([]);
    await tools.page.close();
  });
});
