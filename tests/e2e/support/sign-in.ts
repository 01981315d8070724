import type { Browser, BrowserContext, Page } from 'playwright-core';

/**
 * Signs in the way a person does — through the real strategy and the local provider's page — and
 * lands on `returnTo`. Page errors are collected so a test can assert there were none.
 */
export async function signedInPage(
  context: BrowserContext,
  baseUrl: string,
  login: string,
  returnTo: string,
): Promise<{ page: Page; errors: string[] }> {
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto(`${baseUrl}/auth/github?returnTo=${encodeURIComponent(returnTo)}`);
  await page.waitForURL(/\/auth\/fake\/authorize/);
  const authorize = new URL(page.url());
  authorize.searchParams.set('login', login);
  await page.goto(authorize.toString());
  await page.waitForURL((u) => u.pathname === returnTo.split('?')[0]);
  return { page, errors };
}

/** A member's fresh browser context on an empty submission form. */
export async function openSubmitForm(browser: Browser, baseUrl: string, login: string) {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const { page, errors } = await signedInPage(context, baseUrl, login, '/submit');
  await page.getByRole('heading', { level: 1, name: 'Record a swap' }).waitFor();
  return { context, page, errors };
}
