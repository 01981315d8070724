import { Link } from 'react-router';
import { Page } from '../../components/ui/page';
import { ButtonLink } from '../../components/ui/button';
import { SwapCard } from '../../components/swap-card';
import { Loading, ErrorNotice } from '../../components/ui/query-state';
import { useRecentSwaps } from '../../features/swaps/api/get-recent-swaps';
import { useChassisList } from '../../features/swaps/api/get-catalogue';
import { paths } from '../../config/paths';
import { chassisName } from '@shared/chassis-label';

export default function HomePage() {
  const recent = useRecentSwaps(6);
  const chassis = useChassisList();
  return (
    <>
      <section className="bg-ink text-paper">
        <div className="mx-auto max-w-sheet px-4 pb-12 pt-8 sm:px-6 sm:pb-16 sm:pt-12">
          <p className="text-sm font-bold uppercase tracking-widest text-brass-soft">Community fitment records</p>
          <h1 className="mt-3 max-w-3xl text-3xl font-extrabold leading-tight sm:text-5xl">
            Will it fit, and what else does it need?
          </h1>
          <p className="mt-4 max-w-2xl text-lg text-paper/85">
            Reviewed swaps for brakes, wheels and running gear: the donor parts, the adapter, the shims and spacers, the machining
            and the torque figures — checked against your own wheel before you buy a thing.
          </p>
          <form action="/search" className="mt-8 flex max-w-2xl flex-col gap-2 sm:flex-row" role="search">
            <label htmlFor="home-q" className="sr-only">
              Search swaps
            </label>
            <input
              id="home-q"
              name="q"
              type="search"
              placeholder="Chassis code, car or part number — e.g. H31, Vela caliper, OV-355"
              className="min-h-12 flex-1 rounded-md border-0 bg-paper px-4 text-base text-graphite placeholder:text-graphite-soft"
            />
            <button type="submit" className="min-h-12 rounded-md bg-brass-soft px-6 font-extrabold text-ink hover:bg-paper">
              Find swaps
            </button>
          </form>
          {chassis.data && chassis.data.length > 0 && (
            <p className="mt-4 flex flex-wrap items-center gap-2 text-sm text-paper/80">
              <span>Browse by chassis:</span>
              {chassis.data.map((c) => (
                <Link
                  key={c.slug}
                  to={paths.chassis(c.slug)}
                  className="rounded-full border border-paper/30 px-3 py-1 font-bold hover:border-paper"
                >
                  {chassisName(c)}
                </Link>
              ))}
            </p>
          )}
        </div>
      </section>
      <Page title="What fits your car">
        <section aria-labelledby="recent-heading">
          <div className="mb-4 flex items-end justify-between gap-4">
            <h2 id="recent-heading" className="text-xl font-extrabold text-ink">
              Recently approved swaps
            </h2>
            <Link to="/search" className="text-sm font-bold text-ink underline">
              See all
            </Link>
          </div>
          {recent.isPending ? (
            <Loading label="Loading swaps…" />
          ) : recent.isError ? (
            <ErrorNotice error={recent.error} />
          ) : recent.data.length === 0 ? (
            <p className="text-graphite-soft">No approved swaps yet. Be the first to record one.</p>
          ) : (
            <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
              {recent.data.map((s) => (
                <li key={s.slug} className="flex">
                  <SwapCard swap={s} />
                </li>
              ))}
            </ul>
          )}
        </section>
        <section className="mt-12 grid gap-4 sm:grid-cols-3" aria-label="How Swapyard works">
          {[
            [
              'Find',
              'Search by chassis, donor car or part number. Every record lists the exact parts, adapter, shims and spacers.',
            ],
            [
              'Check',
              'Enter your wheel and see the caliper clearance, new offset and wheel-bolt length — pass or fail, with the margin.',
            ],
            ['Record', 'Fitted a combination yourself? Write it up with photos; a moderator reviews it before it goes live.'],
          ].map(([title, text]) => (
            <div key={title} className="rounded-xl border border-ink/10 bg-paper-card p-5">
              <h3 className="font-extrabold text-ink">{title}</h3>
              <p className="mt-1 text-sm text-graphite">{text}</p>
            </div>
          ))}
        </section>
        <div className="mt-8">
          <ButtonLink to="/tools" variant="secondary">
            Open the fitment calculators
          </ButtonLink>
        </div>
      </Page>
    </>
  );
}
