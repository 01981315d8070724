import { useState } from 'react';
import type { ChassisView } from '@shared/schemas/views';
import { chassisVehicleInputSchema } from '@shared/schemas/vehicle';
import { fieldErrors } from '@shared/schemas/errors';
import { VehicleFields, vehicleFormOf, vehicleInputOf, type VehicleForm } from '../../../components/vehicle-fields';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { useUnits } from '../../../lib/units';
import { useSetChassisVehicle } from '../api/set-chassis-vehicle';

/** The review desk's editor for a chassis' stock figures, on the chassis page. */
export function ChassisFiguresEditor({ chassis, onDone }: { chassis: ChassisView; onDone: () => void }) {
  const imperial = useUnits().system === 'imperial';
  const [form, setForm] = useState<VehicleForm>(() => vehicleFormOf(chassis.vehicle, imperial, chassis.vehicle !== null));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const save = useSetChassisVehicle(chassis.slug);

  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    setProblem(null);
    const parsed = chassisVehicleInputSchema.safeParse({ vehicle: vehicleInputOf(form, imperial) });
    if (!parsed.success) {
      setErrors(fieldErrors(parsed.error.issues));
      return;
    }
    setErrors({});
    try {
      await save.mutateAsync(parsed.data);
      onDone();
    } catch (err) {
      if (err instanceof ApiError) {
        setErrors(err.fields);
        setProblem(err.message);
      } else setProblem('Could not save the figures. Try again.');
    }
  };

  return (
    <form onSubmit={submit} noValidate className="grid gap-3" aria-label="Stock figures for brake balance">
      <VehicleFields
        form={form}
        onChange={setForm}
        errors={errors}
        imperial={imperial}
        stock={chassis.vehicle}
        chassisName={`${chassis.make} ${chassis.model}`}
        intro={`Every swap sheet of the ${chassis.make} ${chassis.model} works out which axle locks first from these figures, unless a reader picks their own car. Invented or estimated figures say so in “Where the figures come from”.`}
        toggleLabel="This chassis has stock figures"
      />
      {problem && (
        <p role="alert" className="text-sm font-bold text-oxide">
          {problem}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : 'Save the stock figures'}
        </Button>
        <Button type="button" variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
