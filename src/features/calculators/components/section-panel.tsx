import { MIN_CLEARANCE_MM } from '@shared/fitment/clearance';
import { FitmentInputError } from '@shared/fitment/errors';
import {
  maxRotorGrowthForClearance,
  minSpacerForClearance,
  sectionClearance,
  SECTION_CLEARANCE_RULE,
  type SectionPoint,
} from '@shared/fitment/section';
import { Caution } from '../../../components/caution';
import { SectionDrawing } from '../../../components/section-drawing';
import { Button } from '../../../components/ui/button';
import { Verdict } from '../../../components/verdict';
import { RotorFigure, SpacerFigure } from '../../../components/section-figures';
import { WheelMeasureGuide } from '../../../components/wheel-measure-guide';
import { useUnits } from '../../../lib/units';
import { readable, type CalcParams } from './calc-params';
import { Fieldset, Panel, QuantityField, SubHeading, Waiting, withSign } from './calc-form';
import { PointList, readNumber, readRows, type PointRow } from './section-points';

export const sectionKeys = ['scal', 'swh', 'ssp', 'srot'];

const SPACER_SLIDER_MAX_MM = 30;

/** A four-piston outline and an 18 in wheel whose fillet, not its barrel or spokes, comes closest (invented figures). */
const EXAMPLE = {
  scal: ['-70_120', '28_120', '33_128', '33_186', '28_194', '-62_194', '-70_186'],
  swh: ['-110_202', '10_202', '20_200', '28_196', '34_189', '38_180', '39_150', '40_100'],
  srot: '356',
};

type Read = { points: SectionPoint[]; rowOf: number[]; errors: Record<number, string> };

function readPoints(rows: PointRow[]): Read {
  const out: Read = { points: [], rowOf: [], errors: {} };
  rows.forEach((row, i) => {
    const z = readNumber(row.z);
    const r = readNumber(row.r);
    if (z === null && r === null) return;
    if (z === null || r === null) out.errors[i] = `enter both z and r`;
    else if (Number.isNaN(z) || Number.isNaN(r))
      out.errors[i] = `enter numbers, e.g. -12.5 or 12,5 (got "${Number.isNaN(z) ? row.z : row.r}")`;
    else {
      out.points.push({ zMm: z, rMm: r });
      out.rowOf.push(i);
    }
  });
  return out;
}

