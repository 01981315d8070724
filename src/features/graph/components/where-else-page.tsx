import { useState, type FormEvent } from 'react';
import { Link, useSearchParams } from 'react-router';
import { partKindLabels } from '@shared/schemas/enums';
import { useWhereElse } from '../api/get-where-else';
import { Page } from '../../../components/ui/page';
import { TextInput } from '../../../components/ui/field';
import { Button } from '../../../components/ui/button';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { ApiError } from '../../../lib/api-client';
import { Caution } from '../../../components/caution';
import { paths } from '../../../config/paths';
import { FitGroups } from './fit-groups';
import { NumbersList } from './numbers-list';

const matchedLabel = {
  number: 'carries the number',
  stamp: 'older stamp in its notes',
  same_part: 'same part, other number',
} as const;

/** "Where else": a part number as typed off a casting or a box, and every chassis that part reaches. */
export default function WhereElsePage() {
  const [params, setParams] = useSearchParams();
  const asked = params.get('number') ?? '';
  const [typed, setTyped] = useState(asked);
  const query = useWhereElse(asked);
  const fieldError = query.error instanceof ApiError ? query.error.fields?.number : undefined;
  const submit = (e: FormEvent) => {
    e.preventDefault();
    setParams(typed.trim() ? { number: typed.trim() } : {});
  };
  const r = query.data;
  return (
    <Page
      title={asked ? `Where else: ${asked}` : 'Where else'}
      heading="Where else does this part go?"
      lead="Type a part number as it is stamped or printed. Case, spaces and dashes do not matter; older stamps and other numbers of the same part are found too."
    >
      <form onSubmit={submit} className="flex max-w-xl flex-wrap items-end gap-3" role="search">
        <TextInput
          label="Part number"
          name="number"
          value={typed}
          onChange={(e) => setTyped(e.target.value)}
          placeholder="e.g. OV-355-104-L"
          autoComplete="off"
          spellCheck={false}
          className="min-w-0 flex-1"
          error={fieldError}
        />
        <Button type="submit">Find</Button>
      </form>
      <div className="mt-8" aria-live="polite">
        {query.isLoading && <Loading label="Looking it up…" />}
        {query.isError && !fieldError && <ErrorNotice error={query.error} />}
        {r && asked && r.parts.length === 0 && (
          <p className="text-graphite-soft">
            No catalogue part carries <span className="font-mono">{r.number}</span> yet.
          </p>
        )}
        {r && r.parts.length > 0 && (
          <div className="space-y-8">
            <section aria-labelledby="records-h">
              <h2 id="records-h" className="mb-3 text-xl font-extrabold text-ink">
                {r.parts.length === 1 ? 'The part' : `The part, recorded ${r.parts.length} times`}
              </h2>
              <ul className="grid gap-3 md:grid-cols-2">
                {r.parts.map((p) => (
                  <li key={p.id} className="rounded-xl border border-ink/10 bg-paper-card p-4">
                    <Link to={paths.part(p.id)} className="font-extrabold text-ink hover:underline">
                      {p.name}
                    </Link>
                    <p className="text-sm text-graphite-soft">
                      {partKindLabels[p.kind]} · {p.maker} · {matchedLabel[p.matched]}
                    </p>
                    {p.cameOn.length > 0 && <p className="mt-1 text-sm text-graphite">Came on {p.cameOn.join('; ')}</p>}
                  </li>
                ))}
              </ul>
            </section>
            {r.otherNumbers.length > 0 && (
              <section aria-labelledby="numbers-h">
                <h2 id="numbers-h" className="mb-3 text-xl font-extrabold text-ink">
                  Also recorded as
                </h2>
                <NumbersList numbers={r.otherNumbers} />
              </section>
            )}
            <section aria-labelledby="reach-h">
              <h2 id="reach-h" className="mb-1 text-xl font-extrabold text-ink">
                Chassis it reaches
              </h2>
              <p className="mb-3 text-graphite-soft">
                {r.totals.swaps === 0
                  ? 'No approved swap uses it yet.'
                  : `${r.totals.chassis} ${r.totals.chassis === 1 ? 'chassis' : 'chassis'} through ${r.totals.swaps} approved ${r.totals.swaps === 1 ? 'swap' : 'swaps'}.`}
              </p>
              <FitGroups fits={r.reaches} label="Chassis it reaches" totalChassis={r.totals.chassis} />
              {r.reaches.length > 0 && (
                <div className="mt-6">
                  <Caution topics={['brakes', 'fasteners']} />
                </div>
              )}
            </section>
          </div>
        )}
      </div>
    </Page>
  );
}
