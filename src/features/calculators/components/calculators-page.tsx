import { useEffect } from 'react';
import { Link, useLocation } from 'react-router';
import { Page } from '../../../components/ui/page';
import { UnitsToggle } from '../../../components/units-toggle';
import { useCalcParams } from './calc-params';
import { TyrePanel } from './tyre-panel';
import { OffsetPanel } from './offset-panel';
import { BoltPatternPanel } from './bolt-pattern-panel';
import { ThreadPanel } from './thread-panel';
import { ClearancePanel } from './clearance-panel';
import { BrakeBalancePanel } from './brake-balance-panel';
import { DistributionPanel } from './distribution-panel';
import { ShimPanel } from './shim-panel';
import { CostPanel } from './cost-panel';
import { SectionPanel } from './section-panel';
import { CaliperFitPanel } from './caliper-fit-panel';
import { DrumPanel } from './drum-panel';

const panels = [
  { id: 'tyre', label: 'Tyre size' },
  { id: 'offset', label: 'Offset and spacer' },
  { id: 'bolt-pattern', label: 'Bolt pattern' },
  { id: 'thread', label: 'Wheel fastening' },
  { id: 'shims', label: 'Shim stack' },
  { id: 'drum', label: 'Drum corner' },
  { id: 'caliper-fit', label: 'Caliper on rotor' },
  { id: 'clearance', label: 'Wheel clearance' },
  { id: 'section', label: 'Section check' },
  { id: 'brakes', label: 'Brake balance' },
  { id: 'distribution', label: 'Brake distribution' },
  { id: 'costs', label: 'Cost routes' },
];

export default function CalculatorsPage() {
  const params = useCalcParams();
  const { search, hash } = useLocation();

  // Opening a shared link lands on its panel once the page has drawn.
  useEffect(() => {
    if (hash) document.getElementById(decodeURIComponent(hash.slice(1)))?.scrollIntoView();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  return (
    <Page
      title="Fitment calculators"
      heading="Fitment calculators"
      lead="The checks behind every swap sheet, for your own numbers. Results update as you type, and the address bar keeps your inputs: copy a panel's link to share exactly what you entered."
      actions={<UnitsToggle look="page" label="Units for the calculators" />}
    >
      <nav aria-label="Calculators" className="mb-6">
        <ul className="flex flex-wrap gap-2">
          {panels.map((p) => (
            <li key={p.id}>
              <Link
                to={{ search, hash: `#${p.id}` }}
                className="inline-flex min-h-9 items-center rounded-full border border-ink/25 bg-paper-card px-3 text-sm font-bold text-ink hover:border-ink"
              >
                {p.label}
              </Link>
            </li>
          ))}
        </ul>
      </nav>
      <p className="mb-6 max-w-3xl text-sm text-graphite-soft">
        Figures are nominal and computed from what you enter; they show which rule each check applies. Measure the real parts, and
        let the manufacturers’ specifications and a qualified technician have the last word.
      </p>
      <div className="grid items-start gap-6 lg:grid-cols-2">
        <TyrePanel params={params} />
        <OffsetPanel params={params} />
        <BoltPatternPanel params={params} />
        <ThreadPanel params={params} />
        <ShimPanel params={params} />
        <DrumPanel params={params} />
        <CaliperFitPanel params={params} />
        <ClearancePanel params={params} />
        <SectionPanel params={params} />
        <BrakeBalancePanel params={params} />
        <DistributionPanel params={params} />
        <CostPanel params={params} />
      </div>
    </Page>
  );
}
