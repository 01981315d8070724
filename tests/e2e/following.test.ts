import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { launchBrowser } from './support/browser';
import { signedInPage } from './support/sign-in';

// The demo seed: rivet_rosa owns the "Green coupe", an H31. She follows the H31 chassis from its page and
// her car from my cars, then changes and stops them on the following page.

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

describe('following a chassis and a car in the browser', () => {
  it('when a member follows from the chassis page and my cars, then the following page lists both, and a frequency change and a stop hold after reload', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const { page, errors } = await signedInPage(context, server.url, 'rivet_rosa', '/chassis/halden-h31');

    await page.getByRole('button', { name: /^Follow the Halden H31/ }).click();
    const form = page.getByRole('form', { name: /^Follow the Halden H31/ });
    await form.getByRole('radio', { name: 'once a day' }).check();
    await form.getByRole('button', { name: 'Follow' }).click();
    expect(await page.getByTestId('follow-state').innerText()).toContain('Following · once a day');

    await page.goto(`${server.url}/me/cars`);
    const car = page.getByRole('list', { name: 'Your cars' }).getByRole('listitem').filter({ hasText: 'Green coupe' });
    await car.getByRole('button', { name: 'Follow your Green coupe' }).click();
    await car.getByRole('button', { name: 'Follow', exact: true }).click(); // weekly is chosen unless changed
    expect(await car.getByTestId('follow-state').innerText()).toContain('Following · once a week');

    await page.getByRole('button', { name: /account menu/ }).click();
    await page.getByRole('navigation', { name: 'Account' }).getByRole('link', { name: 'Following' }).click();
    await page.waitForURL(/\/me\/following$/);
    const list = page.getByRole('list', { name: 'What you follow' });
    await list.getByRole('article').nth(1).waitFor();
    const chassis = list.getByRole('article', { name: /Halden H31/ });
    const coupe = list.getByRole('article', { name: 'Green coupe' });
    expect(await chassis.getByRole('combobox').inputValue()).toBe('daily');
    expect(await coupe.getByRole('combobox').inputValue()).toBe('weekly');
    // a weekly digest is due on a Monday
    const due = /Next digest due (\d{1,2} [A-Z][a-z]{2} \d{4})/.exec(await coupe.innerText())?.[1];
    expect(new Date(`${due} UTC`).getUTCDay()).toBe(1);

    await chassis.getByRole('combobox').selectOption('weekly');
    await page.waitForResponse((r) => r.url().includes('/api/me/follows/') && r.request().method() === 'PATCH');
    await coupe.getByRole('button', { name: 'Stop following' }).click();
    await coupe.waitFor({ state: 'detached' });

    await page.reload();
    await list.getByRole('article').first().waitFor();
    expect(await list.getByRole('article').count()).toBe(1);
    expect(
      await list
        .getByRole('article', { name: /Halden H31/ })
        .getByRole('combobox')
        .inputValue(),
    ).toBe('weekly');

    // back on the chassis page the button says what is followed
    await page.goto(`${server.url}/chassis/halden-h31`);
    expect(await page.getByTestId('follow-state').innerText()).toContain('Following · once a week');
    expect(errors).toEqual([]);
    await context.close();
  });
});
