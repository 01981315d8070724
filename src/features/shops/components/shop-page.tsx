import { useState } from 'react';
import { Link, useParams } from 'react-router';
import type { ShopFittedReport } from '@shared/schemas/shops';
import type { SwapCard as SwapCardData } from '@shared/schemas/views';
import { Page } from '../../../components/ui/page';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { Button, ButtonLink } from '../../../components/ui/button';
import { Markdown } from '../../../components/markdown';
import { SwapCard } from '../../../components/swap-card';
import { paths } from '../../../config/paths';
import { useShopPage } from '../api/get-shop';
import { ShopContactCard } from './shop-contact';
import { ShopEditor } from './shop-editor';
import { formatDate } from '@shared/dates';

const date = (iso: string) => formatDate(iso);

export default function ShopPage() {
  const { slug = '' } = useParams();
  const query = useShopPage(slug);
  const [editing, setEditing] = useState(false);
  if (query.isPending)
    return (
      <Page>
        <Loading label="Loading the shop…" />
      </Page>
    );
  if (query.isError)
    return (
      <Page title="Shop not found">
        <ErrorNotice error={query.error} />
      </Page>
    );
  const { shop, swaps, written, fittedReports, canEdit } = query.data;

  return (
    <Page
      title={shop.name}
      heading={shop.name}
      lead={shop.town ? `Workshop in ${shop.town}` : undefined}
      actions={
        canEdit && !editing ? (
          <div className="flex flex-wrap gap-2">
            <ButtonLink to={paths.shopLinks()} variant="secondary">
              Our shop links
            </ButtonLink>
            <Button onClick={() => setEditing(true)}>Edit shop page</Button>
          </div>
        ) : undefined
      }
    >
      {editing ? (
        <ShopEditor shop={shop} onDone={() => setEditing(false)} />
      ) : (
        <div className="grid items-start gap-6 md:grid-cols-[2fr_1fr]">
          <section aria-label="About the shop" className="rounded-xl border border-ink/10 bg-paper-card p-5">
            {shop.about ? (
              <Markdown>{shop.about}</Markdown>
            ) : (
              <p className="text-graphite-soft">The shop has not written about itself yet.</p>
            )}
            <dl className="tabular mt-5 flex flex-wrap gap-x-8 gap-y-2 border-t border-ink/10 pt-4 text-sm">
              <Figure label="Swaps written" value={written.length} />
              <Figure label="Fitted reports" value={fittedReports.length} />
              <Figure label="Swaps it points customers to" value={swaps.length} />
            </dl>
          </section>
          <ShopContactCard shop={shop} />
        </div>
      )}

      <SwapList
        id="shop-written-h"
        title={`Swaps ${shop.name} wrote`}
        swaps={written}
        empty="No published swaps written by the shop yet."
      />
      <section aria-labelledby="shop-reports-h" className="mt-10">
        <h2 id="shop-reports-h" className="mb-4 text-xl font-extrabold text-ink">
          Fitted reports by {shop.name}
        </h2>
        {fittedReports.length === 0 ? (
          <p className="text-graphite-soft">No fitted reports yet.</p>
        ) : (
          <ul className="grid gap-3 md:grid-cols-2">
            {fittedReports.map((r) => (
              <ReportItem key={`${r.swap.slug}-${r.createdAt}`} report={r} />
            ))}
          </ul>
        )}
      </section>
      <SwapList id="shop-swaps-h" title={`Swaps ${shop.name} links to`} swaps={swaps} empty="No shop links yet." />
    </Page>
  );
}

function Figure({ label, value }: { label: string; value: number }) {
  return (
    <div>
      <dt className="text-xs font-bold uppercase tracking-wide text-graphite-soft">{label}</dt>
      <dd className="text-lg font-extrabold text-ink">{value}</dd>
    </div>
  );
}

function SwapList({ id, title, swaps, empty }: { id: string; title: string; swaps: SwapCardData[]; empty: string }) {
  return (
    <section aria-labelledby={id} className="mt-10">
      <h2 id={id} className="mb-4 text-xl font-extrabold text-ink">
        {title}
      </h2>
      {swaps.length === 0 ? (
        <p className="text-graphite-soft">{empty}</p>
      ) : (
        <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {swaps.map((s) => (
            <li key={s.slug} className="flex">
              <SwapCard swap={s} />
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

function ReportItem({ report }: { report: ShopFittedReport }) {
  return (
    <li className="rounded-xl border border-ink/10 bg-paper-card p-4 text-sm shadow-sm">
      <Link to={paths.swap(report.swap.slug)} className="font-extrabold text-ink underline decoration-brass underline-offset-2">
        {report.swap.title}
      </Link>
      <p className="tabular mt-1 text-graphite">
        Wheel {report.wheel} · {date(report.createdAt)}
      </p>
      {report.note && <p className="mt-1 text-graphite-soft">{report.note}</p>}
    </li>
  );
}
