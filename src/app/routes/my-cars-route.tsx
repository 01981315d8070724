import { RequireSignedIn } from '../../features/account/components/require-signed-in';
import MyCarsPage from '../../features/cars/components/my-cars-page';

export default function MyCarsRoute() {
  return (
    <RequireSignedIn what="your cars">
      <MyCarsPage />
    </RequireSignedIn>
  );
}
