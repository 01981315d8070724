import { Controller, useFormContext, useWatch } from 'react-hook-form';
import { axles, categories, categoryLabels } from '@shared/schemas/enums';
import type { ChassisView } from '@shared/schemas/views';
import { chassisLabel } from '../../../components/swap-card';
import { ChassisCombobox } from '../../../components/chassis-combobox';
import { useChassisOptions } from '../api/get-chassis-options';
import { messageAt, type FormValues } from '../lib/form-values';
import { FNum, FSelect, FText, FormSection } from './form-controls';

/** What the swap is for: an existing chassis or a proposed one, the axle and the category. */
export function ChassisSection({ fixed }: { fixed: { chassis: ChassisView; axle: string; category: string } | null }) {
  const { register, control } = useFormContext<FormValues>();
  const mode = useWatch<FormValues, 'chassisMode'>({ name: 'chassisMode' });
  const chassis = useChassisOptions();

  if (fixed) {
    return (
      <FormSection id="chassis" title="Chassis and axle" lead="A correction keeps the swap’s chassis, axle and category.">
        <p className="text-graphite">
          <strong>{chassisLabel(fixed.chassis)}</strong> · {fixed.axle} axle ·{' '}
          {categoryLabels[fixed.category as keyof typeof categoryLabels] ?? fixed.category}
        </p>
      </FormSection>
    );
  }

  const options = chassis.data ?? [];
  return (
    <FormSection id="chassis" title="Chassis and axle" lead="The car the parts go on.">
      <fieldset>
        <legend className="text-sm font-bold text-graphite">Chassis</legend>
        <div className="mt-2 flex flex-wrap gap-x-6 gap-y-2">
          <label className="flex min-h-10 items-center gap-2 text-sm">
            <input type="radio" value="existing" className="h-5 w-5 accent-ink" {...register('chassisMode')} /> In the catalogue
          </label>
          <label className="flex min-h-10 items-center gap-2 text-sm">
            <input type="radio" value="new" className="h-5 w-5 accent-ink" {...register('chassisMode')} /> Not listed: propose it
          </label>
        </div>
      </fieldset>
      {mode === 'existing' ? (
        <Controller
          control={control}
          name="chassisId"
          render={({ field, formState }) => {
            const error = messageAt(formState.errors, 'chassisId');
            return (
              <div>
                <ChassisCombobox
                  options={options}
                  value={options.find((c) => String(c.id) === field.value)?.slug ?? null}
                  onChange={(slug) => field.onChange(String(options.find((c) => c.slug === slug)?.id ?? ''))}
                  hint={
                    chassis.isPending
                      ? 'Loading the catalogue…'
                      : chassis.isError
                        ? 'The catalogue did not load; propose the chassis instead, or reload.'
                        : 'Type make, model, chassis code or a year.'
                  }
                />
                {error && (
                  <p role="alert" className="mt-1 text-sm font-semibold text-oxide">
                    {error}
                  </p>
                )}
              </div>
            );
          }}
        />
      ) : (
        <div className="grid gap-3 sm:grid-cols-3">
          <FText name="newChassis.make" label="Make" />
          <FText name="newChassis.model" label="Model" />
          <FText name="newChassis.code" label="Chassis code" />
          <FNum name="newChassis.yearFrom" label="First year" />
          <FNum name="newChassis.yearTo" label="Last year" hint="Empty if still built" />
          <FText name="newChassis.body" label="Body" placeholder="saloon, coupe…" />
          <FNum name="newChassis.lugCount" label="Wheel bolts per hub" />
          <FNum name="newChassis.pcdMm" label="Bolt circle (PCD)" quantity="length" />
          <FNum name="newChassis.centreBoreMm" label="Centre bore" quantity="length" />
          <FText name="newChassis.wheelBoltThread" label="Wheel-bolt thread" placeholder="M12x1.5" />
          <p className="text-sm text-graphite-soft sm:col-span-3">The stock wheel, if you know it:</p>
          <FNum name="newChassis.stockWheel.diameterIn" label="Stock wheel diameter" unit="in" />
          <FNum name="newChassis.stockWheel.widthIn" label="Stock wheel width" unit="in" />
          <FNum name="newChassis.stockWheel.offsetMm" label="Stock wheel offset" unit="ET" signed />
          <FText name="newChassis.stockWheel.tyre" label="Stock tyre" placeholder="195/60R15" />
        </div>
      )}
      <div className="grid gap-3 sm:grid-cols-2">
        <FSelect
          name="axle"
          label="Axle"
          options={[
            { value: '', label: 'Choose the axle' },
            ...axles.map((a) => ({ value: a, label: a === 'front' ? 'Front' : 'Rear' })),
          ]}
        />
        <FSelect
          name="category"
          label="Category"
          options={[
            { value: '', label: 'Choose a category' },
            ...categories.map((c) => ({ value: c, label: categoryLabels[c] })),
          ]}
        />
      </div>
    </FormSection>
  );
}
