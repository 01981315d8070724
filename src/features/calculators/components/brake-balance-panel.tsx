import { describeBalanceShift } from '@shared/fitment/swap-checks';
import {
  brakeTorqueNm,
  frontShare,
  DEFAULT_LINE_PRESSURE_BAR,
  DEFAULT_PAD_MU,
  type BrakeCorner,
} from '@shared/fitment/brakes';
import { barToPsi } from '@shared/fitment/units';
import { Caution } from '../../../components/caution';
import { Figure } from '../../../components/verdict';
import { BalanceShiftNote } from '../../../components/balance-shift-note';
import { round, useUnits } from '../../../lib/units';
import { byField, Inputs, type CalcParams } from './calc-params';
import { FieldGrid, Fieldset, Panel, QuantityField, ResultGrid, SubHeading, Waiting } from './calc-form';

type Stage = 'b' | 'a';
type Axle = 'f' | 'r';
const cornerKeys = (stage: Stage, axle: Axle) => [`${stage}${axle}p`, `${stage}${axle}r`, `${stage}${axle}h`];

export const brakeKeys = [
  ...cornerKeys('b', 'f'),
  ...cornerKeys('b', 'r'),
  ...cornerKeys('a', 'f'),
  ...cornerKeys('a', 'r'),
  'rearchanged',
  'p',
  'mu',
];

const TORQUE_RULE =
  'T = 2 μ p A r_eff, r_eff = (rotor Ø − pad height) / 2, equal line pressure front and rear (disc-brake textbook formula)';

type CornerResult = { corner: BrakeCorner; torqueNm: number } | null;

function readCorner(params: CalcParams, stage: Stage, axle: Axle, padMu: number, pressureBar: number, labelPrefix: string) {
  const [pKey, rKey, hKey] = cornerKeys(stage, axle);
  const inputs = new Inputs(params);
  const pistonsPerSideMm = inputs.list(pKey, `${labelPrefix} pistons`);
  const rotorDiameterMm = inputs.number(rKey, `${labelPrefix} rotor Ø`);
  const padHeightMm = inputs.number(hKey, `${labelPrefix} pad height`);
  const result: CornerResult = inputs.run(
    () => {
      const corner = { pistonsPerSideMm, rotorDiameterMm, padHeightMm, padMu };
      return { corner, torqueNm: brakeTorqueNm({ ...corner, linePressureBar: pressureBar }) };
    },
    byField({ pistonsPerSideMm: pKey, rotorDiameterMm: rKey, padHeightMm: hKey, padMu: 'mu', linePressureBar: 'p' }),
  );
  return { inputs, result };
}

