import { Link, useParams, useSearchParams } from 'react-router';
import { useQueries } from '@tanstack/react-query';
import { swapQueryOptions } from '../api/get-swap';
import { Page } from '../../../components/ui/page';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { RevisionChanges } from '../../../components/revision-changes';
import { paths } from '../../../config/paths';

export default function SwapComparePage() {
  const { slug = '' } = useParams();
  const [params] = useSearchParams();
  // the older revision is always the one things changed from
  const [a, b] = [Number(params.get('a')), Number(params.get('b'))].sort((x, y) => x - y) as [number, number];
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
      heading={`What changed from revision ${a} to ${b}`}
      lead={
        <Link to={paths.swap(slug)} className="font-bold text-ink underline">
          {after.data.revision.data.title}
        </Link>
      }
    >
      <RevisionChanges
        before={{ data: before.data.revision.data, body: before.data.revision.body }}
        after={{ data: after.data.revision.data, body: after.data.revision.body }}
      />
    </Page>
  );
}
