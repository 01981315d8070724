import { useState } from 'react';
import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { costRouteLabels, costRoutes } from '@shared/schemas/enums';
import type { ChassisView } from '@shared/schemas/views';
import { Markdown } from '../../../components/markdown';
import { Button } from '../../../components/ui/button';
import {
  drumShoeTypeLabels,
  parkingBrakeTypeLabels,
  seatTypeLabels,
  wheelMaterialLabels,
  wheelOutcomeLabels,
} from '@shared/schemas/swap-data-labels';
import { emptyTestedWheel, stockCorner, type FormValues } from '../lib/form-values';
import { AddButton, FArea, FCheck, FLengthList, FNum, FSelect, FText, FormSection, ListRow, MoreFields } from './form-controls';
import { options } from './parts-sections';

export function WheelSection() {
  const { control } = useFormContext<FormValues>();
  const hasWheel = useWatch<FormValues, 'data.hasWheel'>({ name: 'data.hasWheel' });
  const tested = useFieldArray({ control, name: 'data.wheel.testedWheels' });
  return (
    <FormSection
      id="wheel"
      title="Wheel requirement and clearance"
      lead="What the smallest wheel that clears looks like, measured on the car."
    >
      <FCheck name="data.hasWheel" label="The swap limits which wheels fit" />
      {hasWheel && (
        <>
          <div className="grid gap-3 sm:grid-cols-2">
            <FNum name="data.wheel.minDiameterIn" label="Smallest wheel that clears" unit="in" />
            <FNum
              name="data.wheel.barrelInnerDiameterMm"
              label="Barrel inner diameter at the caliper"
              quantity="length"
              hint="Measured on that smallest wheel"
            />
            <FNum name="data.wheel.caliperRadialProjectionMm" label="Caliper reach beyond the rotor edge" quantity="length" />
            <FNum name="data.wheel.caliperOutboardMm" label="Caliper face outboard of the hub face" quantity="length" signed />
            <FArea name="data.wheel.notes" label="Notes" rows={2} className="sm:col-span-2" />
          </div>
          <h3 className="pt-2 text-sm font-extrabold text-ink">Wheels we tried</h3>
          <p className="text-sm text-graphite-soft">
            Every wheel you offered up, including the ones that did not fit: a wheel that does not fit is one of the most useful
            facts a record can hold. A clearance that overlaps is negative.
          </p>
          {tested.fields.map((f, i) => (
            <TestedWheelRow key={f.id} index={i} onRemove={() => tested.remove(i)} />
          ))}
          <AddButton onClick={() => tested.append(emptyTestedWheel())}>Add a wheel we tried</AddButton>
        </>
      )}
    </FormSection>
  );
}

function TestedWheelRow({ index: i, onRemove }: { index: number; onRemove: () => void }) {
  const outcome = useWatch<FormValues, `data.wheel.testedWheels.${number}.outcome`>({
    name: `data.wheel.testedWheels.${i}.outcome`,
  });
  const at = `data.wheel.testedWheels.${i}` as const;
  return (
    <ListRow label={`Wheel ${i + 1}`} onRemove={onRemove}>
      <div className="grid grid-cols-3 gap-2 sm:col-span-2">
        <FNum name={`${at}.diameterIn`} label="Diameter" unit="in" />
        <FNum name={`${at}.widthIn`} label="Width" unit="in" />
        <FNum name={`${at}.offsetMm`} label="Offset" unit="ET" signed />
      </div>
      <FSelect name={`${at}.outcome`} label="Outcome" options={options(wheelOutcomeLabels)} />
      {outcome === 'fits_with_change' ? (
        <FText name={`${at}.change`} label="What had to change" placeholder="10 mm hub-centric spacer" />
      ) : (
        <FNum name={`${at}.spacerMm`} label="Spacer used" quantity="length" />
      )}
      {outcome === 'fits_with_change' && <FNum name={`${at}.spacerMm`} label="Spacer used" quantity="length" />}
      <FNum name={`${at}.radialClearanceMm`} label="Measured at the barrel" quantity="length" hint="Caliper to barrel" signed />
      <FNum
        name={`${at}.spokeClearanceMm`}
        label="Measured at the spokes"
        quantity="length"
        hint="Caliper face to spokes"
        signed
      />
      <FText
        name={`${at}.measuredWhere`}
        label="Where and how you measured"
        className="sm:col-span-2"
        placeholder="modelling clay on the caliper, wheel turned by hand"
      />
      <MoreFields summary="Material, seat, bore, tyre">
        <FSelect name={`${at}.material`} label="Material" options={options(wheelMaterialLabels)} />
        <FSelect name={`${at}.seat`} label="Wheel-bolt seat" options={options(seatTypeLabels)} />
        <FNum name={`${at}.centreBoreMm`} label="Centre bore" quantity="length" />
        <FText name={`${at}.tyre`} label="Tyre" placeholder="205/55R16" />
      </MoreFields>
      <FText name={`${at}.note`} label="Note" className="sm:col-span-2" />
    </ListRow>
  );
}

