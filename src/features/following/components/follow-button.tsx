import { useState } from 'react';
import { digestFrequencies, digestFrequencyLabels, type DigestFrequency } from '@shared/schemas/following';
import { Button, ButtonLink } from '../../../components/ui/button';
import { paths } from '../../../config/paths';
import { findFollow, useFollow, useMyFollows, useStopFollow, type FollowTargetInput } from '../api/follows';

/**
 * Follow a chassis or one of my cars: one e-mail digest, daily or weekly, of the swaps published for it.
 * A signed-out reader is offered sign-in first.
 */
export function FollowButton({ target, what, signedIn }: { target: FollowTargetInput; what: string; signedIn: boolean }) {
  const follows = useMyFollows(signedIn);
  const follow = useFollow();
  const stop = useStopFollow();
  const [choosing, setChoosing] = useState(false);
  const [frequency, setFrequency] = useState<DigestFrequency>('weekly');
  const here = typeof window === 'undefined' ? '/' : window.location.pathname;

  if (!signedIn)
    return (
      <ButtonLink to={paths.signIn(here)} variant="secondary">
        Sign in to follow
      </ButtonLink>
    );
  const current = findFollow(follows.data, target);
  const error = follow.error ?? stop.error;

  if (current)
    return (
      <div className="flex flex-wrap items-center gap-2" data-testid="follow-state">
        <span className="rounded-md bg-ink-faint px-3 py-2 text-sm font-bold text-ink">
          ✓ Following · {digestFrequencyLabels[current.frequency].toLowerCase()}
        </span>
        <Button variant="quiet" disabled={stop.isPending} onClick={() => stop.mutate(current.id)}>
          Stop following
        </Button>
        {error && (
          <p role="alert" className="text-sm font-semibold text-oxide">
            {error.message}
          </p>
        )}
      </div>
    );

  if (!choosing)
    return (
      <Button variant="secondary" onClick={() => setChoosing(true)} disabled={follows.isPending} aria-label={`Follow ${what}`}>
        Follow
      </Button>
    );

  return (
    <form
      aria-label={`Follow ${what}`}
      className="flex flex-wrap items-center gap-2 rounded-lg border border-ink/20 bg-paper-card p-2"
      onSubmit={async (e) => {
        e.preventDefault();
        await follow.mutateAsync({ ...target, frequency });
        setChoosing(false);
      }}
    >
      <fieldset className="flex flex-wrap items-center gap-3 text-sm">
        <legend className="sr-only">How often to e-mail you</legend>
        <span className="font-bold text-graphite">E-mail me</span>
        {digestFrequencies.map((f) => (
          <label key={f} className="flex items-center gap-1">
            <input type="radio" name="frequency" value={f} checked={frequency === f} onChange={() => setFrequency(f)} />
            {digestFrequencyLabels[f].toLowerCase()}
          </label>
        ))}
      </fieldset>
      <Button type="submit" disabled={follow.isPending}>
        {follow.isPending ? 'Following…' : 'Follow'}
      </Button>
      <Button variant="quiet" onClick={() => setChoosing(false)}>
        Cancel
      </Button>
      <p className="basis-full text-xs text-graphite-soft">
        One digest when swaps are published for {what}; nothing when there is nothing new. Every e-mail has a one-click stop.
      </p>
      {error && (
        <p role="alert" className="basis-full text-sm font-semibold text-oxide">
          {error.message}
        </p>
      )}
    </form>
  );
}
