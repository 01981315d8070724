import { useMemo } from 'react';
import { DEFAULT_PAD_MU, DRUM_BRAKE_FACTORS } from '@shared/fitment/brakes';
import type { AxleBrakes } from '@shared/fitment/axle-torque';
import {
  analyseBrakeDistribution,
  type BrakeSetup,
  type DistributionInput,
  type RearPressureLaw,
} from '@shared/fitment/distribution-analysis';
import { Caution } from '../../../components/caution';
import { Select } from '../../../components/ui/field';
import { useUnits } from '../../../lib/units';
import { byField, Inputs, type CalcParams } from './calc-params';
import { FieldGrid, Fieldset, Panel, QuantityField, Waiting } from './calc-form';
import { DistributionResults } from './distribution-results';

type Stage = 'b' | 'a';
type AxleKey = 'f' | 'r';
const STAGE_NAME = { b: 'before', a: 'after' } as const;
const AXLE_NAME = { f: 'front', r: 'rear' } as const;

const k = (name: string) => `d_${name}`;
const axleKeys = (stage: Stage, axle: AxleKey) =>
  ['t', 'p', 'r', 'h', 'q', 'wc', 'dd', 'bf'].map((part) => k(`${stage}${axle}${part}`));
const valveKeys = (stage: Stage) => ['v', 'vk', 'vs', 'vku', 'vkl'].map((part) => k(`${stage}${part}`));

export const distributionKeys = [
  ...['m', 'fs', 'h', 'wb', 'laden', 'ml', 'fsl', 'hl', 'rf', 'rr', 'mu', 'cf', 'cr', 'cv', 'mc', 'pr', 'br'].map(k),
  ...axleKeys('b', 'f'),
  ...axleKeys('b', 'r'),
  ...axleKeys('a', 'f'),
  ...axleKeys('a', 'r'),
  ...valveKeys('b'),
  ...valveKeys('a'),
];

/** Where a field named by the shared analysis is typed on this panel. */
function fieldKeys(): Record<string, string> {
  const map: Record<string, string> = {
    'unladen.massKg': k('m'),
    'unladen.frontStaticFraction': k('fs'),
    'unladen.cgHeightMm': k('h'),
    'unladen.wheelbaseMm': k('wb'),
    'laden.massKg': k('ml'),
    'laden.frontStaticFraction': k('fsl'),
    'laden.cgHeightMm': k('hl'),
    'laden.wheelbaseMm': k('wb'),
    'tyreLoadedRadiusMm.front': k('rf'),
    'tyreLoadedRadiusMm.rear': k('rr'),
    'pedal.masterCylinderBoreMm': k('mc'),
    'pedal.pedalRatio': k('pr'),
    'pedal.boosterRatio': k('br'),
  };
  for (const stage of ['b', 'a'] as const) {
    for (const axle of ['f', 'r'] as const) {
      const at = `${STAGE_NAME[stage]}.${AXLE_NAME[axle]}`;
      map[`${at}.pistonsPerSideMm`] = k(`${stage}${axle}p`);
      map[`${at}.rotorDiameterMm`] = k(`${stage}${axle}r`);
      map[`${at}.padHeightMm`] = k(`${stage}${axle}h`);
      map[`${at}.padMu`] = k('mu');
      map[`${at}.axleTorqueNmPerBar`] = k(`${stage}${axle}q`);
      map[`${at}.wheelCylinderBoreMm`] = k(`${stage}${axle}wc`);
      map[`${at}.drumDiameterMm`] = k(`${stage}${axle}dd`);
      map[`${at}.brakeFactor`] = k(`${stage}${axle}bf`);
    }
    const valve = `${STAGE_NAME[stage]}.rearValve`;
    map[`${valve}.kneeBar`] = k(`${stage}vk`);
    map[`${valve}.slope`] = k(`${stage}vs`);
    map[`${valve}.kneeBarUnladen`] = k(`${stage}vku`);
    map[`${valve}.kneeBarLaden`] = k(`${stage}vkl`);
  }
  return map;
}

const STAGE_LABEL = { b: 'stock', a: 'swapped' } as const;

function readAxle(inputs: Inputs, params: CalcParams, stage: Stage, axle: AxleKey, padMu: number): AxleBrakes {
  const label = `${STAGE_LABEL[stage]} ${AXLE_NAME[axle]}`;
  const key = (part: string) => k(`${stage}${axle}${part}`);
  if (params.get(key('t')) === 'tpb') {
    return { kind: 'torque-per-bar', axleTorqueNmPerBar: inputs.number(key('q'), `${label} torque per bar`) };
  }
  if (params.get(key('t')) === 'drum') {
    return {
      kind: 'drum',
      wheelCylinderBoreMm: inputs.number(key('wc'), `${label} wheel cylinder bore`),
      drumDiameterMm: inputs.number(key('dd'), `${label} drum Ø`),
      brakeFactor: inputs.number(key('bf'), `${label} brake factor`),
    };
  }
  return {
    kind: 'disc',
    pistonsPerSideMm: inputs.list(key('p'), `${label} pistons`),
    rotorDiameterMm: inputs.number(key('r'), `${label} rotor Ø`),
    padHeightMm: inputs.number(key('h'), `${label} pad height`),
    padMu,
  };
}

