import lighthouse from 'lighthouse';
import * as chromeLauncher from 'chrome-launcher';
import { startServer } from '../e2e/support/server';

// Page speed as a reader on a phone meets it: Lighthouse's mobile profile (simulated slow 4G, 4× CPU
// slowdown) against the built app with the demo data, a few runs per page, medians printed.
// Run with `npm run bench:web` (builds first). A benchmark, not a test: it prints figures and the budgets.

const runs = Number(process.env.BENCH_RUNS ?? 3);
const chromePath = process.env.CHROME_PATH ?? '/usr/bin/chromium';
const budget = { lcpMs: 2500, cls: 0.1, tbtMs: 200 } as const;

type Figures = { lcpMs: number; cls: number; tbtMs: number };

const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
};

async function measure(url: string, port: number): Promise<Figures> {
  const result = await lighthouse(url, { port, onlyCategories: ['performance'], output: 'json', logLevel: 'error' });
  if (!result) throw new Error(`Lighthouse returned nothing for ${url}`);
  const { audits, runtimeError } = result.lhr;
  if (runtimeError) throw new Error(`Lighthouse could not load ${url}: ${runtimeError.message}`);
  const value = (id: string) => {
    const v = audits[id]?.numericValue;
    if (typeof v !== 'number') throw new Error(`no ${id} figure for ${url}`);
    return v;
  };
  return { lcpMs: value('largest-contentful-paint'), cls: value('cumulative-layout-shift'), tbtMs: value('total-blocking-time') };
}

const app = await startServer({ NODE_ENV: 'production', SEED_DEMO: 'auto', AUTH_PROVIDER: 'fake' });
const chrome = await chromeLauncher.launch({ chromePath, chromeFlags: ['--headless=new', '--no-sandbox', '--disable-gpu'] });
try {
  const recent = (await (await fetch(`${app.url}/api/swaps?limit=1`)).json()) as {
    items: { slug: string; chassis: { slug: string; model: string } }[];
  };
  const swap = recent.items[0];
  if (!swap) throw new Error('no approved swap: the demo seed did not load');
  const pages = {
    home: '/',
    search: `/search?q=${encodeURIComponent(swap.chassis.model.toLowerCase())}`,
    sheet: `/swaps/${swap.slug}`,
    chassis: `/chassis/${swap.chassis.slug}`,
  } as const;

  console.log(`Lighthouse mobile profile, median of ${runs} runs per page; budgets LCP ≤ ${budget.lcpMs} ms, CLS ≤ ${budget.cls}, TBT ≤ ${budget.tbtMs} ms`);
  console.log('page      LCP ms    CLS     TBT ms  within budget');
  const summary: Record<string, Figures & { withinBudget: boolean }> = {};
  for (const [name, path] of Object.entries(pages)) {
    const samples: Figures[] = [];
    for (let i = 0; i < runs; i++) samples.push(await measure(app.url + path, chrome.port));
    const figures: Figures = {
      lcpMs: Math.round(median(samples.map((s) => s.lcpMs))),
      cls: Number(median(samples.map((s) => s.cls)).toFixed(3)),
      tbtMs: Math.round(median(samples.map((s) => s.tbtMs))),
    };
    const withinBudget = figures.lcpMs <= budget.lcpMs && figures.cls <= budget.cls && figures.tbtMs <= budget.tbtMs;
    summary[name] = { ...figures, withinBudget };
    console.log(
      `${name.padEnd(8)} ${String(figures.lcpMs).padStart(7)} ${figures.cls.toFixed(3).padStart(7)} ${String(figures.tbtMs).padStart(9)}  ${withinBudget ? 'yes' : 'no'}   ${path}`,
    );
  }
  console.log(JSON.stringify({ runs, budget, pages: summary }));
} finally {
  chrome.kill();
  await app.stop();
}
