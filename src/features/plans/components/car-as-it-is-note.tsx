import { useNavigate } from 'react-router';
import type { CarView } from '@shared/schemas/cars';
import { paths } from '../../../config/paths';
import { Button } from '../../../components/ui/button';
import { useMakePlan } from '../api/plans';

/**
 * On a swap sheet, for a member whose car on this chassis already has swaps fitted: the brake balance can
 * start from that car, the rest of the sheet is the record's own, so it offers a plan for the whole car.
 */
export function CarAsItIsNote({ swapSlug, cars }: { swapSlug: string; cars: CarView[] }) {
  const make = useMakePlan();
  const navigate = useNavigate();
  const changed = cars.filter((c) => c.fitted.length > 0 || c.otherChanges);
  if (changed.length === 0) return null;
  return (
    <div
      role="note"
      className="rounded-lg border border-ink/20 bg-ink-faint/50 p-4 text-sm text-graphite print:hidden"
      data-car-as-is
    >
      {changed.map((car) => {
        const fittedHere = car.fitted.some((f) => f.slug === swapSlug);
        return (
          <div key={car.id} className="flex flex-wrap items-center justify-between gap-2 py-1">
            <p>
              <span className="font-bold">{car.nickname}</span>{' '}
              {fittedHere
                ? 'already has this swap fitted.'
                : `already has ${car.fitted.length ? car.fitted.map((f) => f.title).join('; ') : 'other changes'}. The brake balance above can start from ${car.nickname} as it is; a plan works out the whole car from it: wheels, parts, torque and costs.`}
            </p>
            {!fittedHere && (
              <Button
                variant="secondary"
                disabled={make.isPending}
                onClick={() =>
                  make.mutate(
                    { chassisId: car.chassis.id, carId: car.id, swapSlugs: [swapSlug] },
                    { onSuccess: (made) => void navigate(paths.plan(made.id)) },
                  )
                }
              >
                Work it out on {car.nickname}
              </Button>
            )}
          </div>
        );
      })}
      {make.error && (
        <p role="alert" className="font-bold text-oxide">
          {make.error.message}
        </p>
      )}
    </div>
  );
}
