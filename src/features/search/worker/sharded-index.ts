import { addDocuments, createIndex, search, type SearchIndex } from '@shared/search/search-engine';
import type { SearchDocument } from '@shared/search/search-document';
import type { FacetValue, SearchRequest } from '@shared/search/search-types';
import type { SearchHead, SearchShard, SearchTerms, ShardInfo } from '@shared/search/shard-plan';
import { ShardRouter } from '@shared/search/shard-routing';
import { fetchIndexPart, IndexPartGone, searchIndexPaths, type FetchIndexPart } from '../api/get-search-index';
import type { IndexInfo, SearchAnswer } from './search-protocol';

// The worker's view of the search index: the first index, and the shards fetched so far. A request
// is answered as soon as one shard it needs is in; the rest follow, and `onProgress` tells the page.
// Once every shard a request needs is in, the answer is the one the whole index gives.

type Job = { shard: number; resolve: () => void; reject: (e: unknown) => void };

/** Shards in flight at once; the very first goes alone, so the first answer waits for one shard only. */
const PARALLEL = 4;

const shardKey = (s: Pick<ShardInfo, 'id' | 'hash'>) => `${s.id}/${s.hash}`;

export class ShardedIndex {
  private head: SearchHead | null = null;
  private headEtag: string | null = null;
  private router: ShardRouter | null = null;
  private index: SearchIndex | null = null;
  private version = 0;
  private readonly loaded = new Set<number>();
  /** documents of the shards fetched, by shard id and hash, kept when a new first index names the same shard */
  private held = new Map<string, SearchDocument[]>();
  private readonly inflight = new Map<number, Promise<void>>();
  private readonly terms = new Map<string, Promise<void>>();
  private queue: Job[] = [];
  private running = 0;
  /** shards taken in since the worker started, whichever first index they belong to */
  private arrived = 0;

  constructor(
    /** called with a count that grows whenever a shard arrives: answers given before may now be fuller */
    private readonly onProgress: (arrived: number) => void,
    private readonly fetchPart: FetchIndexPart = fetchIndexPart,
  ) {}

  /** Fetches (or revalidates) the first index; shards already held at the same hash go straight back in. */
  async load(): Promise<IndexInfo> {
    const got = await this.fetchPart<SearchHead>(searchIndexPaths.head(), this.head ? this.headEtag : null);
    if (got.status === 'fresh') this.take(got.body, got.etag);
    if (!this.head) throw new Error('The swap index answered without a body.');
    return this.info();
  }

  info(): IndexInfo {
    const head = this.head!;
    return { version: this.version, documentCount: head.documentCount, chassis: head.chassis, currency: head.currency };
  }

  private take(head: SearchHead, etag: string | null) {
    const router = new ShardRouter(head);
    const index = createIndex(head.stats);
    index.text.useWholeDocFreq((term) => router.docFreq(term));
    this.head = head;
    this.headEtag = etag;
    this.router = router;
    this.index = index;
    this.version++;
    this.loaded.clear();
    this.inflight.clear();
    this.terms.clear();
    for (const job of this.queue) job.reject(new IndexPartGone('The swap index changed while it was loading.'));
    this.queue = [];
    const held = this.held;
    this.held = new Map();
    head.shards.forEach((s, i) => {
      const docs = held.get(shardKey(s));
      if (docs) this.add(i, docs);
    });
  }

  private add(shard: number, docs: SearchDocument[]) {
    addDocuments(this.index!, docs);
    this.held.set(shardKey(this.head!.shards[shard]), docs);
    this.loaded.add(shard);
  }

  private loadTerms(key: string): Promise<void> {
    let p = this.terms.get(key);
    if (!p) {
      const router = this.router!;
      p = this.fetchPart<SearchTerms>(searchIndexPaths.terms(this.head!.generation, key), null).then((got) => {
        if (got.status === 'fresh') router.addTerms(got.body);
      });
      p.catch(() => this.terms.delete(key));
      this.terms.set(key, p);
    }
    return p;
  }

