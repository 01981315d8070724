import { useState } from 'react';
import { Link } from 'react-router';
import type { ShopLinkItem } from '@shared/schemas/shops';
import { Page } from '../../../components/ui/page';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { Badge } from '../../../components/ui/badge';
import { Markdown } from '../../../components/markdown';
import { paths } from '../../../config/paths';
import { useRetireShopLink, useShopLinks, useUpdateShopLink } from '../api/shop-links';
import { QrDownloads } from './qr-downloads';
import { linkBody, linkDraftFrom, ShopLinkFields } from './shop-link-fields';
import { formatDate } from '@shared/dates';
import { formatMoney } from '@shared/money';

const date = (iso: string) => formatDate(iso);

export default function ShopLinksPage() {
  const query = useShopLinks();
  const shopName = query.data?.items[0]?.shop.name;
  return (
    <Page
      title="Shop links"
      heading="Shop links"
      lead="Each link points a customer at the revision you quoted under your shop’s name. The public note goes to your customers; the customer reference, price, expiry and private note stay with your shop. Make a new one from any swap sheet."
    >
      {query.isPending ? (
        <Loading label="Loading your links…" />
      ) : query.isError ? (
        <ErrorNotice error={query.error} />
      ) : query.data.items.length === 0 ? (
        <p className="rounded-lg border border-dashed border-ink/25 bg-paper-card p-6 text-graphite">
          No links yet. Open a swap sheet and use “Make a shop link”.{' '}
          <Link to={paths.search()} className="font-bold text-ink underline">
            Find a swap
          </Link>
        </p>
      ) : (
        <>
          {!query.data.canManage && (
            <p className="mb-4 text-sm text-graphite-soft">
              You are viewing every shop’s links as an admin; only each shop can change its own.
            </p>
          )}
          {query.data.canManage && shopName && <p className="mb-4 text-sm text-graphite-soft">Links of {shopName}.</p>}
          <table className="w-full border-collapse text-left text-sm">
            <caption className="sr-only">Shop links</caption>
            <thead className="hidden border-b border-graphite/20 text-xs uppercase tracking-wide text-graphite-soft md:table-header-group">
              <tr>
                <th scope="col" className="px-2 py-2">
                  Swap and note
                </th>
                <th scope="col" className="px-2 py-2">
                  Revision
                </th>
                <th scope="col" className="px-2 py-2 text-right">
                  Visits
                </th>
                <th scope="col" className="px-2 py-2">
                  Created
                </th>
                <th scope="col" className="px-2 py-2">
                  <span className="sr-only">Actions</span>
                </th>
              </tr>
            </thead>
            <tbody className="grid gap-4 md:table-row-group">
              {query.data.items.map((link) => (
                <LinkRow key={link.code} link={link} canManage={query.data.canManage} />
              ))}
            </tbody>
          </table>
        </>
      )}
    </Page>
  );
}

