import { useState } from 'react';
import { Link } from 'react-router';
import type { ShopLinkItem } from '@shared/schemas/shops';
import { Page } from '../../../components/ui/page';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { Button } from '../../../components/ui/button';
import { TextArea } from '../../../components/ui/field';
import { Badge } from '../../../components/ui/badge';
import { Markdown } from '../../../components/markdown';
import { paths } from '../../../config/paths';
import { useRetireShopLink, useShopLinks, useUpdateShopLink } from '../api/shop-links';
import { QrDownloads } from './qr-downloads';

const date = (iso: string) => new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

export default function ShopLinksPage() {
  const query = useShopLinks();
  const shopName = query.data?.items[0]?.shop.name;
  return (
    <Page
      title="Shop links"
      heading="Shop links"
      lead="Each link points a customer at the revision you quoted under your shop’s name. Your notes stay private to your shop. Make a new one from any swap sheet."
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
  const [note, setNote] = useState(link.private?.note ?? '');
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
            onSubmit={async (e) => {
              e.preventDefault();
              await update.mutateAsync({ code: link.code, note });
              setEditing(false);
            }}
          >
            <TextArea
              label="Private note"
              rows={4}
              value={note}
              onChange={(e) => setNote(e.target.value)}
              error={update.error?.message}
              hint="Only your shop sees it. Markdown; HTML is removed."
            />
            <div className="flex gap-2">
              <Button type="submit" disabled={update.isPending}>
                {update.isPending ? 'Saving…' : 'Save note'}
              </Button>
              <Button variant="quiet" onClick={() => (setEditing(false), setNote(link.private?.note ?? ''))}>
                Cancel
              </Button>
            </div>
          </form>
        ) : link.private?.note ? (
          <div className="mt-2 line-clamp-4 text-sm">
            <Markdown className="prose-sm">{link.private.note}</Markdown>
          </div>
        ) : (
          <p className="mt-2 text-sm text-graphite-soft">No note.</p>
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
      </td>
      <td className={`${cell} md:w-52`}>
        <div className="flex flex-wrap gap-2 md:flex-col md:items-start">
          <Button variant="secondary" onClick={() => setShowQr((s) => !s)} aria-expanded={showQr}>
            {showQr ? 'Hide QR' : 'QR code'}
          </Button>
          {canManage && !retired && !editing && (
            <Button variant="quiet" onClick={() => setEditing(true)}>
              Edit note
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
