import autocannon from 'autocannon';
import fs from 'node:fs';
import os from 'node:os';
import { spawn } from 'node:child_process';
import { freePort, startServer } from '../e2e/support/server';

// HTTP throughput of the built server against a bare Express route measured in the same run.
// Run with `npm run bench:api` (builds the client first).
//
// Besides requests per second, each run reports the CPU time the serving process spent per request
// (from /proc): on a machine shared with other work, wall-clock throughput moves with the neighbours'
// load, while CPU per request says what a request costs this server.

const duration = Number(process.env.BENCH_SECONDS ?? 8);

type Result = { rps: number; p50Ms: number; p99Ms: number; errors: number; non2xx: number; cpuUsPerReq: number | null };

/** user + system CPU time of a process in µs, or null where /proc is not there */
function cpuMicros(pid: number): number | null {
  try {
    const fields = fs.readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
    // utime and stime are fields 14 and 15 of the line, counted in clock ticks (100 per second on Linux)
    return (Number(fields[11]) + Number(fields[12])) * 10_000;
  } catch {
    return null;
  }
}

async function run(url: string, pid: number, connections: number, headers: Record<string, string>): Promise<Result> {
  const before = cpuMicros(pid);
  const r = await autocannon({ url, connections, duration, pipelining: 1, headers });
  const after = cpuMicros(pid);
  const cpuUsPerReq = before === null || after === null || !r.requests.total ? null : (after - before) / r.requests.total;
  return { rps: r.requests.average, p50Ms: r.latency.p50, p99Ms: r.latency.p99, errors: r.errors, non2xx: r.non2xx, cpuUsPerReq };
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

  // `swap` asks the way a browser or a CDN does (gzip accepted); `swapIdentity` asks for plain bytes
  const gzip = { 'accept-encoding': 'gzip, deflate, br' };
  const targets = {
    ceiling: { url: `http://127.0.0.1:${barePort}/bare`, pid: bare.pid!, headers: gzip },
    swap: { url: `${app.url}/api/swaps/${slug}`, pid: app.pid, headers: gzip },
    swapIdentity: { url: `${app.url}/api/swaps/${slug}`, pid: app.pid, headers: {} },
    searchIndex: { url: `${app.url}/api/search-index`, pid: app.pid, headers: gzip },
    home: { url: `${app.url}/`, pid: app.pid, headers: gzip },
  } as const;

  const summary: Record<string, Record<string, number | null>> = {};
  console.log(`${duration} s per run, ${os.cpus().length} cores; server and load generator share them`);
  console.log('target        conns   req/s    p50 ms  p99 ms  ratio   CPU µs/req  errors');
  for (const connections of [10, 50]) {
    const results: Partial<Record<keyof typeof targets, Result>> = {};
    for (const [name, t] of Object.entries(targets) as [keyof typeof targets, (typeof targets)[keyof typeof targets]][]) {
      // warm-up so caches and JIT are in the state a running server is in
      await autocannon({ url: t.url, connections, amount: 3000, headers: t.headers });
      results[name] = await run(t.url, t.pid, connections, t.headers);
    }
    const ceiling = results.ceiling!.rps;
    for (const [name, r] of Object.entries(results) as [string, Result][]) {
      const ratio = r.rps / ceiling;
      const cpu = r.cpuUsPerReq === null ? 'n/a' : r.cpuUsPerReq.toFixed(0);
      console.log(
        `${name.padEnd(13)} ${String(connections).padStart(5)} ${r.rps.toFixed(0).padStart(7)} ${String(r.p50Ms).padStart(8)} ${String(r.p99Ms).padStart(7)} ${ratio.toFixed(2).padStart(6)} ${cpu.padStart(11)} ${String(r.errors + r.non2xx).padStart(7)}`,
      );
      if (connections === 50) {
        const cpuUsPerReq = r.cpuUsPerReq === null ? null : Math.round(r.cpuUsPerReq);
        summary[name] =
          name === 'ceiling'
            ? { rps: Math.round(r.rps), p99Ms: r.p99Ms, cpuUsPerReq }
            : { rps: Math.round(r.rps), p99Ms: r.p99Ms, ratio: Number(ratio.toFixed(3)), cpuUsPerReq };
      }
    }
  }
  console.log(JSON.stringify(summary));
} finally {
  bare.kill('SIGTERM');
  await app.stop();
}
