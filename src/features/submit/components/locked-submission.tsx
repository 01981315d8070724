import { useState } from 'react';
import { Link } from 'react-router';
import type { SubmissionView } from '@shared/schemas/submissions';
import { revisionStatusLabels, type RevisionStatus } from '@shared/schemas/enums';
import { Page } from '../../../components/ui/page';
import { Badge } from '../../../components/ui/badge';
import { Button, ButtonLink } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { useWithdrawSubmission } from '../api/withdraw-submission';
import { Markdown } from '../../../components/markdown';
import { PhotoGrid } from '../../../components/photo-grid';
import { chassisLabel } from '../../../components/swap-card';
import { paths } from '../../../config/paths';
import { formatDateTime } from '@shared/dates';
import { LockIcon } from '../../../components/ui/icons';

const explain: Record<RevisionStatus, string> = {
  draft: 'This draft can be edited.',
  sent_back: 'A moderator sent this back for rework; you can change it and send it again.',
  in_review: 'A moderator is reading it. It is locked until they decide; you will get an e-mail with the outcome.',
  approved: 'Published. A published revision never changes — to change it, propose a correction.',
  declined: 'A moderator decided not to publish this revision. It stays here for your records.',
  superseded: 'A newer published revision replaced this one.',
};

const tone = (s: RevisionStatus) =>
  s === 'approved' ? 'ink' : s === 'declined' ? 'oxide' : s === 'in_review' ? 'brass' : 'plain';

/** A revision its author can no longer edit: in review, approved, declined or superseded. */
export function LockedSubmission({ view }: { view: SubmissionView }) {
  const when = view.submittedAt ? formatDateTime(view.submittedAt) : null;
  return (
    <Page
      title={view.data.title}
      heading={view.data.title}
      lead={`${chassisLabel(view.chassis)} · ${view.axle} axle · revision ${view.number}`}
    >
      <div role="status" className="mb-6 rounded-xl border border-ink/15 bg-paper-card p-4 sm:p-6" data-testid="locked-status">
        <div className="flex flex-wrap items-center gap-2">
          <Badge tone={tone(view.status)}>{revisionStatusLabels[view.status]}</Badge>
          {view.status === 'in_review' && (
            <span className="inline-flex items-center gap-1 text-sm text-graphite-soft">
              <LockIcon className="h-4 w-4" /> Locked while at the desk
            </span>
          )}
          {when && <span className="text-sm text-graphite-soft">Sent {when}</span>}
        </div>
        <p className="mt-3 text-graphite">{explain[view.status]}</p>
        {view.behind && (
          <p className="mt-2 text-sm text-graphite" data-testid="behind-current">
            Revision {view.behind.current.number} was approved after you started this correction, so it cannot be approved as it
            is. The moderator will send it back; you then bring it up to date with revision {view.behind.current.number} in a few
            clicks.
          </p>
        )}
        {view.reviewNote && (view.status === 'declined' || view.status === 'approved') && (
          <p className="mt-2 whitespace-pre-wrap text-sm text-graphite">
            <strong>Moderator’s note:</strong> {view.reviewNote}
          </p>
        )}
        <div className="mt-4 flex flex-wrap gap-3">
          {view.status === 'approved' && <ButtonLink to={paths.swap(view.swapSlug)}>Open the swap sheet</ButtonLink>}
          {(view.status === 'approved' || view.status === 'superseded') && (
            <ButtonLink to={`${paths.submit()}?swap=${encodeURIComponent(view.swapSlug)}`} variant="secondary">
              Propose a correction
            </ButtonLink>
          )}
          {view.status === 'in_review' && <WithdrawButton id={view.id} />}
          <ButtonLink to={paths.mySubmissions()} variant="secondary">
            My submissions
          </ButtonLink>
        </div>
      </div>
      {view.data.summary && <p className="mb-6 text-lg text-graphite">{view.data.summary}</p>}
      <h2 className="mb-2 text-lg font-extrabold text-ink">Parts</h2>
      <ul className="mb-6 list-disc pl-5 text-graphite">
        {view.data.parts.map((p, i) => (
          <li key={i}>
            {p.quantity} × {p.name} <span className="text-graphite-soft">({p.role})</span>
          </li>
        ))}
      </ul>
      {view.body && (
        <>
          <h2 className="mb-2 text-lg font-extrabold text-ink">Write-up</h2>
          <Markdown className="mb-6">{view.body}</Markdown>
        </>
      )}
      {view.photos.length > 0 && (
        <>
          <h2 className="mb-2 text-lg font-extrabold text-ink">Photos</h2>
          <PhotoGrid photos={view.photos} />
        </>
      )}
      <p className="mt-8 text-sm">
        <Link to={paths.mySubmissions()} className="font-bold text-ink underline">
          Back to my submissions
        </Link>
      </p>
    </Page>
  );
}

/** Takes the submission off the desk before a moderator decides: it becomes a draft that can be changed and sent again. */
function WithdrawButton({ id }: { id: number }) {
  const withdraw = useWithdrawSubmission();
  const [error, setError] = useState<string | null>(null);
  const run = async () => {
    if (!window.confirm('Take this submission off the review desk? It becomes a draft again; send it when it is ready.')) return;
    setError(null);
    try {
      await withdraw.mutateAsync(id);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : 'That did not work. Try again.');
    }
  };
  return (
    <>
      <Button variant="secondary" onClick={() => void run()} disabled={withdraw.isPending}>
        {withdraw.isPending ? 'Withdrawing…' : 'Withdraw from review'}
      </Button>
      {error && (
        <p role="alert" className="w-full text-sm font-semibold text-oxide">
          {error}
        </p>
      )}
    </>
  );
}
