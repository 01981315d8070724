import { useRef, useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router';
import type { RowSelectionState } from '@tanstack/react-table';
import { bulkDeclineSchema } from '@shared/schemas/submissions';
import { revisionStatusLabels } from '@shared/schemas/enums';
import { CLAIM_MINUTES, reviewQueueSearch, type ReviewQueueQuery } from '@shared/schemas/review-queue';
import { Page } from '../../../components/ui/page';
import { Button } from '../../../components/ui/button';
import { TextArea } from '../../../components/ui/field';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { ApiError } from '../../../lib/api-client';
import { useShortcuts, type Shortcut } from '../../../lib/use-shortcuts';
import { paths } from '../../../config/paths';
import { queueQueryFrom, useReviewQueue } from '../api/get-review-queue';
import { useClaimNext } from '../api/claims';
import { useBulkDecline } from '../api/bulk-decline';
import { FlagsPanel } from './flags-panel';
import { QueueFilters } from './queue-filters';
import { QueueTable } from './queue-table';
import { ShortcutList } from './shortcut-list';

/** `/review`: what waits for a moderator, oldest first, filtered and a page at a time, with the open flags. */
export default function ReviewDeskPage() {
  const [params, setParams] = useSearchParams();
  const navigate = useNavigate();
  const query = queueQueryFrom(params);
  const { page: _page, ...filters } = query;
  const filterSearch = reviewQueueSearch(filters);
  const queue = useReviewQueue(query);
  const next = useClaimNext();
  const [nextNote, setNextNote] = useState<string | null>(null);
  const [selection, setSelection] = useState<RowSelectionState>({});
  const searchRef = useRef<HTMLInputElement>(null);

  const setAddress = (q: Partial<ReviewQueueQuery>) => {
    setParams(new URLSearchParams(reviewQueueSearch(q)), { replace: true });
    setSelection({});
  };
  const setFilter = (key: keyof ReviewQueueQuery, value: string) => setAddress({ ...query, [key]: value || undefined, page: 1 });

  const openNext = async () => {
    setNextNote(null);
    try {
      const found = await next.mutateAsync({ filters });
      if (found.revisionId === null) setNextNote('Nothing unclaimed is waiting in this filter.');
      else navigate(`${paths.reviewRevision(found.revisionId)}${filterSearch ? `?${filterSearch}` : ''}`);
    } catch (err) {
      setNextNote(err instanceof ApiError ? err.message : 'That did not work. Try again.');
    }
  };

  const data = queue.data;
  const items = data?.items ?? [];
  const lastPage = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  const shortcuts: Shortcut[] = [
    { key: 'n', label: 'Claim and open the next unclaimed submission in this filter', run: () => void openNext() },
    { key: '/', label: 'Search the queue', run: () => searchRef.current?.focus() },
    { key: ']', label: 'Next page', run: () => query.page < lastPage && setAddress({ ...query, page: query.page + 1 }) },
    { key: '[', label: 'Previous page', run: () => query.page > 1 && setAddress({ ...query, page: query.page - 1 }) },
  ];
  useShortcuts(shortcuts);
  const selectedIds = Object.keys(selection)
    .filter((k) => selection[k])
    .map(Number);
  const counts = data?.counts;

  return (
    <Page
      title="Review desk"
      heading="Review desk"
      lead={`Submissions and corrections waiting for a moderator, oldest first. Claim one while you work on it: others see it is taken, and a claim lapses after ${CLAIM_MINUTES} minutes. A revision reaches search only when it is published here.`}
    >
      {counts && (
        <ul className="mb-6 grid grid-cols-3 gap-2 sm:flex sm:flex-wrap sm:gap-3" aria-label="Counts">
          <Count label={revisionStatusLabels.in_review} value={counts.in_review} />
          <Count label={revisionStatusLabels.sent_back} value={counts.sent_back} />
          <Count label="Open flags" value={counts.flags} href="#flags" />
        </ul>
      )}

      <QueueFilters
        query={query}
        onChange={setFilter}
        onClear={() => setAddress({ status: query.status })}
        searchRef={searchRef}
      />

      <div className="mb-4 flex flex-wrap items-center gap-3">
        <Button onClick={() => void openNext()} disabled={next.isPending}>
          {next.isPending ? 'Finding the next…' : 'Open the next unclaimed'}
        </Button>
        {data && (
          <p className="text-sm text-graphite" aria-live="polite">
            {data.total === 0
              ? 'None match.'
              : `${(data.page - 1) * data.pageSize + 1}–${(data.page - 1) * data.pageSize + items.length} of ${data.total}`}
          </p>
        )}
        {nextNote && (
          <p role="status" className="text-sm font-semibold text-ink">
            {nextNote}
          </p>
        )}
      </div>

      {queue.isPending ? (
        <Loading label="Loading the queue…" />
      ) : queue.isError ? (
        <ErrorNotice error={queue.error} />
      ) : items.length === 0 ? (
        <p className="rounded-lg bg-paper-card p-6 text-graphite">Nothing waits here with these filters.</p>
      ) : (
        <>
          <QueueTable items={items} search={filterSearch} selection={selection} onSelectionChange={setSelection} />
          {lastPage > 1 && (
            <nav className="mt-3 flex items-center gap-3 text-sm" aria-label="Queue pages">
              <Button
                variant="secondary"
                disabled={query.page <= 1}
                onClick={() => setAddress({ ...query, page: query.page - 1 })}
              >
                Previous page
              </Button>
              <span className="tabular">
                Page {query.page} of {lastPage}
              </span>
              <Button
                variant="secondary"
                disabled={query.page >= lastPage}
                onClick={() => setAddress({ ...query, page: query.page + 1 })}
              >
                Next page
              </Button>
            </nav>
          )}
          <BulkDecline ids={selectedIds} onDone={() => setSelection({})} />
        </>
      )}

      <ShortcutList shortcuts={shortcuts} />
      <FlagsPanel />
    </Page>
  );
}

function Count({ label, value, href }: { label: string; value: number; href?: string }) {
  const body = (
    <>
      <span className="tabular block text-2xl font-extrabold text-ink">{value}</span>
      <span className="text-xs text-graphite-soft">{label}</span>
    </>
  );
  return (
    <li className="rounded-lg border border-ink/10 bg-paper-card px-3 py-2 sm:min-w-32 sm:px-4">
      {href ? <a href={href}>{body}</a> : body}
    </li>
  );
}

/** Obvious spam: decline the selected revisions at once, with one reason the authors will read. */
function BulkDecline({ ids, onDone }: { ids: number[]; onDone: () => void }) {
  const [note, setNote] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const bulk = useBulkDecline();
  if (ids.length === 0)
    return done ? (
      <p role="status" className="mt-3 text-sm font-semibold text-ink">
        {done}
      </p>
    ) : null;
  const send = async () => {
    setError(null);
    const parsed = bulkDeclineSchema.safeParse({ revisionIds: ids, note });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message ?? 'Check the reason');
      return;
    }
    if (
      !window.confirm(
        `Publish none of these ${ids.length} ${ids.length === 1 ? 'revision' : 'revisions'}? The authors get this reason by e-mail.`,
      )
    )
      return;
    try {
      await bulk.mutateAsync(parsed.data);
      setDone(`${ids.length} ${ids.length === 1 ? 'revision' : 'revisions'} not published.`);
      setNote('');
      onDone();
    } catch (err) {
      setError(err instanceof ApiError ? (Object.values(err.fields)[0] ?? err.message) : 'That did not work. Try again.');
    }
  };
  return (
    <div className="mt-4 rounded-xl border border-oxide/40 bg-oxide-soft/40 p-4">
      <h2 className="font-extrabold text-oxide">Don’t publish the {ids.length} selected</h2>
      <TextArea
        label="Reason (sent to every author)"
        rows={2}
        value={note}
        onChange={(e) => setNote(e.target.value)}
        error={error ?? undefined}
        className="mt-2"
      />
      <Button variant="danger" className="mt-3" onClick={() => void send()} disabled={bulk.isPending}>
        {bulk.isPending ? 'Saving…' : `Don’t publish the selected (${ids.length})`}
      </Button>
    </div>
  );
}