function LinkRow({ link, canManage }: { link: ShopLinkItem; canManage: boolean }) {
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState(() => linkDraftFrom(link));
  const [showQr, setShowQr] = useState(false);
  const [confirmRetire, setConfirmRetire] = useState(false);
  const [copied, setCopied] = useState(false);
  const update = useUpdateShopLink();
  const retire = useRetireShopLink();
  const retired = link.retiredAt !== null;
  const cell = 'block px-2 py-1 md:table-cell md:py-3 md:align-top';
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(link.url);
      setCopied(true);
    } catch {
      setCopied(false);
    }
  };

  return (
    <tr
      data-link-code={link.code}
      className={`block rounded-xl border border-ink/10 bg-paper-card p-3 shadow-sm md:table-row md:rounded-none md:border-0 md:border-b md:border-graphite/10 md:bg-transparent md:p-0 md:shadow-none ${retired ? 'opacity-70' : ''}`}
    >
      <td className={`${cell} md:w-[45%]`}>
        <Link
          to={paths.swapRevision(link.swap.slug, link.revision.number)}
          className="font-extrabold text-ink underline decoration-brass underline-offset-2"
        >
          {link.swap.title}
        </Link>
        <p className="tabular mt-0.5 text-xs text-graphite-soft">
          {link.url}{' '}
          {!retired && (
            <button type="button" onClick={copy} className="ml-1 font-bold text-ink underline">
              {copied ? 'Copied' : 'Copy'}
            </button>
          )}
        </p>
        {editing ? (
          <form
            className="mt-2 grid gap-2"
            aria-label="Edit shop link"
            onSubmit={async (e) => {
              e.preventDefault();
              await update.mutateAsync({ code: link.code, ...linkBody(draft) });
              setEditing(false);
            }}
          >
            <ShopLinkFields
              value={draft}
              onChange={setDraft}
              errors={update.error instanceof ApiError ? update.error.fields : {}}
            />
            {update.error && (
              <p role="alert" className="text-sm font-semibold text-oxide">
                {update.error.message}
              </p>
            )}
            <div className="flex gap-2">
              <Button type="submit" disabled={update.isPending}>
                {update.isPending ? 'Saving…' : 'Save link'}
              </Button>
              <Button variant="quiet" onClick={() => (setEditing(false), setDraft(linkDraftFrom(link)))}>
                Cancel
              </Button>
            </div>
          </form>
        ) : (
          <LinkNotes link={link} />
        )}
      </td>
      <td className={cell}>
        <span className="md:hidden text-xs text-graphite-soft">Revision </span>
        <span className="tabular font-bold">{link.revision.number}</span>
        {link.newerRevision && (
          <div role="status" className="mt-1 max-w-xs rounded-md border border-brass bg-brass-soft/50 p-2 text-xs">
            <p className="font-bold text-brass-deep">Revision {link.newerRevision.number} is newer</p>
            <p>{link.newerRevision.summary}</p>
            <Link
              to={paths.swapCompare(link.swap.slug, link.revision.number, link.newerRevision.number)}
              className="font-bold text-ink underline"
            >
              Compare
            </Link>
          </div>
        )}
      </td>
      <td className={`${cell} tabular md:text-right`}>
        <span className="md:hidden text-xs text-graphite-soft">Visits </span>
        <span className="font-bold">{link.visits}</span>
      </td>
      <td className={`${cell} tabular whitespace-nowrap`}>
        <span className="md:hidden text-xs text-graphite-soft">Created </span>
        {date(link.createdAt)}
        {retired && (
          <span className="ml-2 md:ml-0 md:mt-1 md:block">
            <Badge tone="plain">Retired {date(link.retiredAt!)}</Badge>
          </span>
        )}
        {!retired && link.expired && (
          <span className="ml-2 md:ml-0 md:mt-1 md:block">
            <Badge tone="plain">{link.private?.expiresAt ? `Expired ${date(link.private.expiresAt)}` : 'Expired'}</Badge>
          </span>
        )}
      </td>
      <td className={`${cell} md:w-52`}>
        <div className="flex flex-wrap gap-2 md:flex-col md:items-start">
          <Button variant="secondary" onClick={() => setShowQr((s) => !s)} aria-expanded={showQr}>
            {showQr ? 'Hide QR' : 'QR code'}
          </Button>
          {canManage && !retired && !editing && (
            <Button variant="quiet" onClick={() => setEditing(true)}>
              Edit link
            </Button>
          )}
          {canManage &&
            !retired &&
            (confirmRetire ? (
              <span className="flex flex-wrap gap-2">
                <Button variant="danger" disabled={retire.isPending} onClick={() => retire.mutate(link.code)}>
                  Retire link
                </Button>
                <Button variant="quiet" onClick={() => setConfirmRetire(false)}>
                  Keep
                </Button>
              </span>
            ) : (
              <Button variant="quiet" onClick={() => setConfirmRetire(true)}>
                Retire…
              </Button>
            ))}
        </div>
        {showQr && (
          <div className="mt-3">
            <QrDownloads code={link.code} size="h-28 w-28" />
          </div>
        )}
        {retire.error && (
          <p role="alert" className="mt-2 text-sm font-semibold text-oxide">
            {retire.error.message}
          </p>
        )}
      </td>
    </tr>
  );
}

const money = (p: { amountMinor: number; currency: string }) => formatMoney(p.amountMinor, p.currency);

/** The link's public note, then the shop's private record, each labelled for who reads it. */
function LinkNotes({ link }: { link: ShopLinkItem }) {
  const p = link.private;
  return (
    <div className="mt-2 grid gap-2 text-sm">
      {link.publicNote ? (
        <div className="line-clamp-4 border-l-4 border-brass pl-2">
          <p className="text-xs font-bold text-graphite-soft">Public note</p>
          <Markdown className="prose-sm">{link.publicNote}</Markdown>
        </div>
      ) : (
        <p className="text-graphite-soft">No public note.</p>
      )}
      {p && (p.customerRef || p.quotedPrice || p.expiresAt || p.note) && (
        <div className="rounded-md border border-dashed border-ink/30 p-2" data-testid="link-private">
          <p className="text-xs font-bold text-graphite-soft">Private to your shop</p>
          <p className="tabular">
            {[p.customerRef, p.quotedPrice && `quoted ${money(p.quotedPrice)}`, p.expiresAt && `expires ${date(p.expiresAt)}`]
              .filter(Boolean)
              .join(' · ')}
          </p>
          {p.note && <Markdown className="prose-sm">{p.note}</Markdown>}
        </div>
      )}
    </div>
  );
}
