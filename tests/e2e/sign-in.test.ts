import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';

// Sign-in as a person does it: the header link, the local provider's page, a click on an account,
// back to the page they came from with the account menu showing the role, then sign out.

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

describe('sign-in through the fake provider', () => {
  it('when a moderator clicks through sign-in, then the menu shows the role and sign-out ends the session', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await page.goto(`${server.url}/tools`);
    await page.getByRole('link', { name: 'Sign in' }).click();
    await page.waitForURL(/\/signin\?returnTo=%2Ftools/);
    await page.getByRole('link', { name: 'Continue with GitHub' }).click();
    await page.waitForURL(/\/auth\/fake\/authorize/);
    await page.getByRole('link', { name: /Mo Gauge/ }).click();
    await page.waitForURL(`${server.url}/tools`);

    const menu = page.getByRole('button', { name: /Moderator\) account menu/ });
    await menu.click();
    const account = page.getByRole('navigation', { name: 'Account' });
    await expect.poll(() => account.getByRole('link', { name: 'Review desk' }).count()).toBe(1);
    expect(await page.getByText('Moderator', { exact: true }).count()).toBeGreaterThan(0);
    const me = await page.request.get(`${server.url}/api/me`).then((r) => r.json());
    expect(me.user.login).toBe('gauge_mo');
    expect(me.user.role).toBe('moderator');

    await page.getByRole('button', { name: 'Sign out', exact: true }).click();
    await expect.poll(() => page.getByRole('link', { name: 'Sign in' }).count()).toBe(1);
    const after = await page.request.get(`${server.url}/api/me`).then((r) => r.json());
    expect(after.user).toBeNull();
    await page.close();
  });

  it('when a member signs in, then the review desk link is absent and the desk refuses them', async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    await page.goto(`${server.url}/review`);
    await page.goto(`${server.url}/auth/github?returnTo=/review`);
    await page.getByRole('link', { name: /Paul Piston/ }).click();
    await page.waitForURL(`${server.url}/review`);
    await expect.poll(() => page.getByText(/cannot open|not allowed|moderators/i).count()).toBeGreaterThan(0);
    await page.getByRole('button', { name: /Member\) account menu/ }).click();
    expect(await page.getByRole('navigation', { name: 'Account' }).getByRole('link', { name: 'Review desk' }).count()).toBe(0);
    await page.close();
  });

  it('when a member signs out everywhere on one device, then their other browser is signed out too', async () => {
    const signInAs = async (width: number) => {
      const context = await browser.newContext({ viewport: { width, height: 844 } });
      const page = await context.newPage();
      await page.goto(`${server.url}/auth/github?returnTo=/tools`);
      await page.getByRole('link', { name: /Kai Camber/ }).click();
      await page.waitForURL(`${server.url}/tools`);
      return { context, page };
    };
    const laptop = await signInAs(1280);
    const phone = await signInAs(390);

    await phone.page.getByRole('button', { name: /Member\) account menu/ }).click();
    await phone.page.getByRole('button', { name: /Sign out everywhere/ }).click();
    await expect.poll(() => phone.page.getByRole('link', { name: 'Sign in' }).count()).toBe(1);

    await laptop.page.reload();
    await expect.poll(() => laptop.page.getByRole('link', { name: 'Sign in' }).count()).toBe(1);
    const me = await laptop.page.request.get(`${server.url}/api/me`).then((r) => r.json());
    expect(me).toEqual({ user: null, csrfToken: null });
    await laptop.context.close();
    await phone.context.close();
  });
});