export function SectionPanel({ params }: { params: CalcParams }) {
  const { length, lengthToward } = useUnits();
  const caliperRows = readRows(params, 'scal', 3);
  const wheelRows = readRows(params, 'swh', 2);
  const caliper = readPoints(caliperRows);
  const wheel = readPoints(wheelRows);
  const spacerMm = Math.min(60, Math.max(0, readNumber(params.get('ssp')) || 0));
  const rotorText = params.get('srot');
  const rotorRead = readNumber(rotorText);
  const rotorError = rotorRead !== null && !(rotorRead > 0) ? 'Enter the rotor diameter, e.g. 330' : undefined;
  const rotorDiameterMm = rotorRead !== null && rotorRead > 0 ? rotorRead : undefined;

  const missing: string[] = [];
  if (caliper.points.length < 3)
    missing.push(`${3 - caliper.points.length} more caliper point${caliper.points.length === 2 ? '' : 's'}`);
  if (wheel.points.length < 2) missing.push(`${2 - wheel.points.length} more wheel point${wheel.points.length === 1 ? '' : 's'}`);
  const invalid = Object.keys(caliper.errors).length + Object.keys(wheel.errors).length > 0;

  let computed: {
    result: ReturnType<typeof sectionClearance>;
    spacer: number | null;
    growth: number | null;
  } | null = null;
  let general: string | null = null;
  if (!invalid && missing.length === 0) {
    const input = { caliper: caliper.points, wheel: wheel.points };
    try {
      computed = {
        result: sectionClearance({ ...input, spacerMm }),
        spacer: minSpacerForClearance(input, MIN_CLEARANCE_MM),
        growth: maxRotorGrowthForClearance({ ...input, spacerMm }, MIN_CLEARANCE_MM),
      };
    } catch (error) {
      if (!(error instanceof FitmentInputError)) throw error;
      const [list, index, coordinate] = error.field.split('.');
      const target = list === 'caliper' ? caliper : list === 'wheel' ? wheel : null;
      if (target && index !== undefined)
        target.errors[target.rowOf[Number(index)]] = `${coordinate === 'rMm' ? 'r' : 'z'} ${readable(error).toLowerCase()}`;
      else general = readable(error);
    }
  }

  const sliderMax = Math.max(
    SPACER_SLIDER_MAX_MM,
    Math.ceil(spacerMm),
    computed?.spacer ? Math.min(60, Math.ceil(computed.spacer) + 5) : 0,
  );
  const setSpacer = (mm: number) => params.set('ssp', mm > 0 ? String(Math.round(mm * 100) / 100) : '');
  const fillExample = () => {
    params.setAll('scal', EXAMPLE.scal);
    params.setAll('swh', EXAMPLE.swh);
    params.set('srot', EXAMPLE.srot);
  };

  return (
    <Panel
      id="section"
      title="Section check"
      lead="Your caliper’s outline against the inside of your wheel, in the plane through the axle: the nearest point, whether it is the barrel, the fillet or the spokes, the thinnest spacer that clears and the largest rotor that fits."
      keys={sectionKeys}
      wide="results"
      form={
        <div className="grid gap-4">
          <div className="print:hidden">
            <Button variant="secondary" onClick={fillExample}>
              Fill in an example
            </Button>
          </div>
          <Fieldset legend="Caliper outline">
            <p className="mb-3 text-sm text-graphite-soft">
              The caliper seen from the side, swept around the axle: at each z, the furthest it reaches from the axle. Measure
              with the rotor fitted, going round the outline.
            </p>
            <PointList
              params={params}
              name="scal"
              noun="Caliper point"
              least={3}
              errors={caliper.errors}
              zHint="from the hub’s mounting face, outboard positive"
              rHint="from the axle centre (half the rotor Ø plus how far beyond its edge)"
            />
          </Fieldset>
          <Fieldset legend="Your wheel’s inside">
            <details className="mb-3 rounded-lg bg-paper p-3" open>
              <summary className="cursor-pointer text-sm font-bold text-ink">How to measure it</summary>
              <WheelMeasureGuide className="mt-3" />
            </details>
            <PointList
              params={params}
              name="swh"
              noun="Wheel point"
              least={2}
              errors={wheel.errors}
              zHint="from the wheel’s mounting face, outboard positive (D − D₀)"
              rHint="from the centre"
            />
          </Fieldset>
          <QuantityField
            params={params}
            name="srot"
            label="Rotor Ø the outline was measured with"
            quantity="length"
            placeholder="330"
            hint="Optional: gives the largest rotor as a diameter and draws its edge"
            error={rotorError}
            className="max-w-sm"
          />
        </div>
      }
      results={
        <div className="grid gap-3">
          <div className="rounded-lg border border-graphite/15 bg-paper-card p-3">
            <label htmlFor="section-spacer" className="flex items-baseline justify-between gap-3 text-sm font-bold text-graphite">
              <span>Spacer</span>
              <span className="tabular">{spacerMm > 0 ? length(spacerMm, 1) : 'none'}</span>
            </label>
            <input
              id="section-spacer"
              type="range"
              min={0}
              max={sliderMax}
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
          {computed ? (
            <>
              <SectionDrawing
                caliper={caliper.points}
                wheel={wheel.points}
                spacerMm={spacerMm}
                rotorDiameterMm={rotorDiameterMm}
              />
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
              <SubHeading>What would clear</SubHeading>
              <div className="grid gap-3 sm:grid-cols-2">
                <SpacerFigure spacer={computed.spacer} onTry={setSpacer} />
                <RotorFigure growth={computed.growth} rotorDiameterMm={rotorDiameterMm} spacerMm={spacerMm} />
              </div>
            </>
          ) : (
            <Waiting missing={missing} invalid={invalid} general={general} />
          )}
        </div>
      }
      caution={<Caution topics={['brakes', 'wheels']} />}
    />
  );
}
