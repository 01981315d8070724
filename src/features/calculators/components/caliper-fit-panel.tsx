import {
  caliperRotorFit,
  CENTRING_TOLERANCE_MM,
  type CaliperRotorFitInput,
  type LineFitting,
  type LineFittingKind,
} from '@shared/fitment/caliper-fit';
import type { FitCheck } from '@shared/fitment/fit-check';
import { Caution } from '../../../components/caution';
import { Figure } from '../../../components/verdict';
import { round, useUnits } from '../../../lib/units';
import { byField, Inputs, type CalcParams } from './calc-params';
import {
  ChoiceField,
  choiceOf,
  FieldGrid,
  Fieldset,
  Panel,
  QuantityField,
  ResultGrid,
  SubHeading,
  Waiting,
  withSign,
} from './calc-form';
import { FitCheckCard, type CheckWords } from '../../../components/fit-check-card';
import { caliperFitCheckWords } from '@shared/fitment/swap-caliper-fit';
import { CaliperFitDrawing } from './caliper-fit-drawing';

const joints = [
  { key: 'cfport', label: 'Caliper port', field: 'caliperPort' },
  { key: 'cflce', label: 'Line, caliper end', field: 'lineCaliperEnd' },
  { key: 'cflch', label: 'Line, chassis end', field: 'lineChassisEnd' },
  { key: 'cfchp', label: 'Chassis port', field: 'chassisPort' },
] as const;

export const caliperFitKeys = [
  'cfdes',
  'cfstep',
  'cfpad',
  'cftmin',
  'cftmax',
  'cfcent',
  'cflift',
  'cfmount',
  'cfrotor',
  'cfthick',
  'cfhat',
  'cfring',
  'cfshims',
  'cfmoves',
  ...joints.flatMap((j) => [j.key, `${j.key}t`]),
  'cfdside',
  'cffside',
  'cfdpos',
  'cffpos',
  'cfboth',
];

const fittingOptions = [
  ['banjo', 'Banjo'],
  ['inverted_flare', 'Inverted flare'],
  ['bubble_flare', 'Bubble flare'],
] as const;
const movesOptions = [
  ['outboard', 'Outboard'],
  ['inboard', 'Inboard'],
] as const;
const designedSideOptions = [
  ['', 'Not checked'],
  ['left', 'Left'],
  ['right', 'Right'],
] as const;
const sideOptions = [
  ['left', 'Left'],
  ['right', 'Right'],
] as const;
const positionOptions = [
  ['behind', 'Behind the axle'],
  ['ahead', 'Ahead of the axle'],
] as const;
const bleederOptions = [
  ['one', 'One bleed screw'],
  ['both', 'Bleed screws at both ends'],
] as const;

const words: CheckWords = caliperFitCheckWords;

