import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';

// The build sheet on paper: every published demo record on A4 and on US Letter, as a visitor prints it.

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

/** Pages in a PDF as Chromium writes it: one `/Type /Page` object per page (the tree's root is `/Pages`). */
function pdfPageCount(pdf: Buffer): number {
  return (pdf.toString('latin1').match(/\/Type\s*\/Page(?![a-zA-Z])/g) ?? []).length;
}

async function openForPrint(slug: string): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await page.goto(`${server.url}/swaps/${slug}`);
  await page.locator('h1').first().waitFor();
  await page.locator('#torque').waitFor();
  await page.emulateMedia({ media: 'print' });
  return page;
}

describe('the printed build sheet', () => {
  it('when every published demo record is printed on A4 and on US Letter, then each fits on at most two pages', async () => {
    const list = (await (await fetch(`${server.url}/api/swaps?limit=50`)).json()) as { items: { slug: string }[] };
    expect(list.items.length).toBeGreaterThanOrEqual(8);
    const counts: Record<string, { A4: number; Letter: number }> = {};
    for (const { slug } of list.items) {
      const page = await openForPrint(slug);
      counts[slug] = {
        A4: pdfPageCount(await page.pdf({ format: 'A4' })),
        Letter: pdfPageCount(await page.pdf({ format: 'Letter' })),
      };
      await page.close();
    }
    for (const [slug, c] of Object.entries(counts)) {
      expect({ slug, ...c, fits: c.A4 >= 1 && c.A4 <= 2 && c.Letter >= 1 && c.Letter <= 2 }).toEqual({ slug, ...c, fits: true });
    }
    // the flagship is the longest record: it needs both pages
    expect(counts['h31-front-vela-four-piston-330']).toEqual({ A4: 2, Letter: 2 });
  });

  it('when the flagship is printed, then its fitting steps and checklist are on paper and the rest of the write-up is not', async () => {
    const page = await openForPrint('h31-front-vela-four-piston-330');
    const writeUp = page.locator('#write-up');
    expect(await writeUp.isVisible()).toBe(true);
    expect(await page.locator('#write-up-h').innerText()).toBe('Fitting steps and checklist from the write-up');
    expect(await writeUp.getByRole('heading', { name: 'Fitting', exact: true }).isVisible()).toBe(true);
    expect(await writeUp.locator('ol > li').count()).toBe(6);
    expect(await writeUp.locator('ol > li').first().isVisible()).toBe(true);
    expect(await writeUp.getByRole('heading', { name: 'Checklist', exact: true }).isVisible()).toBe(true);
    const items = writeUp.locator('li.task-list-item');
    expect(await items.count()).toBe(5);
    for (const item of await items.all()) expect(await item.isVisible()).toBe(true);
    // a checklist item has its box and no bullet
    expect(await items.first().evaluate((li) => getComputedStyle(li.parentElement!).listStyleType)).toBe('none');
    // the buying advice and its table stay on screen
    expect(await writeUp.getByRole('heading', { name: 'Before you buy' }).isVisible()).toBe(false);
    expect(await writeUp.locator('table').isVisible()).toBe(false);

    await page.emulateMedia({ media: 'screen' });
    expect(await page.locator('#write-up-h').innerText()).toBe('Write-up');
    expect(await writeUp.getByRole('heading', { name: 'Before you buy' }).isVisible()).toBe(true);
    await page.close();
  });

  it('when a record’s write-up has neither numbered steps nor a checklist, then no empty write-up heading is printed', async () => {
    // the knuckle thread repair's steps are a table
    const page = await openForPrint('h31-front-knuckle-thread-repair');
    expect(await page.locator('#write-up').count()).toBe(1);
    expect(await page.locator('#write-up').isVisible()).toBe(false);
    await page.close();
  });

  it('when a section heading meets the end of a page, then it moves with its content', async () => {
    const page = await openForPrint('h31-front-vela-four-piston-330');
    const rules = await page.evaluate(() =>
      [...document.querySelectorAll('section[aria-labelledby] > div:first-child:has(> h2)')]
        .filter((d) => d.getClientRects().length > 0)
        .map((d) => getComputedStyle(d).breakAfter),
    );
    expect(rules.length).toBeGreaterThan(8);
    expect(new Set(rules)).toEqual(new Set(['avoid']));
    await page.close();
  });
});
