import { RequireSignedIn } from '../../features/account/components/require-signed-in';
import MyCarsPage from '../../features/cars/components/my-cars-page';
import { FollowButton } from '../../features/following/components/follow-button';

export default function MyCarsRoute() {
  return (
    <RequireSignedIn what="your cars">
      <MyCarsPage carActions={(car) => <FollowButton target={{ carId: car.id }} what={`your ${car.nickname}`} signedIn />} />
    </RequireSignedIn>
  );
}
