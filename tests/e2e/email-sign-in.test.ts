import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { launchBrowser } from './support/browser';
import { startSmtp, type TestSmtp } from '../api/support/smtp';

// Sign-in without a provider account: the link goes out through the outbox and a real SMTP server on
// loopback, and is opened in another browser, as people do on their phone.

let server: RunningServer;
let browser: Browser;
let smtp: TestSmtp;

beforeAll(async () => {
  smtp = await startSmtp();
  server = await startServer({ SMTP_URL: `smtp://127.0.0.1:${smtp.port}` });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
  await smtp?.close();
});

/** the link in the delivered message (quoted-printable undone, as a mail program would) */
function linkIn(raw: string): string {
  const body = raw.replace(/=\r?\n/g, '').replace(/=([0-9A-F]{2})/g, (_, hex: string) => String.fromCharCode(parseInt(hex, 16)));
  const match = /https?:\/\/[^\s"<>]+\/auth\/email\/callback\?token=[A-Za-z0-9_-]+/.exec(body);
  if (!match) throw new Error(`no sign-in link in:\n${body}`);
  return match[0];
}

describe('sign-in by e-mail link', () => {
  it('when a visitor asks for a link and opens it in another browser, then that browser is signed in once and only once', async () => {
    const laptop = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await laptop.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(`${server.url}/tools`);
    await page.getByRole('link', { name: 'Sign in' }).click();
    await page.getByRole('heading', { level: 1, name: 'Sign in to Swapyard' }).waitFor();
    await page.getByRole('textbox', { name: 'E-mail address' }).fill('garage.owner@example.com');
    await page.getByRole('button', { name: 'E-mail me a sign-in link' }).click();
    await page.getByTestId('link-sent').waitFor();
    expect(await page.getByTestId('link-sent').innerText()).toContain('garage.owner@example.com');

    await expect.poll(() => smtp.received.filter((m) => m.to.includes('garage.owner@example.com')).length, { timeout: 20_000 }).toBe(1);
    const mail = smtp.received.find((m) => m.to.includes('garage.owner@example.com'))!;
    expect(mail.subject).toBe('Your Swapyard sign-in link');
    const link = linkIn(mail.raw);

    const phone = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const phonePage = await phone.newPage();
    await phonePage.goto(link);
    await phonePage.waitForURL(`${server.url}/tools`);
    const me = await phonePage.request.get(`${server.url}/api/me`).then((r) => r.json());
    expect(me.user).toMatchObject({ login: 'garage-owner', role: 'member' });
    await phonePage.getByRole('button', { name: /account menu/ }).waitFor();

    // the laptop that asked is still a visitor; the used link signs nobody in
    expect((await page.request.get(`${server.url}/api/me`).then((r) => r.json())).user).toBeNull();
    const again = await browser.newContext();
    const againPage = await again.newPage();
    await againPage.goto(link);
    await againPage.getByRole('heading', { level: 1, name: 'That sign-in link no longer works' }).waitFor();
    expect((await againPage.request.get(`${server.url}/api/me`).then((r) => r.json())).user).toBeNull();
    expect(errors).toEqual([]);
    await Promise.all([laptop.close(), phone.close(), again.close()]);
  });
});
