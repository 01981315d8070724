import { Link } from 'react-router';
import type { MySubmissionItem } from '@shared/schemas/submissions';
import { revisionStatusLabels, type RevisionStatus } from '@shared/schemas/enums';
import { Page } from '../../../components/ui/page';
import { ButtonLink } from '../../../components/ui/button';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { paths } from '../../../config/paths';
import { useMySubmissions } from '../api/get-my-submissions';
import { formatDate } from '@shared/dates';

const order: RevisionStatus[] = ['sent_back', 'draft', 'in_review', 'approved', 'declined', 'superseded'];
const leads: Record<RevisionStatus, string> = {
  sent_back: 'A moderator sent these back for rework. Edit and send again.',
  draft: 'Saved as you typed; not sent yet.',
  in_review: 'Waiting for a moderator. Locked until they decide.',
  approved: 'Published. To change one, propose a correction.',
  declined: 'Not published.',
  superseded: 'Replaced by a newer published revision.',
};

const date = (iso: string | null) => (iso ? formatDate(iso) : '—');

function Item({ item }: { item: MySubmissionItem }) {
  const editable = item.status === 'draft' || item.status === 'sent_back';
  return (
    <li className="rounded-lg border border-graphite/15 bg-paper-card p-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="font-extrabold text-ink">
          <Link to={paths.editSubmission(item.id)} className="underline decoration-brass underline-offset-2">
            {item.title}
          </Link>
        </h3>
        <span className="tabular text-xs text-graphite-soft">
          Revision {item.number} · {item.submittedAt ? `sent ${date(item.submittedAt)}` : `changed ${date(item.updatedAt)}`}
        </span>
      </div>
      {item.reviewNote && (item.status === 'sent_back' || item.status === 'declined') && (
        <p className="mt-2 whitespace-pre-wrap rounded-md bg-brass-soft/40 p-2 text-sm text-graphite">
          <strong>Reasons:</strong> {item.reviewNote}
        </p>
      )}
      <div className="mt-3 flex flex-wrap gap-2">
        {editable ? (
          <ButtonLink to={paths.editSubmission(item.id)} variant={item.status === 'sent_back' ? 'primary' : 'secondary'}>
            {item.status === 'sent_back' ? 'Rework and resend' : 'Continue editing'}
          </ButtonLink>
        ) : (
          <ButtonLink to={paths.editSubmission(item.id)} variant="secondary">
            View
          </ButtonLink>
        )}
        {item.status === 'approved' && (
          <ButtonLink to={paths.swap(item.swapSlug)} variant="quiet">
            Swap sheet
          </ButtonLink>
        )}
      </div>
    </li>
  );
}

/** `/me/submissions`: every revision the member wrote, grouped by where it stands. */
export default function MySubmissionsPage() {
  const query = useMySubmissions();
  return (
    <Page
      title="My submissions"
      heading="My submissions"
      lead="Every swap and correction you have written, by where it stands."
      actions={<ButtonLink to={paths.submit()}>Record a swap</ButtonLink>}
    >
      {query.isPending ? (
        <Loading />
      ) : query.isError ? (
        <ErrorNotice error={query.error} />
      ) : query.data.length === 0 ? (
        <p className="text-graphite">Nothing yet. When you record a swap, its drafts and revisions appear here.</p>
      ) : (
        <div className="space-y-8">
          {order.map((status) => {
            const items = query.data.filter((i) => i.status === status);
            if (items.length === 0) return null;
            return (
              <section key={status} aria-labelledby={`group-${status}`}>
                <h2 id={`group-${status}`} className="text-lg font-extrabold text-ink">
                  {revisionStatusLabels[status]} <span className="tabular text-graphite-soft">({items.length})</span>
                </h2>
                <p className="mb-3 text-sm text-graphite-soft">{leads[status]}</p>
                <ul className="space-y-3">
                  {items.map((i) => (
                    <Item key={i.id} item={i} />
                  ))}
                </ul>
              </section>
            );
          })}
        </div>
      )}
    </Page>
  );
}
