import { rearValveKinds, rearValveLabels, type RearValveKind, type VehicleData } from '@shared/schemas/vehicle';
import { barToPsi, inToMm, kgToLb, lbToKg, mmToIn, psiToBar } from '@shared/fitment/units';
import { Select, TextInput } from './ui/field';
import { readNumber } from '../lib/number-text';

// The car's own figures for "which axle locks first", typed in the reader's units and kept as text until saved.

export type VehicleForm = {
  own: boolean;
  mass: string;
  front: string;
  cg: string;
  laden: boolean;
  ladenMass: string;
  ladenFront: string;
  ladenCg: string;
  wheelbase: string;
  radiusFront: string;
  radiusRear: string;
  valve: RearValveKind;
  knee: string;
  kneeLaden: string;
  slope: string;
  basis: string;
};

export const blankVehicleForm: VehicleForm = {
  own: false,
  mass: '',
  front: '',
  cg: '',
  laden: false,
  ladenMass: '',
  ladenFront: '',
  ladenCg: '',
  wheelbase: '',
  radiusFront: '',
  radiusRear: '',
  valve: 'none',
  knee: '',
  kneeLaden: '',
  slope: '',
  basis: '',
};

/** the figures typed in the reader's units, converted when the units toggle flips */
export const vehicleQuantities = {
  mass: 'mass',
  ladenMass: 'mass',
  cg: 'length',
  ladenCg: 'length',
  wheelbase: 'length',
  radiusFront: 'length',
  radiusRear: 'length',
  knee: 'pressure',
  kneeLaden: 'pressure',
} as const;

const trim = (x: number, digits: number) => String(Math.round(x * 10 ** digits) / 10 ** digits);

/** A stored set of figures as the form shows it, in the reader's units. */
export function vehicleFormOf(v: VehicleData | null, imperial: boolean, own: boolean): VehicleForm {
  if (!v) return { ...blankVehicleForm, own };
  const mass = (kg: number) => (imperial ? trim(kgToLb(kg), 0) : trim(kg, 0));
  const len = (mm: number) => (imperial ? trim(mmToIn(mm), 2) : trim(mm, 0));
  const bar = (b: number) => (imperial ? trim(barToPsi(b), 0) : trim(b, 1));
  const valve = v.rearValve;
  return {
    own,
    mass: mass(v.unladen.massKg),
    front: trim(v.unladen.frontStaticFraction * 100, 1),
    cg: len(v.unladen.cgHeightMm),
    laden: v.laden !== null,
    ladenMass: v.laden ? mass(v.laden.massKg) : '',
    ladenFront: v.laden ? trim(v.laden.frontStaticFraction * 100, 1) : '',
    ladenCg: v.laden ? len(v.laden.cgHeightMm) : '',
    wheelbase: len(v.wheelbaseMm),
    radiusFront: len(v.tyreLoadedRadiusMm.front),
    radiusRear: len(v.tyreLoadedRadiusMm.rear),
    valve: valve.kind,
    knee: valve.kind === 'proportioning' ? bar(valve.kneeBar) : valve.kind === 'load-sensing' ? bar(valve.kneeBarUnladen) : '',
    kneeLaden: valve.kind === 'load-sensing' ? bar(valve.kneeBarLaden) : '',
    slope: valve.kind === 'proportioning' || valve.kind === 'load-sensing' ? String(valve.slope) : '',
    basis: v.basis,
  };
}

/**
 * The figures as the API takes them (null when the car uses its chassis' figures). Unreadable numbers
 * become NaN so the shared schema names the field.
 */
