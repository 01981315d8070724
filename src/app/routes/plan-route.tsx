import { useMe } from '../../features/account/api/get-me';
import { useMyCars } from '../../features/cars/api/get-cars';
import { PlanPage } from '../../features/plans/components/plan-page';

/** A plan, with the signed-in member's cars offered as the car it is for. */
export default function PlanRoute() {
  const me = useMe();
  const cars = useMyCars(Boolean(me.data?.user));
  return <PlanPage cars={cars.data ?? []} />;
}
