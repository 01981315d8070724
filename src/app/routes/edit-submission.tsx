import { lazy } from 'react';
import { RequireSignedIn } from '../../features/account/components/require-signed-in';

// the page's own chunk loads only once the account check has passed
const EditSubmissionPage = lazy(() => import('../../features/submit/components/edit-submission-page'));

export default function EditSubmissionRoute() {
  return (
    <RequireSignedIn permission="submit" what="your submission">
      <EditSubmissionPage />
    </RequireSignedIn>
  );
}