export function vehicleInputOf(f: VehicleForm, imperial: boolean): unknown {
  if (!f.own) return null;
  const n = (text: string) => readNumber(text) ?? NaN;
  const mass = (text: string) => (imperial ? lbToKg(n(text)) : n(text));
  const len = (text: string) => (imperial ? inToMm(n(text)) : n(text));
  const bar = (text: string) => (imperial ? psiToBar(n(text)) : n(text));
  const state = (m: string, front: string, cg: string) => ({
    massKg: mass(m),
    frontStaticFraction: n(front) / 100,
    cgHeightMm: len(cg),
  });
  const rearValve =
    f.valve === 'proportioning'
      ? { kind: f.valve, kneeBar: bar(f.knee), slope: n(f.slope) }
      : f.valve === 'load-sensing'
        ? { kind: f.valve, kneeBarUnladen: bar(f.knee), kneeBarLaden: bar(f.kneeLaden), slope: n(f.slope) }
        : { kind: f.valve };
  return {
    unladen: state(f.mass, f.front, f.cg),
    laden: f.laden ? state(f.ladenMass, f.ladenFront, f.ladenCg) : null,
    wheelbaseMm: len(f.wheelbase),
    tyreLoadedRadiusMm: { front: len(f.radiusFront), rear: len(f.radiusRear) },
    rearValve,
    basis: f.basis,
  };
}

/**
 * "Brake-balance figures" of the car form: off, the swap sheets use the chassis' stock figures; on, the
 * car's own (starting from the stock ones, so a member changes only what differs on their car). The chassis
 * page's editor uses the same fields for the stock figures themselves.
 */
