import { Link } from 'react-router';
import type { PinnedSheetView } from '@shared/schemas/shops';
import { Markdown } from '../../../components/markdown';
import { paths } from '../../../config/paths';
import { qrUrl } from '../api/shop-links';
import { formatMoney } from '@shared/money';
import { formatDate } from '@shared/dates';

const date = (iso: string | null) => (iso ? formatDate(iso) : '—');

/**
 * Above a sheet opened through a shop link: who sent it and whether the record moved on since. The link's
 * note is the shop's private record; only the shop's own accounts get it from the server, and see it here.
 */
export function ShopLinkBanner({ pinned }: { pinned: PinnedSheetView }) {
  const { shop, link, sheet, newerRevision } = pinned;
  return (
    <aside
      aria-label={`Shared by ${shop.name}`}
      className="print-break-avoid mb-6 rounded-xl border-2 border-brass bg-paper-card p-4 shadow-sm sm:p-5"
    >
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div className="min-w-0 flex-1">
          <p className="text-xs font-bold uppercase tracking-wide text-brass-deep">Shared by a shop</p>
          <p className="mt-0.5 text-lg font-extrabold text-ink">
            <Link to={paths.shop(shop.slug)} className="underline decoration-brass underline-offset-2">
              {shop.name}
            </Link>
            {shop.town && <span className="font-semibold text-graphite-soft"> · {shop.town}</span>}
          </p>
          {link.publicNote && (
            <div className="mt-2 border-l-4 border-brass pl-3">
              <p className="text-xs font-bold text-graphite-soft">{shop.name} notes</p>
              <Markdown>{link.publicNote}</Markdown>
            </div>
          )}
          {link.private && <PrivatePart part={link.private} />}
          <p className="mt-3 text-sm text-graphite">
            This is the revision {shop.name} quoted: <strong>revision {sheet.revision.number}</strong>, approved{' '}
            {date(sheet.revision.approvedAt)}.
          </p>
        </div>
        {/* the printed sheet carries the link back to this page */}
        <figure className="hidden shrink-0 text-center print:block">
          <img src={qrUrl(link.code, 'svg')} alt="" className="h-28 w-28" />
          <figcaption className="tabular mt-1 text-[10px] text-graphite-soft">{link.url}</figcaption>
        </figure>
      </div>
      {newerRevision && (
        <div role="status" className="mt-3 rounded-lg border border-brass bg-brass-soft/50 p-3 text-sm">
          <p className="font-bold text-brass-deep">A newer revision of this swap exists (revision {newerRevision.number}).</p>
          <p className="mt-0.5">What changed since the shop’s quote: {newerRevision.summary.replace(/^Changed: /, '')}</p>
          <p className="no-print mt-1">
            <Link
              to={paths.swapCompare(sheet.swap.slug, sheet.revision.number, newerRevision.number)}
              className="font-bold text-ink underline"
            >
              Compare the two revisions
            </Link>{' '}
            ·{' '}
            <Link to={paths.swap(sheet.swap.slug)} className="font-bold text-ink underline">
              Read revision {newerRevision.number}
            </Link>{' '}
            · ask {shop.name} whether their quote still stands.
          </p>
        </div>
      )}
    </aside>
  );
}

const money = (p: { amountMinor: number; currency: string }) => formatMoney(p.amountMinor, p.currency);

/** The shop's own record of the quote; the server sends it only to the shop's accounts. */
function PrivatePart({ part }: { part: NonNullable<PinnedSheetView['link']['private']> }) {
  if (!part.note && !part.customerRef && !part.quotedPrice && !part.expiresAt) return null;
  return (
    <div className="no-print mt-2 rounded-md border border-dashed border-ink/30 bg-paper p-3 text-sm">
      <p className="text-xs font-bold text-graphite-soft">Private to your shop — customers do not see this</p>
      <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
        {part.customerRef && (
          <>
            <dt className="text-graphite-soft">Customer</dt>
            <dd className="font-bold">{part.customerRef}</dd>
          </>
        )}
        {part.quotedPrice && (
          <>
            <dt className="text-graphite-soft">Quoted</dt>
            <dd className="tabular font-bold">{money(part.quotedPrice)}</dd>
          </>
        )}
        {part.expiresAt && (
          <>
            <dt className="text-graphite-soft">Link expires</dt>
            <dd className="tabular font-bold">{date(part.expiresAt)}</dd>
          </>
        )}
      </dl>
      {part.note && <Markdown>{part.note}</Markdown>}
    </div>
  );
}

/** The reader followed a link the shop has since retired; the sheet still shows, without the shop's note. */
export function RetiredLinkBanner({ message }: { message: string }) {
  return (
    <aside role="status" className="mb-6 rounded-xl border border-graphite/20 bg-paper-card p-4 text-sm text-graphite">
      <p className="font-bold text-ink">This shop link has been retired</p>
      <p className="mt-1">
        {message} You are reading the revision it pointed to; check the revision history for the current one.
      </p>
    </aside>
  );
}
