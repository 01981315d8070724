import { useState, type ReactNode } from 'react';
import { Link, useNavigate, useParams, useSearchParams } from 'react-router';
import type { CheckResult, ReviewDetail, SubmissionView } from '@shared/schemas/submissions';
import { checkStatusLabels, revisionStatusLabels } from '@shared/schemas/enums';
import { Page } from '../../../components/ui/page';
import { Badge } from '../../../components/ui/badge';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { RevisionChanges } from '../../../components/revision-changes';
import { UntrustedMarkdown } from '../../../components/markdown';
import { chassisLabel } from '../../../components/swap-card';
import { paths } from '../../../config/paths';
import { useReviewDetail } from '../api/get-review-detail';
import { DecisionPanel, decisionKeyLabels } from './decision-panel';
import { useClaim, useClaimNext } from '../api/claims';
import { queueQueryFrom } from '../api/get-review-queue';
import { reviewQueueSearch } from '@shared/schemas/review-queue';
import { useShortcuts, type Shortcut } from '../../../lib/use-shortcuts';
import { ApiError } from '../../../lib/api-client';
import { ClaimBar } from './claim-bar';
import { ShortcutList } from './shortcut-list';
import { TakedownPanel } from './takedown-panel';
import { ChangeNote } from './change-note';
import { formatDateTime } from '@shared/dates';

const when = (iso: string | null) => (iso ? formatDateTime(iso) : '—');

// the desk's own look: a tally of the three results, then one card per check with its tag
const checkLook: Record<CheckResult['status'], { tag: string; card: string }> = {
  fail: { tag: 'bg-oxide text-paper', card: 'border-l-oxide bg-oxide-soft/60' },
  attention: { tag: 'bg-brass-deep text-paper', card: 'border-l-brass bg-brass-soft/40' },
  pass: { tag: 'border border-ink/40 text-ink', card: 'border-l-ink/40 bg-paper-card' },
};
const checkOrder: CheckResult['status'][] = ['fail', 'attention', 'pass'];

export function CheckTally({ checks }: { checks: CheckResult[] }) {
  return (
    <p className="mb-3 flex flex-wrap gap-2 text-sm" data-testid="check-tally">
      {checkOrder.map((status) => {
        const n = checks.filter((c) => c.status === status).length;
        return (
          <span
            key={status}
            className={`rounded-sm px-2 py-0.5 font-bold ${n === 0 ? 'text-graphite-soft' : checkLook[status].tag}`}
          >
            <span className="tabular">{n}</span> {checkStatusLabels[status].toLowerCase()}
          </span>
        );
      })}
    </p>
  );
}

function Checks({ checks }: { checks: CheckResult[] }) {
  return (
    <section aria-labelledby="checks-h">
      <h2 id="checks-h" className="text-xl font-extrabold text-ink">
        Automatic checks
      </h2>
      <CheckTally checks={checks} />
      <ul className="space-y-2" data-testid="checks">
        {checks.map((c) => {
          const look = checkLook[c.status];
          return (
            <li
              key={c.id}
              className={`rounded-md border border-l-4 border-graphite/15 p-3 ${look.card}`}
              data-check={c.id}
              data-status={c.status}
            >
              <div className="flex items-start justify-between gap-3">
                <span className="font-bold text-graphite">{c.label}</span>
                <span
                  className={`shrink-0 rounded-sm px-1.5 py-0.5 text-[0.7rem] font-extrabold uppercase tracking-wider whitespace-nowrap ${look.tag}`}
                >
                  {checkStatusLabels[c.status]}
                </span>
              </div>
              {c.detail && <p className="mt-1 text-sm text-graphite">{c.detail}</p>}
              {c.link && (
                <Link to={c.link} className="mt-1 inline-block text-sm font-bold text-ink underline">
                  Open the likely duplicate
                </Link>
              )}
            </li>
          );
        })}
      </ul>
    </section>
  );
}

