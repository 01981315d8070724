import { mailStatusLabels, type MailStatus } from '@shared/schemas/enums';
import type { OutboxMessage } from '@shared/schemas/submissions';
import { Page } from '../../../components/ui/page';
import { Badge } from '../../../components/ui/badge';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { useOutbox } from '../api/get-outbox';
import { formatDateTime } from '@shared/dates';

const when = (iso: string) => formatDateTime(iso);

const tones: Record<MailStatus, 'ink' | 'brass' | 'oxide' | 'plain'> = {
  kept: 'plain',
  pending: 'brass',
  sending: 'brass',
  retrying: 'brass',
  sent: 'ink',
  failed: 'oxide',
};

function Delivery({ m }: { m: OutboxMessage }) {
  return (
    <>
      <dt className="font-bold">Delivery</dt>
      <dd>
        <Badge tone={tones[m.status]}>{mailStatusLabels[m.status]}</Badge>
        {m.sentAt && <span className="ml-2">{when(m.sentAt)}</span>}
      </dd>
      {m.delivery && m.delivery.attempts > 0 && (
        <>
          <dt className="font-bold">Tries</dt>
          <dd>
            {m.delivery.attempts}
            {m.delivery.nextAttemptAt && m.status === 'retrying' && ` · next ${when(m.delivery.nextAttemptAt)}`}
          </dd>
        </>
      )}
      {m.delivery?.lastError && (
        <>
          <dt className="font-bold">Last error</dt>
          <dd className="break-words text-oxide">{m.delivery.lastError}</dd>
        </>
      )}
    </>
  );
}

/**
 * `/outbox`: every message the site wrote to members, newest first, with its delivery state. The
 * address and the mail server's answers show to admins only. The text part shows as text; the HTML
 * part only in a sandboxed frame.
 */
export default function OutboxPage() {
  const outbox = useOutbox();
  const lead = outbox.data?.delivering
    ? 'Messages to members and how their delivery went. Newest first.'
    : 'Messages to members, kept here while no mail server is set up. Newest first.';
  return (
    <Page title="Outbox" heading="Outbox" lead={lead}>
      {outbox.isPending ? (
        <Loading />
      ) : outbox.isError ? (
        <ErrorNotice error={outbox.error} />
      ) : outbox.data.items.length === 0 ? (
        <p className="text-graphite">The outbox is empty.</p>
      ) : (
        <ul className="space-y-4" data-testid="outbox">
          {outbox.data.items.map((m) => (
            <li key={m.id}>
              <article aria-labelledby={`msg-${m.id}`} className="rounded-xl border border-ink/10 bg-paper-card p-4 sm:p-5">
                <h2 id={`msg-${m.id}`} className="text-lg font-extrabold text-ink">
                  {m.subject}
                </h2>
                <dl className="tabular mt-1 grid gap-x-4 gap-y-0.5 text-sm text-graphite-soft sm:grid-cols-[auto_1fr]">
                  <dt className="font-bold">To</dt>
                  <dd className="break-all">
                    {m.recipient ? `@${m.recipient}` : 'a former member'}
                    {m.to && ` · ${m.to}`}
                  </dd>
                  <dt className="font-bold">Written</dt>
                  <dd>{when(m.createdAt)}</dd>
                  <Delivery m={m} />
                </dl>
                <pre className="mt-3 overflow-x-auto whitespace-pre-wrap break-words rounded-md bg-paper p-3 font-sans text-sm text-graphite">
                  {m.text}
                </pre>
                {m.html && (
                  <details className="mt-3">
                    <summary className="cursor-pointer text-sm font-bold text-ink">HTML version</summary>
                    <iframe
                      title={`HTML version of “${m.subject}”`}
                      sandbox=""
                      srcDoc={m.html}
                      className="mt-2 h-80 w-full rounded-md border border-graphite/20 bg-white"
                    />
                  </details>
                )}
              </article>
            </li>
          ))}
        </ul>
      )}
    </Page>
  );
}
