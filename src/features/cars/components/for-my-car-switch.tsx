import { useSearchParams } from 'react-router';
import { useMyCars } from '../api/get-cars';
import { wheelLabel } from './my-cars-page';
import { chassisName } from '@shared/chassis-label';

/**
 * "For my car" on the search page: narrows the results to a saved car's chassis and to swaps whose
 * minimum wheel its wheel meets. It only writes the search's own `chassis` and `wheel` address parameters.
 */
export function ForMyCarSwitch({ signedIn }: { signedIn: boolean }) {
  const cars = useMyCars(signedIn);
  const [params, setParams] = useSearchParams();
  if (!signedIn || !cars.data || cars.data.length === 0) return null;
  const active = cars.data.find(
    (c) => params.get('chassis') === c.chassis.slug && params.get('wheel') === String(c.wheelDiameterIn),
  );

  const choose = (id: string) => {
    const next = new URLSearchParams(params);
    next.delete('page');
    const car = cars.data.find((c) => String(c.id) === id);
    if (car) {
      next.set('chassis', car.chassis.slug);
      next.set('wheel', String(car.wheelDiameterIn));
      // a chosen chassis stands for its make and model
      next.delete('make');
      next.delete('model');
    } else {
      next.delete('chassis');
      next.delete('wheel');
    }
    setParams(next, { replace: false });
  };

  return (
    <div className="mx-auto w-full max-w-sheet px-4 pt-4 sm:px-6">
      <div className="flex flex-wrap items-center gap-3 rounded-lg border border-ink/15 bg-ink-faint/40 px-3 py-2 text-sm">
        <label className="flex items-center gap-2 font-bold text-ink">
          <input
            type="checkbox"
            role="switch"
            aria-checked={Boolean(active)}
            checked={Boolean(active)}
            onChange={(e) => choose(e.target.checked ? String(cars.data[0]!.id) : '')}
            className="h-4 w-4 accent-[#1d4d3a]"
          />
          For my car
        </label>
        {cars.data.length > 1 && (
          <select
            aria-label="Which car"
            value={active ? String(active.id) : ''}
            onChange={(e) => choose(e.target.value)}
            className="rounded-md border border-graphite/25 bg-paper-card px-2 py-1 text-sm"
          >
            <option value="">Any car</option>
            {cars.data.map((c) => (
              <option key={c.id} value={c.id}>
                {c.nickname} ({c.chassis.code}, {wheelLabel(c)})
              </option>
            ))}
          </select>
        )}
        <span className="text-graphite-soft">
          {active
            ? `Showing swaps for ${active.nickname}: ${chassisName(active.chassis)}, minimum wheel at most ${active.wheelDiameterIn}″.`
            : `Narrow to ${cars.data.length === 1 ? cars.data[0]!.nickname : 'one of your cars'}: its chassis and what its wheel clears.`}
        </span>
      </div>
    </div>
  );
}
