import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { launchBrowser } from './support/browser';
import { openSubmitForm } from './support/sign-in';

// The form's inputs follow the units toggle while the record keeps mm, N·m and bar.
// Conversions per NIST SP 811 B.8/B.9: 1 in = 25.4 mm, 1 lbf·ft = 1.355818 N·m.

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
const units = (page: Page, choice: 'mm · N·m' | 'in · lbf·ft') =>
  page.getByRole('group', { name: 'Units' }).getByRole('button', { name: choice }).click();

type Stored = { data: { rotors: { diameterMm: number; thicknessMm: number }[]; torque: { nm: number }[] } };
const stored = (page: Page, id: number) =>
  page.evaluate(async (id) => (await fetch(`/api/submissions/${id}`)).json(), id) as Promise<Stored>;

describe('submission form units', () => {
  it('when a rotor and a torque are typed in imperial, then mm and N·m are stored and the toggle changes only what is shown', async () => {
    const { context, page, errors } = await openForm('pistonpaul');
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
    const id = Number(/submissions\/(\d+)\/edit/.exec(page.url())![1]);
    const saveState = () => page.locator('[data-save-state]').getAttribute('data-save-state');

    // values typed in metric read in inches after the switch
    await units(page, 'in · lbf·ft');
    expect(await text(page, 'Bolt circle (PCD)').inputValue()).toBe('4.5'); // 114.3 / 25.4
    expect(await text(page, 'Centre bore').inputValue()).toBe('2.6417'); // 67.1 / 25.4 = 2.64173

    await page.getByRole('button', { name: 'Add a rotor' }).click();
    await text(page, 'Diameter').fill('13');
    await text(page, 'Thickness').fill('1.1');
    await page.getByRole('button', { name: 'Add a fastener' }).click();
    await text(page, 'Fastener').fill('caliper to knuckle');
    await text(page, 'Torque').fill('80');
    await expect.poll(async () => (await stored(page, id)).data.rotors[0]?.diameterMm, { timeout: 10_000 }).toBe(330.2);
    await expect.poll(async () => (await stored(page, id)).data.torque[0]?.nm, { timeout: 10_000 }).toBe(108.4654);
    await expect.poll(saveState, { timeout: 10_000 }).toBe('saved');
    expect((await stored(page, id)).data.rotors[0].thicknessMm).toBe(27.94); // 1.1 × 25.4

    // switching back and forth shows converted text and saves nothing: the held values do not move
    const sent: string[] = [];
    page.on('request', (r) => {
      if (r.method() === 'PATCH' || r.method() === 'POST') sent.push(r.url());
    });
    await units(page, 'mm · N·m');
    expect(await text(page, 'Diameter').inputValue()).toBe('330.2');
    expect(await text(page, 'Thickness').inputValue()).toBe('27.94');
    expect(await text(page, 'Torque').inputValue()).toBe('108.4654');
    expect(await text(page, 'Centre bore').inputValue()).toBe('67.1');
    await units(page, 'in · lbf·ft');
    expect(await text(page, 'Torque').inputValue()).toBe('80');
    expect(await text(page, 'Diameter').inputValue()).toBe('13');
    await units(page, 'mm · N·m');
    await units(page, 'in · lbf·ft');
    // longer than the autosave pause
    await page.waitForTimeout(2_000);
    expect(sent).toEqual([]);
    expect(await text(page, 'Centre bore').inputValue()).toBe('2.6417');
    const after = await stored(page, id);
    expect(after.data.rotors[0]).toMatchObject({ diameterMm: 330.2, thicknessMm: 27.94 });

    // a server reason for a length lands on that input, whatever unit it shows
    const refusal = {
      error: {
        code: 'validation',
        message: 'Check the marked fields.',
        fields: { 'data.rotors.0.diameterMm': 'Too large for the wheel the chassis takes' },
      },
    };
    await page.route('**/api/submissions/*', (route) =>
      route.request().method() === 'PATCH'
        ? route.fulfill({ status: 400, contentType: 'application/json', body: JSON.stringify(refusal) })
        : route.fallback(),
    );
    await text(page, 'Diameter').fill('13.5');
    await expect.poll(saveState, { timeout: 10_000 }).toBe('error');
    await expect.poll(() => text(page, 'Diameter').getAttribute('aria-invalid'), { timeout: 5_000 }).toBe('true');
    expect(await text(page, 'Diameter').inputValue()).toBe('13.5');
    await page.getByRole('alert').filter({ hasText: 'Too large for the wheel the chassis takes' }).waitFor();
    await page.unroute('**/api/submissions/*');
    await text(page, 'Diameter').fill('12.5');
    await expect.poll(async () => (await stored(page, id)).data.rotors[0]?.diameterMm, { timeout: 10_000 }).toBe(317.5); // 12.5 × 25.4

    expect(errors).toEqual([]);
    await context.close();
  });
});
