import { RequireSignedIn } from '../../features/account/components/require-signed-in';
import FollowingPage from '../../features/following/components/following-page';

export default function MyFollowingRoute() {
  return (
    <RequireSignedIn what="what you follow">
      <FollowingPage />
    </RequireSignedIn>
  );
}
