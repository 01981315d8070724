import { Link } from 'react-router';
import type { SwapCard as SwapCardData } from '@shared/schemas/views';
import { categoryLabels } from '@shared/schemas/enums';
import { Badge } from './ui/badge';
import { paths } from '../config/paths';
import { chassisLabel } from '@shared/chassis-label';

export { chassisLabel } from '@shared/chassis-label';

export function SwapCard({ swap }: { swap: SwapCardData }) {
  return (
    <article className="group relative flex flex-col overflow-hidden rounded-xl border border-ink/10 bg-paper-card shadow-sm transition-shadow hover:shadow-md">
      {swap.thumbUrl ? (
        <img
          src={swap.thumbUrl}
          alt=""
          width={480}
          height={300}
          loading="lazy"
          // the whole picture, never cropped: demo pictures and many photos carry words near their edges
          className="aspect-[16/10] w-full bg-paper-deep object-contain"
        />
      ) : (
        <div className="aspect-[16/10] w-full bg-paper-deep" aria-hidden />
      )}
      <div className="flex flex-1 flex-col gap-2 p-4">
        <div className="flex flex-wrap gap-1.5">
          <Badge tone="ink">{swap.axle === 'front' ? 'Front axle' : 'Rear axle'}</Badge>
          <Badge tone="plain">{categoryLabels[swap.category]}</Badge>
        </div>
        <h3 className="text-base font-extrabold leading-snug text-ink">
          <Link to={paths.swap(swap.slug)} className="after:absolute after:inset-0 focus:outline-none">
            {swap.title}
          </Link>
        </h3>
        <p className="text-sm text-graphite-soft">{chassisLabel(swap.chassis)}</p>
        {swap.summary && <p className="line-clamp-2 text-sm text-graphite">{swap.summary}</p>}
        <dl className="tabular mt-auto flex flex-wrap gap-x-4 gap-y-1 pt-2 text-xs text-graphite-soft">
          {swap.minWheelIn && (
            <div className="flex gap-1">
              <dt>Min. wheel</dt>
              <dd className="font-bold text-graphite">{swap.minWheelIn}″</dd>
            </div>
          )}
          <div className="flex gap-1">
            <dt>Fitted by</dt>
            <dd className="font-bold text-graphite">
              {swap.fittedCount} {swap.fittedCount === 1 ? 'member' : 'members'}
            </dd>
          </div>
          <div className="flex gap-1">
            <dt>Revision</dt>
            <dd className="font-bold text-graphite">{swap.revisionNumber}</dd>
          </div>
        </dl>
      </div>
    </article>
  );
}
