import { lazy } from 'react';
import { RequireSignedIn } from '../../features/account/components/require-signed-in';

const UpdateSubmissionPage = lazy(() => import('../../features/submit/components/update-submission-page'));

export default function UpdateSubmissionRoute() {
  return (
    <RequireSignedIn permission="submit" what="your correction">
      <UpdateSubmissionPage />
    </RequireSignedIn>
  );
}
