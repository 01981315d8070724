/// <reference lib="webworker" />
import { buildIndex, search, type SearchIndex } from '@shared/search/search-engine';
import { getSearchIndex } from '../api/get-search-index';
import type { ChassisOption, FromWorker, IndexInfo, ToWorker } from './search-protocol';

// Fetches, parses and indexes every approved swap, then answers queries — all off the page's main thread.

declare const self: DedicatedWorkerGlobalScope;

let index: SearchIndex | null = null;
let info: IndexInfo | null = null;
let etag: string | null = null;
let loading: Promise<IndexInfo> | null = null;

async function load(): Promise<IndexInfo> {
  const got = await getSearchIndex(index ? etag : null);
  if (got.status === 'unchanged' && info) return info;
  if (got.status !== 'fresh') throw new Error('The swap index answered without a body.');
  const t0 = performance.now();
  index = buildIndex(got.documents);
  etag = got.etag;
  const chassis = new Map<string, ChassisOption>();
  const currencies = new Set<string>();
  for (const d of got.documents) {
    chassis.set(d.chassis.slug, d.chassis);
    if (d.cost) currencies.add(d.cost.currency);
  }
  info = {
    version: (info?.version ?? 0) + 1,
    documentCount: got.documents.length,
    buildMs: Math.round(performance.now() - t0),
    chassis: [...chassis.values()].sort((a, b) =>
      `${a.make} ${a.model} ${a.code}`.localeCompare(`${b.make} ${b.model} ${b.code}`),
    ),
    currency: currencies.size === 1 ? [...currencies][0] : null,
  };
  return info;
}

const reply = (m: FromWorker) => self.postMessage(m);

self.onmessage = async (e: MessageEvent<ToWorker>) => {
  const msg = e.data;
  try {
    if (msg.type === 'load') {
      loading ??= load().finally(() => (loading = null));
      reply({ id: msg.id, type: 'loaded', info: await loading });
    } else {
      if (loading) await loading;
      if (!index) throw new Error('The swap index is not loaded yet.');
      reply({ id: msg.id, type: 'result', response: search(index, msg.request) });
    }
  } catch (err) {
    reply({ id: msg.id, type: 'error', message: err instanceof Error ? err.message : 'Search failed.' });
  }
};
