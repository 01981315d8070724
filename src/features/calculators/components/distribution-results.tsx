import { useState } from 'react';
import type { DistributionAnalysis, LoadState, SetupAnalysis, StateAnalysis } from '@shared/fitment/distribution-analysis';
import { AdhesionChart, type AdhesionChartSet } from '../../../components/adhesion-chart';
import { round, useUnits } from '../../../lib/units';
import { SubHeading } from './calc-form';
import { WarningIcon } from '../../../components/ui/icons';

const g = (z: number) => `${z.toFixed(2)} g`;
const span = (r: { fromG: number; toG: number }) => `${r.fromG.toFixed(2)}–${r.toG.toFixed(2)} g`;
const BAND_TOP = 0.8;

function stateOf(setup: SetupAnalysis, state: LoadState): StateAnalysis | undefined {
  return setup.states.find((s) => s.state === state);
}

/** Whether the car the reader ends up with locks its rear first below the top of the reference band. */
function rearFirstInBand(analysis: DistributionAnalysis): boolean {
  const final = analysis.after ?? analysis.before;
  return final.states.some((s) => s.rearFirstFromG !== null && s.rearFirstFromG < BAND_TOP);
}

export function DistributionResults({ analysis }: { analysis: DistributionAnalysis }) {
  const states = analysis.before.states.map((s) => s.state);
  const [shown, setShown] = useState<LoadState>('unladen');
  const view = states.includes(shown) ? shown : 'unladen';
  const attention = rearFirstInBand(analysis);
  const sets = (state: LoadState): AdhesionChartSet[] => {
    const list: AdhesionChartSet[] = [
      { stage: 'before', label: analysis.after ? 'Before' : 'Stock', analysis: stateOf(analysis.before, state)! },
    ];
    if (analysis.after) list.push({ stage: 'after', label: 'After', analysis: stateOf(analysis.after, state)! });
    return list;
  };
  const name = (state: LoadState) => (state === 'laden' ? 'Laden car' : 'Unladen car');

  return (
    <div className="grid gap-4">
      <div
        data-attention={attention ? 'true' : 'false'}
        data-distribution-summary
        className={`rounded-lg border p-3 ${attention ? 'border-2 border-oxide bg-oxide-soft' : 'border-ink/30 bg-ink-faint/50'}`}
      >
        <div className="flex items-baseline justify-between gap-3">
          <p className="text-sm font-bold text-graphite">{analysis.after ? 'What the swap does' : 'Lock order'}</p>
          {attention && (
            <p className="flex items-center gap-1 text-xs font-extrabold uppercase tracking-wide text-oxide">
              <WarningIcon className="h-3.5 w-3.5" /> Rear locks first
            </p>
          )}
        </div>
        <p className="mt-1 text-base font-bold text-graphite">{analysis.summary}</p>
        <p className="mt-1 text-xs text-graphite-soft">
          An estimate from the figures entered, not a measurement: fronts locking first is the stable order.
        </p>
      </div>

      {states.length > 1 && (
        <div role="group" aria-label="Load shown in the chart" className="flex gap-2 print:hidden">
          {states.map((state) => (
            <button
              key={state}
              type="button"
              aria-pressed={view === state}
              onClick={() => setShown(state)}
              className={`min-h-9 rounded-full border px-3 text-sm font-bold ${view === state ? 'border-ink bg-ink text-paper-card' : 'border-ink/25 bg-paper-card text-ink hover:border-ink'}`}
            >
              {state === 'laden' ? 'Laden' : 'Unladen'}
            </button>
          ))}
        </div>
      )}
      <AdhesionChart title={name(view)} sets={sets(view)} maxG={analysis.maxDecelerationG} />

      <FiguresTable analysis={analysis} />
      <PedalFigures analysis={analysis} />

      <div className="grid gap-1 text-xs text-graphite-soft">
        <p>
          <span className="font-bold text-graphite">Reference band:</span> {analysis.reference.source} — the front curve above the
          rear between {analysis.reference.frontAboveRear.fromG} and {analysis.reference.frontAboveRear.toG} g (between{' '}
          {analysis.reference.allowance.fromG} and {analysis.reference.allowance.toG} g the rear may cross while it stays within{' '}
          {analysis.reference.allowance.aboveIdeal} of the ideal line), and {analysis.reference.minimumLine.text}.{' '}
          {analysis.reference.caveat}
        </p>
        <p>Sources: {analysis.reference.provenance}</p>
        <p className="font-bold text-graphite">Assumptions</p>
        <ul className="list-disc pl-5">
          {analysis.assumptions.map((a) => (
            <li key={a}>{a}</li>
          ))}
        </ul>
        <p className="font-bold text-graphite">Formulas</p>
        <ul className="list-disc pl-5">
          {analysis.rules.map((r) => (
            <li key={r}>{r}</li>
          ))}
        </ul>
      </div>
    </div>
  );
}

function bandText(s: StateAnalysis): string {
  if (s.reference.inside) return 'Inside';
  const parts: string[] = [];
  const ranges = s.reference.outsideAllowance;
  if (ranges.length) parts.push(`rear above front at ${ranges.map(span).join(', ')}`);
  if (s.reference.aboveMinimumLine.length)
    parts.push(`above the minimum line at ${s.reference.aboveMinimumLine.map(span).join(', ')}`);
  return `Outside: ${parts.join('; ')}`;
}

