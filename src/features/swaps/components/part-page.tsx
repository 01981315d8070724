import { useParams } from 'react-router';
import { usePartPage } from '../api/get-catalogue';
import { Page } from '../../../components/ui/page';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { SwapCard } from '../../../components/swap-card';
import { Badge } from '../../../components/ui/badge';
import { useUnits } from '../../../lib/units';
import { SpecCard } from './chassis-page';

const specLabels: Record<string, string> = {
  pistonsPerSideMm: 'Pistons per side',
  opposed: 'Opposed pistons',
  mounting: 'Mounting',
  mountSpacingMm: 'Mount spacing',
  diameterMm: 'Diameter',
  thicknessMm: 'Thickness',
  vented: 'Vented',
  hatHeightMm: 'Hat height',
  hubCentric: 'Hub-centric',
  centreBoreMm: 'Centre bore',
  outerDiameterMm: 'Outer diameter',
  thread: 'Thread',
  lengthMm: 'Length',
  seat: 'Seat',
  padHeightMm: 'Pad height',
};

type PartPageProps = {
  /** shown between the part's specs and its swaps (e.g. the chassis it reaches) */
  reach?: (partId: number) => React.ReactNode;
};

export default function PartPage({ reach }: PartPageProps = {}) {
  const { id } = useParams();
  const query = usePartPage(Number(id));
  const { length } = useUnits();
  if (query.isPending)
    return (
      <Page>
        <Loading />
      </Page>
    );
  if (query.isError)
    return (
      <Page title="Part not found">
        <ErrorNotice error={query.error} />
      </Page>
    );
  const { part, swaps } = query.data;
  const show = (key: string, v: unknown): string => {
    if (typeof v === 'boolean') return v ? 'Yes' : 'No';
    if (Array.isArray(v)) return v.map((x) => (key.endsWith('Mm') ? length(Number(x), 0) : String(x))).join(' + ');
    if (typeof v === 'number' && key.endsWith('Mm')) return length(v);
    return String(v);
  };
  return (
    <Page
      title={part.name}
      heading={part.name}
      lead={
        <span className="flex flex-wrap items-center gap-2">
          <Badge tone="ink">{part.kind}</Badge>
          {part.maker}
        </span>
      }
    >
      {/* the cards' headings sit under this one, so the page's outline has no gap */}
      <h2 className="sr-only">About the part</h2>
      <div className="grid gap-4 md:grid-cols-3">
        <SpecCard title="Specs" rows={Object.entries(part.specs).map(([k, v]) => [specLabels[k] ?? k, show(k, v)])} />
        <SpecCard
          title="Part numbers"
          rows={part.partNumbers.map((pn, i) => [i === 0 ? 'Number' : 'Also', <span className="font-mono">{pn}</span>])}
        />
        <div className="rounded-xl border border-ink/10 bg-paper-card p-4">
          <h3 className="font-extrabold text-ink">Came on</h3>
          <ul className="mt-2 list-disc pl-5 text-sm">
            {part.cameOn.length ? part.cameOn.map((v) => <li key={v}>{v}</li>) : <li>Aftermarket part</li>}
          </ul>
        </div>
      </div>
      {part.notes && <p className="mt-4 max-w-3xl text-graphite">{part.notes}</p>}
      {reach?.(part.id)}
      <h2 className="mb-4 mt-10 text-xl font-extrabold text-ink">Swaps that use it</h2>
      {swaps.length === 0 ? (
        <p className="text-graphite-soft">No approved swap uses this part yet.</p>
      ) : (
        <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {swaps.map((s) => (
            <li key={s.slug} className="flex">
              <SwapCard swap={s} />
            </li>
          ))}
        </ul>
      )}
    </Page>
  );
}
