import { useState } from 'react';
import { Link } from 'react-router';
import type { FlagCorrection, FlagItem } from '@shared/schemas/submissions';
import { bulkResolveFlagsSchema, resolveFlagSchema } from '@shared/schemas/submissions';
import { flagKindLabels, flagOutcomeLabels, flagOutcomes, isSafetyFlag, type FlagOutcome } from '@shared/schemas/flags';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Select, TextArea } from '../../../components/ui/field';
import { ApiError } from '../../../lib/api-client';
import { paths } from '../../../config/paths';
import { useBulkResolveFlags, useLinkFlag, useResolveFlag } from '../api/resolve-flag';
import { useFlags } from '../api/get-flags';
import { formatDate } from '@shared/dates';

const date = (iso: string) => formatDate(iso);

const correctionLabel = (c: FlagCorrection) =>
  `Revision ${c.number} (${c.status === 'in_review' ? 'at the desk' : c.status === 'approved' ? 'published' : 'replaced since'})`;

/** The correction that answers a flag: approving it resolves the flag as fixed. */
function LinkCorrection({ flag }: { flag: FlagItem }) {
  const link = useLinkFlag();
  if (flag.corrections.length === 0)
    return <p className="mt-2 text-sm text-graphite-soft">No correction of this swap has been sent in yet.</p>;
  return (
    <div className="mt-2">
      <Select
        label="Answered by"
        value={flag.correction?.revisionId ?? ''}
        disabled={link.isPending}
        onChange={(e) => link.mutate({ id: flag.id, revisionId: e.target.value ? Number(e.target.value) : null })}
        error={link.error?.message}
      >
        <option value="">No correction linked</option>
        {flag.corrections.map((c) => (
          <option key={c.revisionId} value={c.revisionId}>
            {correctionLabel(c)}
          </option>
        ))}
      </Select>
    </div>
  );
}

function ResolveForm({ flag }: { flag: FlagItem }) {
  const [outcome, setOutcome] = useState<FlagOutcome | ''>('');
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<Record<string, string | undefined>>({});
  const resolve = useResolveFlag();
  const published = flag.correction && flag.correction.status !== 'in_review';
  const send = async (e: React.FormEvent) => {
    e.preventDefault();
    const parsed = resolveFlagSchema.safeParse({ outcome: outcome || undefined, note });
    if (!parsed.success) return setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
    setErrors({});
    try {
      await resolve.mutateAsync({ id: flag.id, ...parsed.data });
    } catch (err) {
      setErrors(
        err instanceof ApiError
          ? { ...err.fields, _: Object.keys(err.fields).length ? undefined : err.message }
          : { _: 'That did not work. Try again.' },
      );
    }
  };
  return (
    <form onSubmit={(e) => void send(e)} className="mt-3 space-y-2" noValidate aria-label={`Resolve the flag on “${flag.title}”`}>
      <Select
        label="Outcome"
        value={outcome}
        onChange={(e) => setOutcome(e.target.value as FlagOutcome | '')}
        error={errors.outcome ?? errors.correctionRevisionId}
      >
        <option value="">Pick one…</option>
        {flagOutcomes.map((o) => (
          <option key={o} value={o} disabled={o === 'fixed_by_correction' && !published}>
            {flagOutcomeLabels[o]}
            {o === 'fixed_by_correction' && !published ? ' (link a published correction first)' : ''}
          </option>
        ))}
      </Select>
      <TextArea
        label="Note to the reporter (optional)"
        rows={2}
        value={note}
        onChange={(e) => setNote(e.target.value)}
        error={errors.note}
      />
      <Button type="submit" variant="secondary" disabled={resolve.isPending}>
        {resolve.isPending ? 'Resolving…' : 'Resolve flag'}
      </Button>
      {errors._ && (
        <p role="alert" className="text-sm font-semibold text-oxide">
          {errors._}
        </p>
      )}
    </form>
  );
}

/** Several flags resolved with one note; each reporter gets one message for all of theirs. */
function BulkResolve({ ids, onDone }: { ids: number[]; onDone: () => void }) {
  const [outcome, setOutcome] = useState<FlagOutcome | ''>('');
  const [note, setNote] = useState('');
  const [error, setError] = useState<string | null>(null);
  const resolve = useBulkResolveFlags();
  const send = async (e: React.FormEvent) => {
    e.preventDefault();
    const parsed = bulkResolveFlagsSchema.safeParse({ ids, outcome: outcome || undefined, note });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? 'Pick an outcome');
    setError(null);
    try {
      await resolve.mutateAsync(parsed.data);
      setNote('');
      onDone();
    } catch (err) {
      setError(
        err instanceof ApiError ? (err.fields.outcome ?? err.fields.note ?? err.message) : 'That did not work. Try again.',
      );
    }
  };
  return (
    <form
      onSubmit={(e) => void send(e)}
      noValidate
      aria-label="Resolve the selected flags"
      className="mb-4 space-y-2 rounded-xl border border-ink/25 bg-ink-faint/40 p-4"
    >
      <p className="text-sm font-bold text-ink" aria-live="polite">
        {ids.length} selected
      </p>
      <Select label="Outcome for all of them" value={outcome} onChange={(e) => setOutcome(e.target.value as FlagOutcome | '')}>
        <option value="">Pick one…</option>
        {flagOutcomes
          .filter((o) => o !== 'fixed_by_correction')
          .map((o) => (
            <option key={o} value={o}>
              {flagOutcomeLabels[o]}
            </option>
          ))}
      </Select>
      <TextArea
        label="Note to the reporters (optional; each hears at most once a day)"
        rows={2}
        value={note}
        onChange={(e) => setNote(e.target.value)}
        error={error ?? undefined}
      />
      <Button type="submit" disabled={resolve.isPending}>
        {resolve.isPending ? 'Resolving…' : `Resolve ${ids.length} flag${ids.length === 1 ? '' : 's'}`}
      </Button>
    </form>
  );
}

