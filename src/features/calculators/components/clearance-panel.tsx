import {
  maxRotorRuleOfThumbMm,
  radialClearance,
  spokeClearance,
  MAX_ROTOR_RULE,
  type ClearanceResult,
} from '@shared/fitment/clearance';
import { Caution } from '../../../components/caution';
import { Verdict } from '../../../components/verdict';
import { useUnits } from '../../../lib/units';
import { byField, Inputs, type CalcParams } from './calc-params';
import { FieldGrid, Fieldset, Panel, QuantityField, SubHeading, Waiting, withSign } from './calc-form';

export const clearanceKeys = ['barrel', 'rotor', 'proj', 'inset', 'cout', 'cspacer', 'wheel'];

export function ClearancePanel({ params }: { params: CalcParams }) {
  const { length } = useUnits();

  const radial = new Inputs(params);
  const barrel = radial.number('barrel', 'barrel inner diameter');
  const rotor = radial.number('rotor', 'rotor diameter');
  const projection = radial.number('proj', 'caliper radial projection');
  const radialResult = radial.run(
    () => radialClearance({ barrelInnerDiameterMm: barrel, rotorDiameterMm: rotor, caliperRadialProjectionMm: projection }),
    byField({ barrelInnerDiameterMm: 'barrel', rotorDiameterMm: 'rotor', caliperRadialProjectionMm: 'proj' }),
  );

  const spoke = new Inputs(params);
  const inset = spoke.number('inset', 'spoke inset');
  const caliperOutboard = spoke.number('cout', 'caliper outboard face');
  const spacer = spoke.number('cspacer', 'spacer', { optional: true });
  const spokeResult = spoke.run(
    () => spokeClearance({ spokeInsetMm: inset, caliperOutboardMm: caliperOutboard, spacerMm: spacer }),
    byField({ spokeInsetMm: 'inset', caliperOutboardMm: 'cout', spacerMm: 'cspacer' }),
  );

  const thumb = new Inputs(params);
  const wheelIn = thumb.number('wheel', 'wheel diameter');
  const maxRotor = thumb.run(
    () => maxRotorRuleOfThumbMm(wheelIn),
    () => 'wheel',
  );
  const rotorKnown = params.get('rotor') !== '' && !radial.error('rotor') && Number.isFinite(rotor);

  const check = (label: string, result: ClearanceResult) => (
    <Verdict
      label={label}
      ok={result.ok}
      value={length(result.clearanceMm, 1)}
      margin={withSign(result.marginMm, (v) => length(v, 1))}
      rule={result.rule}
    />
  );

  return (
    <Panel
      id="clearance"
      title="Wheel clearance"
      lead="Room between a caliper and the wheel: out to the barrel, and across to the back of the spokes."
      keys={clearanceKeys}
      wide
      form={
        <div className="grid gap-4">
          <Fieldset legend="Barrel (radial)">
            <FieldGrid cols={3}>
              <QuantityField
                params={params}
                name="barrel"
                label="Barrel inner Ø"
                quantity="length"
                placeholder="400"
                hint="At the caliper's plane"
                error={radial.error('barrel')}
              />
              <QuantityField
                params={params}
                name="rotor"
                label="Rotor Ø"
                quantity="length"
                placeholder="330"
                error={radial.error('rotor')}
              />
              <QuantityField
                params={params}
                name="proj"
                label="Caliper projection"
                quantity="length"
                placeholder="25"
                hint="How far the caliper reaches beyond the rotor edge"
                error={radial.error('proj')}
              />
            </FieldGrid>
          </Fieldset>
          <Fieldset legend="Spokes (axial)">
            <FieldGrid cols={3}>
              <QuantityField
                params={params}
                name="inset"
                label="Spoke inset"
                quantity="length"
                signed
                placeholder="30"
                hint="Back of the spokes, outboard of the hub face"
                error={spoke.error('inset')}
              />
              <QuantityField
                params={params}
                name="cout"
                label="Caliper outboard face"
                quantity="length"
                signed
                placeholder="22"
                hint="Outboard of the hub face"
                error={spoke.error('cout')}
              />
              <QuantityField
                params={params}
                name="cspacer"
                label="Spacer"
                quantity="length"
                placeholder="0"
                hint="Leave empty for none"
                error={spoke.error('cspacer')}
              />
            </FieldGrid>
          </Fieldset>
          <Fieldset legend="Rule of thumb">
            <FieldGrid>
              <QuantityField
                params={params}
                name="wheel"
                label="Wheel diameter"
                unit="in"
                placeholder="17"
                error={thumb.error('wheel')}
              />
            </FieldGrid>
          </Fieldset>
        </div>
      }
      results={
        <div className="grid gap-3">
          <SubHeading>Barrel</SubHeading>
          {radialResult ? (
            check('Radial clearance to the barrel', radialResult)
          ) : (
            <Waiting missing={radial.missing} invalid={Object.keys(radial.errors).length > 0} />
          )}
          <SubHeading>Spokes</SubHeading>
          {spokeResult ? (
            check('Clearance to the spokes', spokeResult)
          ) : (
            <Waiting missing={spoke.missing} invalid={Object.keys(spoke.errors).length > 0} />
          )}
          <SubHeading>Largest rotor (advisory)</SubHeading>
          {maxRotor !== null ? (
            <Verdict
              label={`Largest rotor for a ${wheelIn} in wheel`}
              ok={null}
              value={`about ${length(maxRotor, 0)}`}
              note={
                rotorKnown
                  ? rotor <= maxRotor
                    ? `Your ${length(rotor, 0)} rotor is within it; measure with the real wheel all the same.`
                    : `Your ${length(rotor, 0)} rotor is ${length(rotor - maxRotor, 0)} over it: check with the wheel maker's template or the real wheel.`
                  : 'A starting point, not a check; measure with the real wheel.'
              }
              rule={MAX_ROTOR_RULE}
            />
          ) : (
            <Waiting missing={thumb.missing} invalid={Object.keys(thumb.errors).length > 0} />
          )}
        </div>
      }
      caution={<Caution topics={['brakes', 'wheels']} />}
    />
  );
}