function readValve(inputs: Inputs, params: CalcParams, stage: Stage): RearPressureLaw {
  const label = `${STAGE_LABEL[stage]} valve`;
  const key = (part: string) => k(`${stage}${part}`);
  switch (params.get(key('v'))) {
    case 'prop':
      return {
        kind: 'proportioning',
        kneeBar: inputs.number(key('vk'), `${label} knee`),
        slope: inputs.number(key('vs'), `${label} slope`),
      };
    case 'ls':
      return {
        kind: 'load-sensing',
        kneeBarUnladen: inputs.number(key('vku'), `${label} knee unladen`),
        kneeBarLaden: inputs.number(key('vkl'), `${label} knee laden`),
        slope: inputs.number(key('vs'), `${label} slope`),
      };
    case 'ebd':
      return { kind: 'electronic' };
    default:
      return { kind: 'none' };
  }
}

/** A share typed in per cent, checked here so the reason speaks of per cent. */
function readPercent(inputs: Inputs, key: string, label: string): number {
  const value = inputs.number(key, label);
  if (Number.isFinite(value) && (value <= 0 || value >= 100)) inputs.errors[key] = 'Enter a share between 0 and 100 %';
  return value / 100;
}

function useDistribution(params: CalcParams) {
  const signature = distributionKeys.map((key) => params.get(key)).join('\u0001');
  return useMemo(() => {
    const inputs = new Inputs(params);
    const laden = params.get(k('laden')) === '1';
    const padMu = params.get(k('mu')) === '' ? DEFAULT_PAD_MU : inputs.number(k('mu'), 'pad μ');
    const wheelbaseMm = inputs.number(k('wb'), 'wheelbase');
    const unladen = {
      massKg: inputs.number(k('m'), 'mass'),
      frontStaticFraction: readPercent(inputs, k('fs'), 'front axle share'),
      cgHeightMm: inputs.number(k('h'), 'centre-of-gravity height'),
      wheelbaseMm,
    };
    const ladenCar = laden
      ? {
          massKg: inputs.number(k('ml'), 'laden mass'),
          frontStaticFraction: readPercent(inputs, k('fsl'), 'laden front axle share'),
          cgHeightMm: inputs.number(k('hl'), 'laden centre-of-gravity height'),
          wheelbaseMm,
        }
      : undefined;
    const tyreLoadedRadiusMm = {
      front: inputs.number(k('rf'), 'front loaded radius'),
      rear: inputs.number(k('rr'), 'rear loaded radius'),
    };
    const before: BrakeSetup = {
      front: readAxle(inputs, params, 'b', 'f', padMu),
      rear: readAxle(inputs, params, 'b', 'r', padMu),
      rearValve: readValve(inputs, params, 'b'),
    };
    const changes = { front: params.get(k('cf')) === '1', rear: params.get(k('cr')) === '1', valve: params.get(k('cv')) === '1' };
    const after: BrakeSetup | undefined =
      changes.front || changes.rear || changes.valve
        ? {
            front: changes.front ? readAxle(inputs, params, 'a', 'f', padMu) : before.front,
            rear: changes.rear ? readAxle(inputs, params, 'a', 'r', padMu) : before.rear,
            rearValve: changes.valve ? readValve(inputs, params, 'a') : before.rearValve,
          }
        : undefined;
    const pedalGiven = ['mc', 'pr', 'br'].some((part) => params.get(k(part)) !== '');
    const pedal = pedalGiven
      ? {
          masterCylinderBoreMm: inputs.number(k('mc'), 'master cylinder bore'),
          pedalRatio: inputs.number(k('pr'), 'pedal ratio'),
          boosterRatio: params.get(k('br')) === '' ? 1 : inputs.number(k('br'), 'booster ratio'),
        }
      : undefined;
    const input: DistributionInput = { unladen, laden: ladenCar, tyreLoadedRadiusMm, before, after, pedal };
    const analysis = inputs.run(() => analyseBrakeDistribution(input), byField(fieldKeys()));
    return { inputs, analysis, changes, laden };
    // the signature holds every input this panel reads
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [signature]);
}

export function DistributionPanel({ params }: { params: CalcParams }) {
  const { system } = useUnits();
  const { inputs, analysis, changes, laden } = useDistribution(params);
  const errors = inputs.errors;
  const check = (name: string, label: string, value: boolean) => (
    <label className="flex items-center gap-2 text-sm font-bold text-graphite">
      <input
        type="checkbox"
        name={name}
        className="h-5 w-5 accent-ink"
        checked={value}
        onChange={(e) => params.set(name, e.target.checked ? '1' : '')}
      />
      {label}
    </label>
  );

  const axleFields = (stage: Stage, axle: AxleKey) => {
    const key = (part: string) => k(`${stage}${axle}${part}`);
    const given = params.get(key('t'));
    const drumFactors = Object.values(DRUM_BRAKE_FACTORS)
      .map((f) => `${f.label.toLowerCase()} about ${f.brakeFactor}`)
      .join(', ');
    return (
      <div className="grid gap-3">
        <Select label="Given as" name={key('t')} value={given} onChange={(e) => params.set(key('t'), e.target.value)}>
          <option value="">Disc caliper and rotor</option>
          <option value="drum">Drum</option>
          <option value="tpb">Axle torque per bar (a known figure)</option>
        </Select>
        {given === 'tpb' ? (
          <QuantityField
            params={params}
            name={key('q')}
            label="Axle torque per bar"
            unit="N·m/bar"
            placeholder={axle === 'f' ? '42' : '20'}
            hint="Both wheels together"
            error={errors[key('q')]}
          />
        ) : given === 'drum' ? (
          <FieldGrid cols={3}>
            <QuantityField
              params={params}
              name={key('wc')}
              label="Wheel cylinder bore"
              quantity="length"
              placeholder="20.64"
              error={errors[key('wc')]}
            />
            <QuantityField
              params={params}
              name={key('dd')}
              label="Drum Ø"
              quantity="length"
              placeholder="203.2"
              error={errors[key('dd')]}
            />
            <QuantityField
              params={params}
              name={key('bf')}
              label="Brake factor C*"
              placeholder="2.0"
              hint={`Typical: ${drumFactors} (from memory; a measured figure is better)`}
              error={errors[key('bf')]}
            />
          </FieldGrid>
        ) : (
          <FieldGrid cols={3}>
            <QuantityField
              params={params}
              name={key('p')}
              label="Pistons per side"
              quantity="length"
              list
              placeholder={system === 'metric' ? '54' : '2.126'}
              hint="Ø of each, comma-separated"
              error={errors[key('p')]}
            />
            <QuantityField
              params={params}
              name={key('r')}
              label="Rotor Ø"
              quantity="length"
              placeholder="280"
              error={errors[key('r')]}
            />
            <QuantityField
              params={params}
              name={key('h')}
              label="Pad height"
              quantity="length"
              placeholder="50"
              error={errors[key('h')]}
            />
          </FieldGrid>
        )}
      </div>
    );
  };

  const valveFields = (stage: Stage) => {
    const key = (part: string) => k(`${stage}${part}`);
    const type = params.get(key('v'));
    return (
      <div className="grid gap-3">
        <Select label="Rear pressure" name={key('v')} value={type} onChange={(e) => params.set(key('v'), e.target.value)}>
          <option value="">No valve: rear gets the full line pressure</option>
          <option value="prop">Proportioning valve</option>
          <option value="ls">Load-sensing valve</option>
          <option value="ebd">Electronic distribution (with ABS)</option>
        </Select>
        {type === 'prop' && (
          <FieldGrid>
            <QuantityField
              params={params}
              name={key('vk')}
              label="Knee"
              quantity="pressure"
              placeholder="30"
              error={errors[key('vk')]}
            />
            <QuantityField
              params={params}
              name={key('vs')}
              label="Slope above the knee"
              placeholder="0.3"
              hint="Rear bar per bar, 0–1"
              error={errors[key('vs')]}
            />
          </FieldGrid>
        )}
        {type === 'ls' && (
          <FieldGrid cols={3}>
            <QuantityField
              params={params}
              name={key('vku')}
              label="Knee unladen"
              quantity="pressure"
              placeholder="25"
              error={errors[key('vku')]}
            />
            <QuantityField
              params={params}
              name={key('vkl')}
              label="Knee laden"
              quantity="pressure"
              placeholder="45"
              error={errors[key('vkl')]}
            />
            <QuantityField
              params={params}
              name={key('vs')}
              label="Slope"
              placeholder="0.3"
              hint="0–1"
              error={errors[key('vs')]}
            />
          </FieldGrid>
        )}
        {type === 'ebd' && (
          <p className="text-xs text-graphite-soft">
            Modelled as keeping the rear axle from needing more grip than the front — an assumption: the real system works from
            wheel slip, with thresholds only its maker knows.
          </p>
        )}
      </div>
    );
  };

  return (
    <Panel
      id="distribution"
      title="Brake distribution: which axle locks first"
      lead="How much grip each axle needs as you brake harder, where the front and rear lock together, and what a swap does to the order — for the car empty and loaded."
      keys={distributionKeys}
      wide="results"
      form={
        <div className="grid gap-4">
          <Fieldset legend="The car, unladen">
            <FieldGrid>
              <QuantityField
                params={params}
                name={k('m')}
                label="Mass"
                quantity="mass"
                placeholder={system === 'metric' ? '1450' : '3197'}
                error={errors[k('m')]}
              />
              <QuantityField
                params={params}
                name={k('fs')}
                label="Weight on the front axle"
                unit="%"
                placeholder="58"
                hint="Of the car's weight, standing"
                error={errors[k('fs')]}
              />
              <QuantityField
                params={params}
                name={k('h')}
                label="Centre-of-gravity height"
                quantity="length"
                placeholder="520"
                error={errors[k('h')]}
              />
              <QuantityField
                params={params}
                name={k('wb')}
                label="Wheelbase"
                quantity="length"
                placeholder="2700"
                error={errors[k('wb')]}
              />
            </FieldGrid>
          </Fieldset>
          {check(k('laden'), 'Also the laden car (passengers and luggage)', laden)}
          {laden && (
            <Fieldset legend="The car, laden">
              <FieldGrid cols={3}>
                <QuantityField
                  params={params}
                  name={k('ml')}
                  label="Mass"
                  quantity="mass"
                  placeholder={system === 'metric' ? '1850' : '4079'}
                  error={errors[k('ml')]}
                />
                <QuantityField
                  params={params}
                  name={k('fsl')}
                  label="Weight on the front axle"
                  unit="%"
                  placeholder="51"
                  error={errors[k('fsl')]}
                />
                <QuantityField
                  params={params}
                  name={k('hl')}
                  label="Centre-of-gravity height"
                  quantity="length"
                  placeholder="560"
                  error={errors[k('hl')]}
                />
              </FieldGrid>
            </Fieldset>
          )}
          <Fieldset legend="Tyres">
            <FieldGrid>
              <QuantityField
                params={params}
                name={k('rf')}
                label="Front loaded radius"
                quantity="length"
                placeholder="300"
                hint="Hub centre to the ground"
                error={errors[k('rf')]}
              />
              <QuantityField
                params={params}
                name={k('rr')}
                label="Rear loaded radius"
                quantity="length"
                placeholder="300"
                error={errors[k('rr')]}
              />
            </FieldGrid>
          </Fieldset>
          <Fieldset legend="Stock front brakes">{axleFields('b', 'f')}</Fieldset>
          <Fieldset legend="Stock rear brakes">{axleFields('b', 'r')}</Fieldset>
          <Fieldset legend="Stock rear valve">{valveFields('b')}</Fieldset>
          <div className="grid gap-2">
            <p className="text-sm font-extrabold text-ink">What the swap changes</p>
            {check(k('cf'), 'The front brakes', changes.front)}
            {check(k('cr'), 'The rear brakes', changes.rear)}
            {check(k('cv'), 'The rear valve', changes.valve)}
          </div>
          {changes.front && <Fieldset legend="Swapped front brakes">{axleFields('a', 'f')}</Fieldset>}
          {changes.rear && <Fieldset legend="Swapped rear brakes">{axleFields('a', 'r')}</Fieldset>}
          {changes.valve && <Fieldset legend="Rear valve after the swap">{valveFields('a')}</Fieldset>}
          <FieldGrid>
            <QuantityField
              params={params}
              name={k('mu')}
              label="Pad friction μ"
              placeholder={String(DEFAULT_PAD_MU)}
              hint={`Empty: ${DEFAULT_PAD_MU}, the same on every disc`}
              error={errors[k('mu')]}
            />
          </FieldGrid>
          <Fieldset legend="Pedal side (optional)">
            <FieldGrid cols={3}>
              <QuantityField
                params={params}
                name={k('mc')}
                label="Master cylinder bore"
                quantity="length"
                placeholder="22.2"
                error={errors[k('mc')]}
              />
              <QuantityField params={params} name={k('pr')} label="Pedal ratio" placeholder="3.5" error={errors[k('pr')]} />
              <QuantityField
                params={params}
                name={k('br')}
                label="Booster ratio"
                placeholder="4"
                hint="Empty: 1, no booster"
                error={errors[k('br')]}
              />
            </FieldGrid>
          </Fieldset>
        </div>
      }
      results={
        analysis ? (
          <DistributionResults analysis={analysis} />
        ) : (
          <Waiting missing={inputs.missing} invalid={Object.keys(errors).length > 0} general={inputs.general} />
        )
      }
      caution={<Caution topics={['brakes']} />}
    />
  );
}