export function CaliperFitPanel({ params }: { params: CalcParams }) {
  const { length } = useUnits();
  const inputs = new Inputs(params);
  const optional = (key: string, label: string) => (params.get(key).trim() === '' ? undefined : inputs.number(key, label));
  const signed = (a: number) => withSign(a, (v) => length(v, 2));

  const designMm = inputs.number('cfdes', 'designed rotor diameter');
  const stepMm = inputs.number('cfstep', 'pad edge step');
  const liftMm = inputs.number('cflift', 'radial lift');
  const rotorMm = inputs.number('cfrotor', 'rotor diameter');
  const shimText = params.get('cfshims').trim();
  const shimSizes = shimText === '' ? null : inputs.list('cfshims', 'shim sizes');

  const fitting = (j: (typeof joints)[number]): LineFitting | undefined => {
    const thread = params.get(`${j.key}t`).trim();
    return thread === '' ? undefined : { kind: choiceOf<LineFittingKind>(params, j.key, fittingOptions), thread };
  };
  const designedSide = choiceOf(params, 'cfdside', designedSideOptions);

  const input: CaliperRotorFitInput = {
    caliper: {
      designRotorDiameterMm: designMm,
      padEdgeStepMm: stepMm,
      padHeightMm: optional('cfpad', 'pad height'),
      rotorThicknessMinMm: optional('cftmin', 'thinnest rotor'),
      rotorThicknessMaxMm: optional('cftmax', 'thickest rotor'),
      centreFromMountMm: optional('cfcent', 'centre plane from the mount face'),
    },
    bracket: { radialLiftMm: liftMm, mountFaceInboardMm: optional('cfmount', 'mount face from the hub face') },
    rotor: {
      diameterMm: rotorMm,
      thicknessMm: optional('cfthick', 'rotor thickness'),
      hatHeightMm: optional('cfhat', 'rotor overall height'),
      frictionRingInnerDiameterMm: optional('cfring', 'friction ring inner diameter'),
    },
    centring: shimSizes ? { shimSizesMm: shimSizes, shimMoves: choiceOf(params, 'cfmoves', movesOptions) } : undefined,
    hydraulics: Object.fromEntries(joints.map((j) => [j.field, fitting(j)])),
    bleed:
      designedSide === ''
        ? undefined
        : {
            designedSide,
            fittedSide: choiceOf(params, 'cffside', sideOptions),
            designedPosition: choiceOf(params, 'cfdpos', positionOptions),
            fittedPosition: choiceOf(params, 'cffpos', positionOptions),
            bleedersBothEnds: choiceOf(params, 'cfboth', bleederOptions) === 'both',
          },
  };
  const result = inputs.run(
    () => caliperRotorFit(input),
    byField({
      designRotorDiameterMm: 'cfdes',
      padEdgeStepMm: 'cfstep',
      radialLiftMm: 'cflift',
      rotorDiameterMm: 'cfrotor',
      'caliper.padHeightMm': 'cfpad',
      'caliper.rotorThicknessMinMm': 'cftmin',
      'caliper.rotorThicknessMaxMm': 'cftmax',
      'caliper.centreFromMountMm': 'cfcent',
      'bracket.mountFaceInboardMm': 'cfmount',
      'rotor.thicknessMm': 'cfthick',
      'rotor.hatHeightMm': 'cfhat',
      'rotor.frictionRingInnerDiameterMm': 'cfring',
      sizesMm: 'cfshims',
      ...Object.fromEntries(joints.map((j) => [`hydraulics.${j.field}.thread`, `${j.key}t`])),
    }),
  );

  const valueOf = (check: FitCheck): string | undefined => {
    if (check.id === 'pad-overhang' && check.valueMm !== null) {
      return check.valueMm > 0 ? `${length(check.valueMm, 2)} past the edge` : `${length(-check.valueMm, 2)} inside the edge`;
    }
    if (check.id === 'axial-centring' && check.valueMm !== null) return signed(check.valueMm);
    if (check.id === 'bleed-screw') return check.ok ? 'At the top' : 'At the bottom';
    return undefined;
  };

  return (
    <Panel
      id="caliper-fit"
      title="Caliper on rotor"
      lead="Does this caliper, on this bracket, sit on this rotor? Pad on the friction ring, centring on the ring with the shim that does it, rotor thickness, line fittings and where the bleed screw ends up."
      keys={caliperFitKeys}
      wide="results"
      form={
        <div className="flex flex-col gap-4">
          <Fieldset legend="Caliper">
            <FieldGrid>
              <QuantityField
                params={params}
                name="cfdes"
                label="Designed rotor Ø"
                quantity="length"
                placeholder="330"
                hint="The rotor the caliper was made for"
                error={inputs.error('cfdes')}
              />
              <QuantityField
                params={params}
                name="cfstep"
                label="Pad edge step"
                quantity="length"
                placeholder="2"
                hint="Pad outer edge inside the designed rotor's edge"
                error={inputs.error('cfstep')}
              />
              <QuantityField
                params={params}
                name="cfpad"
                label="Pad height"
                quantity="length"
                placeholder="50"
                hint="Radial; optional"
                error={inputs.error('cfpad')}
              />
              <QuantityField
                params={params}
                name="cfcent"
                label="Centre plane from mount face"
                quantity="length"
                placeholder="25.5"
                signed
                hint="Positive outboard; optional"
                error={inputs.error('cfcent')}
              />
              <QuantityField
                params={params}
                name="cftmin"
                label="Thinnest rotor"
                quantity="length"
                placeholder="26"
                hint="Designed range; optional"
                error={inputs.error('cftmin')}
              />
              <QuantityField
                params={params}
                name="cftmax"
                label="Thickest rotor"
                quantity="length"
                placeholder="30"
                error={inputs.error('cftmax')}
              />
            </FieldGrid>
          </Fieldset>
          <Fieldset legend="Bracket">
            <FieldGrid>
              <QuantityField
                params={params}
                name="cflift"
                label="Radial lift"
                quantity="length"
                placeholder="0"
                signed
                hint="Outward from the designed position; negative inward"
                error={inputs.error('cflift')}
              />
              <QuantityField
                params={params}
                name="cfmount"
                label="Mount face from hub face"
                quantity="length"
                placeholder="60"
                signed
                hint="Positive inboard; optional"
                error={inputs.error('cfmount')}
              />
            </FieldGrid>
          </Fieldset>
          <Fieldset legend="Rotor">
            <FieldGrid>
              <QuantityField
                params={params}
                name="cfrotor"
                label="Rotor Ø"
                quantity="length"
                placeholder="330"
                error={inputs.error('cfrotor')}
              />
              <QuantityField
                params={params}
                name="cfthick"
                label="Rotor thickness"
                quantity="length"
                placeholder="28"
                error={inputs.error('cfthick')}
              />
              <QuantityField
                params={params}
                name="cfhat"
                label="Overall height"
                quantity="length"
                placeholder="50"
                hint="Mounting face to the inboard friction face"
                error={inputs.error('cfhat')}
              />
              <QuantityField
                params={params}
                name="cfring"
                label="Friction ring inner Ø"
                quantity="length"
                placeholder="210"
                hint="Optional"
                error={inputs.error('cfring')}
              />
            </FieldGrid>
          </Fieldset>
          <Fieldset legend="Centring shims (optional)">
            <FieldGrid>
              <QuantityField
                params={params}
                name="cfshims"
                label="Shim sizes you have"
                quantity="length"
                list
                placeholder="0.5, 1"
                hint="Comma-separated; use ; between sizes written with decimal commas"
                error={inputs.error('cfshims')}
              />
              <ChoiceField
                params={params}
                name="cfmoves"
                label="A shim on the axial joint moves the caliper"
                options={movesOptions}
              />
            </FieldGrid>
          </Fieldset>
          <Fieldset legend="Brake line (optional)">
            <p className="mb-3 text-xs text-graphite-soft">Each joint is checked once both of its halves have a thread.</p>
            <div className="flex flex-col gap-4">
              {joints.map((j) => (
                <FieldGrid key={j.key}>
                  <ChoiceField params={params} name={j.key} label={j.label} options={fittingOptions} />
                  <QuantityField
                    params={params}
                    name={`${j.key}t`}
                    label={`${j.label}, thread`}
                    text
                    placeholder="M10x1"
                    error={inputs.error(`${j.key}t`)}
                  />
                </FieldGrid>
              ))}
            </div>
          </Fieldset>
          <Fieldset legend="Bleed screw (optional)">
            <FieldGrid>
              <ChoiceField params={params} name="cfdside" label="Caliper made for side" options={designedSideOptions} />
              <ChoiceField params={params} name="cffside" label="Fitted on side" options={sideOptions} />
              <ChoiceField params={params} name="cfdpos" label="On the donor" options={positionOptions} />
              <ChoiceField params={params} name="cffpos" label="As fitted" options={positionOptions} />
              <ChoiceField params={params} name="cfboth" label="Bleed screws" options={bleederOptions} />
            </FieldGrid>
          </Fieldset>
        </div>
      }
      results={
        result ? (
          <div className="flex flex-col gap-3">
            <CaliperFitDrawing
              d={{
                rotorRadiusMm: rotorMm / 2,
                ringInnerRadiusMm:
                  input.rotor.frictionRingInnerDiameterMm === undefined ? null : input.rotor.frictionRingInnerDiameterMm / 2,
                thicknessMm: input.rotor.thicknessMm ?? null,
                ringCentreMm: result.axial?.rotorCentreInboardMm ?? null,
                caliperCentreMm: result.axial?.caliperCentreInboardMm ?? null,
                padOuterRadiusMm: result.padOuterRadiusMm,
                padInnerRadiusMm: result.padInnerRadiusMm,
              }}
            />
            {result.checks.map((check) => (
              <FitCheckCard key={check.id} check={check} words={words} value={valueOf(check)} />
            ))}
            {result.centringShim && (
              <Figure
                label="Centring shim"
                value={
                  result.centringShim.stack.pieces.length
                    ? result.centringShim.stack.pieces.map((p) => length(p, 2)).join(' + ')
                    : 'none'
                }
                note={`${length(result.centringShim.stack.totalMm, 2)} for a ${length(result.centringShim.targetMm, 2)} move ${result.axial?.move}. ${result.centringShim.placement}`}
              />
            )}
            {result.axial && (
              <ResultGrid>
                <Figure
                  label="Ring centre plane"
                  value={length(result.axial.rotorCentreInboardMm, 2)}
                  note="inboard of the hub face"
                />
                <Figure
                  label="Caliper centre plane"
                  value={length(result.axial.caliperCentreInboardMm, 2)}
                  note={`inboard of the hub face; within ${length(CENTRING_TOLERANCE_MM, 2)} counts as centred`}
                />
              </ResultGrid>
            )}
            {result.effectiveRadius && (
              <>
                <SubHeading>Effective radius</SubHeading>
                <ResultGrid>
                  <Figure
                    label="From the pad as placed"
                    value={length(result.effectiveRadius.fromPadMm, 1)}
                    note="middle of the band the pad touches"
                  />
                  <Figure
                    label="Torque against (D − h)/2"
                    value={`× ${round(result.effectiveRadius.ratio, 3)}`}
                    note={`(D − h)/2 = ${length(result.effectiveRadius.estimateMm, 1)}`}
                  />
                </ResultGrid>
                <p className="text-xs text-graphite-soft">
                  Rule: {result.effectiveRadius.rule} — source: {result.effectiveRadius.source}
                </p>
              </>
            )}
          </div>
        ) : (
          <Waiting missing={inputs.missing} invalid={Object.keys(inputs.errors).length > 0} general={inputs.general} />
        )
      }
      caution={
        <Caution topics={['brakes', 'fasteners']}>
          {result && result.cautions.length > 0 && (
            <ul className="mt-2 list-disc space-y-1 pl-5 font-semibold text-oxide" data-fit-cautions>
              {result.cautions.map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
          )}
        </Caution>
      }
    />
  );
}
