import { Link } from 'react-router';
import { useMemo } from 'react';
import type { BalanceStart, CarView } from '@shared/schemas/cars';
import { carFigures, chassisFigures, type VehicleData } from '@shared/schemas/vehicle';
import { paths } from '../../../config/paths';
import { carsOnChassis, useMyCars } from '../api/get-cars';
import { wheelLabel } from './my-cars-page';

type SwapLike = { slug: string; minWheelIn: number | null };

/** "Fill from" buttons for the sheet's wheel check: the member's cars on this swap's chassis first, then the rest. */
export function useCarWheelPresets(chassisSlug: string, signedIn: boolean) {
  const cars = useMyCars(signedIn);
  const all = cars.data ?? [];
  const onChassis = carsOnChassis(all, chassisSlug);
  const ordered = [...onChassis, ...all.filter((c) => !onChassis.includes(c))];
  return ordered.map((c) => ({
    label: onChassis.includes(c) ? `${c.nickname} (${wheelLabel(c)})` : `${c.nickname} (${wheelLabel(c)}, other chassis)`,
    wheel: { diameterIn: c.wheelDiameterIn, widthIn: c.wheelWidthIn, offsetMm: c.wheelOffsetMm, spacerMm: c.spacerMm },
    insideProfile: c.wheelInsideProfile,
  }));
}

/**
 * Where the sheet's brake balance may start from, for the member's cars: a car on this swap's chassis starts
 * from the car as it is (the swaps fitted to it, its own figures or the chassis'); a car on another chassis
 * only lends its own figures.
 */
export function useCarBalanceStarts(
  sheet: { swapSlug: string; chassis: { slug: string; make: string; model: string; vehicle: VehicleData | null } },
  signedIn: boolean,
): BalanceStart[] {
  const cars = useMyCars(signedIn);
  const { swapSlug, chassis } = sheet;
  return useMemo(
    () =>
      (cars.data ?? []).flatMap((car): BalanceStart[] => {
        const own = carFigures(car);
        const stockStart = own && {
          key: `car-${car.id}`,
          label: own.label,
          figures: own,
          brakesAsIs: null,
          fittedTitles: [],
          fittedHere: false,
        };
        if (car.chassis.slug !== chassis.slug || !car.brakesAsIs) return stockStart ? [stockStart] : [];
        return [
          {
            key: `car-${car.id}`,
            label: `${car.nickname} as it is`,
            figures: own ?? chassisFigures(chassis),
            brakesAsIs: car.brakesAsIs,
            fittedTitles: car.fitted.filter((f) => f.slug !== swapSlug).map((f) => f.title),
            fittedHere: car.fitted.some((f) => f.slug === swapSlug),
          },
        ];
      }),
    [cars.data, swapSlug, chassis],
  );
}

/**
 * The chassis page's marks: which swaps clear the member's wheel on this chassis. Only the minimum wheel
 * diameter each swap records is compared; the full clearance check needs the swap's measurements and runs on its sheet.
 */
export function useChassisCarMarks(chassisSlug: string, signedIn: boolean) {
  const cars = useMyCars(signedIn);
  const mine = carsOnChassis(cars.data, chassisSlug);
  if (mine.length === 0) return { intro: null, noteFor: () => null };
  return {
    intro: <ChassisCarIntro cars={mine} />,
    noteFor: (swap: SwapLike) => <SwapMark cars={mine} swap={swap} />,
  };
}

function ChassisCarIntro({ cars }: { cars: CarView[] }) {
  return (
    <div role="note" className="mb-6 rounded-lg border border-ink/20 bg-ink-faint/50 p-4 text-sm text-graphite">
      <p className="font-bold text-ink">
        Checked against your {cars.length === 1 ? 'car' : 'cars'}:{' '}
        {cars.map((c) => `${c.nickname} (${wheelLabel(c)})`).join(', ')}
      </p>
      <p className="mt-1">
        Rule used here: a swap is marked when its recorded minimum wheel diameter is no larger than your wheel’s.
        Caliper-to-barrel and spoke clearance, offset and wheel-bolt length are checked on each swap’s sheet under “Check my
        wheel”.{' '}
        <Link to={paths.myCars()} className="font-bold text-ink underline">
          Edit my cars
        </Link>
      </p>
    </div>
  );
}

function SwapMark({ cars, swap }: { cars: CarView[]; swap: SwapLike }) {
  if (swap.minWheelIn === null) {
    return <p className="px-1 pt-2 text-xs text-graphite-soft">No minimum wheel recorded: check it on the sheet.</p>;
  }
  return (
    <ul className="space-y-1 px-1 pt-2 text-xs" aria-label="Checked against your cars">
      {cars.map((c) => {
        const ok = c.wheelDiameterIn >= swap.minWheelIn!;
        return (
          <li key={c.id} className={ok ? 'font-bold text-ink' : 'font-bold text-oxide'} data-car-check={ok ? 'pass' : 'fail'}>
            <span aria-hidden>{ok ? '✓ ' : '✕ '}</span>
            {ok
              ? `Your ${c.nickname}’s ${c.wheelDiameterIn}″ wheel meets the ${swap.minWheelIn}″ minimum`
              : `Needs at least ${swap.minWheelIn}″; your ${c.nickname} runs ${c.wheelDiameterIn}″`}
          </li>
        );
      })}
    </ul>
  );
}
