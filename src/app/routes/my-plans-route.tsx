import { RequireSignedIn } from '../../features/account/components/require-signed-in';
import MyPlansPage from '../../features/plans/components/my-plans-page';

export default function MyPlansRoute() {
  return (
    <RequireSignedIn what="your plans">
      <MyPlansPage />
    </RequireSignedIn>
  );
}
