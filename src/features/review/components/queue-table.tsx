import { useMemo, useState } from 'react';
import { Link } from 'react-router';
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
import { categoryLabels, checkStatusLabels, revisionStatusLabels } from '@shared/schemas/enums';
import type { ReviewClaim } from '@shared/schemas/review-queue';
import { Badge } from '../../../components/ui/badge';
import { paths } from '../../../config/paths';
import { formatTime } from '@shared/dates';

const age = (iso: string | null) => {
  if (!iso) return '—';
  const days = Math.floor((Date.now() - Date.parse(iso)) / 86_400_000);
  return days <= 0 ? 'today' : days === 1 ? '1 day' : `${days} days`;
};
export const clockTime = (iso: string) => formatTime(iso);

const trustWords = { new: 'new member', trusted: 'trusted member', established: 'established member' } as const;

/** who is working on a submission, in the desk's words */
export function ClaimTag({ claim }: { claim: ReviewClaim | null }) {
  if (!claim) return null;
  return claim.mine ? (
    <Badge tone="ink">Yours until {clockTime(claim.expiresAt)}</Badge>
  ) : (
    <Badge tone="oxide">
      Taken by @{claim.by.login} until {clockTime(claim.expiresAt)}
    </Badge>
  );
}

/** the queue's summary of a revision's automatic checks, in the desk's words */
function CheckBadge({ failed, attention }: { failed: number; attention: number }) {
  if (failed > 0)
    return (
      <span className="whitespace-nowrap rounded-sm bg-oxide px-1.5 py-0.5 text-xs font-extrabold text-paper">
        {failed} {checkStatusLabels.fail.toLowerCase()}
      </span>
    );
  if (attention > 0)
    return (
      <span className="whitespace-nowrap rounded-sm bg-brass-deep px-1.5 py-0.5 text-xs font-extrabold text-paper">
        {attention} {checkStatusLabels.attention.toLowerCase()}
      </span>
    );
  return (
    <span className="whitespace-nowrap rounded-sm border border-ink/40 px-1.5 py-0.5 text-xs font-extrabold text-ink">
      {checkStatusLabels.pass}
    </span>
  );
}

const col = createColumnHelper<ReviewQueueItem>();
/** the columns a phone folds into the swap's own cell */
const wideOnly = new Set(['chassis', 'author', 'submittedAt', 'status', 'failedChecks']);

type Props = {
  items: ReviewQueueItem[];
  /** the desk's filters as a query string, carried to each revision so "decide and open the next" keeps them */
  search: string;
  selection: RowSelectionState;
  onSelectionChange: (s: RowSelectionState) => void;
};

export function QueueTable({ items, search, selection, onSelectionChange }: Props) {
  const [sorting, setSorting] = useState<SortingState>([]);
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
              to={`${paths.reviewRevision(row.original.revisionId)}${search ? `?${search}` : ''}`}
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
              <Badge>{categoryLabels[row.original.category]}</Badge>
              <ClaimTag claim={row.original.claim} />
            </div>
            {/* on a phone the other columns fold into this line instead of scrolling sideways */}
            <p className="mt-1.5 flex flex-wrap items-center gap-x-2 gap-y-1 text-xs text-graphite-soft sm:hidden">
              <span>{row.original.chassis.label}</span>
              <span>
                @{row.original.author.login} · {trustWords[row.original.authorTrust]}
              </span>
              <span className="tabular">{age(row.original.submittedAt)}</span>
              <span className="font-bold text-graphite">{revisionStatusLabels[row.original.status]}</span>
              <CheckBadge failed={row.original.failedChecks} attention={row.original.attentionChecks} />
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
            <span className="block text-xs text-graphite-soft">
              @{row.original.author.login} · {trustWords[row.original.authorTrust]} ({row.original.authorApproved} published)
            </span>
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
        cell: ({ row }) => <CheckBadge failed={row.original.failedChecks} attention={row.original.attentionChecks} />,
      }),
    ],
    [search],
  );
  const table = useReactTable({
    data: items,
    columns,
    state: { rowSelection: selection, sorting },
    getRowId: (r) => String(r.revisionId),
    enableRowSelection: (row) => row.original.status === 'in_review',
    onRowSelectionChange: (updater) => onSelectionChange(typeof updater === 'function' ? updater(selection) : updater),
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  return (
    <div className="overflow-x-auto rounded-xl border border-ink/10 bg-paper-card">
      <table className="w-full text-left text-sm sm:min-w-[46rem]">
        <caption className="sr-only">Review queue, {items.length} revisions on this page</caption>
        <thead>
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id} className="border-b border-graphite/20 text-xs uppercase tracking-wide text-graphite-soft">
              {hg.headers.map((h) => (
                <th
                  key={h.id}
                  scope="col"
                  className={`px-3 py-2 font-bold ${wideOnly.has(h.id) ? 'hidden sm:table-cell' : ''}`}
                  aria-sort={
                    h.column.getIsSorted() === 'asc' ? 'ascending' : h.column.getIsSorted() === 'desc' ? 'descending' : undefined
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
            <tr key={row.id} className={`border-b border-graphite/10 align-top ${row.getIsSelected() ? 'bg-ink-faint/50' : ''}`}>
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
  );
}
