import { Link } from 'react-router';
import { OPEN_DATA_LICENCE } from '@shared/schemas/export';
import { Page } from '../../../components/ui/page';
import { paths } from '../../../config/paths';

const downloads = [
  {
    href: '/api/export/swaps.json',
    label: 'All swaps as JSON',
    note: 'One file: the licence, then every swap with its full record, then the count.',
  },
  {
    href: '/api/export/swaps.csv',
    label: 'All swaps as CSV',
    note: 'One row per swap for spreadsheets. The first line (starting with #) names the licence.',
  },
];

/** What the community can take with it, under which licence, and how to mirror it. */
export default function OpenDataPage() {
  return (
    <Page
      title="Open data"
      heading="Open data"
      lead="Every approved swap belongs to the people who recorded it and to everyone who fits parts after them. Take all of it, whenever you like."
    >
      <div className="grid gap-6 lg:grid-cols-3">
        <section aria-labelledby="licence-h" className="rounded-xl border-2 border-ink/20 bg-paper-card p-5 lg:col-span-1">
          <h2 id="licence-h" className="text-lg font-extrabold text-ink">
            Licence
          </h2>
          <p className="mt-2 font-bold text-graphite">
            <a href={OPEN_DATA_LICENCE.url} className="underline decoration-ink/30 underline-offset-2" rel="license">
              {OPEN_DATA_LICENCE.name}
            </a>{' '}
            <span className="font-mono text-sm text-graphite-soft">({OPEN_DATA_LICENCE.spdx})</span>
          </p>
          <ul className="mt-3 list-disc space-y-1 pl-5 text-sm text-graphite">
            <li>
              <strong>Credit</strong> “{OPEN_DATA_LICENCE.attribution}” and link each record’s permalink.
            </li>
            <li>
              <strong>Share alike:</strong> what you build from the data goes out under the same licence.
            </li>
            <li>Use it for anything, commercial work included.</li>
          </ul>
          <p className="mt-3 text-xs text-graphite-soft">
            Every file names the licence inside it, so it travels with every copy.
          </p>
        </section>
        <section aria-labelledby="downloads-h" className="lg:col-span-2">
          <h2 id="downloads-h" className="text-lg font-extrabold text-ink">
            Download
          </h2>
          <ul className="mt-3 grid gap-3 sm:grid-cols-2">
            {downloads.map((d) => (
              <li key={d.href} className="rounded-xl border border-ink/10 bg-paper-card p-4">
                <a href={d.href} className="font-extrabold text-ink underline decoration-ink/30 underline-offset-2">
                  {d.label}
                </a>
                <p className="mt-1 font-mono text-xs text-graphite-soft">{d.href}</p>
                <p className="mt-2 text-sm text-graphite">{d.note}</p>
              </li>
            ))}
          </ul>
          <p className="mt-4 text-sm text-graphite">
            Each swap comes at its current approved revision: the structured record (parts, adapter, shims, spacers, machining,
            fasteners and torque values, tested wheels, costs), the chassis with the figures the checks read (bolt pattern, centre
            bore, wheel bolts, stock wheel and brakes), the write-up, the revision number and date, the author and a permalink
            that always shows that revision. Drafts and submissions in review never leave.
          </p>
          <p className="mt-2 text-sm text-graphite">
            In the CSV, a text cell that begins with =, +, -, @, a tab or a carriage return starts with an apostrophe, so a
            spreadsheet shows it as text instead of running it.
          </p>
        </section>
      </div>
      <div className="mt-8 grid gap-6 md:grid-cols-2">
        <section aria-labelledby="mirrors-h" className="rounded-xl border border-ink/10 bg-paper-card p-5">
          <h2 id="mirrors-h" className="text-lg font-extrabold text-ink">
            Daily dumps for mirrors
          </h2>
          <p className="mt-2 text-sm text-graphite">
            Once a day the same two files are written gzipped. The newest are always at the same address:
          </p>
          <ul className="mt-2 space-y-1 text-sm">
            {(['json', 'csv'] as const).map((ext) => (
              <li key={ext}>
                <a
                  href={`/dumps/swapyard-swaps-latest.${ext}.gz`}
                  className="break-all font-mono text-ink underline decoration-ink/30 underline-offset-2"
                >
                  /dumps/swapyard-swaps-latest.{ext}.gz
                </a>
              </li>
            ))}
          </ul>
          <p className="mt-2 text-sm text-graphite">
            Each day’s files stay for two weeks as <span className="font-mono">/dumps/swapyard-swaps-YYYY-MM-DD.json.gz</span> and{' '}
            <span className="font-mono">.csv.gz</span>.
          </p>
        </section>
        <section aria-labelledby="api-h" className="rounded-xl border border-ink/10 bg-paper-card p-5">
          <h2 id="api-h" className="text-lg font-extrabold text-ink">
            API
          </h2>
          <p className="mt-2 text-sm text-graphite">
            The exports and the interchange graph are described in OpenAPI 3.1 at{' '}
            <a href="/api/openapi.json" className="font-mono text-ink underline decoration-ink/30 underline-offset-2">
              /api/openapi.json
            </a>
            . No sign-in, no key.{' '}
            <Link to={paths.apiDocs()} className="font-bold text-ink underline decoration-ink/30 underline-offset-2">
              See every endpoint
            </Link>
            .
          </p>
        </section>
      </div>
    </Page>
  );
}
