import { gzipSync } from 'node:zlib';
import { performance } from 'node:perf_hooks';
import Database from 'better-sqlite3';
import MiniSearch, { type Options, type Query, type SearchOptions } from 'minisearch';
import { buildIndex, matchQuery, releaseMatch, search, type SearchIndex } from '../../shared/search/search-engine';
import { chunkPieces, normalisePartNumber, parseQuery, processTerm, tokenize } from '../../shared/search/normalise';
import { fieldBoosts, fields, fieldText, fuzzyFor, type Field } from '../../shared/search/search-fields';
import type { SearchDocument } from '../../shared/search/search-document';
import { makeDocuments, makeQueries, makeWorld } from './search-fixtures';
import { measureShards } from './support/shard-figures';

// npm run bench:search — client-side search at 1k / 10k / 50k approved swaps, beside a linear scan
// and a server-side SQLite FTS5 query over the same documents, all in this one run; then the index in
// shards as a reader loads it: bytes before the first result, and the worker's cost per keystroke.

// SEARCH_BENCH_SIZES=10000,50000 runs only those sizes (the budgets are stated at 10k and 50k)
const sizes = process.env.SEARCH_BENCH_SIZES ? process.env.SEARCH_BENCH_SIZES.split(',').map(Number) : [1_000, 10_000, 50_000];
const QUERIES = 300;
// SEARCH_BENCH_ONLY=shards measures only the index in shards (the comparisons take minutes at 50,000)
const onlyShards = process.env.SEARCH_BENCH_ONLY === 'shards';

const percentile = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))];
};
const round = (n: number, d = 3) => Math.round(n * 10 ** d) / 10 ** d;

function time<T>(fn: () => T): [T, number] {
  const t0 = performance.now();
  const out = fn();
  return [out, performance.now() - t0];
}

function timeQueries(queries: string[], run: (q: string) => unknown) {
  for (const q of queries.slice(0, 30)) run(q); // warm up
  const ms = queries.map((q) => time(() => run(q))[1]);
  return { p50: percentile(ms, 50), p95: percentile(ms, 95), max: Math.max(...ms) };
}

// minisearch's own document search with the same fields, boosts and tokenizer, for comparison
const searchOptions: SearchOptions = {
  boost: fieldBoosts,
  prefix: (term) => term.length >= 2,
  fuzzy: (term) => fuzzyFor(term),
  maxFuzzy: 2,
  combineWith: 'AND',
  tokenize: chunkPieces,
  processTerm,
};
const indexOptions: Options<SearchDocument> = {
  idField: 'id',
  fields: [...fields],
  storeFields: [],
  extractField: (doc, field) => (field === 'id' ? doc.id : fieldText(doc, field as Field)),
  tokenize,
  processTerm,
  searchOptions,
};
function queryTree(q: string): Query | null {
  const chunks = parseQuery(q);
  if (chunks.reduce((n, c) => n + c.join('').length, 0) < 2) return null;
  const queries: Query[] = chunks.map((pieces) =>
    pieces.length === 1 ? pieces[0] : { combineWith: 'OR', queries: [pieces.join(''), { combineWith: 'AND', queries: pieces }] },
  );
  return { combineWith: 'AND', queries };
}

/** The naive baseline: lower-cased text per document, every query word must appear somewhere in it. */
function linearBaseline(docs: SearchDocument[]) {
  const hay = docs.map((d) =>
    [
      d.title,
      d.chassis.make,
      d.chassis.model,
      d.chassis.code,
      ...d.partNames,
      ...d.cameOn,
      d.adapter?.name ?? '',
      d.adapter?.maker ?? '',
      ...tokenize([...d.partNumbers, d.adapter?.partNumber ?? ''].join(' ')),
    ]
      .join(' ')
      .toLowerCase(),
  );
  return (q: string) => {
    const words = parseQuery(q).map((pieces) => pieces.join(''));
    const out: number[] = [];
    for (let i = 0; i < hay.length; i++) if (words.every((w) => hay[i].includes(w))) out.push(i);
    return out.slice(0, 20);
  };
}