function CornerFields({ prefix, title }: { prefix: `data.brakes.${'before' | 'after'}.${'front' | 'rear'}`; title: string }) {
  const kind = useWatch<FormValues, `${typeof prefix}.kind`>({ name: `${prefix}.kind` });
  return (
    <fieldset className="rounded-lg border border-graphite/15 bg-paper p-3">
      <legend className="px-1 text-sm font-bold text-ink">{title}</legend>
      <div className="grid gap-2">
        <FSelect
          name={`${prefix}.kind`}
          label="Brake"
          options={[
            { value: 'disc', label: 'Disc' },
            { value: 'drum', label: 'Drum' },
          ]}
        />
        {kind === 'drum' ? (
          <>
            <div className="grid grid-cols-2 gap-2">
              <FNum name={`${prefix}.wheelCylinderBoreMm`} label="Wheel cylinder bore" quantity="length" />
              <FNum name={`${prefix}.drumDiameterMm`} label="Drum Ø" quantity="length" />
            </div>
            <FSelect name={`${prefix}.shoeType`} label="Shoes" options={options(drumShoeTypeLabels)} />
          </>
        ) : (
          <>
            <FLengthList
              name={`${prefix}.pistonsPerSideMm`}
              label="Piston diameters, one side"
              hint={(unit) => `${unit}, separated by semicolons or spaces: ${unit === 'mm' ? '“38; 42”' : '“1.5; 1.65”'}`}
            />
            <div className="grid grid-cols-2 gap-2">
              <FNum name={`${prefix}.rotorDiameterMm`} label="Rotor Ø" quantity="length" />
              <FNum name={`${prefix}.padHeightMm`} label="Pad height" quantity="length" />
            </div>
          </>
        )}
      </div>
    </fieldset>
  );
}

export function BrakesSection({ chassis }: { chassis: ChassisView | null }) {
  const { setValue } = useFormContext<FormValues>();
  const hasBrakes = useWatch<FormValues, 'data.hasBrakes'>({ name: 'data.hasBrakes' });
  const fillStock = () => {
    if (!chassis) return;
    setValue('data.brakes.before.front', stockCorner(chassis.stockBrakes.front), { shouldDirty: true });
    setValue('data.brakes.before.rear', stockCorner(chassis.stockBrakes.rear), { shouldDirty: true });
    setValue('data.brakes.after.rear', stockCorner(chassis.stockBrakes.rear), { shouldDirty: true });
  };
  return (
    <FormSection
      id="brakes"
      title="Brake figures before and after"
      lead="Piston sizes, rotor diameters and pad heights, so the brake balance can be computed."
    >
      <FCheck name="data.hasBrakes" label="The swap changes calipers or rotors" />
      {hasBrakes && (
        <>
          <div className="grid gap-3 sm:grid-cols-2">
            <FNum name="data.brakes.linePressureBar" label="Line pressure for the comparison" quantity="pressure" />
            <FNum name="data.brakes.padMu" label="Pad friction μ" />
          </div>
          {chassis && (
            <Button variant="secondary" onClick={fillStock}>
              Fill “before” from the {chassis.code}’s stock brakes
            </Button>
          )}
          <div className="grid gap-3 sm:grid-cols-2">
            <CornerFields prefix="data.brakes.before.front" title="Before · front" />
            <CornerFields prefix="data.brakes.before.rear" title="Before · rear" />
            <CornerFields prefix="data.brakes.after.front" title="After · front" />
            <CornerFields prefix="data.brakes.after.rear" title="After · rear" />
          </div>
        </>
      )}
    </FormSection>
  );
}

