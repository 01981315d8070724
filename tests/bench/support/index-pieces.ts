import { createHash } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import type { SearchDocument } from '../../../shared/search/search-document';
import { buildPieces, type IndexPieces, type SearchTerms } from '../../../shared/search/shard-plan';
import { IndexPartGone, searchIndexPaths, type FetchIndexPart } from '../../../src/features/search/api/get-search-index';

// The search index in pieces served from memory at the addresses the app uses, for the worker's own
// loading code in tests and in the benchmark: every fetch is logged with its gzipped size.

const addressHash = (text: string) => createHash('sha256').update(text).digest('base64url').slice(0, 16);

/** one fetch: `arrived` once its body is in the reader's hands */
export type Fetch = { path: string; gzBytes: number; arrived: boolean };

export function servePieces(docs: SearchDocument[], catalogue: SearchDocument['chassis'][], shardTarget?: number) {
  const pieces: IndexPieces = buildPieces(docs, catalogue, addressHash, shardTarget);
  const { generation } = pieces.head;
  const texts = new Map<string, string>([[searchIndexPaths.head(), JSON.stringify(pieces.head)]]);
  for (const s of pieces.shards) texts.set(searchIndexPaths.shard(s), s.json);
  const termsAt = (key: string) => searchIndexPaths.terms(generation, key);
  for (const [key, table] of pieces.terms) texts.set(termsAt(key), JSON.stringify(table));
  const gz = new Map<string, number>();
  const gzBytes = (path: string) => {
    let n = gz.get(path);
    if (n === undefined) gz.set(path, (n = gzipSync(texts.get(path)!).length));
    return n;
  };

  /** a reader's connection: its own log of what it fetched */
  const connect = () => {
    const log: Fetch[] = [];
    const fetchPart: FetchIndexPart = async <T>(path: string) => {
      // like the server: a code table no term starts with is empty, an unknown shard is gone
      const key = decodeURIComponent(path.split('/').at(-1)!);
      if (!texts.has(path) && path === termsAt(key))
        texts.set(path, JSON.stringify({ generation, key, terms: {} } satisfies SearchTerms));
      if (!texts.has(path)) throw new IndexPartGone(`nothing at ${path}`);
      const entry = { path, gzBytes: gzBytes(path), arrived: false };
      log.push(entry);
      // a real fetch resolves on a later turn; so do these, so the worker's ordering is exercised
      await new Promise((resolve) => setImmediate(resolve));
      entry.arrived = true;
      return { status: 'fresh', etag: null, body: JSON.parse(texts.get(path)!) as T };
    };
    /** gzipped bytes of every piece that has arrived so far */
    const arrivedBytes = () => log.reduce((n, f) => n + (f.arrived ? f.gzBytes : 0), 0);
    return { fetchPart, log, arrivedBytes };
  };
  return { pieces, gzBytes, connect, ...connect() };
}
