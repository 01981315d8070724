import autocannon from 'autocannon';
import os from 'node:os';
import { spawn } from 'node:child_process';
import { freePort, startServer } from '../e2e/support/server';

// HTTP throughput of the built server against a bare Express route measured in the same run.
// Run with `npm run bench:api` (builds the client first).

const duration = Number(process.env.BENCH_SECONDS ?? 8);

type Result = { rps: number; p50Ms: number; p99Ms: number; errors: number; non2xx: number };

async function run(url: string, connections: number): Promise<Result> {
  const r = await autocannon({ url, connections, duration, pipelining: 1 });
  return { rps: r.requests.average, p50Ms: r.latency.p50, p99Ms: r.latency.p99, errors: r.errors, non2xx: r.non2xx };
}

const barePort = await freePort();
const bare = spawn(process.execPath, ['--import', 'tsx', 'tests/bench/support/bare-server.ts'], {
  env: { ...process.env, PORT: String(barePort) },
  stdio: ['ignore', 'ignore', 'inherit'],
});
const app = await startServer({ NODE_ENV: 'production', AUTH_PROVIDER: 'fake', SEED_DEMO: 'auto' });
try {
  for (let i = 0; ; i++) {
    const up = await fetch(`http://127.0.0.1:${barePort}/bare`).then(
      (r) => r.ok,
      () => false,
    );
    if (up) break;
    if (i > 100) throw new Error('the bare server did not start');
    await new Promise((r) => setTimeout(r, 100));
  }
  const recent = (await (await fetch(`${app.url}/api/swaps?limit=1`)).json()) as { items: { slug: string }[] };
  const slug = recent.items[0]?.slug;
  if (!slug) throw new Error('no approved swap to fetch: the demo seed did not load');

  const targets = {
    ceiling: `http://127.0.0.1:${barePort}/bare`,
    swap: `${app.url}/api/swaps/${slug}`,
    searchIndex: `${app.url}/api/search-index`,
    home: `${app.url}/`,
  } as const;

  const summary: Record<string, Record<string, number>> = {};
  console.log(`${duration} s per run, ${os.cpus().length} cores; server and load generator share them`);
  console.log('target        conns   req/s    p50 ms  p99 ms  ratio   errors');
  for (const connections of [10, 50]) {
    const results: Partial<Record<keyof typeof targets, Result>> = {};
    for (const [name, url] of Object.entries(targets) as [keyof typeof targets, string][]) {
      // warm-up so caches and JIT are in the state a running server is in
      await autocannon({ url, connections, duration: 1 });
      results[name] = await run(url, connections);
    }
    const ceiling = results.ceiling!.rps;
    for (const [name, r] of Object.entries(results) as [string, Result][]) {
      const ratio = r.rps / ceiling;
      console.log(
        `${name.padEnd(13)} ${String(connections).padStart(5)} ${r.rps.toFixed(0).padStart(7)} ${String(r.p50Ms).padStart(8)} ${String(r.p99Ms).padStart(7)} ${ratio.toFixed(2).padStart(6)} ${String(r.errors + r.non2xx).padStart(8)}`,
      );
      if (connections === 50) {
        summary[name] =
          name === 'ceiling'
            ? { rps: Math.round(r.rps), p99Ms: r.p99Ms }
            : { rps: Math.round(r.rps), p99Ms: r.p99Ms, ratio: Number(ratio.toFixed(3)) };
      }
    }
  }
  console.log(JSON.stringify(summary));
} finally {
  bare.kill('SIGTERM');
  await app.stop();
}
