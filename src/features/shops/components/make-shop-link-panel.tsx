import { useState } from 'react';
import { Link } from 'react-router';
import type { ShopLinkItem } from '@shared/schemas/shops';
import { Button } from '../../../components/ui/button';
import { paths } from '../../../config/paths';
import { ApiError } from '../../../lib/api-client';
import { useCreateShopLink } from '../api/shop-links';
import { QrDownloads } from './qr-downloads';
import { emptyLinkDraft, linkBody, ShopLinkFields } from './shop-link-fields';

/** On a swap sheet, for shop accounts: a short link pinned to the swap's current revision, with a public note and the shop's private record of the quote. */
export function MakeShopLinkPanel({
  swapSlug,
  shownNumber,
  currentNumber,
  shopName,
}: {
  swapSlug: string;
  shownNumber: number;
  currentNumber: number | null;
  shopName: string;
}) {
  const create = useCreateShopLink();
  const [draft, setDraft] = useState(emptyLinkDraft);
  const [made, setMade] = useState<ShopLinkItem | null>(null);
  const [copied, setCopied] = useState(false);

  return (
    <section
      id="shop-link"
      aria-labelledby="shop-link-h"
      className="no-print rounded-xl border border-brass/60 bg-brass-soft/25 p-4 sm:p-5"
    >
      <h2 id="shop-link-h" className="text-lg font-extrabold text-ink">
        Make a shop link
      </h2>
      <p className="mt-1 text-sm text-graphite">
        A short link for {shopName}’s customers, pinned to revision {currentNumber ?? shownNumber}
        {currentNumber !== null && currentNumber !== shownNumber
          ? ' (the current one, not the older revision you are reading)'
          : ', the current one'}
        . It keeps showing that revision even after newer ones are approved, with a notice that says so.
      </p>
      {made ? (
        <div className="mt-4 grid gap-3" role="status">
          <p className="text-sm">
            Link made:{' '}
            <a href={made.url} className="tabular font-extrabold text-ink underline" data-testid="shop-link-url">
              {made.url}
            </a>{' '}
            <button
              type="button"
              className="ml-1 text-sm font-bold text-ink underline"
              onClick={() =>
                navigator.clipboard?.writeText(made.url).then(
                  () => setCopied(true),
                  () => setCopied(false),
                )
              }
            >
              {copied ? 'Copied' : 'Copy'}
            </button>
          </p>
          <QrDownloads code={made.code} />
          <p className="text-sm">
            <Link to={paths.shopLinks()} className="font-bold text-ink underline">
              All our shop links
            </Link>{' '}
            ·{' '}
            <button
              type="button"
              className="font-bold text-ink underline"
              onClick={() => (setMade(null), setDraft(emptyLinkDraft))}
            >
              Make another
            </button>
          </p>
        </div>
      ) : (
        <form
          className="mt-3 grid gap-3"
          onSubmit={async (e) => {
            e.preventDefault();
            setMade(await create.mutateAsync({ swapSlug, ...linkBody(draft) }));
          }}
        >
          <ShopLinkFields
            value={draft}
            onChange={setDraft}
            errors={create.error instanceof ApiError ? create.error.fields : {}}
          />
          <div className="flex flex-wrap items-center gap-3">
            <Button type="submit" disabled={create.isPending}>
              {create.isPending ? 'Making the link…' : 'Make link'}
            </Button>
            {create.error && (
              <p role="alert" className="text-sm font-semibold text-oxide">
                {create.error.message}
              </p>
            )}
          </div>
        </form>
      )}
    </section>
  );
}
