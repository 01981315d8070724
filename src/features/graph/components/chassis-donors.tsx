import { Link } from 'react-router';
import { partKindLabels } from '@shared/schemas/enums';
import { useChassisGraph } from '../api/get-chassis-graph';
import { Loading } from '../../../components/ui/query-state';
import { paths } from '../../../config/paths';
import { SwapLinks } from './swap-links';

/** A chassis page's donor parts: every catalogue part an approved swap fits to it, by kind, each with the swaps. */
export function ChassisDonors({ slug }: { slug: string }) {
  const query = useChassisGraph(slug);
  if (query.isPending) return <Loading label="Finding donor parts…" />;
  // a proposed chassis has no public graph; its page says so already
  if (query.isError) return null;
  const g = query.data;
  if (g.kinds.length === 0) return null;
  return (
    <section aria-labelledby="donors-h" className="space-y-6">
      <div>
        <h2 id="donors-h" className="text-xl font-extrabold text-ink">
          Donor parts that fit
        </h2>
        <p className="mt-1 text-graphite-soft">
          {g.totals.parts} catalogue {g.totals.parts === 1 ? 'part' : 'parts'} fitted through {g.totals.swaps} approved{' '}
          {g.totals.swaps === 1 ? 'swap' : 'swaps'}.
        </p>
      </div>
      {g.kinds.map((k) => (
        <div key={k.kind}>
          <h3 className="mb-2 text-sm font-bold uppercase tracking-wide text-graphite-soft">
            {partKindLabels[k.kind]} · {k.partCount} {k.partCount === 1 ? 'part' : 'parts'}
          </h3>
          <ul aria-label={`${partKindLabels[k.kind]} donor parts`} className="grid gap-4 md:grid-cols-2">
            {k.parts.map((d) => (
              <li key={d.part.id} className="rounded-xl border border-ink/10 bg-paper-card p-4">
                <p className="font-extrabold text-ink">
                  <Link to={paths.part(d.part.id)} className="hover:underline">
                    {d.part.name}
                  </Link>
                </p>
                <p className="mb-2 text-sm text-graphite-soft">
                  {d.part.maker}
                  {d.part.partNumbers[0] && <span className="font-mono"> · {d.part.partNumbers[0]}</span>}
                  {d.part.cameOn[0] && <> · from {d.part.cameOn[0]}</>}
                </p>
                <SwapLinks swaps={d.swaps} swapCount={d.swapCount} />
              </li>
            ))}
          </ul>
          {k.partCount > k.parts.length && (
            <p className="mt-2 text-sm text-graphite-soft">
              Showing the {k.parts.length} most used of {k.partCount}.
            </p>
          )}
        </div>
      ))}
    </section>
  );
}