function FiguresTable({ analysis }: { analysis: DistributionAnalysis }) {
  const setups: Array<[string, SetupAnalysis]> = [[analysis.after ? 'Before' : 'Stock', analysis.before]];
  if (analysis.after) setups.push(['After', analysis.after]);
  const top = analysis.maxDecelerationG;
  const rows: Array<{ label: string; cell: (s: StateAnalysis) => string; wrap?: boolean }> = [
    { label: 'Both lock together', cell: (s) => (s.lockTogetherG === null ? `not up to ${g(top)}` : g(s.lockTogetherG)) },
    {
      label: 'Rear locks first',
      cell: (s) =>
        s.rearFirstFromG === null
          ? `never up to ${g(top)}`
          : s.rearFirstFromG < 0.005
            ? 'from the start'
            : `above ${g(s.rearFirstFromG)}`,
    },
    {
      label: 'Braking efficiency at k 0.8',
      cell: (s) => {
        const e = s.efficiency.find((p) => p.k === 0.8);
        return e?.decelerationG != null ? `${round(e.efficiency! * 100, 0)} % · ${g(e.decelerationG)}` : '—';
      },
    },
    { label: 'Reference band', cell: bandText, wrap: true },
  ];
  return (
    <div className="grid gap-3">
      <SubHeading>Figures</SubHeading>
      <p className="tabular text-sm text-graphite">
        Front share of brake force at equal pressure:{' '}
        {setups.map(([label, s], i) => (
          <span key={label} className="font-bold">
            {i > 0 && ' → '}
            {round(s.hydraulicFrontShare * 100, 1)} %
          </span>
        ))}
      </p>
      {analysis.before.states.map(({ state }) => (
        <table key={state} className="tabular w-full text-sm" data-distribution-table={state}>
          <caption className="pb-1 text-left text-xs font-extrabold uppercase tracking-wide text-graphite-soft">
            {state === 'laden' ? 'Laden car' : 'Unladen car'}
          </caption>
          <thead>
            <tr className="text-left text-graphite-soft">
              <th scope="col" className="py-1 font-bold">
                <span className="sr-only">Figure</span>
              </th>
              {setups.map(([label]) => (
                <th key={label} scope="col" className="py-1 text-right font-bold">
                  {label}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="font-semibold">
            {rows.map((row) => (
              <tr key={row.label} className="border-t border-graphite/10 align-top">
                <th scope="row" className="py-1.5 pr-2 text-left font-bold">
                  {row.label}
                </th>
                {setups.map(([label, setup]) => (
                  <td key={label} className={`py-1.5 pl-2 text-right ${row.wrap ? '' : 'whitespace-nowrap'}`}>
                    {row.cell(stateOf(setup, state)!)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      ))}
      <p className="text-xs text-graphite-soft">
        Braking efficiency: the deceleration reached before the first axle locks, over the road’s grip k; 100 % only where both
        axles lock together.
      </p>
    </div>
  );
}

function PedalFigures({ analysis }: { analysis: DistributionAnalysis }) {
  const { pressure, force, volume, length } = useUnits();
  const final = analysis.after ?? analysis.before;
  const unladen = stateOf(final, 'unladen')!;
  const fluidRatio = analysis.comparison?.fluidRatio ?? null;
  const hasPedal = unladen.pedal.pedalForceNPerG !== null;
  if (!hasPedal && !final.fluid) return null;
  return (
    <div className="grid gap-2 text-sm">
      <SubHeading>Pedal side{analysis.after ? ', after the swap' : ''}</SubHeading>
      <dl className="tabular grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
        {final.states.map((s) => (
          <div key={s.state} className="contents">
            <dt className="text-graphite-soft">Line pressure per g, {s.state}</dt>
            <dd className="text-right font-bold">{pressure(s.pedal.lineBarPerG)}</dd>
            {s.pedal.pedalForceNPerG !== null && (
              <>
                <dt className="text-graphite-soft">Pedal force per g, {s.state}</dt>
                <dd className="text-right font-bold">{force(s.pedal.pedalForceNPerG)}</dd>
              </>
            )}
          </div>
        ))}
        {final.fluid && (
          <>
            <dt className="text-graphite-soft">Fluid per mm of pad travel</dt>
            <dd className="text-right font-bold">{volume(final.fluid.mm3PerMmPadTravel)}</dd>
          </>
        )}
        {final.fluid?.pedalTravelMmPerMmPadTravel != null && (
          <>
            <dt className="text-graphite-soft">Pedal travel per mm of pad travel</dt>
            <dd className="text-right font-bold">{length(final.fluid.pedalTravelMmPerMmPadTravel, 1)}</dd>
          </>
        )}
      </dl>
      <p className="text-xs text-graphite-soft">
        Below any valve knee. Pressure from p = F / A at the master cylinder, after the pedal ratio and the booster; pads move
        only tenths of a millimetre, so the travel scales down with them.
        {fluidRatio !== null && fluidRatio > 1.005
          ? ` The swapped pistons take ${round(fluidRatio, 2)} × the fluid: expect a longer pedal.`
          : fluidRatio !== null && fluidRatio < 0.995
            ? ` The swapped pistons take ${round(fluidRatio, 2)} × the fluid: expect a shorter, firmer pedal.`
            : ''}
      </p>
    </div>
  );
}
