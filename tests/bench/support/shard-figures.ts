import { performance } from 'node:perf_hooks';
import type { SearchDocument } from '../../../shared/search/search-document';
import { ShardRouter } from '../../../shared/search/shard-routing';
import { ShardedIndex } from '../../../src/features/search/worker/sharded-index';
import { searchIndexPaths } from '../../../src/features/search/api/get-search-index';
import { servePieces } from './index-pieces';

// The sharded index as a reader meets it, through the worker's own loading code: what arrives before
// the first result, and what each keystroke costs once the shards it needs are in.

const percentile = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))];
};
const spread = (xs: number[]) => ({ p50: percentile(xs, 50), p95: percentile(xs, 95), max: Math.max(...xs) });

/** what a reader types, keystroke by keystroke: every prefix of the query */
const keystrokes = (q: string) => Array.from({ length: q.length }, (_, i) => q.slice(0, i + 1)).filter((s) => s.trim());

export function measureShards(docs: SearchDocument[], catalogue: SearchDocument['chassis'][], queries: string[]) {
  const t0 = performance.now();
  const served = servePieces(docs, catalogue);
  const splitMs = performance.now() - t0;
  const { head, shards } = served.pieces;
  const headGz = served.gzBytes(searchIndexPaths.head());
  const shardGz = shards.map((s) => served.gzBytes(searchIndexPaths.shard(s)));
  const headJson = JSON.stringify(head);
  const t1 = performance.now();
  new ShardRouter(JSON.parse(headJson));
  const headParseMs = performance.now() - t1;

  return {
    splitMs,
    shardCount: shards.length,
    headGz,
    shardGz: spread(shardGz),
    headParseMs,

    /** A fresh reader per query: opening a shared link (whole query at once) and typing it key by key. */
    async firstResult() {
      const opened: number[] = [];
      const typed: number[] = [];
      const firstAnswerMs: number[] = [];
      for (const q of queries) {
        const link = served.connect();
        const reader = new ShardedIndex(() => undefined, link.fetchPart);
        const t = performance.now();
        await reader.answer({ q, limit: 20 });
        firstAnswerMs.push(performance.now() - t);
        opened.push(link.arrivedBytes());

        const typing = served.connect();
        const typist = new ShardedIndex(() => undefined, typing.fetchPart);
        for (const k of keystrokes(q)) {
          const a = await typist.answer({ q: k, limit: 20 });
          // a keystroke too short to search shows the browse page: not yet a result for the query
          if (a.words > 0 && a.total > 0) break;
        }
        typed.push(typing.arrivedBytes());
      }
      return { opened: spread(opened), typed: spread(typed), firstAnswerMs: spread(firstAnswerMs) };
    },

    /** One warm reader with every shard in: the worker's time per keystroke (routing, search, facets, page). */
    async keystrokeCost() {
      const reader = new ShardedIndex(() => undefined, served.fetchPart);
      const t = performance.now();
      await reader.answer({ filters: { axle: 'front' }, limit: 20 }, { complete: true });
      const loadAllMs = performance.now() - t;
      const strokes = queries.flatMap(keystrokes);
      for (const k of strokes) await reader.answer({ q: k, limit: 20 }, { complete: true });
      const ms: number[] = [];
      for (const k of strokes) {
        const s = performance.now();
        await reader.answer({ q: k, limit: 20 });
        ms.push(performance.now() - s);
      }
      return { strokes: strokes.length, loadAllMs, ms: spread(ms) };
    },
  };
}
