import { useMemo, useState } from 'react';
import { Link } from 'react-router';
import type { SwapData } from '@shared/schemas/swap-data';
import type { Axle } from '@shared/schemas/enums';
import { MIN_CLEARANCE_MM } from '@shared/fitment/clearance';
import { FitmentInputError } from '@shared/fitment/errors';
import { rotorDiameterOf } from '@shared/fitment/swap-checks';
import {
  legacyCaliperOutline,
  maxRotorGrowthForClearance,
  minSpacerForClearance,
  sectionClearance,
  SECTION_CLEARANCE_RULE,
  type SectionPoint,
} from '@shared/fitment/section';
import { wheelOutcomeLabels } from '@shared/schemas/swap-data-labels';
import { SectionDrawing } from '../../../components/section-drawing';
import { RotorFigure, SpacerFigure } from '../../../components/section-figures';
import { withSign } from '../../../components/fit-check-card';
import { Estimate, Verdict } from '../../../components/verdict';
import { Select } from '../../../components/ui/field';
import { paths } from '../../../config/paths';
import { useUnits } from '../../../lib/units';
import { SheetSection } from './sheet-section';

/** A wheel whose inside profile is on record: one of the record's tested wheels, or one of the reader's cars. */
export type ProfiledWheel = { key: string; label: string; profile: SectionPoint[]; spacerMm: number; mine: boolean };

const SLIDER_MAX_MM = 30;

/** The record's caliper outline, or for a record without one the box its two legacy numbers describe (an estimate). */
function caliperOf(data: SwapData, axle: Axle): { outline: SectionPoint[]; recorded: boolean } | null {
  const req = data.wheel;
  if (!req) return null;
  if (req.caliperOutline && req.caliperOutline.length >= 3) return { outline: req.caliperOutline, recorded: true };
  const rotorDiameterMm = rotorDiameterOf(data, axle);
  if (!rotorDiameterMm) return null;
  return {
    outline: legacyCaliperOutline({
      rotorDiameterMm,
      caliperRadialProjectionMm: req.caliperRadialProjectionMm,
      caliperOutboardMm: req.caliperOutboardMm,
    }),
    recorded: false,
  };
}

export function profiledTestedWheels(data: SwapData): ProfiledWheel[] {
  return (data.wheel?.testedWheels ?? []).flatMap((t, i) =>
    t.insideProfile && t.insideProfile.length >= 2
      ? [
          {
            key: `tested-${i}`,
            label: `${t.diameterIn}×${t.widthIn} ET${t.offsetMm}${t.spacerMm ? ` + ${t.spacerMm} mm` : ''} (tested: ${wheelOutcomeLabels[t.outcome].toLowerCase()})`,
            profile: t.insideProfile,
            spacerMm: t.spacerMm,
            mine: false,
          },
        ]
      : [],
  );
}

/**
 * The section check on the sheet: the caliper's outline against the inside of a wheel, drawn, with the measured
 * nearest point, a spacer slider, the thinnest spacer that clears and the largest rotor that fits. The reader's own
 * wheel (from my cars) comes first. Printed, it shows the drawing for the wheel chosen.
 */
