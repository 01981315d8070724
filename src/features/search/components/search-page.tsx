import { useEffect, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { useNavigationType, useSearchParams } from 'react-router';
import { categoryLabels, machiningLevelLabels, type Category, type MachiningLevel } from '@shared/schemas/enums';
import type { FilterKey, SearchFilters, SearchResponse, SearchSort } from '@shared/search/search-types';
import { Page } from '../../../components/ui/page';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/caution';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { useSearch } from '../hooks/use-search';
import { SearchResult } from './search-result';
import { costBucketLabel, SearchFacetsPanel } from './search-facets';
import { PAGE_SIZE, readState, withFilter, writeState, type SearchState } from './search-state';
import type { IndexInfo } from '../worker/search-protocol';
import { chassisName } from '@shared/chassis-label';

const sortLabels: Record<SearchSort, string> = { relevance: 'Best match', newest: 'Newest', fitted: 'Most fitted' };

function filterLabel(key: FilterKey, filters: SearchFilters, info: IndexInfo | undefined): string {
  const v = filters[key];
  switch (key) {
    case 'axle':
      return v === 'front' ? 'Front axle' : 'Rear axle';
    case 'category':
      return categoryLabels[v as Category];
    case 'wheel':
      return `${v}″ wheels`;
    case 'machining':
      return machiningLevelLabels[v as MachiningLevel];
    case 'parkingBrake':
      return v === 'yes' ? 'Parking brake kept' : 'Parking brake lost';
    case 'cost':
      return costBucketLabel(String(v), info?.currency ?? null);
    case 'chassis': {
      const c = info?.chassis.find((x) => x.slug === v);
      return c ? chassisName(c) : String(v);
    }
    default:
      return String(v);
  }
}

export default function SearchPage() {
  const [params, setParams] = useSearchParams();
  const state = useMemo(() => readState(params), [params]);
  const request = useMemo(
    () => ({ q: state.q, filters: state.filters, sort: state.sort, offset: (state.page - 1) * PAGE_SIZE, limit: PAGE_SIZE }),
    [state],
  );
  const { index, results } = useSearch(request);
  const [text, setText] = useState(state.q);
  const [filtersOpen, setFiltersOpen] = useState(false);
  const inputRef = useRef<HTMLInputElement>(null);
  const listRef = useRef<HTMLOListElement>(null);

  const navigationType = useNavigationType();
  // back/forward or a link changes the address: the box follows it. While someone types, the address
  // trails the box by a render or two, so it must not overwrite what they have just typed.
  useEffect(() => {
    if (navigationType !== 'POP' && document.activeElement === inputRef.current) return;
    setText((t) => (t.trim() === state.q ? t : state.q));
  }, [state.q, navigationType]);

  // "/" jumps to the search box from anywhere on the page
  useEffect(() => {
    const onKey = (e: globalThis.KeyboardEvent) => {
      const el = e.target as HTMLElement | null;
      const typing = el && (el.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(el.tagName));
      if (e.key === '/' && !typing && !e.metaKey && !e.ctrlKey && !e.altKey) {
        e.preventDefault();
        inputRef.current?.focus();
        inputRef.current?.select();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, []);

  const go = (next: SearchState, replace = false) => setParams(writeState(next), { replace, preventScrollReset: replace });
  const setFilter = (key: FilterKey, value: string | number | undefined) =>
    go({ ...state, filters: withFilter(state.filters, key, value), page: 1 });

  const onType = (value: string) => {
    setText(value);
    // typing refines one search: the first keystroke makes a history entry, the rest replace it
    go({ ...state, q: value.trim(), page: 1 }, state.q !== '');
  };

  const resultLinks = () => Array.from(listRef.current?.querySelectorAll<HTMLAnchorElement>('a[data-result-link]') ?? []);
  const moveFocus = (from: Element | null, step: number) => {
    const links = resultLinks();
    const i = links.findIndex((l) => l === from);
    const next = links[Math.max(0, Math.min(links.length - 1, i + step))];
    if (next) next.focus();
    else if (step < 0) inputRef.current?.focus();
  };
  const onListKey = (e: KeyboardEvent<HTMLOListElement>) => {
    const links = resultLinks();
    const i = links.findIndex((l) => l === document.activeElement);
    if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      e.preventDefault();
      if (e.key === 'ArrowUp' && i === 0) inputRef.current?.focus();
      else moveFocus(document.activeElement, e.key === 'ArrowDown' ? 1 : -1);
    } else if (e.key === 'Home') {
      e.preventDefault();
      links[0]?.focus();
    } else if (e.key === 'End') {
      e.preventDefault();
      links.at(-1)?.focus();
    }
  };

  const data = results.data;
  const info = index.data;
  const activeFilters = Object.keys(state.filters) as FilterKey[];
  const pages = data ? Math.max(1, Math.ceil(data.total / PAGE_SIZE)) : 1;
  const sort = data?.sort ?? state.sort ?? (state.q ? 'relevance' : 'newest');

  return (
    <Page title={state.q ? `“${state.q}” — search` : 'Search swaps'}>
      <form role="search" className="mb-6" onSubmit={(e) => e.preventDefault()}>
        <h1 className="mb-2 text-2xl font-extrabold tracking-tight text-ink sm:text-3xl">
          <label htmlFor="search-q">Find a swap that fits</label>
        </h1>
        <div className="relative">
          <input
            ref={inputRef}
            id="search-q"
            type="search"
            value={text}
            onChange={(e) => onType(e.target.value)}
            onKeyDown={(e) => {
              if (e.key === 'ArrowDown') {
                e.preventDefault();
                resultLinks()[0]?.focus();
              }
            }}
            autoComplete="off"
            spellCheck={false}
            aria-describedby="search-help"
            aria-controls="search-results"
            placeholder="Chassis code, car or part number — H31, Vela caliper, OV-355-104-L"
            className="min-h-12 w-full rounded-lg border border-ink/25 bg-paper-card px-4 pr-12 text-base text-graphite shadow-inner placeholder:text-graphite-soft/70 focus:border-ink"
          />
          <kbd
            className="pointer-events-none absolute right-3 top-1/2 hidden -translate-y-1/2 rounded border border-graphite/25 px-1.5 text-xs text-graphite-soft sm:block"
            aria-hidden
          >
            /
          </kbd>
        </div>
        <p id="search-help" className="mt-2 text-xs text-graphite-soft">
          Part numbers match with or without dashes. Press / to come back here, ↓ to walk through the results.
        </p>
      </form>

      {index.isError ? (
        <ErrorNotice error={index.error}>
          <Button variant="secondary" onClick={() => void index.refetch()}>
            Try again
          </Button>
        </ErrorNotice>
      ) : !info || !data ? (
        <Loading label="Loading the swap index…" />
      ) : (
        <div className="grid gap-6 lg:grid-cols-[17rem_1fr] lg:gap-10">
          <aside aria-label="Filters" className="lg:sticky lg:top-4 lg:self-start">
            <Button
              variant="secondary"
              className="w-full lg:hidden"
              aria-expanded={filtersOpen}
              aria-controls="search-facets"
              onClick={() => setFiltersOpen((o) => !o)}
            >
              {filtersOpen ? 'Hide filters' : `Filters${activeFilters.length ? ` (${activeFilters.length})` : ''}`}
            </Button>
            <div
              id="search-facets"
              className={`${filtersOpen ? 'mt-4 block' : 'hidden'} rounded-xl border border-ink/10 bg-paper-card p-4 lg:mt-0 lg:block lg:border-0 lg:bg-transparent lg:p-0`}
            >
              <SearchFacetsPanel
                facets={data.facets}
                filters={state.filters}
                chassis={info.chassis}
                currency={info.currency}
                onChange={setFilter}
                onClear={() => go({ ...state, filters: {}, page: 1 })}
              />
            </div>
          </aside>

          <section aria-labelledby="results-heading" className="min-w-0">
            <div className="mb-4 flex flex-wrap items-end justify-between gap-3">
              <div>
                <h2 id="results-heading" className="text-lg font-extrabold text-ink" aria-live="polite">
                  <span className="tabular">{data.total.toLocaleString('en-GB')}</span> {data.total === 1 ? 'swap' : 'swaps'}
                  {state.q ? <> for “{state.q}”</> : null}
                </h2>
                <p className="text-xs text-graphite-soft">
                  out of <span className="tabular">{info.documentCount.toLocaleString('en-GB')}</span> approved
                  {data.pending > 0 && <> · more arriving as the rest of the index loads</>}
                </p>
              </div>
              <label className="flex items-center gap-2 text-sm font-bold text-graphite">
                Sort
                <select
                  value={sort}
                  onChange={(e) => go({ ...state, sort: e.target.value as SearchSort, page: 1 })}
                  className="min-h-10 rounded-md border border-graphite/25 bg-paper-card px-2 text-sm"
                >
                  {(['relevance', 'newest', 'fitted'] as const).map((s) => (
                    <option key={s} value={s} disabled={s === 'relevance' && !state.q}>
                      {sortLabels[s]}
                    </option>
                  ))}
                </select>
              </label>
            </div>

            {activeFilters.length > 0 && (
              <ul className="mb-4 flex flex-wrap gap-2" aria-label="Active filters">
                {activeFilters.map((k) => (
                  <li key={k}>
                    <button
                      type="button"
                      onClick={() => setFilter(k, undefined)}
                      className="inline-flex min-h-8 items-center gap-1.5 rounded-full bg-ink-faint px-3 text-sm font-bold text-ink hover:bg-brass-soft"
                      aria-label={`Remove filter ${filterLabel(k, state.filters, info)}`}
                    >
                      {filterLabel(k, state.filters, info)} <span aria-hidden>×</span>
                    </button>
                  </li>
                ))}
              </ul>
            )}

            <WordsMatched data={data} q={state.q} />

            {data.total === 0 && data.pending > 0 ? (
              <Loading label="Searching the rest of the index…" />
            ) : data.total === 0 ? (
              <NoResults
                state={state}
                data={data}
                info={info}
                onRemove={(k) => setFilter(k, undefined)}
                onClearQuery={() => onType('')}
              />
            ) : (
              <>
                <ol id="search-results" ref={listRef} onKeyDown={onListKey} className="flex flex-col gap-3" aria-label="Results">
                  {data.hits.map((h) => (
                    <li key={h.doc.id}>
                      <SearchResult doc={h.doc} />
                    </li>
                  ))}
                </ol>
                {pages > 1 && (
                  <nav aria-label="Result pages" className="mt-6 flex items-center justify-between gap-3">
                    <Button variant="secondary" disabled={state.page <= 1} onClick={() => go({ ...state, page: state.page - 1 })}>
                      Previous
                    </Button>
                    <span className="tabular text-sm text-graphite-soft">
                      Page {state.page} of {pages}
                    </span>
                    <Button
                      variant="secondary"
                      disabled={state.page >= pages}
                      onClick={() => go({ ...state, page: state.page + 1 })}
                    >
                      Next
                    </Button>
                  </nav>
                )}
              </>
            )}
            <div className="mt-8">
              <Caution topics={['brakes', 'wheels']} />
            </div>
          </section>
        </div>
      )}
    </Page>
  );
}

/** With several words, how many swaps have them all: those come first, the rest have some of them. */
function WordsMatched({ data, q }: { data: SearchResponse; q: string }) {
  if (data.words < 2 || data.total === 0 || data.matchedAll === data.total) return null;
  const some = data.total - data.matchedAll;
  return (
    <p role="status" className="mb-4 rounded-lg border-l-4 border-brass bg-brass-soft/50 px-4 py-3 text-sm text-graphite">
      {data.matchedAll === 0 ? (
        <>
          No swap matches every word of “{q}”. These match some of them — check the spelling of a code or part number, or drop a
          word.
        </>
      ) : (
        <>
          <strong className="tabular">{data.matchedAll.toLocaleString('en-GB')}</strong>{' '}
          {data.matchedAll === 1 ? 'swap matches' : 'swaps match'} every word and {data.matchedAll === 1 ? 'comes' : 'come'}{' '}
          first; the other <span className="tabular">{some.toLocaleString('en-GB')}</span> match some of them.
        </>
      )}
    </p>
  );
}

function NoResults({
  state,
  data,
  info,
  onRemove,
  onClearQuery,
}: {
  state: SearchState;
  data: SearchResponse;
  info: IndexInfo;
  onRemove: (k: FilterKey) => void;
  onClearQuery: () => void;
}) {
  const helpful = data.relax.filter((r) => r.total > 0).sort((a, b) => b.total - a.total);
  return (
    <div className="rounded-xl border border-dashed border-ink/25 bg-paper-card p-6">
      <h3 className="text-lg font-extrabold text-ink">Nothing fits all of that yet</h3>
      {helpful.length > 0 ? (
        <>
          <p className="mt-2 text-graphite">Letting go of one filter would bring swaps back:</p>
          <ul className="mt-3 flex flex-wrap gap-2">
            {helpful.map((r) => (
              <li key={r.filter}>
                <Button variant="secondary" onClick={() => onRemove(r.filter)}>
                  Without “{filterLabel(r.filter, state.filters, info)}” — {r.total} {r.total === 1 ? 'swap' : 'swaps'}
                </Button>
              </li>
            ))}
          </ul>
        </>
      ) : (
        <p className="mt-2 text-graphite">
          {state.q
            ? 'Try fewer words, a shorter part of the part number, or the chassis code alone.'
            : 'No approved swap has these properties together. Clear a filter or two.'}
        </p>
      )}
      {state.q && (
        <div className="mt-4">
          <Button variant="quiet" onClick={onClearQuery}>
            Clear the words and keep the filters
          </Button>
        </div>
      )}
    </div>
  );
}
