import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';
import { readWatch, signInContext, watchedContext, watchedPage } from './support/watched-page';

// The built app under the server's own Content-Security-Policy: the policy is strict, and the
// app's main pages run under it without one violation (a violation means something the app
// needs is being blocked, or the policy had to be loosened to hide it).

let server: RunningServer;
let browser: Browser;
const contexts: Record<string, BrowserContext> = {};

beforeAll(async () => {
  server = await startServer({ SEED_DEMO: 'auto' });
  browser = await launchBrowser();
  contexts.anonymous = await watchedContext(browser);
  for (const login of ['rivet_rosa', 'gauge_mo', 'ada_admin', 'ridgeway_shop'])
    contexts[login] = (await signInContext(browser, server.url, login)).context;
});
afterAll(async () => {
  for (const c of Object.values(contexts)) await c.close();
  await browser?.close();
  await server?.stop();
});

const pages: { name: string; as: string; url: string; ready: string }[] = [
  { name: 'home', as: 'anonymous', url: '/', ready: 'article h3 a' },
  { name: 'search', as: 'anonymous', url: '/search?q=vela', ready: '#search-results li' },
  { name: 'swap sheet', as: 'anonymous', url: '/swaps/h31-front-vela-four-piston-330', ready: '#torque' },
  { name: 'calculators', as: 'anonymous', url: '/tools', ready: 'main h1' },
  { name: 'chassis page', as: 'anonymous', url: '/chassis/halden-h31', ready: 'main h1' },
  { name: 'shop page', as: 'anonymous', url: '/shops/ridgeway-performance', ready: 'main h1' },
  { name: 'pinned sheet', as: 'anonymous', url: '/l/rp-h31vela', ready: '#torque' },
  { name: 'submission form', as: 'rivet_rosa', url: '/submit', ready: 'main form' },
  { name: 'my cars', as: 'rivet_rosa', url: '/me/cars', ready: 'main h1' },
  { name: 'swap sheet, shop signed in', as: 'ridgeway_shop', url: '/swaps/h31-front-vela-four-piston-330', ready: '#shop-link' },
  { name: 'review desk', as: 'gauge_mo', url: '/review', ready: 'main h1' },
  { name: 'outbox', as: 'gauge_mo', url: '/outbox', ready: 'main h1' },
  { name: 'admin', as: 'ada_admin', url: '/admin', ready: 'main h1' },
];

describe('content security policy', () => {
  it('when the app page is served, then its policy forbids plugins, base rewriting, framing and inline or eval script', async () => {
    const res = await fetch(`${server.url}/`);
    const csp = res.headers.get('content-security-policy') ?? '';
    const directives = new Map(
      csp
        .split(';')
        .map((d) => d.trim().split(/\s+/))
        .filter((d) => d[0])
        .map(([name, ...values]) => [name!, values]),
    );
    expect(directives.get('object-src')).toEqual(["'none'"]);
    expect(directives.get('base-uri')).toEqual(["'none'"]);
    expect(directives.get('frame-ancestors')).toEqual(["'none'"]);
    expect(directives.get('script-src')).toEqual(["'self'"]);
    expect(directives.get('default-src')).toEqual(["'self'"]);
    // and the API answers carry it too
    const api = await fetch(`${server.url}/api/health`);
    expect(api.headers.get('content-security-policy')).toBe(csp);
  });

  for (const p of pages) {
    it(`when the ${p.name} loads (${p.as}), then no CSP violation is reported`, async () => {
      const { page, cspConsole, errors } = await watchedPage(contexts[p.as]!);
      const response = await page.goto(`${server.url}${p.url}`);
      const csp = (await response!.allHeaders())['content-security-policy'] ?? '';
      expect(csp).toContain("object-src 'none'");
      expect(csp).toContain("base-uri 'none'");
      expect(csp).toContain("frame-ancestors 'none'");
      await page.locator(p.ready).first().waitFor({ timeout: 15_000 });
      await page.waitForLoadState('networkidle');
      await page.waitForTimeout(300);
      const watch = await readWatch(page);
      expect(watch.csp, 'securitypolicyviolation events').toEqual([]);
      expect(cspConsole, 'console messages about the policy').toEqual([]);
      expect(errors).toEqual([]);
      console.log(`csp: ${p.name} (${p.as}): 0 violations`);
      await page.close();
    });
  }
});
