import { useState } from 'react';
import { Link } from 'react-router';
import type { FlagItem } from '@shared/schemas/submissions';
import { resolveFlagSchema } from '@shared/schemas/submissions';
import { Button } from '../../../components/ui/button';
import { TextArea } from '../../../components/ui/field';
import { ApiError } from '../../../lib/api-client';
import { paths } from '../../../config/paths';
import { useResolveFlag } from '../api/resolve-flag';

const date = (iso: string) => new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

function ResolveForm({ flag }: { flag: FlagItem }) {
  const [note, setNote] = useState('');
  const [error, setError] = useState<string | null>(null);
  const resolve = useResolveFlag();
  const send = async (e: React.FormEvent) => {
    e.preventDefault();
    const parsed = resolveFlagSchema.safeParse({ note });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? 'Say what was done');
    setError(null);
    try {
      await resolve.mutateAsync({ id: flag.id, note: parsed.data.note });
    } catch (err) {
      setError(err instanceof ApiError ? (err.fields.note ?? err.message) : 'That did not work. Try again.');
    }
  };
  return (
    <form onSubmit={(e) => void send(e)} className="mt-3 space-y-2" noValidate>
      <TextArea
        label="What was done (the reporter reads this)"
        rows={2}
        value={note}
        onChange={(e) => setNote(e.target.value)}
        error={error ?? undefined}
      />
      <Button type="submit" variant="secondary" disabled={resolve.isPending}>
        {resolve.isPending ? 'Resolving…' : 'Resolve flag'}
      </Button>
    </form>
  );
}

/** Flags members raised on published swaps, each resolved with a note to the reporter. */
export function FlagsPanel({ flags }: { flags: FlagItem[] }) {
  const open = flags.filter((f) => f.status === 'open');
  return (
    <section id="flags" aria-labelledby="flags-h" className="mt-10 scroll-mt-20">
      <h2 id="flags-h" className="mb-3 text-xl font-extrabold text-ink">
        Open flags <span className="tabular text-graphite-soft">({open.length})</span>
      </h2>
      {open.length === 0 ? (
        <p className="text-graphite-soft">No open flags.</p>
      ) : (
        <ul className="grid gap-4 md:grid-cols-2">
          {open.map((f) => (
            <li key={f.id} className="rounded-xl border border-brass/40 bg-paper-card p-4">
              <p className="text-sm text-graphite-soft">
                {date(f.createdAt)} · flagged by {f.reporter.name}
              </p>
              <h3 className="mt-1 font-extrabold text-ink">
                <Link to={paths.swap(f.swapSlug)} className="underline decoration-brass underline-offset-2">
                  {f.title}
                </Link>
              </h3>
              <p className="mt-2 whitespace-pre-wrap text-graphite">{f.reason}</p>
              <ResolveForm flag={f} />
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
