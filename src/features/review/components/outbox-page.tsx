import { Page } from '../../../components/ui/page';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { useOutbox } from '../api/get-outbox';

const when = (iso: string) => new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/**
 * `/outbox`: the messages the site would have e-mailed, newest first, while no mail server
 * is configured. The text part shows as text; the HTML part only in a sandboxed frame.
 */
export default function OutboxPage() {
  const outbox = useOutbox();
  return (
    <Page title="Outbox" heading="Outbox" lead="Messages to members, kept here while no mail server is set up. Newest first.">
      {outbox.isPending ? (
        <Loading />
      ) : outbox.isError ? (
        <ErrorNotice error={outbox.error} />
      ) : outbox.data.length === 0 ? (
        <p className="text-graphite">The outbox is empty.</p>
      ) : (
        <ul className="space-y-4" data-testid="outbox">
          {outbox.data.map((m) => (
            <li key={m.id}>
              <article aria-labelledby={`msg-${m.id}`} className="rounded-xl border border-ink/10 bg-paper-card p-4 sm:p-5">
                <h2 id={`msg-${m.id}`} className="text-lg font-extrabold text-ink">
                  {m.subject}
                </h2>
                <dl className="tabular mt-1 grid gap-x-4 text-sm text-graphite-soft sm:grid-cols-[auto_1fr]">
                  <dt className="font-bold">To</dt>
                  <dd className="break-all">{m.to}</dd>
                  <dt className="font-bold">Written</dt>
                  <dd>{when(m.createdAt)}</dd>
                  <dt className="font-bold">Sent</dt>
                  <dd>{m.sentAt ? when(m.sentAt) : 'Not sent (local outbox)'}</dd>
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