  /** Queues the shards (ahead of older requests'), one promise per shard. */
  private fetchShards(shards: number[]): Promise<void>[] {
    const waits = shards.map((s) => {
      let p = this.inflight.get(s);
      if (!p) {
        p = new Promise<void>((resolve, reject) => this.queue.push({ shard: s, resolve, reject }));
        p.catch(() => undefined);
        this.inflight.set(s, p);
      }
      return p;
    });
    // this request's shards go first, in its order; older requests' keep theirs behind them
    const order = new Map(shards.map((s, i) => [s, i]));
    this.queue.sort((a, b) => (order.get(a.shard) ?? Infinity) - (order.get(b.shard) ?? Infinity));
    this.pump();
    return waits;
  }

  private pump() {
    const limit = this.loaded.size === 0 ? 1 : PARALLEL;
    while (this.running < limit && this.queue.length > 0) {
      const job = this.queue.shift()!;
      this.running++;
      this.fetchShard(job.shard)
        .then(job.resolve, (e) => {
          this.inflight.delete(job.shard);
          job.reject(e);
        })
        .finally(() => {
          this.running--;
          this.pump();
        });
    }
  }

  private async fetchShard(i: number) {
    const head = this.head!;
    const got = await this.fetchPart<SearchShard>(searchIndexPaths.shard(head.shards[i]), null);
    if (this.head !== head || this.loaded.has(i)) return;
    if (got.status !== 'fresh') throw new Error('A part of the swap index answered without a body.');
    this.add(i, got.body.documents);
    this.onProgress(++this.arrived);
  }

  /**
   * Answers from what is loaded once one shard the request needs is in (`complete`: once all are).
   * A part the first index named that is gone means the index changed: it is read again, and the
   * request asked again once.
   */
  async answer(request: SearchRequest, { complete = false } = {}): Promise<SearchAnswer> {
    try {
      return await this.answerOnce(request, complete);
    } catch (e) {
      if (!(e instanceof IndexPartGone || e instanceof AggregateError)) throw e;
      await this.load();
      return this.answerOnce(request, complete);
    }
  }

  private async answerOnce(request: SearchRequest, complete: boolean): Promise<SearchAnswer> {
    if (!this.head) await this.load();
    const head = this.head!;
    const router = this.router!;
    await Promise.all(router.missingKeys(request.q).map((k) => this.loadTerms(k)));
    const route = router.route(request);
    if (route.browse) return { ...(request.sort === 'fitted' ? head.browse.fitted : head.browse.newest), pending: 0 };
    const missing = route.shards.filter((s) => !this.loaded.has(s));
    if (missing.length > 0) {
      const waits = this.fetchShards(missing);
      if (complete) await Promise.all(waits);
      else if (missing.length === route.shards.length) await Promise.any(waits);
    }
    if (this.head !== head) throw new IndexPartGone('The swap index changed while it was loading.');
    const response = search(this.index!, request);
    const pending = route.shards.filter((s) => !this.loaded.has(s)).length;
    const answer: SearchAnswer = { ...response, documentCount: head.documentCount, pending };
    return route.restricted ? withinScope(answer, request, head) : answer;
  }
}

/**
 * Only the chosen make's shards are loaded: other makes' counts are unknown, so the make and model
 * lists keep the chosen values, and "without this filter" counts for them are left out.
 */
function withinScope(answer: SearchAnswer, request: SearchRequest, head: SearchHead): SearchAnswer {
  const f = request.filters ?? {};
  const picked = head.chassis.find((c) => c.slug === f.chassis);
  const keep = (chosen: string | undefined) => (v: FacetValue) => chosen === undefined || v.value === chosen;
  return {
    ...answer,
    facets: {
      ...answer.facets,
      make: answer.facets.make.filter(keep(f.make ?? picked?.make)),
      model: answer.facets.model.filter(keep(f.model ?? picked?.model)),
    },
    relax: answer.relax.filter((r) => r.filter !== 'make' && r.filter !== 'model' && r.filter !== 'chassis'),
  };
}