export function VehicleFields({
  form,
  onChange,
  errors,
  imperial,
  stock,
  chassisName,
  intro,
  toggleLabel = 'Use my own figures for this car',
}: {
  form: VehicleForm;
  onChange: (next: VehicleForm) => void;
  errors: Record<string, string>;
  imperial: boolean;
  /** the chosen chassis' stock figures, if the catalogue has them */
  stock: VehicleData | null;
  chassisName: string | null;
  /** replaces the car form's explanation (the chassis page's editor has its own) */
  intro?: string;
  toggleLabel?: string;
}) {
  const set = (key: keyof VehicleForm) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) =>
    onChange({ ...form, [key]: e.target.value });
  const massUnit = imperial ? 'lb' : 'kg';
  const lengthUnit = imperial ? 'in' : 'mm';
  const pressureUnit = imperial ? 'psi' : 'bar';
  const err = (path: string) => errors[`vehicle.${path}`];
  const toggle = (own: boolean) =>
    onChange(own ? { ...vehicleFormOf(stock, imperial, true), ...keepTyped(form) } : { ...form, own });

  return (
    <fieldset className="grid gap-3 rounded-lg border border-ink/15 p-3 sm:col-span-2 lg:col-span-3" data-vehicle-fields>
      <legend className="px-1 text-sm font-extrabold text-ink">Brake-balance figures</legend>
      <p className="text-xs text-graphite-soft">
        {intro ??
          'Swap sheets work out which axle locks first from the car’s weight, its split, its centre of gravity and its rear valve.'}
        {intro !== undefined
          ? ''
          : !chassisName
            ? ' Without your own, they use the chassis’ stock figures.'
            : stock
              ? ` Without your own, they use the ${chassisName} stock figures.`
              : ` The catalogue has no stock figures for the ${chassisName}, so give your own to see it.`}
      </p>
      <label className="flex items-center gap-2 text-sm font-bold text-graphite">
        <input type="checkbox" className="h-5 w-5 accent-ink" checked={form.own} onChange={(e) => toggle(e.target.checked)} />
        {toggleLabel}
      </label>
      {form.own && (
        <div className="grid gap-3 sm:grid-cols-3">
          <TextInput
            label={`Mass with driver (${massUnit})`}
            inputMode="decimal"
            value={form.mass}
            onChange={set('mass')}
            error={err('unladen.massKg')}
          />
          <TextInput
            label="Weight on the front axle (%)"
            inputMode="decimal"
            value={form.front}
            onChange={set('front')}
            error={err('unladen.frontStaticFraction')}
          />
          <TextInput
            label={`Centre-of-gravity height (${lengthUnit})`}
            inputMode="decimal"
            value={form.cg}
            onChange={set('cg')}
            error={err('unladen.cgHeightMm')}
          />
          <label className="flex items-center gap-2 text-sm font-bold text-graphite sm:col-span-3">
            <input
              type="checkbox"
              className="h-5 w-5 accent-ink"
              checked={form.laden}
              onChange={(e) => onChange({ ...form, laden: e.target.checked })}
            />
            Also the car fully laden
          </label>
          {form.laden && (
            <>
              <TextInput
                label={`Laden mass (${massUnit})`}
                inputMode="decimal"
                value={form.ladenMass}
                onChange={set('ladenMass')}
                error={err('laden.massKg')}
              />
              <TextInput
                label="Laden weight on the front (%)"
                inputMode="decimal"
                value={form.ladenFront}
                onChange={set('ladenFront')}
                error={err('laden.frontStaticFraction')}
              />
              <TextInput
                label={`Laden centre-of-gravity height (${lengthUnit})`}
                inputMode="decimal"
                value={form.ladenCg}
                onChange={set('ladenCg')}
                error={err('laden.cgHeightMm')}
              />
            </>
          )}
          <TextInput
            label={`Wheelbase (${lengthUnit})`}
            inputMode="decimal"
            value={form.wheelbase}
            onChange={set('wheelbase')}
            error={err('wheelbaseMm')}
          />
          <TextInput
            label={`Front tyre loaded radius (${lengthUnit})`}
            inputMode="decimal"
            value={form.radiusFront}
            onChange={set('radiusFront')}
            error={err('tyreLoadedRadiusMm.front')}
            hint="Hub centre to the ground"
          />
          <TextInput
            label={`Rear tyre loaded radius (${lengthUnit})`}
            inputMode="decimal"
            value={form.radiusRear}
            onChange={set('radiusRear')}
            error={err('tyreLoadedRadiusMm.rear')}
          />
          <Select label="Rear valve" value={form.valve} onChange={set('valve')} className="sm:col-span-3">
            {rearValveKinds.map((kind) => (
              <option key={kind} value={kind}>
                {rearValveLabels[kind]}
              </option>
            ))}
          </Select>
          {(form.valve === 'proportioning' || form.valve === 'load-sensing') && (
            <>
              <TextInput
                label={`Knee${form.valve === 'load-sensing' ? ', unladen' : ''} (${pressureUnit})`}
                inputMode="decimal"
                value={form.knee}
                onChange={set('knee')}
                error={err(form.valve === 'proportioning' ? 'rearValve.kneeBar' : 'rearValve.kneeBarUnladen')}
              />
              {form.valve === 'load-sensing' && (
                <TextInput
                  label={`Knee, laden (${pressureUnit})`}
                  inputMode="decimal"
                  value={form.kneeLaden}
                  onChange={set('kneeLaden')}
                  error={err('rearValve.kneeBarLaden')}
                />
              )}
              <TextInput
                label="Slope above the knee"
                inputMode="decimal"
                value={form.slope}
                onChange={set('slope')}
                error={err('rearValve.slope')}
                hint="Rear bar per bar, 0–1"
              />
            </>
          )}
          <TextInput
            label="Where the figures come from"
            value={form.basis}
            onChange={set('basis')}
            error={err('basis')}
            placeholder="Weighed on a corner scale, with a full tank"
            maxLength={300}
            className="sm:col-span-3"
          />
        </div>
      )}
    </fieldset>
  );
}

/** Figures already typed survive switching the own-figures box off and on again. */
function keepTyped(form: VehicleForm): Partial<VehicleForm> {
  const typed: Partial<VehicleForm> = {};
  for (const [key, value] of Object.entries(form) as [keyof VehicleForm, VehicleForm[keyof VehicleForm]][]) {
    if (key !== 'own' && typeof value === 'string' && value !== '' && value !== blankVehicleForm[key])
      (typed as Record<string, unknown>)[key] = value;
  }
  if (form.laden) typed.laden = true;
  return typed;
}
