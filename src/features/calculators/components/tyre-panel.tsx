import {
  IMPLIED_ASPECT_SOURCE,
  LOAD_INDEX_SOURCE,
  loadIndexKg,
  parseTyreSize,
  speedCapability,
  tyreGeometry,
  tyreLoadCheck,
  type TyreGeometry,
  type TyreSize,
} from '@shared/fitment/tyre';
import { FitmentInputError } from '@shared/fitment/errors';
import { Caution } from '../../../components/caution';
import { Figure, Verdict } from '../../../components/verdict';
import { round, useUnits } from '../../../lib/units';
import { byField, Inputs, type CalcParams } from './calc-params';
import { ChoiceField, choiceOf, FieldGrid, Panel, QuantityField, ResultGrid, SubHeading, Waiting, withSign } from './calc-form';

export const tyreKeys = ['tyre', 'tyre2', 'axle', 'twin'];

const axleOptions = [
  ['2', 'Two (single tyres)'],
  ['4', 'Four (twin tyres)'],
] as const;

// NIST SP 811: 1 mile = 1.609344 km exactly
const KM_PER_MILE = 1.609344;

const DIAMETER_RULE = 'Keep a replacement within about 3 % of the original overall diameter (common practice, no source)';

export function TyrePanel({ params }: { params: CalcParams }) {
  const { length, mass, system } = useUnits();
  const inputs = new Inputs(params);
  const code = inputs.text('tyre', 'a tyre size');
  const parsed = inputs.run(
    () => {
      const size = parseTyreSize(code);
      return { size, geometry: tyreGeometry(size) };
    },
    () => 'tyre',
  );
  const geometry = parsed?.geometry ?? null;

  const axleText = params.get('axle').trim();
  const tyresOnAxle = Number(choiceOf(params, 'twin', axleOptions));
  let load: ReturnType<typeof tyreLoadCheck> | null = null;
  let loadError: string | undefined;
  if (parsed && axleText !== '') {
    const second = new Inputs(params);
    const axleLoadKg = second.number('axle', 'axle load');
    load = second.run(
      () => tyreLoadCheck({ size: parsed.size, axleLoadKg, tyresOnAxle }),
      byField({ axleLoadKg: 'axle', code: 'axle', loadIndex: 'axle' }),
    );
    loadError = second.error('axle');
  }

  const compareCode = params.get('tyre2').trim();
  let compare: TyreGeometry | null = null;
  let compareError: string | undefined;
  if (compareCode) {
    const second = new Inputs(params);
    compare = second.run(
      () => tyreGeometry(parseTyreSize(compareCode)),
      () => 'tyre2',
    );
    compareError = second.error('tyre2');
  }

  const speedUnit = system === 'metric' ? 'km/h' : 'mph';
  const indicated = system === 'metric' ? 100 : 60;

  return (
    <Panel
      id="tyre"
      title="Tyre size"
      lead="Sidewall, overall diameter and rolling circumference from the size on the sidewall; add a second size to compare."
      keys={tyreKeys}
      wide="results"
      form={
        <FieldGrid>
          <QuantityField
            params={params}
            name="tyre"
            label="Tyre size"
            text
            placeholder="225/45R17"
            hint="As on the sidewall: 225/45ZR17 94W XL, LT265/75R16 123/120Q, 195/70R15C 104/102R, 185/70HR14, 165SR15, 31x10.50R15"
            error={inputs.error('tyre')}
          />
          <QuantityField
            params={params}
            name="tyre2"
            label="Compare with (optional)"
            text
            placeholder="235/40R18"
            error={compareError}
          />
          <QuantityField
            params={params}
            name="axle"
            label="Axle load (optional)"
            quantity="mass"
            placeholder="900"
            hint="From the weighbridge or the plate; checks the load index"
            error={loadError}
          />
          <ChoiceField params={params} name="twin" label="Tyres on the axle" options={axleOptions} />
        </FieldGrid>
      }
      results={
        geometry ? (
          <>
            <ResultGrid>
              <Figure label="Sidewall height" value={length(geometry.sidewallMm, 2)} />
              <Figure label="Overall diameter" value={length(geometry.diameterMm, 1)} />
              <Figure label="Circumference" value={length(geometry.circumferenceMm, 1)} />
              <Figure
                label={system === 'metric' ? 'Revolutions per km' : 'Revolutions per mile'}
                value={round(system === 'metric' ? geometry.revsPerKm : geometry.revsPerMile, 1)}
                note={
                  system === 'metric' ? `${round(geometry.revsPerMile, 1)} per mile` : `${round(geometry.revsPerKm, 1)} per km`
                }
              />
            </ResultGrid>
            <p className="mt-2 text-xs text-graphite-soft">Nominal, unloaded sizes; a loaded tyre rolls a little smaller.</p>
            <ServiceDescription size={parsed!.size} />
            {load && (
              <div className="mt-3">
                <Verdict
                  label={`Axle load on ${load.tyresOnAxle} tyres of index ${load.loadIndex}`}
                  ok={load.ok}
                  words={{ pass: 'Carries the load', fail: 'Overloaded' }}
                  value={`${mass(load.axleLoadKg)} of ${mass(load.axleCapacityKg)}`}
                  margin={withSign(load.marginKg, (v) => mass(v))}
                  note={`${load.tyresOnAxle} × ${mass(load.capacityPerTyreKg)} per tyre.${load.note ? ` ${load.note}` : ''}`}
                  rule={`${load.rule} — source: ${load.source}`}
                />
              </div>
            )}
            {compare && <Comparison before={geometry} after={compare} indicated={indicated} speedUnit={speedUnit} />}
          </>
        ) : (
          <Waiting missing={inputs.missing} invalid={Boolean(inputs.error('tyre'))} />
        )
      }
      caution={<Caution topics={['wheels']} />}
    />
  );
}

