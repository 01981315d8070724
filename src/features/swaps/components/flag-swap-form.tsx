import { useState } from 'react';
import { flagSchema } from '@shared/schemas/submissions';
import { useFlagSwap } from '../api/flag-swap';
import { ApiError } from '../../../lib/api-client';
import { TextArea } from '../../../components/ui/field';
import { Button } from '../../../components/ui/button';
import { paths } from '../../../config/paths';
import { SheetSection } from './sheet-section';

/** "Something is wrong here": any signed-in member can flag a swap; moderators resolve it from the review desk. */
export function FlagSwapForm({ slug, signedIn }: { slug: string; signedIn: boolean }) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string>();
  const flag = useFlagSwap();

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
            const parsed = flagSchema.safeParse({ reason });
            if (!parsed.success) return setError(parsed.error.issues[0]?.message);
            setError(undefined);
            flag.mutate(
              { slug, reason: parsed.data.reason },
              {
                onError: (err) =>
                  setError(err instanceof ApiError ? (err.fields.reason ?? err.message) : 'Could not send the flag.'),
              },
            );
          }}
        >
          <TextArea
            label="What is wrong?"
            hint="A wrong torque figure, a part number that does not match, a safety concern…"
            rows={3}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            error={error}
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