export function SectionCheck({ data, axle, mine }: { data: SwapData; axle: Axle; mine: ProfiledWheel[] }) {
  const { length, lengthToward } = useUnits();
  const caliper = useMemo(() => caliperOf(data, axle), [data, axle]);
  const wheels = useMemo(() => [...mine, ...profiledTestedWheels(data)], [mine, data]);
  const [chosenKey, setChosenKey] = useState<string | null>(null);
  const chosen = wheels.find((w) => w.key === chosenKey) ?? wheels[0];
  const [spacerByWheel, setSpacerByWheel] = useState<Record<string, number>>({});
  const spacerMm = chosen ? (spacerByWheel[chosen.key] ?? chosen.spacerMm) : 0;
  const rotorDiameterMm = rotorDiameterOf(data, axle) ?? undefined;

  const computed = useMemo(() => {
    if (!caliper || !chosen) return null;
    const input = { caliper: caliper.outline, wheel: chosen.profile };
    try {
      return {
        result: sectionClearance({ ...input, spacerMm }),
        spacer: minSpacerForClearance(input, MIN_CLEARANCE_MM),
        growth: maxRotorGrowthForClearance({ ...input, spacerMm }, MIN_CLEARANCE_MM),
      };
    } catch (error) {
      if (error instanceof FitmentInputError) return null;
      throw error;
    }
  }, [caliper, chosen, spacerMm]);

  if (!caliper) return null;
  const measured = caliper.recorded;
  const setSpacer = (mm: number) => chosen && setSpacerByWheel((s) => ({ ...s, [chosen.key]: mm }));

  return (
    <div className="print:hidden">
      <SheetSection id="section" title="Section through the wheel">
        {!chosen || !computed ? (
          <p className="text-sm text-graphite-soft">
            No wheel with its inside profile is on record for this swap.{' '}
            <Link to={paths.myCars()} className="font-bold text-ink underline">
              Record your wheel’s inside in my cars
            </Link>{' '}
            to see the caliper drawn against it.
          </p>
        ) : (
          <div className="grid gap-4 lg:grid-cols-[3fr_2fr] print:block">
            <div className="grid content-start gap-3">
              <SectionDrawing
                caliper={caliper.outline}
                wheel={chosen.profile}
                spacerMm={spacerMm}
                rotorDiameterMm={rotorDiameterMm}
                estimate={!measured}
                title={`Caliper against the ${chosen.label}`}
              />
              {!measured && (
                <p className="text-sm text-graphite-soft" data-testid="section-box">
                  This record has no caliper outline: the caliper is drawn as the box its two numbers describe (top at the rotor
                  edge plus {length(data.wheel!.caliperRadialProjectionMm)}, outer face {length(data.wheel!.caliperOutboardMm)}{' '}
                  outboard of the hub face). The clearance is an estimate.
                </p>
              )}
            </div>
            <div className="grid content-start gap-3 print:hidden">
              {wheels.length > 1 && (
                <Select label="Wheel" value={chosen.key} onChange={(e) => setChosenKey(e.target.value)}>
                  {wheels.map((w) => (
                    <option key={w.key} value={w.key}>
                      {w.mine ? `Your ${w.label}` : w.label}
                    </option>
                  ))}
                </Select>
              )}
              <div className="rounded-lg border border-graphite/15 bg-paper-card p-3">
                <label
                  htmlFor="sheet-section-spacer"
                  className="flex items-baseline justify-between gap-3 text-sm font-bold text-graphite"
                >
                  <span>Spacer</span>
                  <span className="tabular">{spacerMm > 0 ? length(spacerMm, 1) : 'none'}</span>
                </label>
                <input
                  id="sheet-section-spacer"
                  type="range"
                  min={0}
                  max={Math.max(SLIDER_MAX_MM, Math.ceil(spacerMm))}
                  step={0.5}
                  value={spacerMm}
                  aria-valuetext={spacerMm > 0 ? length(spacerMm, 1) : 'no spacer'}
                  onChange={(e) => setSpacer(Number(e.target.value))}
                  className="mt-2 h-8 w-full accent-[#1d4d3a]"
                />
                <p className="text-xs text-graphite-soft">
                  Moves the wheel outboard: the spokes and the fillet move away, the barrel stays.
                </p>
              </div>
              {measured ? (
                <Verdict
                  label="Clearance at the nearest point"
                  ok={!computed.result.interferes && computed.result.clearanceMm >= MIN_CLEARANCE_MM - 1e-9}
                  value={
                    computed.result.interferes
                      ? `${lengthToward(-computed.result.clearanceMm, 'up')} overlap`
                      : lengthToward(computed.result.clearanceMm, 'down')
                  }
                  margin={withSign(computed.result.clearanceMm - MIN_CLEARANCE_MM, (v) => length(v, 1))}
                  rule={SECTION_CLEARANCE_RULE}
                />
              ) : (
                <Estimate
                  label="Clearance at the nearest point"
                  value={
                    computed.result.interferes
                      ? `${lengthToward(-computed.result.clearanceMm, 'up')} overlap`
                      : lengthToward(computed.result.clearanceMm, 'down')
                  }
                  basis="The caliper as a box from the record’s two numbers against the wheel’s recorded inside; measure the caliper’s outline for a verdict."
                />
              )}
              <SpacerFigure spacer={computed.spacer} onTry={setSpacer} />
              <RotorFigure growth={computed.growth} rotorDiameterMm={rotorDiameterMm} spacerMm={spacerMm} />
            </div>
          </div>
        )}
      </SheetSection>
    </div>
  );
}

/**
 * The printed build sheet's section drawing: the reader's own wheel (their first car with a recorded inside), with its
 * spacer, floated beside the wheel requirement. The record's tested wheels stay on screen, so a sheet printed for the
 * garage shows the one wheel that matters to the reader and keeps to two pages.
 */
export function PrintedSection({ data, axle, mine }: { data: SwapData; axle: Axle; mine: ProfiledWheel[] }) {
  const caliper = caliperOf(data, axle);
  const wheel = mine[0];
  if (!caliper || !wheel) return null;
  return (
    <div className="hidden print:float-right print:ml-4 print:block print:w-[60mm]" data-testid="printed-section">
      <SectionDrawing
        caliper={caliper.outline}
        wheel={wheel.profile}
        spacerMm={wheel.spacerMm}
        rotorDiameterMm={rotorDiameterOf(data, axle) ?? undefined}
        estimate={!caliper.recorded}
        title={`Caliper against the ${wheel.label}`}
      />
    </div>
  );
}
