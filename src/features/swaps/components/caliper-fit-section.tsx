import type { SwapData } from '@shared/schemas/swap-data';
import type { Axle } from '@shared/schemas/enums';
import { caliperFitCheckWords, caliperFitsFor } from '@shared/fitment/swap-caliper-fit';
import { FitCheckCard } from '../../../components/fit-check-card';
import { Figure } from '../../../components/verdict';
import { useUnits } from '../../../lib/units';
import { SheetSection } from './sheet-section';

/** Does each caliper sit on the rotor this record gives it: pad on the rotor and the ring, thickness, centring shim. */
export function CaliperFitSection({ data, axle }: { data: SwapData; axle: Axle }) {
  const { length } = useUnits();
  const fits = caliperFitsFor(data, axle);
  if (fits.length === 0) return null;
  return (
    <SheetSection id="caliper-fit" title="Caliper on the rotor">
      <div className="grid gap-4">
        {fits.map((f) => (
          <div key={f.label} data-caliper-fit={f.label}>
            <h3 className="mb-2 text-sm font-bold text-graphite">{f.label}</h3>
            {f.fit ? (
              <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3 print:grid-cols-4 print:gap-1">
                {f.fit.checks.map((c) => (
                  <FitCheckCard
                    key={c.id}
                    check={c}
                    words={caliperFitCheckWords}
                    // the overhang itself reads backwards when the pad is on the rotor: show where its edge is
                    value={c.id === 'pad-overhang' ? `${length(f.fit!.padOuterRadiusMm, 1)} from the axle` : undefined}
                  />
                ))}
                {f.fit.centringShim && (
                  <Figure
                    label="Centring shim"
                    value={`${length(f.fit.centringShim.stack.totalMm, 2)} stack`}
                    note={f.fit.centringShim.placement}
                  />
                )}
                {f.fit.effectiveRadius && (
                  <Figure
                    label="Effective radius from the pad position"
                    value={length(f.fit.effectiveRadius.fromPadMm, 1)}
                    note={`Against ${length(f.fit.effectiveRadius.estimateMm, 1)} from (D − h)/2: torque × ${f.fit.effectiveRadius.ratio.toFixed(3)}. ${f.fit.effectiveRadius.rule}`}
                  />
                )}
              </div>
            ) : (
              <p className="text-sm text-graphite-soft">
                {f.error ?? `Not worked out: the record does not give ${f.missing.join(', ')}.`}
              </p>
            )}
            {f.fit && f.missing.length > 0 && (
              <p className="mt-2 text-sm text-graphite-soft print:hidden">Not checked: {f.missing.join(', ')}.</p>
            )}
            {f.fit && f.fit.cautions.length > 0 && (
              <ul className="mt-2 space-y-1 rounded-lg border border-oxide/40 bg-oxide-soft p-3 text-sm text-oxide" role="note">
                {f.fit.cautions.map((c) => (
                  <li key={c}>{c}</li>
                ))}
              </ul>
            )}
          </div>
        ))}
      </div>
    </SheetSection>
  );
}
