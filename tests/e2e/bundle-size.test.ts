import { describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

// Deterministic: reads the build that `npm run test:e2e` makes first.
const dist = path.resolve(import.meta.dirname, '../../dist');
const budgetBytes = 180 * 1024; // the budget: home page initial JS ≤ 180 KB gzipped

function initialScripts(): string[] {
  const html = fs.readFileSync(path.join(dist, 'index.html'), 'utf8');
  const entries = [...html.matchAll(/<script[^>]+type="module"[^>]+src="([^"]+)"/g)].map((m) => m[1]);
  const preloads = [...html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+)"/g)].map((m) => m[1]);
  return [...new Set([...entries, ...preloads])];
}

const gz = (file: string) => zlib.gzipSync(fs.readFileSync(path.join(dist, file.replace(/^\//, '')))).length;

describe('bundle size', () => {
  it('when the home page loads, then its initial JavaScript stays within 180 KB gzipped', () => {
    const scripts = initialScripts();
    expect(scripts.length).toBeGreaterThan(0);
    const total = scripts.reduce((sum, f) => sum + gz(f), 0);
    console.log(`home initial JS: ${scripts.length} files, ${(total / 1024).toFixed(1)} KB gzipped (budget 180 KB)`);
    expect(total).toBeLessThanOrEqual(budgetBytes);
  });

  it('when the build is made, then the submission form, review desk, calculators and the chart drawing are separate lazy chunks', () => {
    const initial = initialScripts();
    const assets = fs.readdirSync(path.join(dist, 'assets'));
    for (const chunk of ['submit-page', 'review-desk-page', 'calculators-page', 'adhesion-chart-drawing']) {
      const file = assets.find((a) => a.startsWith(chunk) && a.endsWith('.js'));
      expect(file, `${chunk} should be its own chunk`).toBeDefined();
      expect(initial.some((s) => s.endsWith(file!))).toBe(false);
    }
  });
});