const actionWords: Record<string, string> = {
  submit: 'put it on the review desk',
  submitted: 'put it on the review desk',
  resubmit: 'put it on the review desk again',
  approve: 'published it',
  approved: 'published it',
  'send-back': 'sent it back for rework',
  send_back: 'sent it back for rework',
  sent_back: 'sent it back for rework',
  decline: 'decided not to publish it',
  declined: 'decided not to publish it',
  withdrawn: 'withdrew it from review (a draft again)',
  create: 'started the draft',
  created: 'started the draft',
};

function History({ history }: { history: ReviewDetail['history'] }) {
  return (
    <section aria-labelledby="review-history-h">
      <h2 id="review-history-h" className="mb-3 text-xl font-extrabold text-ink">
        History
      </h2>
      {history.length === 0 ? (
        <p className="text-sm text-graphite-soft">No events yet.</p>
      ) : (
        <ol className="space-y-3 border-l-2 border-ink/15 pl-4">
          {history.map((h, i) => (
            <li key={i}>
              <p className="text-sm">
                <strong>{h.actor.name}</strong> {actionWords[h.action] ?? h.action.replace(/[_-]/g, ' ')}{' '}
                <span className="text-graphite-soft">· {when(h.at)}</span>
              </p>
              {h.note && <p className="mt-1 whitespace-pre-wrap rounded-md bg-paper-card p-2 text-sm text-graphite">{h.note}</p>}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}

/**
 * `/review/:revisionId`: what a moderator needs to decide — checks, the changes against
 * the current revision, the history, the decision, and the sheet as readers will see it
 * (rendered by `sheet`, which the app supplies).
 */
export function ReviewPage({ sheet }: { sheet: (revision: SubmissionView) => ReactNode }) {
  const { revisionId = '' } = useParams();
  const id = Number(revisionId);
  const query = useReviewDetail(id);
  const claimActions = useClaim(id);
  const next = useClaimNext();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  // the desk's filters travel in the address, so "open the next" stays within them
  const { page: _page, ...filters } = queueQueryFrom(params);
  const search = reviewQueueSearch(filters);
  const deskHref = `${paths.review()}${search ? `?${search}` : ''}`;
  const [nextNote, setNextNote] = useState<string | null>(null);
  const openNext = async () => {
    setNextNote(null);
    try {
      const found = await next.mutateAsync({ filters, after: id });
      if (found.revisionId === null)
        setNextNote('Nothing unclaimed is left in this filter. Back to the desk when you are ready.');
      else navigate(`${paths.reviewRevision(found.revisionId)}${search ? `?${search}` : ''}`);
    } catch (err) {
      setNextNote(err instanceof ApiError ? err.message : 'The next submission did not open. Try again.');
    }
  };
  const detail = query.data;
  const canClaim = Boolean(detail && detail.revision.status === 'in_review' && detail.canDecide);
  const shortcuts: Shortcut[] = [
    { key: 'c', label: 'Claim this submission, or extend your claim', run: () => canClaim && void claimActions.claim.mutate() },
    { key: 'n', label: 'Skip: claim and open the next unclaimed one', run: () => void openNext() },
    { key: 'b', label: 'Back to the desk', run: () => navigate(deskHref) },
  ];
  useShortcuts(shortcuts);
  if (query.isPending)
    return (
      <Page title="Review">
        <Loading label="Loading the revision…" />
      </Page>
    );
  if (query.isError)
    return (
      <Page title="Review">
        <ErrorNotice error={query.error} />
      </Page>
    );
  const { revision, checks, current, basedOn, history, canDecide, claim } = query.data;
  const behind = revision.behind && basedOn ? { base: basedOn, current: revision.behind.current } : null;
  return (
    <Page
      title={`Review: ${revision.data.title}`}
      heading={revision.data.title}
      lead={
        <>
          {chassisLabel(revision.chassis)} · {revision.axle} axle · by {revision.author.name} (@{revision.author.login}) · sent{' '}
          {when(revision.submittedAt)}
        </>
      }
      actions={
        <div className="flex flex-wrap gap-2">
          <Badge tone={revision.status === 'in_review' ? 'brass' : revision.status === 'approved' ? 'ink' : 'plain'}>
            {revisionStatusLabels[revision.status]}
          </Badge>
          {revision.isCorrection ? <Badge tone="brass">Correction → revision {revision.number}</Badge> : <Badge>New swap</Badge>}
        </div>
      }
    >
      <p className="mb-4 text-sm">
        <Link to={deskHref} className="font-bold text-ink underline">
          ← Back to the review desk
        </Link>
      </p>
      {revision.status === 'in_review' && <ClaimBar claim={claim} actions={claimActions} canClaim={canClaim} />}
      {nextNote && (
        <p role="status" className="mb-4 rounded-lg bg-ink-faint/60 p-3 text-sm font-semibold text-ink">
          {nextNote}
        </p>
      )}
      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="min-w-0 space-y-10">
          {behind && (
            <section
              aria-labelledby="behind-h"
              className="rounded-xl border-l-4 border-oxide bg-oxide-soft/40 p-4"
              data-testid="behind-current"
            >
              <h2 id="behind-h" className="text-xl font-extrabold text-ink">
                The record moved on
              </h2>
              <p className="mt-2 text-graphite">
                This correction started from revision {behind.base.number}; revision {behind.current.number} was approved since.
                Approving it as it is would put back what revision {behind.current.number} changed, so it cannot be approved until
                its author brings it up to date. Send it back: they are offered a merge that keeps both sides’ changes and asks
                them where the two differ.
              </p>
            </section>
          )}
          <ChangeNote revision={revision} />
          <Checks checks={checks} />
          {behind && current && (
            <section aria-labelledby="newer-h">
              <h2 id="newer-h" className="mb-3 text-xl font-extrabold text-ink">
                What revision {behind.current.number} changed since revision {behind.base.number}
              </h2>
              <RevisionChanges before={behind.base} after={current} idPrefix="newer-changes" />
            </section>
          )}
          {behind && (
            <section aria-labelledby="diff-h">
              <h2 id="diff-h" className="mb-3 text-xl font-extrabold text-ink">
                What this correction changes in revision {behind.base.number}
              </h2>
              <RevisionChanges
                before={behind.base}
                after={{ data: revision.data, body: revision.body }}
                idPrefix="review-changes"
              />
            </section>
          )}
          {!behind && current && (
            <section aria-labelledby="diff-h">
              <h2 id="diff-h" className="mb-3 text-xl font-extrabold text-ink">
                What this correction changes in revision {current.number}
              </h2>
              <RevisionChanges before={current} after={{ data: revision.data, body: revision.body }} idPrefix="review-changes" />
            </section>
          )}
          {(revision.status === 'approved' || revision.status === 'superseded') && <TakedownPanel detail={query.data} />}
          <History history={history} />
          {/* listed here rather than under the decision, so the sticky decision panel stays within the screen */}
          <ShortcutList shortcuts={[...shortcuts, ...decisionKeyLabels.map((d) => ({ ...d, run: () => {} }))]} />
        </div>
        <div className="lg:sticky lg:top-4 lg:self-start">
          <DecisionPanel
            key={`${revision.id}-${behind ? 'behind' : 'current'}`}
            revision={revision}
            canDecide={canDecide}
            heldBy={claim && !claim.mine ? claim.by.login : null}
            openNext={openNext}
          />
        </div>
      </div>
      <section aria-labelledby="sheet-h" className="mt-12 rounded-2xl border-2 border-dashed border-ink/20">
        <h2 id="sheet-h" className="px-4 pt-4 text-xl font-extrabold text-ink sm:px-6">
          The sheet as it will look
        </h2>
        {/* nobody has reviewed this text yet: it is formatted only if it parses within a time budget */}
        <UntrustedMarkdown>{sheet(revision)}</UntrustedMarkdown>
      </section>
    </Page>
  );
}
