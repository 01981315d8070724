import AxeBuilder from '@axe-core/playwright';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';
import { signInContext, watchedContext } from './support/watched-page';

// axe-core in Chromium over the main pages of the built app on the demo scenario: no violations of
// any impact. Each page's counts by impact are printed for the report.

let server: RunningServer;
let browser: Browser;
const contexts: Record<string, BrowserContext> = {};
let reviewId = 0;

beforeAll(async () => {
  server = await startServer({ SEED_DEMO: 'auto' });
  browser = await launchBrowser();
  contexts.anonymous = await watchedContext(browser);
  for (const login of ['rivet_rosa', 'gauge_mo']) contexts[login] = (await signInContext(browser, server.url, login)).context;
  const mo = contexts.gauge_mo!;
  const queue = (await (await mo.request.get(`${server.url}/api/review/queue`)).json()) as {
    items: { revisionId: number; status: string }[];
  };
  reviewId = queue.items.find((i) => i.status === 'in_review')?.revisionId ?? 0;
});
afterAll(async () => {
  for (const c of Object.values(contexts)) await c.close();
  await browser?.close();
  await server?.stop();
});

const pages: { name: string; as: string; url: () => string; ready: string }[] = [
  { name: 'home', as: 'anonymous', url: () => '/', ready: 'article h3 a' },
  { name: 'search', as: 'anonymous', url: () => '/search?q=vela', ready: '#search-results li' },
  { name: 'swap sheet', as: 'anonymous', url: () => '/swaps/h31-front-vela-four-piston-330', ready: '#torque' },
  { name: 'calculators', as: 'anonymous', url: () => '/tools', ready: 'main h1' },
  { name: 'part page', as: 'anonymous', url: () => '/parts/1', ready: '#reach-h' },
  { name: 'chassis page', as: 'anonymous', url: () => '/chassis/halden-h31', ready: '#donors-h' },
  { name: 'where-else search', as: 'anonymous', url: () => '/where-else?number=ov%20355%20104%20l', ready: '#reach-h' },
  { name: 'open data page', as: 'anonymous', url: () => '/open-data', ready: '#mirrors-h' },
  { name: 'API page', as: 'anonymous', url: () => '/api-docs', ready: '#example-h' },
  { name: 'shop page', as: 'anonymous', url: () => '/shops/ridgeway-performance', ready: '#shop-reports-h' },
  { name: 'following page', as: 'rivet_rosa', url: () => '/me/following', ready: 'main h1' },
  { name: 'submission form', as: 'rivet_rosa', url: () => '/submit', ready: 'main form' },
  { name: 'review desk', as: 'gauge_mo', url: () => '/review', ready: 'main table, main h1' },
  { name: 'review page', as: 'gauge_mo', url: () => `/review/${reviewId}`, ready: '[data-testid="checks"]' },
];

describe('accessibility (axe-core)', () => {
  it('has a revision in review from the demo scenario to open', () => {
    expect(reviewId).toBeGreaterThan(0);
  });

  for (const p of pages) {
    it(`when the ${p.name} is checked, then axe finds no violation`, async () => {
      const page = await contexts[p.as]!.newPage();
      await page.goto(`${server.url}${p.url()}`);
      await page.locator(p.ready).first().waitFor({ timeout: 15_000 });
      await page.waitForLoadState('networkidle');
      const result = await new AxeBuilder({ page }).analyze();
      const byImpact: Record<string, number> = { critical: 0, serious: 0, moderate: 0, minor: 0 };
      for (const v of result.violations) byImpact[v.impact ?? 'minor'] = (byImpact[v.impact ?? 'minor'] ?? 0) + v.nodes.length;
      console.log(
        `axe: ${p.name}: ${Object.entries(byImpact)
          .map(([k, n]) => `${k} ${n}`)
          .join(
            ', ',
          )} (${result.passes.length} rules passed${result.violations.length ? `; failed: ${result.violations.map((v) => `${v.id} [${v.impact}]`).join(', ')}` : ''})`,
      );
      // the design asks for no serious or critical findings; the pages are clean of the lesser ones too, so keep them so
      const bad = result.violations.map(
        (v) =>
          `${v.impact} ${v.id}: ${v.help}\n${v.nodes.map((n) => `  ${n.target.join(' ')} ${n.html.slice(0, 120)} — ${n.failureSummary?.split('\n').slice(1).join(' ')}`).join('\n')}`,
      );
      if (bad.length) console.log(`axe: ${p.name}:\n${bad.join('\n')}`);
      expect(bad).toEqual([]);
      await page.close();
    });
  }
});
