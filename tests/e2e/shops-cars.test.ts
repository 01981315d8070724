import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { hydrated, launchBrowser } from './support/browser';
import { signedInPage } from './support/sign-in';

// The demo seed loads into the server's empty database: Ridgeway Performance, its shop account, and rivet_rosa.
const sheetSlug = 'h31-front-vela-four-piston-330';

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

/** Signs in through the real strategy and the fake provider's page, the way a person does, and lands on `returnTo`. */
async function signedInAs(login: string, returnTo: string) {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
  return signedInPage(context, server.url, login, returnTo);
}

describe('shop links and my cars in the browser', () => {
  let code = '';

  it('when a shop user makes a link from a swap sheet, then it gets a short address and its QR downloads as PNG and SVG', async () => {
    const { page, errors } = await signedInAs('ridgeway_shop', `/swaps/${sheetSlug}`);
    const panel = page.locator('#shop-link');
    await panel.getByRole('heading', { name: 'Make a shop link' }).waitFor();
    await panel
      .getByRole('textbox', { name: 'Private note' })
      .fill('Fixed price **includes** the 10 mm spacers. <script>bad()</script>Ask for Jo.');
    await panel.getByRole('button', { name: 'Make link' }).click();
    const url = await panel.getByTestId('shop-link-url').innerText();
    expect(url).toMatch(new RegExp(`^${server.url}/l/[a-z2-9]{7}$`));
    code = url.split('/l/')[1]!;

    const [png] = await Promise.all([
      page.waitForEvent('download'),
      panel.getByRole('link', { name: 'Download QR (PNG)' }).click(),
    ]);
    expect(png.suggestedFilename()).toBe(`swapyard-link-${code}.png`);
    const pngBytes = fs.readFileSync((await png.path())!);
    expect(pngBytes.subarray(0, 4)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47]));
    const [svg] = await Promise.all([
      page.waitForEvent('download'),
      panel.getByRole('link', { name: 'Download QR (SVG)' }).click(),
    ]);
    expect(svg.suggestedFilename()).toBe(`swapyard-link-${code}.svg`);
    expect(fs.readFileSync((await svg.path())!, 'utf8')).toMatch(/^<svg/);

    // the links list shows it, with no visits yet
    await page.getByRole('link', { name: 'All our shop links' }).click();
    const row = page.locator(`tr[data-link-code="${code}"]`);
    await row.waitFor();
    expect(await row.innerText()).toContain('Fixed price');
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('when an anonymous visitor opens /l/:code, then they see the pinned revision under the shop’s banner without its private note, and the visit counts', async () => {
    expect(code).not.toBe('');
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(`${server.url}/l/${code}`);
    await hydrated(page);
    await page.waitForURL(new RegExp(`/swaps/${sheetSlug}/r/2\\?via=${code}$`));
    const banner = page.getByRole('complementary', { name: 'Shared by Ridgeway Performance' });
    await banner.waitFor();
    const text = await banner.innerText();
    // the note is the shop's own record: a customer never gets it
    expect(text).not.toContain('Fixed price');
    expect(await page.content()).not.toContain('Ask for Jo');
    expect(text).toContain('revision 2');
    await page.getByRole('heading', { level: 1, name: /Orsino Vela four-piston front calipers/ }).waitFor();

    const unknown = await page.goto(`${server.url}/l/zzzzzzz`);
    expect(unknown?.status()).toBe(404);
    expect(await page.getByRole('heading', { level: 1 }).innerText()).toBe('We don’t know this link');
    expect(errors).toEqual([]);
    await context.close();

    const shop = await signedInAs('ridgeway_shop', '/shop/links');
    const row = shop.page.locator(`tr[data-link-code="${code}"]`);
    await row.waitFor();
    expect(await row.locator('td').nth(2).innerText()).toMatch(/\b1$/);
    // the shop's own account sees its note over the pinned sheet, marked as private
    await shop.page.goto(`${server.url}/l/${code}`);
    const own = shop.page.getByRole('complementary', { name: 'Shared by Ridgeway Performance' });
    await own.getByText('Private to your shop — customers do not see this').waitFor();
    expect(await own.innerText()).toContain('Fixed price includes the 10 mm spacers. Ask for Jo.');
    expect(await own.locator('strong', { hasText: 'includes' }).count()).toBe(1);
    await shop.page.context().close();
  });

  it('when a member saves a car, then the swap sheet’s wheel check fills from it in one click and shows its verdicts', async () => {
    const { page, errors } = await signedInAs('rivet_rosa', '/me/cars');
    const form = page.getByRole('form', { name: 'Add a car' });
    await form.getByRole('combobox', { name: 'Chassis' }).fill('H31');
    await form
      .getByRole('option', { name: /Halden H31/ })
      .first()
      .click();
    await form.getByRole('textbox', { name: 'Nickname' }).fill('Track coupe');
    await form.getByRole('textbox', { name: /^Wheel diameter/ }).fill('17');
    await form.getByRole('textbox', { name: /^Wheel width/ }).fill('7.5');
    await form.getByRole('textbox', { name: /^Offset ET/ }).fill('35');
    await form.getByRole('textbox', { name: /^Spacer fitted/ }).fill('10');
    await form.getByRole('textbox', { name: /^Tyre size/ }).fill('215/45-17');
    await form.getByRole('button', { name: 'Add car' }).click();
    expect(await form.getByRole('alert').first().innerText()).toContain('is not a tyre size');
    await form.getByRole('textbox', { name: /^Tyre size/ }).fill('215/45R17');
    await form.getByRole('button', { name: 'Add car' }).click();
    const cars = page.getByRole('list', { name: 'Your cars' });
    await cars.getByRole('heading', { name: 'Track coupe' }).waitFor();
    expect(await cars.innerText()).toContain('17×7.5 ET35');

    await page.goto(`${server.url}/swaps/${sheetSlug}`);
    await hydrated(page);
    const check = page.locator('#check');
    await check.getByRole('button', { name: 'Track coupe (17×7.5 ET35)' }).click();
    const wheelForm = check.getByRole('form', { name: 'Your wheel' });
    expect(await wheelForm.getByRole('textbox', { name: 'Diameter (in)' }).inputValue()).toBe('17');
    expect(await wheelForm.getByRole('textbox', { name: 'Offset ET (mm)' }).inputValue()).toBe('35');
    expect(await wheelForm.getByRole('textbox', { name: /^Spacer/ }).inputValue()).toBe('10');
    const diameter = check.locator('[data-verdict]').filter({ has: page.getByText('Wheel diameter', { exact: true }) });
    await diameter.waitFor();
    expect(await diameter.getAttribute('data-verdict')).toBe('pass');
    expect(await diameter.innerText()).toContain('17″ (needs ≥ 16″)');
    expect(await check.getByText('New offset').locator('xpath=following-sibling::p[1]').innerText()).toBe('ET25');

    // the chassis page marks the swap against the saved car, naming the rule
    await page.goto(`${server.url}/chassis/halden-h31`);
    await hydrated(page);
    await page.getByText(/Checked against your cars: .*Track coupe \(17×7\.5 ET35\)/).waitFor();
    expect(await page.locator('[data-car-check="pass"]', { hasText: 'Track coupe' }).count()).toBeGreaterThan(0);
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('when a member records their wheel’s inside profile, then a bad point is named beside it, and the sheet draws the caliper against that wheel', async () => {
    const { page, errors } = await signedInAs('rivet_rosa', '/me/cars');
    const form = page.getByRole('form', { name: 'Add a car' });
    await form.getByRole('combobox', { name: 'Chassis' }).fill('H31');
    await form
      .getByRole('option', { name: /Halden H31/ })
      .first()
      .click();
    await form.getByRole('textbox', { name: 'Nickname' }).fill('Flow-formed saloon');
    await form.getByRole('textbox', { name: /^Wheel diameter/ }).fill('17');
    await form.getByRole('textbox', { name: /^Wheel width/ }).fill('7');
    await form.getByRole('textbox', { name: /^Offset ET/ }).fill('45');
    await form.getByRole('textbox', { name: /^Spacer fitted/ }).fill('0');
    // barrel, fillet, spokes: z from the mounting face (outboard positive), r from the centre; the last r mistyped
    const points = [
      ['-120', '194'],
      ['27', '186'],
      ['35,5', '171'],
      ['39', '-90'],
    ];
    for (const [i, [z, r]] of points.entries()) {
      await form.getByRole('button', { name: 'Add a point' }).click();
      await form.getByRole('textbox', { name: `Point ${i + 1} z` }).fill(z);
      await form.getByRole('textbox', { name: `Point ${i + 1} r` }).fill(r);
    }
    await form.getByRole('button', { name: 'Add car' }).click();
    const pointFour = form.getByRole('listitem', { name: 'Point 4' });
    await pointFour.getByRole('alert').waitFor();
    expect(await pointFour.getByRole('alert').innerText()).toContain('A radius is 0 or more');
    await form.getByRole('textbox', { name: 'Point 4 r' }).fill('90');
    await form.getByRole('button', { name: 'Add car' }).click();
    const cars = page.getByRole('list', { name: 'Your cars' });
    await cars.getByRole('heading', { name: 'Flow-formed saloon' }).waitFor();
    expect(await cars.getByRole('listitem').filter({ hasText: 'Flow-formed saloon' }).innerText()).toContain(
      'Wheel inside profile: 4 points',
    );

    // the sheet draws the record's caliper outline against the member's own wheel first; only the fillet reaches it
    await page.goto(`${server.url}/swaps/${sheetSlug}`);
    await hydrated(page);
    const section = page.locator('#section');
    await section.getByRole('combobox', { name: 'Wheel' }).selectOption({ label: 'Your Flow-formed saloon (17×7 ET45)' });
    const verdict = section.locator('[data-verdict]').filter({ hasText: 'Clearance at the nearest point' });
    await expect.poll(() => verdict.getAttribute('data-verdict')).toBe('fail');
    expect(await section.locator('[data-section-drawing] figcaption').innerText()).toContain(
      'The caliper overlaps the fillet by 1.7 mm',
    );
    // the printed build sheet carries the drawing of the reader's own wheel beside the wheel requirement
    await page.emulateMedia({ media: 'print' });
    expect(await page.locator('[data-testid="printed-section"]').isVisible()).toBe(true);
    expect(await section.isVisible()).toBe(false);
    expect(errors).toEqual([]);
    await page.context().close();
  });
});
