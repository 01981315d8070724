import { useState } from 'react';
import { useParams } from 'react-router';
import { axles, categories, categoryLabels } from '@shared/schemas/enums';
import { useChassisPage } from '../api/get-catalogue';
import { Page } from '../../../components/ui/page';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { SwapCard, chassisLabel } from '../../../components/swap-card';
import type { SwapCard as SwapCardData } from '@shared/schemas/views';
import { useUnits } from '../../../lib/units';
import { paths } from '../../../config/paths';
import { Button, ButtonLink } from '../../../components/ui/button';
import { VehicleFiguresList } from '../../../components/vehicle-figures';
import { ChassisFiguresEditor } from './chassis-figures-editor';
import { chassisName } from '@shared/chassis-label';

type ChassisPageProps = {
  /** shown above the swap list (e.g. which of the member's cars the swaps were checked against) */
  intro?: (chassisSlug: string) => React.ReactNode;
  /** shown under a swap's card (e.g. that check's verdict) */
  cardNote?: (swap: SwapCardData) => React.ReactNode;
  /** shown after the swap list (e.g. the donor parts that fit through those swaps) */
  donors?: (chassisSlug: string) => React.ReactNode;
  /** reviewers keep the chassis' stock brake-balance figures */
  canEditFigures?: boolean;
  /** beside the page's actions (e.g. following the chassis) */
  follow?: (chassis: { slug: string; label: string }) => React.ReactNode;
};

export default function ChassisPage({ intro, cardNote, donors, canEditFigures = false, follow }: ChassisPageProps = {}) {
  const { slug = '' } = useParams();
  const query = useChassisPage(slug);
  const [editingFigures, setEditingFigures] = useState(false);
  const { length } = useUnits();
  if (query.isPending)
    return (
      <Page>
        <Loading />
      </Page>
    );
  if (query.isError)
    return (
      <Page title="Chassis not found">
        <ErrorNotice error={query.error} />
      </Page>
    );
  const { chassis: c, swaps, proposed } = query.data;
  const corner = (k: 'front' | 'rear') => c.stockBrakes[k];
  return (
    <Page
      title={chassisLabel(c)}
      heading={chassisName(c)}
      lead={`${c.body} · ${c.yearFrom}–${c.yearTo ?? 'on'}${c.notes ? ` · ${c.notes}` : ''}`}
      actions={
        <div className="flex flex-wrap items-start gap-2">
          {!proposed && follow?.({ slug: c.slug, label: chassisLabel(c) })}
          <ButtonLink to={paths.search(`chassis=${c.slug}`)} variant="secondary">
            Search within this chassis
          </ButtonLink>
        </div>
      }
    >
      {proposed && (
        <p role="note" className="mb-6 rounded-lg border border-brass bg-brass-soft/40 p-3 text-sm text-graphite">
          <strong className="text-brass-deep">Proposed, not in the catalogue yet.</strong> This chassis was proposed with a
          submission. Only its author and the review desk can open this page, until a moderator approves the submission; if the
          submission is declined, the chassis is removed.
        </p>
      )}
      <section aria-labelledby="hub-h" className="grid gap-4 md:grid-cols-3">
        <h2 id="hub-h" className="sr-only">
          Hub and stock specs
        </h2>
        <SpecCard
          title="Hub"
          rows={[
            ['Bolt pattern', `${c.lugCount}×${c.pcdMm}`],
            ['Centre bore', length(c.centreBoreMm)],
            ['Wheel bolts', c.wheelBoltThread],
          ]}
        />
        <SpecCard
          title="Stock wheel"
          rows={[
            ['Size', `${c.stockWheel.diameterIn}×${c.stockWheel.widthIn} ET${c.stockWheel.offsetMm}`],
            ['Tyre', c.stockWheel.tyre],
          ]}
        />
        <SpecCard
          title="Stock brakes"
          rows={(['front', 'rear'] as const).map((k) => [k === 'front' ? 'Front' : 'Rear', corner(k).description])}
        />
        {(c.vehicle || (canEditFigures && !proposed)) && (
          <div className="rounded-xl border border-ink/10 bg-paper-card p-4 md:col-span-3" data-chassis-vehicle>
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h3 className="font-extrabold text-ink">Figures for brake balance</h3>
              {canEditFigures && !proposed && !editingFigures && (
                <Button variant="secondary" onClick={() => setEditingFigures(true)}>
                  {c.vehicle ? 'Edit the stock figures' : 'Add stock figures'}
                </Button>
              )}
            </div>
            {editingFigures ? (
              <ChassisFiguresEditor chassis={c} onDone={() => setEditingFigures(false)} />
            ) : c.vehicle ? (
              <>
                <p className="mb-2 text-xs text-graphite-soft">
                  Stock figures the swap sheets use to work out which axle locks first; members can give their own car’s in my
                  cars.
                </p>
                <VehicleFiguresList vehicle={c.vehicle} />
              </>
            ) : (
              <p className="text-xs text-graphite-soft">
                No stock figures yet: the swap sheets of this chassis cannot say which axle locks first.
              </p>
            )}
          </div>
        )}
      </section>
      <div className="mt-10 space-y-10">
        {intro?.(c.slug)}
        {swaps.length === 0 && <p className="text-graphite-soft">No approved swaps for this chassis yet.</p>}
        {axles.map((axle) => {
          const forAxle = swaps.filter((s) => s.axle === axle);
          if (forAxle.length === 0) return null;
          return (
            <section key={axle} aria-labelledby={`axle-${axle}`}>
              <h2 id={`axle-${axle}`} className="mb-4 text-xl font-extrabold text-ink">
                {axle === 'front' ? 'Front axle' : 'Rear axle'}
              </h2>
              {categories.map((cat) => {
                const group = forAxle.filter((s) => s.category === cat);
                if (group.length === 0) return null;
                return (
                  <div key={cat} className="mb-6">
                    <h3 className="mb-2 text-sm font-bold uppercase tracking-wide text-graphite-soft">{categoryLabels[cat]}</h3>
                    <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
                      {group.map((s) => (
                        <li key={s.slug} className={cardNote ? 'flex flex-col' : 'flex'}>
                          <SwapCard swap={s} />
                          {cardNote?.(s)}
                        </li>
                      ))}
                    </ul>
                  </div>
                );
              })}
            </section>
          );
        })}
        {!proposed && donors?.(c.slug)}
      </div>
    </Page>
  );
}

export function SpecCard({ title, rows }: { title: string; rows: [string, React.ReactNode][] }) {
  return (
    <div className="rounded-xl border border-ink/10 bg-paper-card p-4">
      <h3 className="font-extrabold text-ink">{title}</h3>
      <dl className="tabular mt-2 space-y-1 text-sm">
        {rows.map(([k, v]) => (
          <div key={k} className="flex justify-between gap-3">
            <dt className="text-graphite-soft">{k}</dt>
            <dd className="text-right font-bold">{v}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}
