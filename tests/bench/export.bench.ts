import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable, Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { performance } from 'node:perf_hooks';
import { closeDb } from '../../server/db/client';
import { swapsCsv, swapsJson } from '../../server/features/export/export.service';
import { writeDumps } from '../../server/features/export/dump';
import { openBenchWorld } from '../support/bench-world';

// npm run bench:export — the open-data exports at 100,000 swaps (the benchmark world, tests/support/bench-world.ts):
// each file is streamed the way the export routes stream it (Readable.from over the pieces, into a sink that
// drops the bytes), with the heap and resident memory measured after a forced collection every 10,000 swaps.
// Constant memory means the figures at the end are those at the start, whatever the file's size. Then the daily
// dump is written and timed.

const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) throw new Error('run with node --expose-gc (npm run bench:export does)');
const mb = (n: number) => (n / 2 ** 20).toFixed(1);

const { db } = openBenchWorld();

async function measure(name: string, pieces: Iterable<string>) {
  gc!();
  const start = process.memoryUsage();
  const samples: { swaps: number; heap: number; rss: number }[] = [];
  let bytes = 0;
  let swaps = 0;
  const t0 = performance.now();
  const sink = new Writable({
    write(chunk: Buffer, _enc, done) {
      bytes += chunk.length;
      // a JSON swap starts a line with {"slug" or ,{"slug"; a CSV row is a line (records end in \n, cells are quoted)
      const text = chunk.toString();
      swaps += name === 'json' ? (text.match(/\n,?\{"slug"/g) ?? []).length : 0;
      if (name === 'json' && swaps >= (samples.length + 1) * 10_000) {
        gc!();
        const m = process.memoryUsage();
        samples.push({ swaps, heap: m.heapUsed, rss: m.rss });
      }
      done();
    },
  });
  await pipeline(Readable.from(pieces, { objectMode: false }), sink);
  const seconds = (performance.now() - t0) / 1000;
  gc!();
  const end = process.memoryUsage();
  const heaps = samples.map((s) => s.heap);
  console.log(
    `${name}: ${mb(bytes)} MiB in ${seconds.toFixed(1)} s (${mb(bytes / seconds)} MiB/s)` +
      (name === 'json' ? `, ${swaps} swaps (${Math.round(swaps / seconds)}/s)` : ''),
  );
  console.log(
    `  heap before ${mb(start.heapUsed)} MiB, after ${mb(end.heapUsed)} MiB` +
      (heaps.length ? `; during, every 10,000 swaps: min ${mb(Math.min(...heaps))}, max ${mb(Math.max(...heaps))} MiB` : '') +
      `; rss before ${mb(start.rss)} MiB, after ${mb(end.rss)} MiB`,
  );
  if (samples.length) console.log(`  heap at ${samples.map((s) => `${s.swaps / 1000}k: ${mb(s.heap)}`).join(', ')} MiB`);
}

await measure('json', swapsJson(db, 'https://swapyard.example'));
await measure('csv', swapsCsv(db, 'https://swapyard.example'));

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-dumps-'));
const t0 = performance.now();
const written = await writeDumps(db, dir, 'https://swapyard.example');
console.log(
  `daily dump in ${((performance.now() - t0) / 1000).toFixed(1)} s: ${written.map((w) => `${path.basename(w.file)} ${mb(w.bytes)} MiB`).join(', ')}`,
);
fs.rmSync(dir, { recursive: true, force: true });
closeDb(db);
