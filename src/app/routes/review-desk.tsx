import { lazy } from 'react';
import { RequireSignedIn } from '../../features/account/components/require-signed-in';
import { HeldReportsSummary } from '../../features/fitted-reports/components/held-reports-summary';

// the page's own chunk loads only once the account check has passed
const ReviewDeskPage = lazy(() => import('../../features/review/components/review-desk-page'));

export default function ReviewDeskRoute() {
  return (
    <RequireSignedIn permission="review" what="the review desk">
      <ReviewDeskPage />
      <HeldReportsSummary />
    </RequireSignedIn>
  );
}
