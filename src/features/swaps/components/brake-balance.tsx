import { useMemo, useState } from 'react';
import type { SwapData } from '@shared/schemas/swap-data';
import type { ChassisView } from '@shared/schemas/views';
import { chassisFigures } from '@shared/schemas/vehicle';
import type { BalanceStart } from '@shared/schemas/cars';
import type { LoadState, SetupAnalysis } from '@shared/fitment/distribution-analysis';
import { brakeBalanceOf } from '@shared/fitment/swap-checks';
import { useUnits } from '../../../lib/units';
import { Figure } from '../../../components/verdict';
import { BalanceShiftNote } from '../../../components/balance-shift-note';
import { AdhesionChart } from '../../../components/adhesion-chart';
import { VehicleFiguresList, rearValveText } from '../../../components/vehicle-figures';
import { SheetSection } from './sheet-section';

const pct = (share: number) => `${(share * 100).toFixed(1)} %`;
const NO_CARS: BalanceStart[] = [];
const stateOf = (setup: SetupAnalysis, state: LoadState) => setup.states.find((s) => s.state === state)!;

/**
 * The sheet's brake section: which way the swap moves the balance and, with the chassis' stock figures or the
 * reader's own car, which axle locks first before and after it, drawn against deceleration. Opened by a
 * member whose car on this chassis already has swaps fitted, it starts from that car as it is.
 */
