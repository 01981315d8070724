import {
  DEFAULT_PAD_MU,
  DRUM_BRAKE_FACTORS,
  DRUM_TORQUE_RULE,
  drumBrakeTorqueNm,
  type DrumShoeArrangement,
} from '@shared/fitment/brakes';
import { Caution } from '../../../components/caution';
import { Figure } from '../../../components/verdict';
import { round, useUnits } from '../../../lib/units';
import { byField, Inputs, type CalcParams } from './calc-params';
import { ChoiceField, choiceOf, FieldGrid, Panel, QuantityField, ResultGrid, Waiting } from './calc-form';

export const drumKeys = ['wcyl', 'drum', 'shoes', 'cstar', 'dbar'];

const shoeOptions = (Object.keys(DRUM_BRAKE_FACTORS) as DrumShoeArrangement[]).map(
  (k) => [k, DRUM_BRAKE_FACTORS[k].label] as const,
);

export function DrumPanel({ params }: { params: CalcParams }) {
  const { length, torque, pressure } = useUnits();
  const shoes = choiceOf<DrumShoeArrangement>(params, 'shoes', shoeOptions);
  const typical = DRUM_BRAKE_FACTORS[shoes];
  const inputs = new Inputs(params);
  const boreMm = inputs.number('wcyl', 'wheel-cylinder bore');
  const drumMm = inputs.number('drum', 'drum diameter');
  const pressureBar = inputs.number('dbar', 'line pressure');
  const own = params.get('cstar').trim() !== '';
  const brakeFactor = own ? inputs.number('cstar', 'brake factor') : typical.brakeFactor;
  const result = inputs.run(
    () => {
      const torqueNm = drumBrakeTorqueNm({
        wheelCylinderBoreMm: boreMm,
        drumDiameterMm: drumMm,
        brakeFactor,
        linePressureBar: pressureBar,
      });
      const forceN = pressureBar * 0.1 * ((Math.PI * boreMm * boreMm) / 4);
      // the same drum read as a disc (2 μ in place of C*, at the drum radius): the error a drum corner avoids
      const asDiscNm = (2 * DEFAULT_PAD_MU * forceN * (drumMm / 2)) / 1000;
      return { torqueNm, forceN, asDiscNm };
    },
    byField({ wheelCylinderBoreMm: 'wcyl', drumDiameterMm: 'drum', brakeFactor: 'cstar', linePressureBar: 'dbar' }),
  );

  return (
    <Panel
      id="drum"
      title="Drum corner"
      lead="Brake torque of a drum corner from its wheel cylinder, drum and shoe arrangement, so a drum is not mistaken for a disc in the balance."
      keys={drumKeys}
      form={
        <FieldGrid>
          <QuantityField
            params={params}
            name="wcyl"
            label="Wheel-cylinder bore"
            quantity="length"
            placeholder="20.64"
            error={inputs.error('wcyl')}
          />
          <QuantityField
            params={params}
            name="drum"
            label="Drum diameter"
            quantity="length"
            placeholder="203.2"
            error={inputs.error('drum')}
          />
          <ChoiceField
            params={params}
            name="shoes"
            label="Shoe arrangement"
            options={shoeOptions}
            hint={`Typical C* ${typical.brakeFactor.toFixed(1)} (from memory)`}
          />
          <QuantityField
            params={params}
            name="cstar"
            label="Brake factor C*"
            placeholder={String(typical.brakeFactor)}
            hint="Leave empty for the typical value; enter the brake's own when you have it"
            error={inputs.error('cstar')}
          />
          <QuantityField
            params={params}
            name="dbar"
            label="Line pressure"
            quantity="pressure"
            placeholder="40"
            error={inputs.error('dbar')}
          />
        </FieldGrid>
      }
      results={
        result ? (
          <>
            <ResultGrid>
              <Figure
                label="Brake torque per wheel"
                value={torque(result.torqueNm)}
                note={`at ${pressure(pressureBar)}, C* ${round(brakeFactor, 2)}, drum radius ${length(drumMm / 2, 1)}`}
              />
              <Figure label="Wheel-cylinder force" value={`${round(result.forceN, 0)} N`} note="line pressure × piston area" />
              <Figure
                label="Read as a disc instead"
                value={torque(result.asDiscNm)}
                note={`2 μ (μ ${DEFAULT_PAD_MU}) in place of C*: ${round(result.torqueNm / result.asDiscNm, 1)} × too low`}
              />
            </ResultGrid>
            <p className="mt-3 text-xs text-graphite-soft">Rule: {DRUM_TORQUE_RULE}</p>
            <p className="mt-1 text-xs text-graphite-soft" data-brake-factor-source>
              Brake factor: {own ? 'your value' : `typical ${typical.label.toLowerCase()}, ${typical.source}`}.
            </p>
          </>
        ) : (
          <Waiting missing={inputs.missing} invalid={Object.keys(inputs.errors).length > 0} />
        )
      }
      caution={<Caution topics={['brakes']} />}
    />
  );
}
