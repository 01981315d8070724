import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { launchBrowser } from './support/browser';
import { openSubmitForm } from './support/sign-in';

// The first save of a new swap moves the form from /submit to the draft's own address. The
// form being left stays on screen until the draft's page has loaded; whatever is typed there,
// and whatever is saved later, must survive the move and a reload.

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

const openForm = (login: string) => openSubmitForm(browser, server.url, login);

const text = (page: Page, name: string) => page.getByRole('textbox', { name, exact: true });

/** just enough for the first save to be accepted */
async function fillMinimal(page: Page) {
  await page.getByRole('radio', { name: 'Not listed: propose it' }).check();
  await text(page, 'Make').fill('Halden');
  await text(page, 'Model').fill('H40');
  await text(page, 'Chassis code').fill('H40');
  await text(page, 'First year').fill('2001');
  await text(page, 'Last year').fill('2008');
  await text(page, 'Wheel bolts per hub').fill('5');
  await text(page, 'Bolt circle (PCD)').fill('114.3');
  await text(page, 'Centre bore').fill('67.1');
  await text(page, 'Wheel-bolt thread').fill('M12x1.5');
  await page.getByRole('combobox', { name: 'Axle' }).selectOption('front');
  await page.getByRole('combobox', { name: 'Category' }).selectOption('brakes');
  await text(page, 'Title').fill('Tamsin Regent rotors on the Halden H40');
  await text(page, 'Role in this swap').fill('front rotor, both sides');
  await text(page, 'Name').fill('Regent vented rotor');
}

const stored = (page: Page, id: number) =>
  page.evaluate(async (id) => (await fetch(`/api/submissions/${id}`)).json(), id) as Promise<{
    axle: string;
    data: { parts: { maker: string }[] };
  }>;
const idOf = (page: Page) => Number(/submissions\/(\d+)\/edit/.exec(page.url())![1]);

describe('the move from /submit to the draft', () => {
  it('when input is typed after the first save but before the draft page has loaded, then it is kept and saved', async () => {
    const { context, page, errors } = await openForm('rivet_rosa');
    // hold the draft page's code so the form being left stays on screen after the address changes
    let release!: () => void;
    const held = new Promise<void>((resolve) => (release = resolve));
    await page.route('**/assets/edit-submission-page-*.js', async (route) => {
      await held;
      await route.fallback();
    });
    await fillMinimal(page);

    await page.waitForURL(/\/submissions\/\d+\/edit$/, { timeout: 15_000 });
    expect(await page.getByRole('heading', { level: 1 }).innerText()).toBe('Record a swap');
    // a top-level field and a field inside the parts list, both typed into the form being left
    await page.getByRole('combobox', { name: 'Axle' }).selectOption('rear');
    await text(page, 'Maker').fill('Tamsin');
    release();

    await page.getByRole('heading', { level: 1, name: 'Draft swap' }).waitFor();
    expect(await page.getByRole('combobox', { name: 'Axle' }).inputValue()).toBe('rear');
    expect(await text(page, 'Maker').inputValue()).toBe('Tamsin');
    const id = idOf(page);
    await expect.poll(async () => (await stored(page, id)).data.parts[0].maker, { timeout: 10_000 }).toBe('Tamsin');
    expect((await stored(page, id)).axle).toBe('rear');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('when the draft page is reloaded after later saves, then it opens what the server holds and sends nothing older', async () => {
    const { context, page, errors } = await openForm('camber_kai');
    await fillMinimal(page);
    await page.waitForURL(/\/submissions\/\d+\/edit$/, { timeout: 15_000 });
    await page.getByRole('heading', { level: 1, name: 'Draft swap' }).waitFor();
    const id = idOf(page);
    const saveState = () => page.locator('[data-save-state]').getAttribute('data-save-state');

    await text(page, 'Maker').fill('Tamsin Regent');
    await expect.poll(async () => (await stored(page, id)).data.parts[0].maker, { timeout: 10_000 }).toBe('Tamsin Regent');
    await expect.poll(saveState, { timeout: 10_000 }).toBe('saved');

    const patches: string[] = [];
    page.on('request', (r) => {
      if (r.method() === 'PATCH') patches.push(r.url());
    });
    await page.reload();
    await page.getByRole('heading', { level: 1, name: 'Draft swap' }).waitFor();
    expect(await text(page, 'Maker').inputValue()).toBe('Tamsin Regent');
    // longer than the autosave pause: an older copy would have been sent by now
    await page.waitForTimeout(2_000);
    expect(patches).toEqual([]);
    expect((await stored(page, id)).data.parts[0].maker).toBe('Tamsin Regent');
    expect(errors).toEqual([]);
    await context.close();
  });
});
