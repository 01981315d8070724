import { lazy } from 'react';
import { RequireSignedIn } from '../../features/account/components/require-signed-in';

// the page's own chunk loads only once the account check has passed
const MySubmissionsPage = lazy(() => import('../../features/submit/components/my-submissions-page'));

export default function MySubmissionsRoute() {
  return (
    <RequireSignedIn what="your submissions">
      <MySubmissionsPage />
    </RequireSignedIn>
  );
}
