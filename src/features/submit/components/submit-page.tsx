import { useSearchParams } from 'react-router';
import { Page } from '../../../components/ui/page';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { useSwapToCorrect } from '../api/get-swap-to-correct';
import { emptyValues, valuesFromData } from '../lib/form-values';
import { SubmissionEditor } from './submission-editor';

/** `/submit` records a new swap; `/submit?swap=<slug>` proposes a correction of an approved one. */
export default function SubmitPage() {
  const [params] = useSearchParams();
  const slug = params.get('swap');
  const swap = useSwapToCorrect(slug);
  if (!slug) return <SubmissionEditor key="new" mode={{ kind: 'new' }} initial={emptyValues()} />;
  if (swap.isPending)
    return (
      <Page title="Correction">
        <Loading label="Loading the swap to correct…" />
      </Page>
    );
  if (swap.isError)
    return (
      <Page title="Correction">
        <ErrorNotice error={swap.error} />
      </Page>
    );
  const { revision } = swap.data;
  return (
    <SubmissionEditor
      key={slug}
      mode={{ kind: 'correction', swap: swap.data }}
      initial={valuesFromData(revision.data, revision.body)}
    />
  );
}
