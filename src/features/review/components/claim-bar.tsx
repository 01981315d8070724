import { useState } from 'react';
import type { ReviewClaim } from '@shared/schemas/review-queue';
import { CLAIM_MINUTES } from '@shared/schemas/review-queue';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import type { useClaim } from '../api/claims';
import { clockTime } from './queue-table';

type Props = { claim: ReviewClaim | null; actions: ReturnType<typeof useClaim>; canClaim: boolean };

/** Who is working on this submission, and the moderator's claim, extend and release. */
export function ClaimBar({ claim, actions, canClaim }: Props) {
  const [error, setError] = useState<string | null>(null);
  const run = async (what: 'claim' | 'release') => {
    setError(null);
    try {
      await actions[what].mutateAsync();
    } catch (err) {
      setError(err instanceof ApiError ? err.message : 'That did not work. Try again.');
    }
  };
  const busy = actions.claim.isPending || actions.release.isPending;
  const tone =
    claim && !claim.mine
      ? 'border-oxide bg-oxide-soft/40'
      : claim
        ? 'border-ink bg-ink-faint/40'
        : 'border-graphite/20 bg-paper-card';
  return (
    <section aria-label="Claim" className={`mb-6 rounded-xl border-l-4 p-3 ${tone}`} data-testid="claim-bar">
      <div className="flex flex-wrap items-center gap-3">
        <p className="text-sm font-semibold text-graphite" role="status">
          {!claim
            ? 'Nobody is working on this submission.'
            : claim.mine
              ? `You are working on this until ${clockTime(claim.expiresAt)}.`
              : `Taken: @${claim.by.login} is working on this until ${clockTime(claim.expiresAt)}.`}
        </p>
        {canClaim && (!claim || claim.mine) && (
          <Button variant="secondary" onClick={() => void run('claim')} disabled={busy}>
            {claim ? `Extend to ${CLAIM_MINUTES} minutes` : `Claim it for ${CLAIM_MINUTES} minutes`}
          </Button>
        )}
        {claim && (
          <Button variant="quiet" onClick={() => void run('release')} disabled={busy}>
            {claim.mine ? 'Release' : `Release @${claim.by.login}’s claim`}
          </Button>
        )}
      </div>
      {error && (
        <p role="alert" className="mt-2 text-sm font-semibold text-oxide">
          {error}
        </p>
      )}
    </section>
  );
}
