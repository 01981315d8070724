import { chromium, type Browser, type Page } from 'playwright-core';

export const chromiumArgs = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** Debian's chromium; playwright gives every launch a fresh temporary profile. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: '/usr/bin/chromium', args: chromiumArgs });
}

/**
 * Waits until the app has taken the page over (its first commit, hydration of a server-drawn page included):
 * before that a server-drawn page shows its content but drops clicks and choices.
 */
export async function hydrated(page: Page): Promise<void> {
  await page.locator('html[data-hydrated]').waitFor({ state: 'attached' });
}
