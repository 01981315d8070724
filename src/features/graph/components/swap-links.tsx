import { Link } from 'react-router';
import type { SwapLink } from '@shared/schemas/graph';
import { paths } from '../../../config/paths';

/** The swaps that show how a part fits, newest approval first; the count says how many the list stands for. */
export function SwapLinks({ swaps, swapCount }: { swaps: SwapLink[]; swapCount: number }) {
  return (
    <ul className="space-y-1.5 text-sm">
      {swaps.map((s) => (
        <li key={s.slug} className="leading-snug">
          <Link
            to={paths.swap(s.slug)}
            className="font-bold text-ink underline decoration-ink/30 underline-offset-2 hover:decoration-ink"
          >
            {s.title}
          </Link>
          <span className="text-graphite-soft">
            {' · '}
            {s.axle === 'front' ? 'front axle' : 'rear axle'} · revision {s.revisionNumber}
            {s.adapter?.name && (
              <>
                {' · with '}
                {s.adapter.name}
                {s.adapter.partNumber && <span className="font-mono"> {s.adapter.partNumber}</span>}
              </>
            )}
          </span>
        </li>
      ))}
      {swapCount > swaps.length && (
        <li className="text-graphite-soft">
          and {swapCount - swaps.length} more {swapCount - swaps.length === 1 ? 'swap' : 'swaps'}
        </li>
      )}
    </ul>
  );
}