export function BrakeBalanceSection({
  data,
  chassis,
  carStarts = NO_CARS,
}: {
  data: SwapData;
  chassis: Pick<ChassisView, 'make' | 'model' | 'vehicle'>;
  /** the reader's cars the balance may start from (from my cars) */
  carStarts?: BalanceStart[];
}) {
  const units = useUnits();
  const { torque, pressure } = units;
  const choices = useMemo(() => {
    const stockFigures = chassisFigures(chassis);
    const stock: BalanceStart[] = stockFigures
      ? [
          {
            key: 'stock',
            label: stockFigures.label,
            figures: stockFigures,
            brakesAsIs: null,
            fittedTitles: [],
            fittedHere: false,
          },
        ]
      : [];
    return [...stock, ...carStarts];
  }, [chassis, carStarts]);
  const [chosenKey, setChosenKey] = useState<string | null>(null);
  // a car with swaps already fitted is the car the reader is working on: start from it as it is
  const start = choices.find((c) => c.key === chosenKey) ?? choices.find((c) => c.brakesAsIs) ?? choices[0] ?? null;
  const figures = start?.figures ?? null;
  const balance = useMemo(
    () =>
      brakeBalanceOf(data, figures, start?.brakesAsIs ? { brakesAsIs: start.brakesAsIs, fittedHere: start.fittedHere } : null),
    [data, figures, start],
  );
  const [shown, setShown] = useState<LoadState>('unladen');
  if (!balance) return null;
  const analysis = balance.distribution;
  const states = analysis ? analysis.before.states.map((s) => s.state) : [];
  const view = states.includes(shown) ? shown : 'unladen';

  return (
    <SheetSection id="balance" title="Brake balance: which axle locks first">
      {choices.length > 1 && (
        <label className="mb-3 flex flex-wrap items-center gap-2 text-sm font-bold text-graphite print:hidden">
          Worked out for
          <select
            className="min-h-10 max-w-full rounded-md border border-graphite/30 bg-paper-card px-2 text-sm"
            value={start?.key ?? ''}
            onChange={(e) => setChosenKey(e.target.value)}
          >
            {choices.map((c) => (
              <option key={c.key} value={c.key}>
                {c.label.replace(/^the /, '')}
              </option>
            ))}
          </select>
        </label>
      )}
      {start?.brakesAsIs && (
        <p className="mb-2 text-sm font-bold text-ink print:text-xs" data-balance-start="car-as-is">
          Starts from {start.label}:{' '}
          {start.fittedHere
            ? `this swap is already fitted, so “before” is the car without it.${start.fittedTitles.length ? ` The car keeps ${start.fittedTitles.join('; ')}.` : ''}`
            : `with ${start.fittedTitles.join('; ')} fitted, “before” is that car’s brakes now, not the stock car’s.`}
        </p>
      )}
      <p className="mb-2 text-sm text-graphite print:mb-1 print:text-xs" data-balance-figures={figures?.source ?? 'none'}>
        {figures ? (
          <>
            Worked out with {figures.label} ({rearValveText(figures.vehicle.rearValve, units)}).{' '}
            <span className="print:hidden">
              An estimate from those figures, not a measurement: have the balance checked on a brake tester.
            </span>
          </>
        ) : (
          `The catalogue has no stock figures for the ${chassis.make} ${chassis.model}, so which axle locks first cannot be worked out here. Add your car’s own figures in My cars to see it.`
        )}
      </p>
      <BalanceShiftNote shift={balance.shift} />

      {analysis && analysis.after && (
        // the chart stays on screen: the printed build sheet keeps to two pages with the sentence above
        <div className="mt-4 grid gap-3 print:hidden">
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
          <AdhesionChart
            title={view === 'laden' ? 'Laden car, before and after the swap' : 'Unladen car, before and after the swap'}
            sets={[
              { stage: 'before', label: 'Before', analysis: stateOf(analysis.before, view) },
              { stage: 'after', label: 'After', analysis: stateOf(analysis.after, view) },
            ]}
            maxG={analysis.maxDecelerationG}
          />
          <details className="text-xs text-graphite-soft print:hidden" data-balance-basis>
            <summary className="cursor-pointer font-bold text-ink">The figures, assumptions and sources</summary>
            <div className="mt-2 grid gap-2">
              <VehicleFiguresList vehicle={figures!.vehicle} />
              <p className="font-bold text-graphite">Assumptions</p>
              <ul className="list-disc pl-5">
                <li>
                  Rear pressure law: {rearValveText(figures!.vehicle.rearValve, units)}
                  {figures!.vehicle.rearValve.kind === 'none' ? '' : ', the same before and after the swap'}.
                </li>
                <li>
                  {figures!.vehicle.laden
                    ? 'Worked out unladen (the car with its driver) and laden (at its permitted maximum mass).'
                    : 'Worked out unladen only: no laden figures are given.'}
                </li>
                {analysis.assumptions.map((a) => (
                  <li key={a}>{a}</li>
                ))}
              </ul>
              <p>
                <span className="font-bold text-graphite">Reference band:</span> {analysis.reference.source} — the front curve
                above the rear between {analysis.reference.frontAboveRear.fromG} and {analysis.reference.frontAboveRear.toG} g.{' '}
                {analysis.reference.caveat}
              </p>
              <p className="font-bold text-graphite">Sources</p>
              <ul className="list-disc pl-5">
                {analysis.rules.map((r) => (
                  <li key={r}>{r}</li>
                ))}
                <li>{analysis.reference.provenance}</li>
              </ul>
            </div>
          </details>
        </div>
      )}

      <div className="mt-3 grid items-start gap-3 sm:grid-cols-2 print:hidden">
        <Figure
          label="Front share before"
          value={pct(balance.frontShareBefore)}
          note={`Front ${torque(balance.torqueNm.before.front)} · rear ${torque(balance.torqueNm.before.rear)} per wheel`}
        />
        <Figure
          label="Front share after"
          value={pct(balance.frontShareAfter)}
          note={`Front ${torque(balance.torqueNm.after.front)} · rear ${torque(balance.torqueNm.after.rear)} per wheel`}
        />
      </div>
      <p className="mt-2 text-xs text-graphite-soft print:hidden">
        Static share of brake torque with equal line pressure ({pressure(balance.linePressureBar)}) and pad μ {balance.padMu};
        disc brake torque T = 2 μ p A r (textbook form).
      </p>
    </SheetSection>
  );
}
