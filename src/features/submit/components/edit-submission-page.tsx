import { useParams } from 'react-router';
import type { SubmissionView } from '@shared/schemas/submissions';
import { Page } from '../../../components/ui/page';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { useSubmission } from '../api/get-submission';
import { valuesFromData, emptyValues, withIncompleteRows, type FormValues } from '../lib/form-values';
import { SubmissionEditor } from './submission-editor';
import { LockedSubmission } from './locked-submission';

function valuesOfView(view: SubmissionView): FormValues {
  const base = emptyValues();
  const values = valuesFromData(view.data, view.body, {
    ...base,
    chassisMode: 'existing',
    chassisId: String(view.chassis.id),
    axle: view.axle,
    category: view.category,
  });
  // the rows the author had not finished, back where they stood
  return withIncompleteRows(values, view.incompleteRows);
}

/** `/submissions/:id/edit`: a draft or sent-back revision in the form; anything else read-only. */
export default function EditSubmissionPage() {
  const { id: raw = '' } = useParams();
  const id = Number(raw);
  const query = useSubmission(id);
  if (!Number.isInteger(id) || id <= 0)
    return (
      <Page title="Not found">
        <ErrorNotice error={new Error('That is not a submission number.')} />
      </Page>
    );
  if (query.isPending)
    return (
      <Page title="Submission">
        <Loading label="Loading your submission…" />
      </Page>
    );
  if (query.isError)
    return (
      <Page title="Submission">
        <ErrorNotice error={query.error} />
      </Page>
    );
  const view = query.data;
  if (!view.editable) return <LockedSubmission view={view} />;
  return <SubmissionEditor key={view.id} mode={{ kind: 'edit', view }} initial={valuesOfView(view)} />;
}
