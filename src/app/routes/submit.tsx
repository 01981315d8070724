import { lazy } from 'react';
import { RequireSignedIn } from '../../features/account/components/require-signed-in';

// the page's own chunk loads only once the account check has passed
const SubmitPage = lazy(() => import('../../features/submit/components/submit-page'));

export default function SubmitRoute() {
  return (
    <RequireSignedIn permission="submit" what="the submission form">
      <SubmitPage />
    </RequireSignedIn>
  );
}