export function CostsSection() {
  const { control, getValues } = useFormContext<FormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'data.costs' });
  const currency = useWatch<FormValues, 'data.currency'>({ name: 'data.currency' });
  return (
    <FormSection
      id="costs"
      title="Costs by route"
      lead="What you paid (as built), the cheapest sensible way (budget), and a ready-made new kit for comparison."
    >
      <FText name="data.currency" label="Currency" hint="Three letters, e.g. EUR" className="max-w-[10rem]" />
      {fields.map((f, i) => (
        <ListRow key={f.id} label={`Cost line ${i + 1}`} onRemove={() => remove(i)}>
          <FSelect
            name={`data.costs.${i}.route`}
            label="Route"
            options={costRoutes.map((r) => ({ value: r, label: costRouteLabels[r] }))}
          />
          <FNum name={`data.costs.${i}.amount`} label="Amount" unit={currency || '—'} />
          <FText name={`data.costs.${i}.item`} label="Item" className="sm:col-span-2" />
        </ListRow>
      ))}
      <AddButton onClick={() => append({ route: getValues('data.costs').at(-1)?.route ?? 'as_built', item: '', amount: '' })}>
        Add a cost line
      </AddButton>
    </FormSection>
  );
}

export function JobSection() {
  const parkingType = useWatch<FormValues, 'data.parkingBrakeType'>({ name: 'data.parkingBrakeType' });
  return (
    <FormSection id="job" title="The job">
      <div className="grid gap-3 sm:grid-cols-3">
        <FNum name="data.installHours" label="Install time" unit="h" />
        <FSelect
          name="data.difficulty"
          label="Difficulty"
          options={[
            { value: '', label: 'Not rated' },
            { value: '1', label: '1 · basic hand tools' },
            { value: '2', label: '2 · some experience' },
            { value: '3', label: '3 · experienced home mechanic' },
            { value: '4', label: '4 · workshop skills' },
            { value: '5', label: '5 · machine shop' },
          ]}
        />
        <FSelect
          name="data.parkingBrakeType"
          label="Parking brake"
          hint="The one on this swap's axle"
          options={[
            { value: '', label: 'Not stated' },
            ...options(parkingBrakeTypeLabels).filter((o) => o.value !== 'not_stated'),
          ]}
        />
        {parkingType && parkingType !== 'none' && (
          <FSelect
            name="data.parkingBrakeKept"
            label="After the swap"
            options={[
              { value: 'yes', label: 'Kept and working' },
              { value: 'no', label: 'Lost' },
            ]}
          />
        )}
      </div>
      <FArea name="data.tools" label="Tools needed" rows={3} hint="One tool per line: “Torque wrench, 20–120 N·m”" />
    </FormSection>
  );
}

/** The write-up with a preview through the same renderer as the swap sheet. */
export function WriteUpSection() {
  const body = useWatch<FormValues, 'body'>({ name: 'body' });
  const [tab, setTab] = useState<'write' | 'preview'>('write');
  return (
    <FormSection
      id="write-up"
      title="Write-up"
      lead="How the job went, step by step. Markdown: **bold**, lists, tables, links (http, https, mailto)."
    >
      <div role="tablist" aria-label="Write-up" className="flex gap-1 lg:hidden">
        {(['write', 'preview'] as const).map((t) => (
          <button
            key={t}
            type="button"
            role="tab"
            aria-selected={tab === t}
            className={`rounded-md px-3 py-2 text-sm font-bold ${tab === t ? 'bg-ink text-paper' : 'text-ink hover:bg-ink-faint'}`}
            onClick={() => setTab(t)}
          >
            {t === 'write' ? 'Write' : 'Preview'}
          </button>
        ))}
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        <div className={tab === 'write' ? '' : 'hidden lg:block'}>
          <FArea name="body" label="Write-up (markdown)" rows={14} />
        </div>
        <div className={tab === 'preview' ? '' : 'hidden lg:block'}>
          <p className="mb-1 text-sm font-bold text-graphite" id="preview-label">
            Preview, as on the swap sheet
          </p>
          <div
            aria-labelledby="preview-label"
            className="min-h-40 rounded-md border border-dashed border-graphite/25 bg-paper p-3"
            data-testid="write-up-preview"
          >
            {body?.trim() ? <Markdown>{body}</Markdown> : <p className="text-sm text-graphite-soft">Nothing written yet.</p>}
          </div>
        </div>
      </div>
    </FormSection>
  );
}
