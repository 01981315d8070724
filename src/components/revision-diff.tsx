import type { SwapData } from '@shared/schemas/swap-data';
import { diffBody, diffSwapData } from '@shared/revision-diff';

/** Field-by-field changes of the structured data and a line diff of the write-up. */
export function RevisionDiff({
  before,
  after,
  labels,
}: {
  before: { data: SwapData; body: string } | null;
  after: { data: SwapData; body: string };
  labels: [string, string];
}) {
  const fields = diffSwapData(before?.data ?? null, after.data);
  const body = diffBody(before?.body ?? '', after.body);
  const bodyChanged = body.some((c) => c.added || c.removed);
  return (
    <div className="space-y-6">
      <section aria-labelledby="diff-fields">
        <h3 id="diff-fields" className="mb-2 font-extrabold text-ink">
          Structured data
        </h3>
        {fields.length === 0 ? (
          <p className="text-sm text-graphite-soft">No field changed.</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="tabular w-full min-w-[36rem] text-left text-sm">
              <thead>
                <tr className="border-b border-graphite/20 text-xs uppercase text-graphite-soft">
                  <th scope="col" className="px-2 py-1">
                    Field
                  </th>
                  <th scope="col" className="px-2 py-1">
                    {labels[0]}
                  </th>
                  <th scope="col" className="px-2 py-1">
                    {labels[1]}
                  </th>
                </tr>
              </thead>
              <tbody>
                {fields.map((f) => (
                  <tr key={f.path} className="border-b border-graphite/10 align-top">
                    <td className="px-2 py-1 font-mono text-xs">{f.path}</td>
                    <td className="px-2 py-1 break-all bg-oxide-soft/50">
                      {f.before ?? <span className="text-graphite-soft">—</span>}
                    </td>
                    <td className="px-2 py-1 break-all bg-ink-faint/70">
                      {f.after ?? <span className="text-graphite-soft">—</span>}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
      <section aria-labelledby="diff-body">
        <h3 id="diff-body" className="mb-2 font-extrabold text-ink">
          Write-up
        </h3>
        {!bodyChanged ? (
          <p className="text-sm text-graphite-soft">The write-up is unchanged.</p>
        ) : (
          <pre className="overflow-x-auto rounded-lg border border-graphite/15 bg-paper-card p-3 text-xs leading-relaxed whitespace-pre-wrap">
            {body.map((c, i) => (
              <span
                key={i}
                className={
                  c.added
                    ? 'block bg-ink-faint text-ink'
                    : c.removed
                      ? 'block bg-oxide-soft text-oxide line-through'
                      : 'block text-graphite-soft'
                }
              >
                {c.value
                  .replace(/\n$/, '')
                  .split('\n')
                  .map((line) => `${c.added ? '+ ' : c.removed ? '− ' : '  '}${line}`)
                  .join('\n')}
              </span>
            ))}
          </pre>
        )}
      </section>
    </div>
  );
}