export function BrakeBalancePanel({ params }: { params: CalcParams }) {
  const { torque, pressure, system } = useUnits();
  const rearChanged = params.get('rearchanged') === '1';

  const general = new Inputs(params);
  const pressureBar = params.get('p') === '' ? DEFAULT_LINE_PRESSURE_BAR : general.number('p', 'line pressure');
  const padMu = params.get('mu') === '' ? DEFAULT_PAD_MU : general.number('mu', 'pad μ');

  const bf = readCorner(params, 'b', 'f', padMu, pressureBar, 'stock front');
  const br = readCorner(params, 'b', 'r', padMu, pressureBar, 'stock rear');
  const af = readCorner(params, 'a', 'f', padMu, pressureBar, 'swapped front');
  const ar = rearChanged ? readCorner(params, 'a', 'r', padMu, pressureBar, 'swapped rear') : br;

  const errors = { ...bf.inputs.errors, ...br.inputs.errors, ...af.inputs.errors, ...ar.inputs.errors, ...general.errors };
  const missing = [...bf.inputs.missing, ...br.inputs.missing, ...af.inputs.missing, ...(rearChanged ? ar.inputs.missing : [])];
  const generalError = [bf, br, af, ar].map((c) => c.inputs.general).find(Boolean) ?? null;

  const sharePct = (front: CornerResult, rear: CornerResult) =>
    front && rear ? frontShare(front.corner, rear.corner, pressureBar) * 100 : null;
  const before = general.ready ? sharePct(bf.result, br.result) : null;
  const after = general.ready ? sharePct(af.result, ar.result) : null;
  // the same words as the swap sheet and the review desk for the same figures
  const shift = before !== null && after !== null ? describeBalanceShift(before / 100, after / 100) : null;

  const cornerFields = (stage: Stage, axle: Axle) => {
    const [pKey, rKey, hKey] = cornerKeys(stage, axle);
    return (
      <FieldGrid cols={3}>
        <QuantityField
          params={params}
          name={pKey}
          label="Pistons per side"
          quantity="length"
          list
          placeholder={system === 'metric' ? '40, 44' : '1.575, 1.732'}
          hint="Ø of each, comma-separated"
          error={errors[pKey]}
        />
        <QuantityField params={params} name={rKey} label="Rotor Ø" quantity="length" placeholder="330" error={errors[rKey]} />
        <QuantityField
          params={params}
          name={hKey}
          label="Pad height"
          quantity="length"
          placeholder="55"
          hint="Radial, at the pad"
          error={errors[hKey]}
        />
      </FieldGrid>
    );
  };

  const torqueCell = (c: CornerResult) => (c ? torque(c.torqueNm) : '—');

  return (
    <Panel
      id="brakes"
      title="Brake balance before and after"
      lead="Brake torque per corner and the share the front axle takes, before and after a caliper or rotor swap."
      keys={brakeKeys}
      wide
      form={
        <div className="grid gap-4">
          <p className="text-xs text-graphite-soft">
            Pistons on <em>one</em> side of the rotor: all pistons of a floating caliper, the pistons on one side of an opposed
            one.
          </p>
          <Fieldset legend="Stock front">{cornerFields('b', 'f')}</Fieldset>
          <Fieldset legend="Stock rear">{cornerFields('b', 'r')}</Fieldset>
          <Fieldset legend="Swapped front">{cornerFields('a', 'f')}</Fieldset>
          <label className="flex items-center gap-2 text-sm font-bold text-graphite">
            <input
              type="checkbox"
              className="h-5 w-5 accent-ink"
              checked={rearChanged}
              onChange={(e) => params.set('rearchanged', e.target.checked ? '1' : '')}
            />
            The rear brakes change too
          </label>
          {rearChanged && <Fieldset legend="Swapped rear">{cornerFields('a', 'r')}</Fieldset>}
          <FieldGrid>
            <QuantityField
              params={params}
              name="p"
              label="Line pressure"
              quantity="pressure"
              placeholder={
                system === 'metric' ? String(DEFAULT_LINE_PRESSURE_BAR) : round(barToPsi(DEFAULT_LINE_PRESSURE_BAR), 0)
              }
              hint={`Empty: ${pressure(DEFAULT_LINE_PRESSURE_BAR)}; the share does not depend on it`}
              error={errors.p}
            />
            <QuantityField
              params={params}
              name="mu"
              label="Pad friction μ"
              placeholder={String(DEFAULT_PAD_MU)}
              hint={`Empty: ${DEFAULT_PAD_MU}, the same front and rear`}
              error={errors.mu}
            />
          </FieldGrid>
        </div>
      }
      results={
        <div className="grid gap-3">
          <SubHeading>Torque per corner at {pressure(pressureBar)}</SubHeading>
          <table className="tabular w-full text-sm">
            <caption className="sr-only">Brake torque per corner</caption>
            <thead>
              <tr className="text-left text-graphite-soft">
                <th scope="col" className="py-1 font-bold">
                  <span className="sr-only">Corner</span>
                </th>
                <th scope="col" className="py-1 text-right font-bold">
                  Stock
                </th>
                <th scope="col" className="py-1 text-right font-bold">
                  Swapped
                </th>
              </tr>
            </thead>
            <tbody className="font-semibold">
              <tr className="border-t border-graphite/10">
                <th scope="row" className="py-1.5 text-left font-bold">
                  Front
                </th>
                <td className="py-1.5 text-right">{torqueCell(bf.result)}</td>
                <td className="py-1.5 text-right">{torqueCell(af.result)}</td>
              </tr>
              <tr className="border-t border-graphite/10">
                <th scope="row" className="py-1.5 text-left font-bold">
                  Rear
                </th>
                <td className="py-1.5 text-right">{torqueCell(br.result)}</td>
                <td className="py-1.5 text-right">{torqueCell(ar.result)}</td>
              </tr>
            </tbody>
          </table>
          {before !== null || after !== null ? (
            <ResultGrid>
              <Figure label="Front share, stock" value={before !== null ? `${round(before, 2)} %` : '—'} />
              <Figure label="Front share, swapped" value={after !== null ? `${round(after, 2)} %` : '—'} />
            </ResultGrid>
          ) : null}
          {shift !== null ? (
            <BalanceShiftNote shift={shift} />
          ) : (
            <Waiting missing={missing} invalid={Object.keys(errors).length > 0} general={generalError} />
          )}
          <p className="text-xs text-graphite-soft">Formula: {TORQUE_RULE}.</p>
        </div>
      }
      caution={<Caution topics={['brakes']} />}
    />
  );
}
