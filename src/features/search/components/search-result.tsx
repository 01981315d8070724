import { Link } from 'react-router';
import type { SearchDocument } from '@shared/search/search-document';
import { categoryLabels, machiningLevelLabels } from '@shared/schemas/enums';
import { Badge } from '../../../components/ui/badge';
import { chassisLabel } from '../../../components/swap-card';
import { paths } from '../../../config/paths';
import { formatMoney } from '@shared/money';
import { formatDate } from '@shared/dates';

const wholeMoney = (minor: number, currency: string) => formatMoney(minor, currency, { whole: true });

export function costText(cost: SearchDocument['cost']) {
  if (!cost) return null;
  return cost.min === cost.max
    ? wholeMoney(cost.min, cost.currency)
    : `${wholeMoney(cost.min, cost.currency)} – ${wholeMoney(cost.max, cost.currency)}`;
}

/** One result: title, chassis, the specs people filter by, and the parts that make it up. */
export function SearchResult({ doc }: { doc: SearchDocument }) {
  const cost = costText(doc.cost);
  const adapterListed = doc.adapter !== null && doc.partNames.some((n) => n.includes(doc.adapter!.name));
  return (
    <article className="relative rounded-xl border border-ink/10 bg-paper-card p-4 shadow-sm transition-shadow focus-within:ring-2 focus-within:ring-brass hover:shadow-md sm:p-5">
      <div className="flex flex-wrap items-center gap-1.5">
        <Badge tone="ink">{doc.axle === 'front' ? 'Front axle' : 'Rear axle'}</Badge>
        <Badge tone="plain">{categoryLabels[doc.category]}</Badge>
        {doc.machining !== 'none' && (
          <Badge tone={doc.machining === 'major' ? 'oxide' : 'brass'}>{machiningLevelLabels[doc.machining]}</Badge>
        )}
      </div>
      <h3 className="mt-2 text-lg font-extrabold leading-snug text-ink">
        <Link to={paths.swap(doc.slug)} data-result-link className="after:absolute after:inset-0 focus:outline-none">
          {doc.title}
        </Link>
      </h3>
      <p className="text-sm font-semibold text-graphite-soft">{chassisLabel(doc.chassis)}</p>
      {(doc.partNames.length > 0 || doc.adapter) && (
        <p className="mt-2 line-clamp-2 text-sm text-graphite">
          {doc.partNames.slice(0, 3).join(' · ')}
          {doc.adapter && !adapterListed && ` · ${doc.adapter.name}${doc.adapter.maker ? ` (${doc.adapter.maker})` : ''}`}
        </p>
      )}
      {doc.partNumbers.length > 0 && (
        <p className="tabular mt-1 truncate font-mono text-xs text-graphite-soft">
          {doc.partNumbers.slice(0, 4).join('  ')}
          {doc.partNumbers.length > 4 && ` +${doc.partNumbers.length - 4}`}
        </p>
      )}
      <dl className="tabular mt-3 grid grid-cols-2 gap-x-4 gap-y-1 text-xs text-graphite-soft sm:flex sm:flex-wrap">
        <div className="flex gap-1">
          <dt>Min. wheel</dt>
          <dd className="font-bold text-graphite">{doc.minWheelIn ? `${doc.minWheelIn}″` : 'stock'}</dd>
        </div>
        {doc.parkingBrakeKept !== null && (
          <div className="flex gap-1">
            <dt>Parking brake</dt>
            <dd className="font-bold text-graphite">{doc.parkingBrakeKept ? 'kept' : 'lost'}</dd>
          </div>
        )}
        {cost && (
          <div className="flex gap-1">
            <dt>Cost</dt>
            <dd className="font-bold text-graphite">{cost}</dd>
          </div>
        )}
        <div className="flex gap-1">
          <dt>Fitted by</dt>
          <dd className="font-bold text-graphite">
            {doc.fittedCount} {doc.fittedCount === 1 ? 'member' : 'members'}
          </dd>
        </div>
        <div className="flex gap-1">
          <dt>Approved</dt>
          <dd className="font-bold text-graphite">
            <time dateTime={doc.updatedAt}>{formatDate(doc.updatedAt)}</time>
          </dd>
        </div>
      </dl>
    </article>
  );
}
