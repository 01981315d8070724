import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { launchBrowser } from './support/browser';
import { openSubmitForm, signedInPage } from './support/sign-in';

// The form as a new member meets it: rows added on purpose do not complain before anything is typed,
// nothing moves under the pointer, and a half-filled row is saved as incomplete rather than holding
// the whole draft back.

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

const text = (page: Page, name: string) => page.getByRole('textbox', { name, exact: true });
const saveState = (page: Page) => page.locator('[data-save-state]').getAttribute('data-save-state');

async function startDraft(page: Page) {
  await page.getByRole('radio', { name: 'Not listed: propose it' }).check();
  await text(page, 'Make').fill('Halden');
  await text(page, 'Model').fill('H40');
  await text(page, 'Chassis code').fill('H40');
  await text(page, 'First year').fill('2001');
  await text(page, 'Wheel bolts per hub').fill('5');
  await text(page, 'Bolt circle (PCD)').fill('114.3');
  await text(page, 'Centre bore').fill('67.1');
  await text(page, 'Wheel-bolt thread').fill('M12x1.5');
  await page.getByRole('combobox', { name: 'Axle' }).selectOption('front');
  await page.getByRole('combobox', { name: 'Category' }).selectOption('brakes');
  await text(page, 'Title').fill('Tamsin Regent rotors on the Halden H40');
  await text(page, 'Role in this swap').fill('front rotor, both sides');
  await text(page, 'Name').fill('Regent vented rotor');
  await page.waitForURL(/\/submissions\/\d+\/edit$/, { timeout: 15_000 });
  await page.getByRole('heading', { level: 1, name: 'Draft swap' }).waitFor();
  return Number(/submissions\/(\d+)\/edit/.exec(page.url())![1]);
}

describe('drafts that keep what was typed', () => {
  it('when "Add a shim" is clicked four times, then there are four rows and no complaint before anything is typed', async () => {
    const { context, page, errors } = await openSubmitForm(browser, server.url, 'pistonpaul');
    const add = page.getByRole('button', { name: 'Add a shim' });
    for (let i = 0; i < 4; i++) await add.click();
    const thickness = page.locator('input[name^="data.shims."][name$=".thicknessMm"]');
    expect(await thickness.count()).toBe(4);
    expect(await page.locator('#shims [role="alert"]').count()).toBe(0);

    // an error shows once the field is left, the field keeps its place, and it clears while typing
    await thickness.nth(0).fill('');
    await thickness.nth(0).press('Tab');
    const addTop = (await add.boundingBox())!.y;
    await page.locator('[name="data.shims.0.quantity"]').fill('');
    await page.locator('[name="data.shims.0.quantity"]').press('Tab');
    await expect.poll(() => page.locator('#shims [role="alert"]').count()).toBeGreaterThan(0);
    expect((await add.boundingBox())!.y).toBe(addTop);
    await page.locator('[name="data.shims.0.quantity"]').fill('4');
    await thickness.nth(0).fill('0.5');
    await expect.poll(() => page.locator('#shims [role="alert"]').count()).toBe(0);
    expect((await add.boundingBox())!.y).toBe(addTop);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('when a fastener row is half filled, then the rest still saves, the row is kept as incomplete, and another browser sees both', async () => {
    const { context, page, errors } = await openSubmitForm(browser, server.url, 'rivet_rosa');
    const id = await startDraft(page);
    await page.getByRole('button', { name: 'Add a fastener' }).click();
    // a torque typed before the fastener is named: the row does not read yet
    await text(page, 'Torque').fill('110');
    // the rest of the form keeps changing and keeps saving
    await text(page, 'Title').fill('Tamsin Regent rotors on the Halden H40, wheel bolts to follow');
    await expect.poll(() => saveState(page), { timeout: 15_000 }).toBe('saved');
    const status = page.locator('[data-save-state]');
    await expect.poll(() => status.getAttribute('data-unfinished')).toBe('1');
    expect(await status.innerText()).toMatch(/kept as incomplete: Fasteners & torque, row 1/);

    // sending names the field that holds it back, with a link to it
    await page.getByRole('button', { name: 'Send for review' }).click();
    const sendError = page.getByTestId('send-error');
    await sendError.waitFor();
    expect(await sendError.innerText()).toMatch(/Fasteners & torque, row 1/);
    await sendError.getByRole('link').click();
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('name'))).toMatch(/^data\.fasteners\.0\./);

    // another browser opens the same draft: the new title and the unfinished row are both there
    const other = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const { page: second } = await signedInPage(other, server.url, 'rivet_rosa', `/submissions/${id}/edit`);
    await second.getByRole('heading', { level: 1, name: 'Draft swap' }).waitFor();
    expect(await text(second, 'Title').inputValue()).toBe('Tamsin Regent rotors on the Halden H40, wheel bolts to follow');
    expect(await text(second, 'Torque').inputValue()).toBe('110');
    expect(errors).toEqual([]);
    await other.close();
    await context.close();
  });

  it('when a draft is deleted, then the page does not ask for it again, and the add buttons draw their own icon', async () => {
    const { context, page, errors } = await openSubmitForm(browser, server.url, 'pistonpaul');
    // the "+" is the app's own drawing, not a character that needs an emoji font
    const addShim = page.getByRole('button', { name: 'Add a shim' });
    expect(await addShim.locator('svg[data-icon]').count()).toBe(1);
    expect(await addShim.innerText()).not.toMatch(/[\uFF0B+]/);

    const id = await startDraft(page);
    const afterDelete: string[] = [];
    let deleted = false;
    page.on('response', (r) => deleted && afterDelete.push(`${r.status()} ${r.request().method()} ${new URL(r.url()).pathname}`));
    page.on('console', (m) => deleted && m.type() === 'error' && afterDelete.push(`console: ${m.text()}`));
    page.once('dialog', (d) => void d.accept());
    const gone = page.waitForResponse((r) => r.request().method() === 'DELETE' && r.url().endsWith(`/api/submissions/${id}`));
    await page.getByRole('button', { name: 'Delete draft' }).click();
    expect((await gone).status()).toBe(204);
    deleted = true;
    await page.waitForURL((u) => u.pathname === '/me/submissions');
    await page.waitForLoadState('networkidle');
    expect(
      afterDelete.filter(
        (line) => line.includes(`/api/submissions/${id}`) || line.startsWith('404') || line.startsWith('console'),
      ),
    ).toEqual([]);
    expect(errors).toEqual([]);
    await context.close();
  });
});