/** Flags members raised on published swaps, a page at a time; each resolved with a note to the reporter, or several at once. */
export function FlagsPanel() {
  const [page, setPage] = useState(1);
  const [selected, setSelected] = useState<Set<number>>(new Set());
  const query = useFlags(page);
  const data = query.data;
  const open = data?.items ?? [];
  const total = data?.total ?? 0;
  const pages = data ? Math.max(1, Math.ceil(total / data.pageSize)) : 1;
  const first = data ? (data.page - 1) * data.pageSize + 1 : 0;
  const toggle = (id: number) =>
    setSelected((s) => {
      const next = new Set(s);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  const allOnPage = open.length > 0 && open.every((f) => selected.has(f.id));
  const go = (p: number) => {
    setSelected(new Set());
    setPage(p);
  };
  return (
    <section id="flags" aria-labelledby="flags-h" className="mt-10 scroll-mt-20">
      <h2 id="flags-h" className="mb-3 text-xl font-extrabold text-ink">
        Open flags <span className="tabular text-graphite-soft">({total})</span>
      </h2>
      {query.isError ? (
        <p className="text-oxide">The flags did not load. Reload the page to try again.</p>
      ) : open.length === 0 && total > 0 && page > 1 ? (
        <p className="text-graphite-soft">
          This page is empty now.{' '}
          <button type="button" className="font-bold text-ink underline" onClick={() => go(pages)}>
            Go to page {pages}
          </button>
        </p>
      ) : open.length === 0 ? (
        <p className="text-graphite-soft">{query.isPending ? 'Loading the flags…' : 'No open flags.'}</p>
      ) : (
        <>
          <div className="mb-3 flex flex-wrap items-center justify-between gap-3">
            <label className="flex items-center gap-2 text-sm font-bold text-graphite">
              <input
                type="checkbox"
                className="h-4 w-4 accent-ink"
                checked={allOnPage}
                onChange={() => setSelected(allOnPage ? new Set() : new Set(open.map((f) => f.id)))}
              />
              Select every flag on this page
            </label>
            <p className="tabular text-sm text-graphite-soft">
              Flags {first}–{first + open.length - 1} of {total}
            </p>
          </div>
          <p className="mb-3 text-sm text-graphite-soft">
            A flag about a figure or unsafe advice is shown on its sheet (without the reporter’s name) until it is resolved or a
            correction linked to it is published. Each reporter gets at most one e-mail a day about outcomes.
          </p>
          {selected.size > 0 && <BulkResolve ids={[...selected]} onDone={() => setSelected(new Set())} />}
          <ul className="grid gap-4 md:grid-cols-2">
            {open.map((f) => (
              <li key={f.id} className="rounded-xl border border-brass/40 bg-paper-card p-4">
                <div className="flex items-start justify-between gap-3">
                  <p className="text-sm text-graphite-soft">
                    {date(f.createdAt)} · flagged by {f.reporter.name}
                  </p>
                  <label className="flex items-center gap-1 text-sm text-graphite">
                    <input
                      type="checkbox"
                      className="h-4 w-4 accent-ink"
                      checked={selected.has(f.id)}
                      onChange={() => toggle(f.id)}
                      aria-label={`Select the flag on “${f.title}” by ${f.reporter.name}`}
                    />
                    Select
                  </label>
                </div>
                <h3 className="mt-1 font-extrabold text-ink">
                  <Link to={paths.swap(f.swapSlug)} className="underline decoration-brass underline-offset-2">
                    {f.title}
                  </Link>
                </h3>
                <p className="mt-1">
                  <Badge tone={isSafetyFlag(f.kind) ? 'oxide' : 'plain'}>{flagKindLabels[f.kind]}</Badge>
                  {isSafetyFlag(f.kind) && <span className="ml-2 text-xs text-graphite-soft">shown to readers while open</span>}
                </p>
                <p className="mt-2 line-clamp-6 whitespace-pre-wrap break-words text-graphite">{f.reason}</p>
                <LinkCorrection flag={f} />
                <ResolveForm flag={f} />
              </li>
            ))}
          </ul>
          {pages > 1 && (
            <nav aria-label="Pages of flags" className="mt-4 flex items-center justify-center gap-3">
              <Button variant="secondary" disabled={page <= 1} onClick={() => go(page - 1)}>
                Previous page
              </Button>
              <span className="tabular text-sm text-graphite">
                Page {page} of {pages}
              </span>
              <Button variant="secondary" disabled={page >= pages} onClick={() => go(page + 1)}>
                Next page
              </Button>
            </nav>
          )}
        </>
      )}
    </section>
  );
}