function Comparison({
  before,
  after,
  indicated,
  speedUnit,
}: {
  before: TyreGeometry;
  after: TyreGeometry;
  indicated: number;
  speedUnit: string;
}) {
  const { length } = useUnits();
  const ratio = after.diameterMm / before.diameterMm;
  const differencePct = (ratio - 1) * 100;
  // The speedometer counts revolutions of the first size: it shows indicated while the car covers indicated × ratio.
  const trueSpeed = indicated * ratio;
  const readingPct = (1 - 1 / ratio) * 100;
  const within = Math.abs(differencePct) <= 3;
  const reading =
    Math.abs(readingPct) < 0.05
      ? 'reads the same'
      : `reads ${round(Math.abs(readingPct), 1)} % ${readingPct > 0 ? 'low' : 'high'}`;
  return (
    <>
      <SubHeading>Compared with the first size</SubHeading>
      <ResultGrid>
        <Verdict
          label="Overall diameter difference"
          ok={null}
          value={`${withSign(differencePct, (v) => round(v, 2))} %`}
          note={`${withSign(after.diameterMm - before.diameterMm, (v) => length(v, 1))}; ${within ? 'within' : 'outside'} about 3 %`}
          rule={DIAMETER_RULE}
        />
        <Figure
          label="Speedometer effect"
          value={`${round(trueSpeed, 1)} ${speedUnit}`}
          note={`True speed at an indicated ${indicated} ${speedUnit}: the speedometer ${reading}.`}
        />
      </ResultGrid>
    </>
  );
}

const prefixNames: Record<string, string> = {
  P: 'P: passenger tyre (US sizing)',
  LT: 'LT: light-truck tyre',
  T: 'T: temporary spare',
  ST: 'ST: special trailer tyre',
};

/** What the code says beyond the size: use, load index, speed symbol and the older conventions it follows. */
function ServiceDescription({ size }: { size: TyreSize }) {
  const { mass, system } = useUnits();
  const speed = speedCapability(size);
  const kg = (index: number) => {
    try {
      return mass(loadIndexKg(index));
    } catch (error) {
      if (error instanceof FitmentInputError) return 'outside the table carried here';
      throw error;
    }
  };
  const notes: string[] = [];
  if (size.prefix) notes.push(prefixNames[size.prefix]);
  if (size.commercial) notes.push('C: commercial (van) tyre');
  if (size.reinforced)
    notes.push(
      `${size.reinforced}: ${size.reinforced === 'XL' ? 'extra load' : 'reinforced'}, the higher load needs a higher pressure`,
    );
  if (size.aspectRatioImplied)
    notes.push(`No aspect ratio in the code: ${size.aspectRatio} % assumed (${IMPLIED_ASPECT_SOURCE}).`);
  if (size.format === 'flotation') notes.push(`Flotation size: ${size.overallDiameterIn} in overall diameter given directly.`);
  if (size.loadIndex === undefined && !speed && notes.length === 0) return null;
  const speedText = speed
    ? `${speed.above ? 'over ' : ''}${system === 'metric' ? `${speed.kmh} km/h` : `${round(speed.kmh / KM_PER_MILE, 0)} mph`}`
    : null;
  return (
    <>
      <SubHeading>Service description</SubHeading>
      <ResultGrid>
        {size.loadIndex !== undefined && (
          <Figure
            label={
              size.dualLoadIndex !== undefined
                ? `Load index ${size.loadIndex}/${size.dualLoadIndex}`
                : `Load index ${size.loadIndex}`
            }
            value={`${kg(size.loadIndex)}${size.dualLoadIndex !== undefined ? ` / ${kg(size.dualLoadIndex)}` : ''}`}
            note={`per tyre${size.dualLoadIndex !== undefined ? ', single / twin fitment' : ''}; ${LOAD_INDEX_SOURCE}`}
          />
        )}
        {speed && speedText && (
          <Figure label={`Speed ${speed.symbol}${size.bracketed ? ' (bracketed)' : ''}`} value={speedText} note={speed.source} />
        )}
      </ResultGrid>
      {notes.length > 0 && (
        <ul className="mt-2 list-disc space-y-1 pl-5 text-xs text-graphite-soft">
          {notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      )}
    </>
  );
}
