import { RequireSignedIn } from '../../features/account/components/require-signed-in';
import MySubmissionsPage from '../../features/submit/components/my-submissions-page';

export default function MySubmissionsRoute() {
  return (
    <RequireSignedIn what="your submissions">
      <MySubmissionsPage />
    </RequireSignedIn>
  );
}
