import { Link } from 'react-router';
import { useOpenApi, type OpenApiOperation } from '../api/get-openapi';
import { Page } from '../../../components/ui/page';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { Badge } from '../../../components/ui/badge';
import { paths } from '../../../config/paths';

/** OpenAPI descriptions mark code with backticks: shown as code */
function Described({ text }: { text: string }) {
  return (
    <>
      {text.split('`').map((part, i) =>
        i % 2 ? (
          <code key={i} className="font-mono text-[0.95em]">
            {part}
          </code>
        ) : (
          part
        ),
      )}
    </>
  );
}

type Endpoint = { method: string; path: string; op: OpenApiOperation };

/** The public API's endpoints, read from its OpenAPI description, grouped by tag. */
export default function ApiDocsPage() {
  const query = useOpenApi();
  const doc = query.data;
  const endpoints: Endpoint[] = doc
    ? Object.entries(doc.paths).flatMap(([path, ops]) => Object.entries(ops).map(([method, op]) => ({ method, path, op })))
    : [];
  const tags = [...new Set(endpoints.map((e) => e.op.tags?.[0] ?? 'Other'))];
  return (
    <Page
      title="API"
      heading="Public API"
      lead={
        <>
          Read-only, no sign-in. The machine-readable description is{' '}
          <a href="/api/openapi.json" className="font-mono text-ink underline decoration-ink/30 underline-offset-2">
            /api/openapi.json
          </a>{' '}
          (OpenAPI 3.1). The data is open: see{' '}
          <Link to={paths.openData()} className="text-ink underline decoration-ink/30 underline-offset-2">
            its licence
          </Link>
          .
        </>
      }
    >
      {query.isPending && <Loading />}
      {query.isError && <ErrorNotice error={query.error} />}
      <div className="space-y-8">
        {tags.map((tag) => (
          <section key={tag} aria-labelledby={`tag-${tag}`}>
            <h2 id={`tag-${tag}`} className="mb-3 text-xl font-extrabold text-ink">
              {tag}
            </h2>
            <ul className="space-y-3" aria-label={`${tag} endpoints`}>
              {endpoints
                .filter((e) => (e.op.tags?.[0] ?? 'Other') === tag)
                .map(({ method, path, op }) => (
                  <li key={`${method} ${path}`} className="rounded-xl border border-ink/10 bg-paper-card p-4">
                    <p className="flex flex-wrap items-center gap-2">
                      <Badge tone="ink">{method.toUpperCase()}</Badge>
                      <code className="break-all font-mono text-sm font-bold text-ink">{path}</code>
                    </p>
                    {op.summary && <p className="mt-2 text-graphite">{op.summary}</p>}
                    {op.description && (
                      <p className="mt-1 text-sm text-graphite-soft">
                        <Described text={op.description} />
                      </p>
                    )}
                    {op.parameters && op.parameters.length > 0 && (
                      <p className="mt-2 text-sm text-graphite">
                        <span className="font-bold">Parameters: </span>
                        {op.parameters.map((p, i) => (
                          <span key={p.name}>
                            {i > 0 && ', '}
                            <code className="font-mono">{p.name}</code> ({p.in}
                            {p.required ? ', required' : ''})
                          </span>
                        ))}
                      </p>
                    )}
                    <p className="mt-1 text-sm text-graphite-soft">
                      Answers:{' '}
                      <Described
                        text={Object.entries(op.responses)
                          .map(([code, r]) => `${code} ${r.description}`)
                          .join(' · ')}
                      />
                    </p>
                  </li>
                ))}
            </ul>
          </section>
        ))}
      </div>
      {doc && (
        <section aria-labelledby="example-h" className="mt-10">
          <h2 id="example-h" className="mb-2 text-xl font-extrabold text-ink">
            Example
          </h2>
          <pre className="overflow-x-auto rounded-lg bg-ink p-4 text-sm text-paper">
            <code>{`curl -s '${window.location.origin}/api/graph/where-else?number=OV-355-104-L'\ncurl -sO '${window.location.origin}/api/export/swaps.csv'`}</code>
          </pre>
        </section>
      )}
    </Page>
  );
}
