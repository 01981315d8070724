/// <reference lib="webworker" />
import type { FromWorker, IndexInfo, ToWorker } from './search-protocol';
import { ShardedIndex } from './sharded-index';

// Fetches the first index and the shards a query needs, indexes them and answers queries — all off
// the page's main thread.

declare const self: DedicatedWorkerGlobalScope;

const reply = (m: FromWorker) => self.postMessage(m);

// several shards may land within a few milliseconds: tell the page once they have settled
let progressTimer: ReturnType<typeof setTimeout> | null = null;
let latest = 0;
const index = new ShardedIndex((arrived) => {
  latest = arrived;
  progressTimer ??= setTimeout(() => {
    progressTimer = null;
    reply({ id: null, type: 'progress', loaded: latest });
  }, 60);
});

let loading: Promise<IndexInfo> | null = null;

self.onmessage = async (e: MessageEvent<ToWorker>) => {
  const msg = e.data;
  try {
    if (msg.type === 'load') {
      loading ??= index.load().finally(() => (loading = null));
      reply({ id: msg.id, type: 'loaded', info: await loading });
    } else {
      if (loading) await loading;
      reply({ id: msg.id, type: 'result', response: await index.answer(msg.request) });
    }
  } catch (err) {
    reply({ id: msg.id, type: 'error', message: err instanceof Error ? err.message : 'Search failed.' });
  }
};