/** A server-side alternative: FTS5 with prefix queries and bm25 weights like the client's boosts (no typo tolerance). */
function fts5Baseline(docs: SearchDocument[]) {
  const db = new Database(':memory:');
  db.exec(
    `create virtual table swaps_fts using fts5(code, model, make, part_numbers, title, part_names, adapter, came_on, tokenize = 'unicode61 remove_diacritics 2', prefix = '2 3')`,
  );
  const insert = db.prepare(
    'insert into swaps_fts(rowid, code, model, make, part_numbers, title, part_names, adapter, came_on) values (?, ?, ?, ?, ?, ?, ?, ?, ?)',
  );
  const [, buildMs] = time(() =>
    db.transaction(() => {
      for (const d of docs) {
        const numbers = [...d.partNumbers, d.adapter?.partNumber ?? ''].filter(Boolean);
        insert.run(
          d.id,
          d.chassis.code,
          d.chassis.model,
          d.chassis.make,
          [...numbers, ...numbers.map(normalisePartNumber)].join(' '),
          d.title,
          d.partNames.join(' '),
          d.adapter ? `${d.adapter.name} ${d.adapter.maker}` : '',
          d.cameOn.join(' '),
        );
      }
    })(),
  );
  const stmt = db.prepare(
    'select rowid from swaps_fts where swaps_fts match ? order by bm25(swaps_fts, 10, 8, 3, 6, 2, 1.2, 1, 0.8) limit 20',
  );
  const run = (q: string) => {
    const chunks = parseQuery(q);
    if (chunks.length === 0) return [];
    const expr = chunks.map((pieces) => `"${pieces.join('')}"*`).join(' AND ');
    return stmt.all(expr);
  };
  return { run, buildMs, close: () => db.close() };
}

type Row = {
  buildMs: number;
  docsJsonBytes: number;
  gzBytesPerDoc: number;
  indexJsonBytes: number;
  indexGzBytesPerDoc: number;
  loadMs: number;
  parseAndBuildMs: number;
  queryP50Ms: number;
  queryP95Ms: number;
  matchP95Ms: number;
  plainMiniP95Ms: number;
  browseAllMs: number;
  linearP95Ms: number;
  fts5P95Ms: number;
  fts5BuildMs: number;
  avgResults: number;
  shards: number;
  headGzBytes: number;
  firstResultP50Bytes: number;
  firstResultP95Bytes: number;
  firstResultMaxBytes: number;
  typedFirstResultP95Bytes: number;
  keystrokeP50Ms: number;
  keystrokeP95Ms: number;
};

const world = makeWorld();

type Sharded = ReturnType<typeof measureShards>;
const shardRows: Record<string, { firstResultP95Bytes: number; keystrokeP95Ms: number }> = {};

/** The index in shards at one size, as a reader meets it. */
async function measureAndLogShards(n: number, docs: SearchDocument[], queries: string[], docsGz: number) {
  const sharded = measureShards(docs, world.chassis, queries);
  const first = await sharded.firstResult();
  const keys = await sharded.keystrokeCost();
  logShards(n, sharded, first, keys, docsGz);
  return { sharded, first, keys };
}

function logShards(
  n: number,
  sharded: Sharded,
  first: Awaited<ReturnType<Sharded['firstResult']>>,
  keys: Awaited<ReturnType<Sharded['keystrokeCost']>>,
  docsGz: number,
) {
  shardRows[String(n)] = { firstResultP95Bytes: first.opened.p95, keystrokeP95Ms: round(keys.ms.p95) };
  const kib = (b: number) => `${(b / 1024).toFixed(1)} KiB`;
  log(
    `  sharded index        ${sharded.shardCount} shards (p50 ${kib(sharded.shardGz.p50)}, max ${kib(sharded.shardGz.max)} gzip); first index ${kib(sharded.headGz)} gzip, parsed with its routing tables in ${round(sharded.headParseMs, 1)} ms; split on the server in ${round(sharded.splitMs, 0)} ms`,
  );
  log(
    `  before 1st result    link with the query: p50 ${kib(first.opened.p50)}, p95 ${kib(first.opened.p95)}, max ${kib(first.opened.max)} gzip (whole list ${kib(docsGz)}); first answer in the worker p95 ${round(first.firstAnswerMs.p95, 1)} ms`,
  );
  log(
    `                       typing key by key: p50 ${kib(first.typed.p50)}, p95 ${kib(first.typed.p95)}, max ${kib(first.typed.max)} gzip until a keystroke shows a result`,
  );
  log(
    `  keystroke (worker)   p50 ${round(keys.ms.p50)} ms, p95 ${round(keys.ms.p95)} ms, max ${round(keys.ms.max)} ms over ${keys.strokes} keystrokes (routing + match + filters + facets + page, every shard in; all ${sharded.shardCount} taken in within ${round(keys.loadAllMs, 0)} ms)`,
  );
}
const summary: Record<string, Row> = {};
const log = (s: string) => process.stdout.write(s + '\n');

