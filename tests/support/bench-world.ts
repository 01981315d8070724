import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { openDb, migrateDb, closeDb, type Db } from '../../server/db/client';
import { buildSyntheticWorld, type WorldSize } from './synthetic-catalogue';

// The benchmarks' invented world (100,000 swaps, 20,000 parts, 2,000 chassis unless BENCH_SWAPS / BENCH_PARTS /
// BENCH_CHASSIS say otherwise). It takes minutes to build, so it is kept in the temp folder and reused by later
// runs of the same size and migrations (BENCH_FRESH=1 builds it again).

export const benchWorldSize = (): WorldSize => ({
  swaps: Number(process.env.BENCH_SWAPS ?? 100_000),
  parts: Number(process.env.BENCH_PARTS ?? 20_000),
  chassis: Number(process.env.BENCH_CHASSIS ?? 2_000),
});

export function openBenchWorld(size = benchWorldSize()): { db: Db; file: string } {
  const file = path.join(os.tmpdir(), `swapyard-graph-bench-${size.swaps}-${size.parts}-${size.chassis}.db`);
  const migrations = fs.readdirSync(path.resolve(import.meta.dirname, '../../drizzle')).filter((f) => f.endsWith('.sql')).length;
  const stale = () => {
    const db = openDb(file);
    const applied = db.$client.prepare('select count(*) as n from __drizzle_migrations').get() as { n: number };
    closeDb(db);
    return applied.n !== migrations;
  };
  if (process.env.BENCH_FRESH || !fs.existsSync(file) || stale()) {
    for (const f of [file, `${file}-wal`, `${file}-shm`]) fs.rmSync(f, { force: true });
    const db = openDb(file);
    migrateDb(db);
    const t0 = performance.now();
    const w = buildSyntheticWorld(db, size);
    db.$client.pragma('optimize');
    console.log(
      `built ${w.approvedSwaps} approved swaps (+${w.unpublishedSwaps} unpublished), ${size.parts} parts, ${size.chassis} chassis in ${((performance.now() - t0) / 1000).toFixed(1)} s`,
    );
    return { db, file };
  }
  console.log(`reusing ${file}`);
  return { db: openDb(file), file };
}
