import fs from 'node:fs';
import os from 'node:os';
import { performance } from 'node:perf_hooks';
import { sql } from 'drizzle-orm';
import { closeDb } from '../../server/db/client';
import { chassisGraph, partGraph, whereElse } from '../../server/features/graph/graph.service';
import { getPartPage } from '../../server/features/catalogue/catalogue.service';
import { openBenchWorld } from '../support/bench-world';
import { rng } from './search-fixtures';

// npm run bench:graph — the interchange graph's page queries at 100,000 swaps and 20,000 catalogue parts:
// the part page's graph, the chassis page's donor parts, the "where else" search, and the part page's
// list of swaps, each over a few hundred pages picked at random (popular parts and chassis included).
//
// BENCH_SWAPS / BENCH_PARTS / BENCH_CHASSIS change the size (tests/support/bench-world.ts).

const PAGES = Number(process.env.BENCH_PAGES ?? 300);

const percentile = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))];
};
const round = (n: number, d = 2) => Math.round(n * 10 ** d) / 10 ** d;

function measure<T>(inputs: T[], run: (input: T) => unknown) {
  for (const input of inputs.slice(0, 20)) run(input); // warm the page cache and the statement cache
  const ms = inputs.map((input) => {
    const t0 = performance.now();
    run(input);
    return performance.now() - t0;
  });
  return { p50: percentile(ms, 50), p95: percentile(ms, 95), max: Math.max(...ms) };
}

const { db, file } = openBenchWorld();
const c = db.$client;
const count = (q: string) => (c.prepare(q).get() as { n: number }).n;
console.log(
  `${count("select count(*) as n from swaps s join revisions r on r.id = s.current_revision_id where r.status = 'approved'")} approved swaps, ` +
    `${count('select count(*) as n from parts')} parts, ${count('select count(*) as n from revision_parts')} part lines, ` +
    `${count('select count(*) as n from part_number_keys')} part-number keys; database ${round(fs.statSync(file).size / 2 ** 20, 0)} MiB`,
);

const r = rng(99);
const partIds = db.all<{ id: number }>(sql`select id from parts`).map((p) => p.id);
const chassisSlugs = db.all<{ slug: string }>(sql`select slug from chassis where proposed = 0`).map((x) => x.slug);
const numbers = db.all<{ number: string; source: string }>(sql`select number, source from part_number_keys`);
// the way people type a number off a casting: lower case, spaces or no separators at all
const typed = (n: string) => r.pick([n, n.toLowerCase(), n.replace(/-/g, ' '), n.replace(/[^A-Za-z0-9]/g, '').toLowerCase()]);
const pages = {
  parts: Array.from({ length: PAGES }, () => r.pick(partIds)),
  // the most used parts are where the graph is largest: the first ids of each kind are the popular ones
  popularParts: db
    .all<{ partId: number }>(sql`select part_id as partId from revision_parts group by part_id order by count(*) desc limit 30`)
    .map((p) => p.partId),
  chassis: Array.from({ length: PAGES }, () => r.pick(chassisSlugs)),
  numbers: Array.from({ length: PAGES }, () => typed(r.pick(numbers).number)),
};

const rows: [string, ReturnType<typeof measure>][] = [
  ['part page: graph', measure(pages.parts, (id) => partGraph(db, id))],
  ['part page: graph, 30 most used parts', measure(pages.popularParts, (id) => partGraph(db, id))],
  ['part page: swap cards', measure(pages.parts, (id) => getPartPage(db, id))],
  ['chassis page: donor parts', measure(pages.chassis, (slug) => chassisGraph(db, slug))],
  ['where else (typed numbers)', measure(pages.numbers, (n) => whereElse(db, n))],
];

const biggest = partGraph(db, pages.popularParts[0]);
console.log(
  `most used part: ${biggest.totals.swaps} swaps on ${biggest.totals.chassis} chassis; ${PAGES} pages per query, ${os.cpus().length} cores shared`,
);
console.log('page query                                  p50 ms   p95 ms   max ms');
for (const [name, m] of rows)
  console.log(
    `${name.padEnd(42)} ${String(round(m.p50)).padStart(7)} ${String(round(m.p95)).padStart(8)} ${String(round(m.max)).padStart(8)}`,
  );
closeDb(db);
