import { chromium } from 'playwright-core';
import { makeDocuments, makeWorld } from './search-fixtures';

// node --import tsx tests/bench/search-worker.bench.ts [http://localhost:3000] [50000]
// Opens the built search page in Chromium with the index answered by N synthetic documents and records
// every main-thread long task (> 50 ms) from navigation until the page shows the document count.

const base = process.argv[2] ?? 'http://localhost:3000';
const count = Number(process.argv[3] ?? 50_000);
const body = JSON.stringify({ documents: makeDocuments(count, makeWorld()) });

const browser = await chromium.launch({
  executablePath: process.env.CHROMIUM ?? '/usr/bin/chromium',
  args: [
    '--headless',
    '--no-sandbox',
    '--disable-gpu',
    '--disable-quic',
    '--no-first-run',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
  ],
});
try {
  const page = await browser.newPage();
  await page.route('**/api/search-index', (route) => route.fulfill({ status: 200, contentType: 'application/json', body }));
  await page.addInitScript(() => {
    const w = window as unknown as { __long: number[] };
    w.__long = [];
    new PerformanceObserver((list) => list.getEntries().forEach((e) => w.__long.push(e.duration))).observe({
      type: 'longtask',
      buffered: true,
    });
  });
  const t0 = Date.now();
  await page.goto(`${base}/search`);
  // the count under the heading reads "out of 50,000 approved" once the worker has built its index
  await page.getByText(`out of ${count.toLocaleString('en-GB')} approved`).waitFor({ timeout: 120_000 });
  const readyMs = Date.now() - t0;
  const input = page.getByRole('searchbox');
  const t1 = Date.now();
  await input.fill('caliper');
  await page.getByRole('heading', { name: /for “caliper”/ }).waitFor();
  const firstQueryMs = Date.now() - t1;
  const longTasks = await page.evaluate(() => (window as unknown as { __long: number[] }).__long);
  console.log(
    JSON.stringify({
      documents: count,
      payloadBytes: body.length,
      readyMs,
      firstQueryMs,
      mainThreadLongTasks: longTasks.length,
      longestMainThreadTaskMs: Math.round(Math.max(0, ...longTasks)),
    }),
  );
} finally {
  await browser.close();
}
