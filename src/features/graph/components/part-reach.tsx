import { Link } from 'react-router';
import { usePartGraph } from '../api/get-part-graph';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { Caution } from '../../../components/caution';
import { paths } from '../../../config/paths';
import { FitGroups } from './fit-groups';
import { NumbersList } from './numbers-list';

/** A part page's graph: the vehicles the part came on and every chassis approved swaps fit it to, with how. */
export function PartReach({ partId }: { partId: number }) {
  const query = usePartGraph(partId);
  if (query.isPending) return <Loading label="Finding where it fits…" />;
  if (query.isError) return <ErrorNotice error={query.error} />;
  const g = query.data;
  return (
    <section aria-labelledby="reach-h" className="mt-10 space-y-6">
      <div>
        <h2 id="reach-h" className="text-xl font-extrabold text-ink">
          Where it fits
        </h2>
        <p className="mt-1 text-graphite-soft">
          {g.totals.swaps === 0
            ? 'No approved swap fits this part to a car yet.'
            : `${g.totals.swaps} approved ${g.totals.swaps === 1 ? 'swap fits' : 'swaps fit'} it to ${g.totals.chassis} chassis, with the adapters they use.`}{' '}
          {g.numbers[0] && (
            <Link
              to={paths.whereElse(g.numbers[0].number)}
              className="font-bold text-ink underline decoration-ink/30 underline-offset-2"
            >
              Where else does {g.numbers[0].number} go?
            </Link>
          )}
        </p>
      </div>
      {/* the page lists its own record's numbers and vehicles; other records of the same part and older stamps add to them */}
      {(g.sameAs.length > 0 || g.numbers.length > g.part.partNumbers.length) && (
        <div className="grid gap-4 md:grid-cols-2">
          <div className="rounded-xl border border-ink/10 bg-paper-card p-4">
            <h3 className="font-extrabold text-ink">Known by</h3>
            <div className="mt-2">
              <NumbersList numbers={g.numbers} />
            </div>
            {g.sameAs.length > 0 && (
              <p className="mt-3 text-sm text-graphite">
                Also in the catalogue as{' '}
                {g.sameAs.map((p, i) => (
                  <span key={p.id}>
                    {i > 0 && ', '}
                    <Link to={paths.part(p.id)} className="text-ink underline decoration-ink/30 underline-offset-2">
                      {p.name}
                    </Link>
                  </span>
                ))}
                .
              </p>
            )}
          </div>
          {g.sameAs.length > 0 && (
            <div className="rounded-xl border border-ink/10 bg-paper-card p-4">
              <h3 className="font-extrabold text-ink">Came on, across its records</h3>
              <ul aria-label="Vehicles it came on" className="mt-2 list-disc pl-5 text-sm">
                {g.cameOn.map((v) => (
                  <li key={v}>{v}</li>
                ))}
              </ul>
            </div>
          )}
        </div>
      )}
      {g.fits.length > 0 && (
        <>
          <FitGroups fits={g.fits} label="Chassis it fits" totalChassis={g.totals.chassis} />
          <Caution topics={['brakes', 'fasteners']}>
            <p className="mt-2">
              A swap shows how the part fitted one car. Read its sheet for the adapter, shims, machining and torque values before
              you order parts.
            </p>
          </Caution>
        </>
      )}
    </section>
  );
}
