import { useMemo, useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router';
import type { RebasePreview } from '@shared/schemas/submissions';
import { compareRevisions, compareWriteUps, type ChangeValue, type RowChange } from '@shared/revision-changes';
import { mergeThreeWay, type MergeSide } from '@shared/revision-merge';
import { Page } from '../../../components/ui/page';
import { Button } from '../../../components/ui/button';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { RevisionChanges, useShowChangeValue } from '../../../components/revision-changes';
import { Caution } from '../../../components/caution';
import { ApiError } from '../../../lib/api-client';
import { paths } from '../../../config/paths';
import { useRebasePreview, useRebaseSubmission } from '../api/rebase-submission';

type Content = { data: RebasePreview['mine']['data']; body: string };

/** How one conflict reads on the sheet: the record with revision N's value against the record with the author's. */
type ConflictView = { path: string; rows: { section: string; row: RowChange }[]; writeUp: ReturnType<typeof compareWriteUps> };

function describeConflicts(p: RebasePreview): ConflictView[] {
  const base = { data: p.base.data, body: p.base.body };
  const theirs = { data: p.current.data, body: p.current.body };
  const allMine = Object.fromEntries(p.conflicts.map((c) => [c.path, 'mine' as MergeSide]));
  const withMine = mergeThreeWay<Content>(base, theirs, p.mine, allMine).value;
  return p.conflicts.map((c) => {
    const withTheirs = mergeThreeWay<Content>(base, theirs, p.mine, { ...allMine, [c.path]: 'theirs' }).value;
    const changes = compareRevisions(withTheirs, withMine);
    return {
      path: c.path,
      rows: changes.sections.flatMap((s) => s.rows.map((row) => ({ section: s.title, row }))),
      writeUp: c.path === 'body' ? compareWriteUps(withTheirs.body, withMine.body) : [],
    };
  });
}

function Value({ value, show }: { value: ChangeValue | null; show: (v: ChangeValue) => string }) {
  return <span className="tabular font-bold">{value ? show(value) : 'not given'}</span>;
}

/** One field both sides changed: what each says, and the pick. */
function Conflict({
  conflict,
  index,
  count,
  currentNumber,
  choice,
  onChoose,
}: {
  conflict: ConflictView;
  index: number;
  count: number;
  currentNumber: number;
  choice: MergeSide | undefined;
  onChoose: (side: MergeSide) => void;
}) {
  const show = useShowChangeValue();
  const name = `conflict-${index}`;
  const heading =
    conflict.path === 'body'
      ? 'Write-up'
      : conflict.rows.length
        ? [...new Set(conflict.rows.map((r) => `${r.section}: ${r.row.name}`))].join(' · ')
        : 'A detail the sheet does not show';
  return (
    <li
      className={`rounded-xl border-2 p-4 ${choice ? 'border-ink/25 bg-paper-card' : 'border-brass bg-brass-soft/30'}`}
      data-conflict={conflict.path}
    >
      <fieldset>
        <legend className="text-sm text-graphite-soft">
          Both changed this ({index + 1} of {count})
          <span className="mt-0.5 block text-base font-extrabold text-ink">{heading}</span>
        </legend>
        {conflict.rows.length > 0 && (
          <dl className="mt-2 divide-y divide-graphite/10 text-sm">
            {conflict.rows.flatMap(({ row }, i) =>
              row.change === 'changed'
                ? row.fields.map((f) => (
                    <div key={`${i}-${f.label}`} className="grid gap-x-3 gap-y-0.5 py-1.5 sm:grid-cols-[minmax(9rem,14rem)_1fr]">
                      <dt className="font-bold text-graphite-soft">{f.label}</dt>
                      <dd className="flex flex-wrap gap-x-4 gap-y-0.5">
                        <span>
                          <span className="text-xs uppercase tracking-wide text-graphite-soft">revision {currentNumber}</span>{' '}
                          <Value value={f.before} show={show} />
                        </span>
                        <span>
                          <span className="text-xs uppercase tracking-wide text-graphite-soft">yours</span>{' '}
                          <Value value={f.after} show={show} />
                        </span>
                      </dd>
                    </div>
                  ))
                : [
                    <div key={i} className="py-1.5">
                      <dt className="font-bold text-graphite-soft">
                        {row.change === 'added' ? 'Only in yours' : `Only in revision ${currentNumber}`}
                      </dt>
                      <dd>
                        {row.name}
                        {row.fields.length > 0 && (
                          <span className="text-graphite-soft">
                            {' '}
                            ({row.fields.map((f) => `${f.label}: ${show((f.after ?? f.before)!)}`).join(', ')})
                          </span>
                        )}
                      </dd>
                    </div>,
                  ],
            )}
          </dl>
        )}
        {conflict.writeUp.length > 0 && (
          <ul className="mt-2 space-y-2 text-sm">
            {conflict.writeUp.map((c, i) => (
              <li key={i} className="rounded-md bg-paper p-2 leading-relaxed whitespace-pre-wrap">
                {c.change === 'reworded' ? (
                  c.words.map((w, j) =>
                    w.change === 'same' ? (
                      <span key={j}>{w.text}</span>
                    ) : w.change === 'added' ? (
                      <ins key={j} className="rounded-sm bg-brass-soft px-0.5 font-semibold no-underline" title="yours">
                        {w.text}
                      </ins>
                    ) : (
                      <del
                        key={j}
                        className="text-graphite-soft decoration-oxide decoration-2"
                        title={`revision ${currentNumber}`}
                      >
                        {w.text}
                      </del>
                    ),
                  )
                ) : (
                  <>
                    <span className="text-xs font-bold uppercase tracking-wide text-graphite-soft">
                      {c.change === 'added' ? 'Only in yours' : `Only in revision ${currentNumber}`}
                    </span>{' '}
                    {c.text}
                  </>
                )}
              </li>
            ))}
          </ul>
        )}
        <div className="mt-3 grid gap-2 sm:grid-cols-2">
          {(['theirs', 'mine'] as const).map((side) => (
            <label
              key={side}
              className={`flex cursor-pointer items-center gap-2 rounded-lg border p-2 text-sm font-bold ${choice === side ? 'border-ink bg-ink-faint/60 text-ink' : 'border-graphite/20 bg-paper'}`}
            >
              <input
                type="radio"
                name={name}
                checked={choice === side}
                onChange={() => onChoose(side)}
                className="h-4 w-4 accent-ink"
              />
              {side === 'theirs' ? `Keep revision ${currentNumber}’s` : 'Keep yours'}
            </label>
          ))}
        </div>
      </fieldset>
    </li>
  );
}

function Merge({ id, preview }: { id: number; preview: RebasePreview }) {
  const navigate = useNavigate();
  const rebase = useRebaseSubmission(id);
  const [choices, setChoices] = useState<Record<string, MergeSide>>({});
  const [error, setError] = useState<string | null>(null);
  const conflicts = useMemo(() => describeConflicts(preview), [preview]);
  const result = useMemo(() => mergeThreeWay<Content>(preview.base, preview.current, preview.mine, choices), [preview, choices]);
  const picked = preview.conflicts.filter((c) => choices[c.path]).length;
  const left = preview.conflicts.length - picked;
  const n = preview.current.number;

  const apply = async () => {
    setError(null);
    try {
      await rebase.mutateAsync({ currentRevisionId: preview.current.revisionId, choices });
      navigate(paths.editSubmission(id), { replace: true });
    } catch (err) {
      setError(err instanceof ApiError ? err.message : 'It was not brought up to date. Try again.');
    }
  };

  return (
    <div className="space-y-10">
      <section aria-labelledby="newer-h">
        <h2 id="newer-h" className="mb-1 text-xl font-extrabold text-ink">
          What revision {n} changed
        </h2>
        <p className="mb-3 text-sm text-graphite-soft">
          Against revision {preview.base.number}, the one your correction started from. These stay unless you changed the same
          thing.
        </p>
        <RevisionChanges before={preview.base} after={preview.current} idPrefix="newer-changes" />
      </section>

      <section aria-labelledby="conflicts-h">
        <h2 id="conflicts-h" className="mb-1 text-xl font-extrabold text-ink">
          {conflicts.length ? 'Pick one where you both changed the same thing' : 'Nothing to pick'}
        </h2>
        <p className="mb-3 text-sm text-graphite-soft">
          {conflicts.length
            ? `${picked} of ${conflicts.length} picked. Everything else merges on its own: your changes stay, and so do revision ${n}’s.`
            : `None of your changes touch what revision ${n} changed, so both are kept.`}
        </p>
        {conflicts.length > 0 && (
          <div className="mb-3">
            <Caution topics={['fasteners']}>
              <p className="mt-2">
                Where you and revision {n} give different figures, keep the one you can back with the maker’s specification or a
                measurement; say where it comes from in the write-up.
              </p>
            </Caution>
          </div>
        )}
        {conflicts.length > 0 && (
          <ol className="space-y-3">
            {conflicts.map((c, i) => (
              <Conflict
                key={c.path}
                conflict={c}
                index={i}
                count={conflicts.length}
                currentNumber={n}
                choice={choices[c.path]}
                onChoose={(side) => setChoices((old) => ({ ...old, [c.path]: side }))}
              />
            ))}
          </ol>
        )}
      </section>

      <section aria-labelledby="result-h">
        <h2 id="result-h" className="mb-1 text-xl font-extrabold text-ink">
          Your correction once it is up to date
        </h2>
        <p className="mb-3 text-sm text-graphite-soft">
          What it will change in revision {n}
          {left ? ', with your own value wherever you have not picked yet' : ''}.
        </p>
        <RevisionChanges before={preview.current} after={result.value} idPrefix="result-changes" />
      </section>

      <div className="sticky bottom-0 -mx-4 flex flex-wrap items-center gap-3 border-t border-graphite/15 bg-paper/95 px-4 py-3 sm:mx-0 sm:rounded-xl sm:border">
        <Button onClick={() => void apply()} disabled={left > 0 || rebase.isPending}>
          {rebase.isPending ? 'Bringing it up to date…' : 'Bring it up to date'}
        </Button>
        <Link to={paths.editSubmission(id)} className="text-sm font-bold text-ink underline">
          Back to the draft
        </Link>
        {left > 0 && <span className="text-sm text-graphite-soft">{left} still to pick</span>}
        {error && (
          <p role="alert" className="w-full text-sm font-bold text-oxide">
            {error}
          </p>
        )}
      </div>
    </div>
  );
}

/** `/submissions/:id/update`: a correction behind the swap's current revision, merged with it field by field. */
export default function UpdateSubmissionPage() {
  const { id: raw = '' } = useParams();
  const id = Number(raw);
  const preview = useRebasePreview(id);
  const title = 'Bring your correction up to date';
  if (preview.isPending)
    return (
      <Page title={title}>
        <Loading label="Merging with the current revision…" />
      </Page>
    );
  if (preview.isError) {
    const upToDate = preview.error instanceof ApiError && preview.error.code === 'up_to_date';
    return (
      <Page title={title} heading={title}>
        {upToDate ? (
          <p className="rounded-lg bg-paper-card p-4 text-graphite">
            It already starts from the swap’s current revision.{' '}
            <Link to={paths.editSubmission(id)} className="font-bold text-ink underline">
              Back to the draft
            </Link>
          </p>
        ) : (
          <ErrorNotice error={preview.error} />
        )}
      </Page>
    );
  }
  const p = preview.data;
  return (
    <Page
      title={title}
      heading={title}
      lead={`Revision ${p.current.number} was approved after you started this correction (revision ${p.revision.number}) from revision ${p.base.number}. What only one of you changed is kept as it is; where you both changed the same thing, you pick which stays. Your photos stay as they are.`}
    >
      <Merge id={id} preview={p} />
    </Page>
  );
}
