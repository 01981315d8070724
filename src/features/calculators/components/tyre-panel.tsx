import { parseTyreSize, tyreGeometry, type TyreGeometry } from '@shared/fitment/tyre';
import { Caution } from '../../../components/caution';
import { Figure, Verdict } from '../../../components/verdict';
import { round, useUnits } from '../../../lib/units';
import { Inputs, type CalcParams } from './calc-params';
import { FieldGrid, Panel, QuantityField, ResultGrid, SubHeading, Waiting, withSign } from './calc-form';

export const tyreKeys = ['tyre', 'tyre2'];

const DIAMETER_RULE = 'Keep a replacement within about 3 % of the original overall diameter (common practice, no source)';

export function TyrePanel({ params }: { params: CalcParams }) {
  const { length, system } = useUnits();
  const inputs = new Inputs(params);
  const code = inputs.text('tyre', 'a tyre size');
  const geometry = inputs.run(
    () => tyreGeometry(parseTyreSize(code)),
    () => 'tyre',
  );

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
            inputMode="text"
            placeholder="225/45R17"
            hint="As on the sidewall, e.g. 225/45R17 or 225/45ZR17 94W"
            error={inputs.error('tyre')}
          />
          <QuantityField
            params={params}
            name="tyre2"
            label="Compare with (optional)"
            inputMode="text"
            placeholder="235/40R18"
            error={compareError}
          />
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
