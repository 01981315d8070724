import { useMemo, useState } from 'react';
import { Link, useSearchParams } from 'react-router';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type RowSelectionState,
  type SortingState,
} from '@tanstack/react-table';
import type { ReviewQueueItem } from '@shared/schemas/submissions';
import { bulkDeclineSchema } from '@shared/schemas/submissions';
import { checkStatusLabels, revisionStatusLabels } from '@shared/schemas/enums';
import { Page } from '../../../components/ui/page';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Select, TextArea } from '../../../components/ui/field';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { ApiError } from '../../../lib/api-client';
import { paths } from '../../../config/paths';
import { useReviewQueue } from '../api/get-review-queue';
import { useChassisFilter } from '../api/get-chassis-filter';
import { useBulkDecline } from '../api/bulk-decline';
import { FlagsPanel } from './flags-panel';

const age = (iso: string | null) => {
  if (!iso) return '—';
  const days = Math.floor((Date.now() - Date.parse(iso)) / 86_400_000);
  return days <= 0 ? 'today' : days === 1 ? '1 day' : `${days} days`;
};

const col = createColumnHelper<ReviewQueueItem>();

/** `/review`: what waits for a moderator, oldest first, with the open flags. */
export default function ReviewDeskPage() {
  const [params, setParams] = useSearchParams();
  const filters = {
    status: params.get('status') ?? 'in_review',
    chassis: params.get('chassis') ?? '',
    olderThanDays: Number(params.get('olderThanDays')) || undefined,
  };
  const queue = useReviewQueue(filters);
  const chassis = useChassisFilter();
  const [selection, setSelection] = useState<RowSelectionState>({});
  const [sorting, setSorting] = useState<SortingState>([]);
  const setFilter = (key: string, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
    setSelection({});
  };

  const columns = useMemo(
    () => [
      col.display({
        id: 'select',
        header: ({ table }) => (
          <input
            type="checkbox"
            className="h-5 w-5 accent-ink"
            aria-label="Select all shown"
            checked={table.getIsAllRowsSelected()}
            ref={(el) => {
              if (el) el.indeterminate = table.getIsSomeRowsSelected();
            }}
            onChange={table.getToggleAllRowsSelectedHandler()}
          />
        ),
        cell: ({ row }) => (
          <input
            type="checkbox"
            className="h-5 w-5 accent-ink"
            aria-label={`Select “${row.original.title}”`}
            checked={row.getIsSelected()}
            disabled={!row.getCanSelect()}
            onChange={row.getToggleSelectedHandler()}
          />
        ),
      }),
      col.accessor('title', {
        header: 'Swap',
        cell: ({ row }) => (
          <div>
            <Link
              to={paths.reviewRevision(row.original.revisionId)}
              className="font-bold text-ink underline decoration-brass underline-offset-2"
            >
              {row.original.title}
            </Link>
            <div className="mt-1 flex flex-wrap gap-1">
              {row.original.isCorrection ? (
                <Badge tone="brass">Correction · rev. {row.original.number}</Badge>
              ) : (
                <Badge>New swap</Badge>
              )}
              <Badge tone="ink">{row.original.axle === 'front' ? 'Front' : 'Rear'}</Badge>
            </div>
            {/* on a phone the other columns fold into this line instead of scrolling sideways */}
            <p className="mt-1.5 flex flex-wrap items-center gap-x-2 gap-y-1 text-xs text-graphite-soft sm:hidden">
              <span>{row.original.chassis.label}</span>
              <span>@{row.original.author.login}</span>
              <span className="tabular">{age(row.original.submittedAt)}</span>
              <span className="font-bold text-graphite">{revisionStatusLabels[row.original.status]}</span>
              <CheckBadge failed={row.original.failedChecks} />
            </p>
          </div>
        ),
      }),
      col.accessor((r) => r.chassis.label, { id: 'chassis', header: 'Chassis' }),
      col.accessor((r) => r.author.name, {
        id: 'author',
        header: 'Author',
        cell: ({ row }) => (
          <span>
            {row.original.author.name}
            <span className="block text-xs text-graphite-soft">@{row.original.author.login}</span>
          </span>
        ),
      }),
      col.accessor('submittedAt', {
        header: 'Waiting',
        sortingFn: (a, b) => Date.parse(a.original.submittedAt ?? '') - Date.parse(b.original.submittedAt ?? ''),
        cell: ({ getValue }) => <span className="tabular whitespace-nowrap">{age(getValue())}</span>,
      }),
      col.accessor('status', { header: 'Status', cell: ({ getValue }) => revisionStatusLabels[getValue()] }),
      col.accessor('failedChecks', {
        header: 'Checks',
        cell: ({ getValue }) => <CheckBadge failed={getValue()} />,
      }),
    ],
    [],
  );

  const items = queue.data?.items ?? [];
  const table = useReactTable({
    data: items,
    columns,
    state: { rowSelection: selection, sorting },
    getRowId: (r) => String(r.revisionId),
    enableRowSelection: (row) => row.original.status === 'in_review',
    onRowSelectionChange: setSelection,
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  const selectedIds = Object.keys(selection)
    .filter((k) => selection[k])
    .map(Number);
  const counts = queue.data?.counts;

  return (
    <Page
      title="Review desk"
      heading="Review desk"
      lead="Submissions and corrections waiting for a moderator, oldest first. A revision reaches search only when it is published here."
    >
      {counts && (
        <ul className="mb-6 grid grid-cols-3 gap-2 sm:flex sm:flex-wrap sm:gap-3" aria-label="Counts">
          <Count label={revisionStatusLabels.in_review} value={counts.in_review} />
          <Count label={revisionStatusLabels.sent_back} value={counts.sent_back} />
          <Count label="Open flags" value={counts.flags} href="#flags" />
        </ul>
      )}

      <div
        className="mb-4 grid gap-3 rounded-xl border border-ink/10 bg-paper-card p-4 sm:grid-cols-3"
        role="search"
        aria-label="Filter the queue"
      >
        <Select label="Status" value={filters.status} onChange={(e) => setFilter('status', e.target.value)}>
          <option value="in_review">{revisionStatusLabels.in_review}</option>
          <option value="sent_back">{revisionStatusLabels.sent_back}</option>
        </Select>
        <Select label="Chassis" value={filters.chassis} onChange={(e) => setFilter('chassis', e.target.value)}>
          <option value="">Any chassis</option>
          {(chassis.data ?? []).map((c) => (
            <option key={c.slug} value={c.slug}>
              {c.make} {c.model} ({c.code})
            </option>
          ))}
        </Select>
        <Select
          label="Waiting"
          value={String(filters.olderThanDays ?? '')}
          onChange={(e) => setFilter('olderThanDays', e.target.value)}
        >
          <option value="">Any time</option>
          <option value="1">More than a day</option>
          <option value="3">More than 3 days</option>
          <option value="7">More than a week</option>
          <option value="14">More than two weeks</option>
        </Select>
      </div>

      {queue.isPending ? (
        <Loading label="Loading the queue…" />
      ) : queue.isError ? (
        <ErrorNotice error={queue.error} />
      ) : items.length === 0 ? (
        <p className="rounded-lg bg-paper-card p-6 text-graphite">Nothing waits here with these filters.</p>
      ) : (
        <>
          <div className="overflow-x-auto rounded-xl border border-ink/10 bg-paper-card">
            <table className="w-full text-left text-sm sm:min-w-[46rem]">
              <caption className="sr-only">Review queue, {items.length} revisions</caption>
              <thead>
                {table.getHeaderGroups().map((hg) => (
                  <tr key={hg.id} className="border-b border-graphite/20 text-xs uppercase tracking-wide text-graphite-soft">
                    {hg.headers.map((h) => (
                      <th
                        key={h.id}
                        scope="col"
                        className={`px-3 py-2 font-bold ${wideOnly.has(h.id) ? 'hidden sm:table-cell' : ''}`}
                        aria-sort={
                          h.column.getIsSorted() === 'asc'
                            ? 'ascending'
                            : h.column.getIsSorted() === 'desc'
                              ? 'descending'
                              : undefined
                        }
                      >
                        {h.column.getCanSort() && h.id !== 'select' ? (
                          <button
                            type="button"
                            className="inline-flex items-center gap-1 uppercase"
                            onClick={h.column.getToggleSortingHandler()}
                          >
                            {flexRender(h.column.columnDef.header, h.getContext())}
                            <span aria-hidden>
                              {h.column.getIsSorted() === 'asc' ? '▲' : h.column.getIsSorted() === 'desc' ? '▼' : ''}
                            </span>
                          </button>
                        ) : (
                          flexRender(h.column.columnDef.header, h.getContext())
                        )}
                      </th>
                    ))}
                  </tr>
                ))}
              </thead>
              <tbody>
                {table.getRowModel().rows.map((row) => (
                  <tr
                    key={row.id}
                    className={`border-b border-graphite/10 align-top ${row.getIsSelected() ? 'bg-ink-faint/50' : ''}`}
                  >
                    {row.getVisibleCells().map((cell) => (
                      <td key={cell.id} className={`px-3 py-3 ${wideOnly.has(cell.column.id) ? 'hidden sm:table-cell' : ''}`}>
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <BulkDecline ids={selectedIds} onDone={() => setSelection({})} />
        </>
      )}

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
/** the columns a phone folds into the swap's own cell */
const wideOnly = new Set(['chassis', 'author', 'submittedAt', 'status', 'failedChecks']);

/** the queue's summary of a revision's automatic checks, in the desk's words */
function CheckBadge({ failed }: { failed: number }) {
  return failed > 0 ? (
    <span className="whitespace-nowrap rounded-sm bg-oxide px-1.5 py-0.5 text-xs font-extrabold text-paper">
      {failed} {checkStatusLabels.fail.toLowerCase()}
    </span>
  ) : (
    <span className="whitespace-nowrap rounded-sm border border-ink/40 px-1.5 py-0.5 text-xs font-extrabold text-ink">
      {checkStatusLabels.pass}
    </span>
  );
}

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
