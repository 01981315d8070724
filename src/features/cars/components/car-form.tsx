import { useState } from 'react';
import { carInputSchema, type CarInput, type CarView } from '@shared/schemas/cars';
import { fieldErrors } from '@shared/schemas/errors';
import { inToMm, mmToIn } from '@shared/fitment/units';
import { TextInput } from '../../../components/ui/field';
import { ChassisCombobox } from '../../../components/chassis-combobox';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { useUnits } from '../../../lib/units';
import { useTypedInUnits } from '../../../lib/use-typed-in-units';
import { useChassisOptions } from '../api/get-cars';
import {
  VehicleFields,
  vehicleFormOf,
  vehicleInputOf,
  vehicleQuantities,
  type VehicleForm,
} from '../../../components/vehicle-fields';
import { profileOf, rowsOf, WheelProfileFields, type ProfileRow } from './wheel-profile-fields';
import { FittedSwapsFields, type FittedForm } from './fitted-swaps-fields';
import { numberKeyboard } from '../../../lib/number-text';

type Form = Record<'chassisId' | 'nickname' | 'wheelDiameterIn' | 'wheelWidthIn' | 'wheelOffsetMm' | 'tyre' | 'spacer', string>;

const blank: Form = {
  chassisId: '',
  nickname: '',
  wheelDiameterIn: '',
  wheelWidthIn: '',
  wheelOffsetMm: '',
  tyre: '',
  spacer: '0',
};

const fromCar = (car: CarView, imperial: boolean): Form => ({
  chassisId: String(car.chassis.id),
  nickname: car.nickname,
  wheelDiameterIn: String(car.wheelDiameterIn),
  wheelWidthIn: String(car.wheelWidthIn),
  wheelOffsetMm: String(car.wheelOffsetMm),
  tyre: car.tyre,
  spacer: imperial ? String(Math.round(mmToIn(car.spacerMm) * 100) / 100) : String(car.spacerMm),
});

