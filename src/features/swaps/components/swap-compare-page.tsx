import { Link, useParams, useSearchParams } from 'react-router';
import { useQueries } from '@tanstack/react-query';
import { swapQueryOptions } from '../api/get-swap';
import { Page } from '../../../components/ui/page';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { RevisionDiff } from '../../../components/revision-diff';
import { paths } from '../../../config/paths';

export default function SwapComparePage() {
  const { slug = '' } = useParams();
  const [params] = useSearchParams();
  const a = Number(params.get('a'));
  const b = Number(params.get('b'));
  const [before, after] = useQueries({ queries: [swapQueryOptions(slug, a), swapQueryOptions(slug, b)] });
  if (!Number.isInteger(a) || !Number.isInteger(b) || a < 1 || b < 1)
    return (
      <Page title="Compare">
        <ErrorNotice error={new Error('Pick two revision numbers to compare.')} />
      </Page>
    );
  if (before.isPending || after.isPending)
    return (
      <Page title="Compare">
        <Loading />
      </Page>
    );
  if (before.isError || after.isError)
    return (
      <Page title="Compare">
        <ErrorNotice error={before.error ?? after.error} />
      </Page>
    );
  return (
    <Page
      title={`Revisions ${a} and ${b}`}
      heading={`What changed: revision ${a} → ${b}`}
      lead={
        <Link to={paths.swap(slug)} className="font-bold text-ink underline">
          {after.data.revision.data.title}
        </Link>
      }
    >
      <RevisionDiff
        before={{ data: before.data.revision.data, body: before.data.revision.body }}
        after={{ data: after.data.revision.data, body: after.data.revision.body }}
        labels={[`Revision ${a}`, `Revision ${b}`]}
      />
    </Page>
  );
}
