import { useState } from 'react';
import { flagSchema } from '@shared/schemas/submissions';
import { flagKindLabels, flagKinds, type FlagKind } from '@shared/schemas/flags';
import { useFlagSwap } from '../api/flag-swap';
import { ApiError } from '../../../lib/api-client';
import { Select, TextArea } from '../../../components/ui/field';
import { Button } from '../../../components/ui/button';
import { paths } from '../../../config/paths';
import { SheetSection } from './sheet-section';

/** "Something is wrong here": any signed-in member can flag a swap; moderators resolve it from the review desk. */
export function FlagSwapForm({ slug, signedIn }: { slug: string; signedIn: boolean }) {
  const [open, setOpen] = useState(false);
  const [kind, setKind] = useState<FlagKind | ''>('');
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<{ kind?: string; reason?: string }>({});
  const flag = useFlagSwap(slug);

  if (!signedIn) {
    return (
      <SheetSection id="flag" title="Something wrong here?">
        <p className="text-sm text-graphite">
          <a className="font-bold text-ink underline" href={paths.signIn(`/swaps/${slug}`)}>
            Sign in
          </a>{' '}
          to flag a mistake for the moderators, or to propose a corrected revision.
        </p>
      </SheetSection>
    );
  }
  return (
    <SheetSection id="flag" title="Something wrong here?">
      {flag.isSuccess ? (
        <p role="status" className="text-sm font-bold text-ink">
          Thank you — a moderator will look at it and you will hear back by e-mail.
        </p>
      ) : !open ? (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => setOpen(true)}>
            Flag a problem
          </Button>
          <a
            href={`${paths.submit()}?swap=${slug}`}
            className="inline-flex min-h-10 items-center rounded-md px-4 text-sm font-bold text-ink hover:bg-ink-faint"
          >
            Propose a correction
          </a>
        </div>
      ) : (
        <form
          className="flex max-w-xl flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            const parsed = flagSchema.safeParse({ kind: kind || undefined, reason });
            if (!parsed.success)
              return setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
            setErrors({});
            flag.mutate(parsed.data, {
              onError: (err) =>
                setErrors(
                  err instanceof ApiError
                    ? { kind: err.fields.kind, reason: err.fields.reason ?? (err.fields.kind ? undefined : err.message) }
                    : { reason: 'Could not send the flag.' },
                ),
            });
          }}
        >
          <Select
            label="What kind of problem?"
            hint="A questioned figure or unsafe advice is shown to readers (without your name) until a moderator settles it."
            value={kind}
            onChange={(e) => setKind(e.target.value as FlagKind | '')}
            error={errors.kind}
          >
            <option value="">Pick one…</option>
            {flagKinds.map((k) => (
              <option key={k} value={k}>
                {flagKindLabels[k]}
              </option>
            ))}
          </Select>
          <TextArea
            label="What is wrong?"
            hint="Which figure or step, what you think it should be, and where that comes from."
            rows={3}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            error={errors.reason}
          />
          <div className="flex gap-2">
            <Button type="submit" disabled={flag.isPending}>
              {flag.isPending ? 'Sending…' : 'Send to the moderators'}
            </Button>
            <Button variant="quiet" onClick={() => setOpen(false)}>
              Cancel
            </Button>
          </div>
        </form>
      )}
    </SheetSection>
  );
}