log(`search benchmark — node ${process.version}, ${QUERIES} queries per size\n`);
for (const n of sizes) {
  const docs = makeDocuments(n, world);
  const queries = makeQueries(QUERIES, docs, world);
  if (onlyShards) {
    log(`── ${n.toLocaleString('en')} documents`);
    await measureAndLogShards(n, docs, queries, gzipSync(JSON.stringify({ documents: docs })).length);
    log('');
    continue;
  }

  const docsJson = JSON.stringify({ documents: docs });
  const docsGz = gzipSync(docsJson).length;
  const [index, buildMs] = time(() => buildIndex(docs));
  const mini = new MiniSearch<SearchDocument>(indexOptions);
  mini.addAll(docs);
  const indexJson = JSON.stringify(mini);
  const indexGz = gzipSync(indexJson).length;
  const [, loadMs] = time(() => MiniSearch.loadJSON(indexJson, indexOptions));
  const [, parseAndBuildMs] = time(() => buildIndex((JSON.parse(docsJson) as { documents: SearchDocument[] }).documents));

  const full = timeQueries(queries, (q) => search(index, { q, limit: 20 }));
  const matchOnly = timeQueries(queries, (q) => releaseMatch(index, matchQuery(index, q)));
  const withFilter = timeQueries(queries, (q) => search(index, { q, filters: { axle: 'front' }, limit: 20 }));
  const plain = timeQueries(queries, (q) => {
    const tree = queryTree(q);
    return tree ? mini.search(tree, searchOptions) : [];
  });
  const [, browseAllMs] = time(() => search(index as SearchIndex, { limit: 20 }));
  const avgResults = queries.reduce((s, q) => s + search(index, { q, limit: 0 }).total, 0) / queries.length;

  const linear = timeQueries(queries, linearBaseline(docs));
  const fts = fts5Baseline(docs);
  const ftsTimes = timeQueries(queries, fts.run);
  fts.close();

  const { sharded, first, keys } = await measureAndLogShards(n, docs, queries, docsGz);

  const row: Row = {
    buildMs: round(buildMs, 1),
    docsJsonBytes: docsJson.length,
    gzBytesPerDoc: round(docsGz / n, 1),
    indexJsonBytes: indexJson.length,
    indexGzBytesPerDoc: round(indexGz / n, 1),
    loadMs: round(loadMs, 1),
    parseAndBuildMs: round(parseAndBuildMs, 1),
    queryP50Ms: round(full.p50),
    queryP95Ms: round(full.p95),
    matchP95Ms: round(matchOnly.p95),
    plainMiniP95Ms: round(plain.p95),
    browseAllMs: round(browseAllMs),
    linearP95Ms: round(linear.p95),
    fts5P95Ms: round(ftsTimes.p95),
    fts5BuildMs: round(fts.buildMs, 1),
    avgResults: round(avgResults, 1),
    shards: sharded.shardCount,
    headGzBytes: sharded.headGz,
    firstResultP50Bytes: first.opened.p50,
    firstResultP95Bytes: first.opened.p95,
    firstResultMaxBytes: first.opened.max,
    typedFirstResultP95Bytes: first.typed.p95,
    keystrokeP50Ms: round(keys.ms.p50),
    keystrokeP95Ms: round(keys.ms.p95),
  };
  summary[String(n)] = row;

  log(`── ${n.toLocaleString('en')} documents`);
  log(`  build index          ${row.buildMs} ms (JSON.parse + build: ${row.parseAndBuildMs} ms)`);
  log(
    `  documents on wire    ${(docsJson.length / 1024).toFixed(0)} KiB JSON, ${(docsGz / 1024).toFixed(0)} KiB gzip = ${row.gzBytesPerDoc} B/doc`,
  );
  log(
    `  serialized index     ${(indexJson.length / 1024).toFixed(0)} KiB JSON, ${(indexGz / 1024).toFixed(0)} KiB gzip = ${row.indexGzBytesPerDoc} B/doc (still needs the documents to show and facet)`,
  );
  log(`  load serialized      ${row.loadMs} ms (MiniSearch.loadJSON)`);
  log(
    `  query (full answer)  p50 ${row.queryP50Ms} ms, p95 ${row.queryP95Ms} ms, max ${round(full.max)} ms — match + filters + facets + sort + page`,
  );
  log(`  query (match only)   p50 ${round(matchOnly.p50)} ms, p95 ${row.matchP95Ms} ms`);
  log(
    `  query + axle filter  p50 ${round(withFilter.p50)} ms, p95 ${round(withFilter.p95)} ms (full answer with one filter chosen)`,
  );
  log(
    `  minisearch.search    p50 ${round(plain.p50)} ms, p95 ${row.plainMiniP95Ms} ms (the library's own scoring, same tree; for comparison)`,
  );
  log(`  browse all, newest   ${row.browseAllMs} ms (no query, facets over every document)`);
  log(`  linear filter        p50 ${round(linear.p50)} ms, p95 ${row.linearP95Ms} ms (substring, no ranking or typos)`);
  log(
    `  SQLite FTS5          p50 ${round(ftsTimes.p50)} ms, p95 ${row.fts5P95Ms} ms (prefix + bm25, no typos, no facets; build ${row.fts5BuildMs} ms)`,
  );
  log(`  results per query    ${row.avgResults} on average`);
  log('');
}

