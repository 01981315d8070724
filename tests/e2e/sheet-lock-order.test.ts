import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { hydrated, launchBrowser } from './support/browser';
import { signedInPage } from './support/sign-in';

// The swap sheet's brake section on the demo scenario: which axle locks first before and after the swap,
// from the chassis' stock figures or the reader's own car, drawn, and kept in the two-page print.

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

const note = (page: Page) => page.locator('#balance [data-balance]');

describe('which axle locks first on the swap sheet', () => {
  it('when the H31 rear drum-in-hat sheet is read on a phone, then the stock figures put the rear first above 0.60 g, the chart draws it and the print keeps the warning on two pages', async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(`${server.url}/swaps/h31-rear-regent-300-drum-in-hat`);
    await hydrated(page);
    const section = page.locator('#balance');
    await section.scrollIntoViewIfNeeded();
    await expect.poll(() => note(page).getAttribute('data-severity')).toBe('hazard');
    expect(await note(page).getAttribute('data-balance')).toBe('rearward');
    const text = await note(page).innerText();
    expect(text).toContain('The swap moves the balance toward the rear (front share 70.2 % → 64.5 %)');
    expect(text).toContain('after it the rear locks first above 0.60 g when unladen');
    expect(await section.locator('[data-balance-figures]').innerText()).toContain(
      'Worked out with the Halden H31 stock figures (proportioning valve, knee 35 bar, slope 0.3)',
    );

    // the chart: drawn lazily, with its words for screen readers; laden and unladen on a switch
    await section.locator('[data-adhesion-chart] svg').first().waitFor();
    const caption = section.locator('figcaption');
    expect(await caption.textContent()).toContain('Unladen car, before and after the swap');
    expect(await caption.textContent()).toMatch(
      /After: the front locks first from 0\.00 g to 0\.60 g, then the rear locks first from 0\.60 g/,
    );
    await section.getByRole('button', { name: 'Laden', exact: true }).click();
    await expect.poll(() => caption.textContent()).toContain('Laden car, before and after the swap');
    await section.getByText('The figures, assumptions and sources').click();
    const basis = section.locator('[data-balance-basis]');
    expect(await basis.innerText()).toContain('Rear pressure law: proportioning valve, knee 35 bar, slope 0.3');
    expect(await basis.innerText()).toContain('UN Regulation No. 13-H');
    expect(await basis.innerText()).toContain('Limpert');
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);

    await page.emulateMedia({ media: 'print' });
    expect(await note(page).isVisible()).toBe(true);
    expect(await note(page).innerText()).toContain('The rear wheels lock before the fronts above 0.60 g when unladen');
    expect(await section.locator('figure').isVisible()).toBe(false);
    const pdf = await page.pdf({ format: 'A4' });
    const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page(?!s)/g) ?? []).length;
    expect(pages).toBeGreaterThanOrEqual(1);
    expect(pages).toBeLessThanOrEqual(2);
    expect(errors).toEqual([]);
    await page.close();
  });

  it('when the H40 rear drum-in-hat sheet is read, then its load-sensing valve keeps the fronts first and there is no rear-first warning', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await page.goto(`${server.url}/swaps/h40-rear-regent-300-drum-in-hat`);
    await hydrated(page);
    await expect.poll(() => note(page).getAttribute('data-severity')).toBe('advisory');
    const text = await note(page).innerText();
    expect(text).toContain('toward the rear (front share 70.8 % → 68.6 %)');
    expect(text).toContain('the front still locks first up to 1.00 g laden and unladen');
    expect(text).not.toContain('rear locks first');
    await page.close();
  });

  it('when a member opens a sheet, then the balance starts from their car as it is, they can pick another start, and impossible figures in my cars get a field reason and change nothing', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const { page, errors } = await signedInPage(context, server.url, 'rivet_rosa', '/swaps/h31-rear-regent-300-drum-in-hat');
    const section = page.locator('#balance');
    const choice = section.getByRole('combobox', { name: 'Worked out for' });
    // the choice appears once the member's cars have loaded
    await choice.waitFor();
    expect(await choice.locator('option').allTextContents()).toEqual([
      'Halden H31 stock figures',
      'Green coupe as it is',
      'Winter saloon as it is',
    ]);
    // the Green coupe has this rear swap and the four-piston front fitted: the sheet starts from it
    expect(await choice.locator('option:checked').textContent()).toBe('Green coupe as it is');
    const start = section.locator('[data-balance-start]');
    expect(await start.innerText()).toContain('this swap is already fitted, so “before” is the car without it');
    // the Green coupe is lowered: its centre of gravity is lower, so the valve keeps the fronts first
    await expect.poll(() => note(page).getAttribute('data-severity')).toBe('advisory');
    expect(await note(page).innerText()).toContain('the front still locks first up to 1.00 g laden and unladen');
    expect(await section.locator('[data-balance-figures]').innerText()).toContain('Worked out with Green coupe’s own figures');

    // the Winter saloon has a front swap fitted: "before" is that car's brakes now
    await choice.selectOption({ label: 'Winter saloon as it is' });
    expect(await start.innerText()).toContain('fitted, “before” is that car’s brakes now');
    expect(await section.locator('[data-balance-figures]').innerText()).toContain('Worked out with the Halden H31 stock figures');
    await choice.selectOption({ label: 'Halden H31 stock figures' });
    expect(await start.count()).toBe(0);

    await page.goto(`${server.url}/me/cars`);
    await page.getByRole('button', { name: 'Edit' }).first().click();
    const front = page.getByRole('textbox', { name: 'Weight on the front axle (%)' });
    expect(await front.inputValue()).toBe('52');
    await front.fill('95');
    await page.getByRole('button', { name: 'Save changes' }).click();
    await expect.poll(() => page.getByText('Between 20 and 80 %').count()).toBe(1);
    expect(await front.getAttribute('aria-invalid')).toBe('true');
    await page.reload();
    await page.getByRole('button', { name: 'Edit' }).first().click();
    expect(await page.getByRole('textbox', { name: 'Weight on the front axle (%)' }).inputValue()).toBe('52');
    expect(errors).toEqual([]);
    await context.close();
  });
  it('when a moderator edits a chassis stock figures, then an impossible wheelbase is refused beside its field and a possible one is shown on the page', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const { page, errors } = await signedInPage(context, server.url, 'gauge_mo', '/chassis/orsino-vela');
    const card = page.locator('[data-chassis-vehicle]');
    await card.getByRole('button', { name: 'Edit the stock figures' }).click();
    const wheelbase = card.getByRole('textbox', { name: /^Wheelbase/ });
    expect(await wheelbase.inputValue()).toBe('2540');
    await wheelbase.fill('254');
    await card.getByRole('button', { name: 'Save the stock figures' }).click();
    await card.getByText('Between 1500 and 5000 mm').waitFor();
    expect(await wheelbase.getAttribute('aria-invalid')).toBe('true');
    await wheelbase.fill('2550');
    await card.getByRole('button', { name: 'Save the stock figures' }).click();
    await card.getByRole('button', { name: 'Edit the stock figures' }).waitFor();
    expect(await card.innerText()).toContain('2,550 mm');
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    expect(errors).toEqual([]);
    await context.close();
  });
});
