import { Link } from 'react-router';
import type { FitGroup } from '@shared/schemas/graph';
import { paths } from '../../../config/paths';
import { SwapLinks } from './swap-links';
import { chassisName as nameOf } from '@shared/chassis-label';

export const chassisName = (c: FitGroup['chassis']) => `${nameOf(c)} (${c.yearFrom}–${c.yearTo ?? 'on'})`;

/** Every chassis a part reaches through approved swaps, with those swaps and the catalogue adapters they use. */
export function FitGroups({ fits, label, totalChassis }: { fits: FitGroup[]; label: string; totalChassis: number }) {
  return (
    <>
      <ul aria-label={label} className="grid gap-4 md:grid-cols-2">
        {fits.map((f) => (
          <li key={f.chassis.slug} className="rounded-xl border border-ink/10 bg-paper-card p-4">
            <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
              <h3 className="font-extrabold text-ink">
                <Link to={paths.chassis(f.chassis.slug)} className="hover:underline">
                  {chassisName(f.chassis)}
                </Link>
              </h3>
              <span className="tabular text-xs font-bold text-graphite-soft">
                {f.swapCount} {f.swapCount === 1 ? 'swap' : 'swaps'}
              </span>
            </div>
            <div className="mt-2">
              <SwapLinks swaps={f.swaps} swapCount={f.swapCount} />
            </div>
            {f.adapters.length > 0 && (
              <p className="mt-3 border-t border-ink/10 pt-2 text-sm text-graphite">
                <span className="font-bold">Adapters in the catalogue: </span>
                {f.adapters.map((a, i) => (
                  <span key={a.id}>
                    {i > 0 && ', '}
                    <Link to={paths.part(a.id)} className="text-ink underline decoration-ink/30 underline-offset-2">
                      {a.name}
                    </Link>
                    {a.partNumbers[0] && <span className="font-mono text-graphite-soft"> {a.partNumbers[0]}</span>}
                  </span>
                ))}
              </p>
            )}
          </li>
        ))}
      </ul>
      {totalChassis > fits.length && (
        <p className="mt-3 text-sm text-graphite-soft">
          Showing the {fits.length} chassis with the most swaps, of {totalChassis}.
        </p>
      )}
    </>
  );
}
