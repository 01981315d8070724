import type { SearchRequest } from '@shared/search/search-types';
import type { FromWorker, IndexInfo, SearchAnswer, ToWorker } from './search-protocol';

export type SearchClient = {
  load(): Promise<IndexInfo>;
  query(request: SearchRequest): Promise<SearchAnswer>;
  /** called with a growing count whenever more shards arrive; returns the unsubscribe */
  onProgress(listener: (loaded: number) => void): () => void;
};

type WithoutId<T> = T extends unknown ? Omit<T, 'id'> : never;
type Pending = { resolve: (m: FromWorker) => void; reject: (e: Error) => void };

/** The page's side of the search worker: one worker per tab, started on first use. */
function createSearchClient(): SearchClient {
  let worker: Worker | null = null;
  let seq = 0;
  const pending = new Map<number, Pending>();
  const listeners = new Set<(loaded: number) => void>();

  const start = () => {
    const w = new Worker(new URL('./search.worker.ts', import.meta.url), { type: 'module', name: 'swap-search' });
    w.onmessage = (e: MessageEvent<FromWorker>) => {
      if (e.data.id === null) {
        const { loaded } = e.data;
        listeners.forEach((l) => l(loaded));
        return;
      }
      const p = pending.get(e.data.id);
      if (!p) return;
      pending.delete(e.data.id);
      if (e.data.type === 'error') p.reject(new Error(e.data.message));
      else p.resolve(e.data);
    };
    w.onerror = (e) => {
      for (const p of pending.values()) p.reject(new Error(e.message || 'The search worker stopped.'));
      pending.clear();
      worker = null;
    };
    return w;
  };

  const send = (msg: WithoutId<ToWorker>) =>
    new Promise<FromWorker>((resolve, reject) => {
      worker ??= start();
      const id = ++seq;
      pending.set(id, { resolve, reject });
      worker.postMessage({ ...msg, id } as ToWorker);
    });

  return {
    load: async () => {
      const m = await send({ type: 'load' });
      if (m.type !== 'loaded') throw new Error('Unexpected answer from the search worker.');
      return m.info;
    },
    query: async (request) => {
      const m = await send({ type: 'query', request });
      if (m.type !== 'result') throw new Error('Unexpected answer from the search worker.');
      return m.response;
    },
    onProgress: (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

export const searchClient = createSearchClient();