const budget = (ok: boolean) => (ok ? 'ok' : 'OVER');
log('budgets:');
if (summary['10000'])
  log(`  p95 ≤ 1 ms at 10,000: ${summary['10000'].queryP95Ms} ms ${budget(summary['10000'].queryP95Ms <= 1)}`);
if (summary['50000'])
  log(`  p95 ≤ 2 ms at 50,000: ${summary['50000'].queryP95Ms} ms ${budget(summary['50000'].queryP95Ms <= 2)}`);
if (shardRows['50000']) {
  const r = shardRows['50000'];
  log(
    `  ≤ 150 KB gzipped before the first result at 50,000 (p95 of links with a query): ${(r.firstResultP95Bytes / 1000).toFixed(1)} KB ${budget(r.firstResultP95Bytes <= 150_000)}`,
  );
  log(`  keystroke p95 ≤ 1 ms at 50,000, sharded: ${r.keystrokeP95Ms} ms ${budget(r.keystrokeP95Ms <= 1)}`);
}
if (!onlyShards)
  log(
    `  ≤ 300 B/doc gzipped:  ${Math.max(...sizes.map((n) => summary[String(n)].gzBytesPerDoc))} B ${budget(sizes.every((n) => summary[String(n)].gzBytesPerDoc <= 300))}`,
  );
log('');
if (onlyShards) log(JSON.stringify(shardRows));
else
  log(
    JSON.stringify(
      Object.fromEntries(
        Object.entries(summary).map(([n, r]) => [
          n,
          {
            buildMs: r.buildMs,
            gzBytesPerDoc: r.gzBytesPerDoc,
            loadMs: r.loadMs,
            queryP50Ms: r.queryP50Ms,
            queryP95Ms: r.queryP95Ms,
            linearP95Ms: r.linearP95Ms,
            fts5P95Ms: r.fts5P95Ms,
            indexGzBytesPerDoc: r.indexGzBytesPerDoc,
            matchP95Ms: r.matchP95Ms,
            shards: r.shards,
            headGzBytes: r.headGzBytes,
            firstResultP50Bytes: r.firstResultP50Bytes,
            firstResultP95Bytes: r.firstResultP95Bytes,
            firstResultMaxBytes: r.firstResultMaxBytes,
            typedFirstResultP95Bytes: r.typedFirstResultP95Bytes,
            keystrokeP50Ms: r.keystrokeP50Ms,
            keystrokeP95Ms: r.keystrokeP95Ms,
          },
        ]),
      ),
    ),
  );
