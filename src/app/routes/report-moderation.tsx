import { lazy } from 'react';
import { RequireSignedIn } from '../../features/account/components/require-signed-in';

const ReportModerationPage = lazy(() => import('../../features/fitted-reports/components/report-moderation-page'));

export default function ReportModerationRoute() {
  return (
    <RequireSignedIn permission="review" what="the fitted reports to check">
      <ReportModerationPage />
    </RequireSignedIn>
  );
}