/** Add or edit one car. Checked with the same schema the server uses; server field reasons show beside the fields. */
export function CarForm({
  car,
  saving,
  onSave,
  onCancel,
}: {
  car?: CarView;
  saving: boolean;
  onSave: (input: CarInput) => Promise<unknown>;
  onCancel?: () => void;
}) {
  const units = useUnits();
  const imperial = units.system === 'imperial';
  const chassisList = useChassisOptions();
  const [form, setForm] = useTypedInUnits<Form>(() => (car ? fromCar(car, imperial) : blank), { spacer: 'length' });
  const [vehicle, setVehicle] = useTypedInUnits<VehicleForm>(
    () => vehicleFormOf(car?.vehicle ?? null, imperial, Boolean(car?.vehicle)),
    vehicleQuantities,
  );
  const [fitted, setFitted] = useState<FittedForm>(() => ({
    slugs: car?.fitted.map((f) => f.slug) ?? [],
    otherChanges: car?.otherChanges ?? '',
  }));
  const chosen = chassisList.data?.find((c) => String(c.id) === form.chassisId) ?? null;
  const [profileRows, setProfileRows] = useState<ProfileRow[]>(() => rowsOf(car?.wheelInsideProfile ?? null, imperial));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const set = (key: keyof Form) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) =>
    setForm((f) => ({ ...f, [key]: e.target.value }));

  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    setProblem(null);
    const spacerRaw = form.spacer.trim().replace(',', '.');
    const spacerMm = spacerRaw === '' ? 0 : imperial ? Math.round(inToMm(Number(spacerRaw)) * 10) / 10 : Number(spacerRaw);
    const parsed = carInputSchema.safeParse({
      ...form,
      spacerMm,
      spacer: undefined,
      vehicle: vehicleInputOf(vehicle, imperial),
      wheelInsideProfile: profileOf(profileRows, imperial),
      fittedSwapSlugs: fitted.slugs,
      otherChanges: fitted.otherChanges,
    });
    if (!parsed.success) {
      const fields = fieldErrors(parsed.error.issues);
      setErrors(fields);
      return;
    }
    setErrors({});
    try {
      await onSave(parsed.data);
      if (!car) {
        setForm(blank);
        setVehicle(vehicleFormOf(null, imperial, false));
        setProfileRows([]);
        setFitted({ slugs: [], otherChanges: '' });
      }
    } catch (err) {
      if (err instanceof ApiError) {
        setErrors(err.fields);
        setProblem(err.message);
      } else setProblem('Saving failed. Your entries are still here; try again.');
    }
  };

  return (
    <form
      onSubmit={submit}
      noValidate
      aria-label={car ? `Edit ${car.nickname}` : 'Add a car'}
      className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3"
    >
      <div className="sm:col-span-2 lg:col-span-1">
        <ChassisCombobox
          options={chassisList.data ?? []}
          value={chosen?.slug ?? null}
          onChange={(slug) => {
            setForm((f) => ({ ...f, chassisId: String(chassisList.data?.find((c) => c.slug === slug)?.id ?? '') }));
            // swaps are made for one chassis: a car moved to another starts with none fitted
            if (slug !== chosen?.slug) setFitted((f) => ({ ...f, slugs: [] }));
          }}
          placeholder={chassisList.isPending ? 'Loading chassis…' : 'Make, model, code or year'}
          hint="Type to pick, e.g. H31 or 1995"
        />
        {errors.chassisId && (
          <p role="alert" className="mt-1 text-sm font-semibold text-oxide">
            {errors.chassisId}
          </p>
        )}
      </div>
      <TextInput
        label="Nickname"
        value={form.nickname}
        onChange={set('nickname')}
        error={errors.nickname}
        placeholder="Green coupe"
        maxLength={60}
      />
      <TextInput
        label="Tyre size"
        value={form.tyre}
        onChange={set('tyre')}
        error={errors.tyre}
        placeholder="205/55R16"
        hint="As on the sidewall; optional"
      />
      <TextInput
        label="Wheel diameter (in)"
        inputMode="decimal"
        value={form.wheelDiameterIn}
        onChange={set('wheelDiameterIn')}
        error={errors.wheelDiameterIn}
        placeholder="16"
      />
      <TextInput
        label="Wheel width (in)"
        inputMode="decimal"
        value={form.wheelWidthIn}
        onChange={set('wheelWidthIn')}
        error={errors.wheelWidthIn}
        placeholder="7"
      />
      <TextInput
        label="Offset ET (mm)"
        {...numberKeyboard(true)}
        value={form.wheelOffsetMm}
        onChange={set('wheelOffsetMm')}
        error={errors.wheelOffsetMm}
        placeholder="38"
      />
      <TextInput
        label={`Spacer fitted (${units.lengthUnit})`}
        inputMode="decimal"
        value={form.spacer}
        onChange={set('spacer')}
        error={errors.spacerMm}
        hint="0 when none"
      />
      <VehicleFields
        form={vehicle}
        onChange={setVehicle}
        errors={errors}
        imperial={imperial}
        stock={chosen?.vehicle ?? null}
        chassisName={chosen ? `${chosen.make} ${chosen.model}` : null}
      />
      <WheelProfileFields rows={profileRows} onChange={setProfileRows} errors={errors} />
      <FittedSwapsFields chassisSlug={chosen?.slug ?? null} form={fitted} onChange={setFitted} errors={errors} />
      <div className="flex flex-wrap items-end gap-2 sm:col-span-2 lg:col-span-3">
        <Button type="submit" disabled={saving}>
          {saving ? 'Saving…' : car ? 'Save changes' : 'Add car'}
        </Button>
        {onCancel && (
          <Button variant="quiet" onClick={onCancel}>
            Cancel
          </Button>
        )}
        {problem && (
          <p role="alert" className="text-sm font-semibold text-oxide">
            {problem}
          </p>
        )}
      </div>
    </form>
  );
}
