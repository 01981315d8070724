import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { axles, machiningOperations, partKindLabels, partKinds } from '@shared/schemas/enums';
import {
  fastenerKindLabels,
  lubricationLabels,
  machiningComponentLabels,
  shimDirectionLabels,
  shimJointLabels,
} from '@shared/schemas/swap-data-labels';
import { useUnits } from '../../../lib/units';
import { unitOf } from '../../../lib/quantity-text';
import { emptyFastener, emptyPart, type FormValues } from '../lib/form-values';
import { PartPicker } from './part-picker';
import { AddButton, FArea, FCheck, FNum, FSelect, FText, FormSection, ListError, ListRow, MoreFields } from './form-controls';

/** select options from a label map, in the map's order */
export const options = (labels: Record<string, string>) => Object.entries(labels).map(([value, label]) => ({ value, label }));
export const axleOptions = axles.map((a) => ({ value: a, label: a === 'front' ? 'Front' : 'Rear' }));

const operationLabels: Record<(typeof machiningOperations)[number], string> = {
  grind: 'Grind',
  machine: 'Machine',
  drill: 'Drill',
  trim: 'Trim',
};

export function TitleSection() {
  return (
    <FormSection id="title" title="Title and summary">
      <FText name="data.title" label="Title" hint="What goes on what, e.g. “Vela four-piston front calipers on the H31”." />
      <FArea name="data.summary" label="Summary" rows={3} hint="One or two sentences for search results." />
    </FormSection>
  );
}

export function PartsSection() {
  const { control } = useFormContext<FormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'data.parts' });
  return (
    <FormSection
      id="parts"
      title="Donor parts"
      lead="Every part the swap needs, with its part numbers and the vehicles it came on."
    >
      <ListError name="data.parts" />
      {fields.map((f, i) => (
        <ListRow key={f.id} label={`Part ${i + 1}`} onRemove={() => remove(i)} disabled={fields.length === 1}>
          <PartPicker index={i} />
          <FSelect
            name={`data.parts.${i}.kind`}
            label="Kind"
            options={partKinds.map((k) => ({ value: k, label: partKindLabels[k] }))}
          />
          <FText name={`data.parts.${i}.role`} label="Role in this swap" placeholder="front caliper, left" />
          <FText name={`data.parts.${i}.name`} label="Name" className="sm:col-span-2" />
          <FText name={`data.parts.${i}.maker`} label="Maker" />
          <FNum name={`data.parts.${i}.quantity`} label="Quantity" />
          <FText
            name={`data.parts.${i}.partNumbers`}
            label="Part numbers"
            hint="Separate with commas"
            className="sm:col-span-2"
          />
          <FArea name={`data.parts.${i}.cameOn`} label="Came on" rows={2} hint="One vehicle per line" className="sm:col-span-2" />
          <FArea name={`data.parts.${i}.notes`} label="Notes" rows={2} className="sm:col-span-2" />
        </ListRow>
      ))}
      <AddButton onClick={() => append(emptyPart())}>Add a part</AddButton>
    </FormSection>
  );
}

export function AdapterSection() {
  const hasAdapter = useWatch<FormValues, 'data.hasAdapter'>({ name: 'data.hasAdapter' });
  return (
    <FormSection id="adapter" title="Adapter and hardware">
      <FCheck name="data.hasAdapter" label="The swap uses an adapter bracket or plate" />
      {hasAdapter && (
        <div className="grid gap-3 sm:grid-cols-2">
          <FText name="data.adapter.name" label="Adapter" className="sm:col-span-2" />
          <FText name="data.adapter.maker" label="Maker" />
          <FText name="data.adapter.partNumber" label="Part number" />
          <FArea
            name="data.adapter.hardwareIncluded"
            label="Hardware included"
            rows={3}
            hint="One item per line, e.g. “2 × M10×1.25 bolts, 40 mm, 10.9”"
            className="sm:col-span-2"
          />
          <FArea name="data.adapter.notes" label="Notes" rows={2} className="sm:col-span-2" />
        </div>
      )}
    </FormSection>
  );
}

export function ShimsSpacersSection() {
  const { control } = useFormContext<FormValues>();
  const axle = useWatch<FormValues, 'axle'>({ name: 'axle' });
  const shims = useFieldArray({ control, name: 'data.shims' });
  const spacers = useFieldArray({ control, name: 'data.spacers' });
  return (
    <FormSection
      id="shims"
      title="Shims and spacers"
      lead="Shims in the caliper's mounting; wheel spacers between hub and wheel."
    >
      <h3 className="text-sm font-extrabold text-ink">Shims</h3>
      <p className="text-sm text-graphite-soft">
        A shim moves the caliper the way its joint's bolts run: shims on bolts along the axle centre the caliper over the rotor;
        shims under radial mounting ears lift it away from the axle (for a larger rotor) and cannot centre it.
      </p>
      {shims.fields.map((f, i) => (
        <ListRow key={f.id} label={`Shim ${i + 1}`} onRemove={() => shims.remove(i)}>
          <FSelect name={`data.shims.${i}.joint`} label="Joint" options={options(shimJointLabels)} />
          <FSelect name={`data.shims.${i}.direction`} label="Moves the caliper" options={options(shimDirectionLabels)} />
          <FNum name={`data.shims.${i}.thicknessMm`} label="Thickness" quantity="length" />
          <FNum name={`data.shims.${i}.quantity`} label="Quantity, whole axle" />
          <FText name={`data.shims.${i}.notes`} label="Where exactly" className="sm:col-span-2" />
        </ListRow>
      ))}
      <AddButton
        onClick={() =>
          shims.append({ joint: 'bracket_to_knuckle', direction: 'axial', thicknessMm: '', quantity: '4', notes: '' })
        }
      >
        Add a shim
      </AddButton>
      <fieldset className="grid gap-3 rounded-lg border border-graphite/15 bg-paper p-3 sm:grid-cols-3">
        <legend className="px-1 text-sm font-bold text-ink">Centring gap, if you measured it</legend>
        <FNum name="data.centring.gapMm" label="Gap the shims fill" quantity="length" hint="Per bolt, by feeler gauge" />
        <FSelect name="data.centring.joint" label="At the joint" options={options(shimJointLabels)} />
        <FNum name="data.centring.positions" label="Bolt positions" hint="Each takes one stack (4 for two calipers)" />
      </fieldset>
      <h3 className="border-t border-graphite/10 pt-4 text-sm font-extrabold text-ink">Wheel spacers</h3>
      {spacers.fields.map((f, i) => (
        <ListRow key={f.id} label={`Wheel spacer ${i + 1}`} onRemove={() => spacers.remove(i)}>
          <FSelect name={`data.spacers.${i}.axle`} label="Axle" options={axleOptions} />
          <FNum name={`data.spacers.${i}.thicknessMm`} label="Thickness" quantity="length" />
          <FSelect
            name={`data.spacers.${i}.mounting`}
            label="Mounting"
            options={[
              { value: 'slip_on', label: 'Slip-on (longer wheel bolts)' },
              { value: 'bolt_on', label: 'Bolt-on (own studs)' },
            ]}
          />
          <FSelect
            name={`data.spacers.${i}.material`}
            label="Material"
            options={[
              { value: 'aluminium', label: 'Aluminium' },
              { value: 'steel', label: 'Steel' },
            ]}
          />
          <FNum name={`data.spacers.${i}.quantity`} label="Quantity" />
          <FCheck name={`data.spacers.${i}.hubCentric`} label="Hub-centric" className="sm:pt-6" />
          <FText name={`data.spacers.${i}.notes`} label="Notes" className="sm:col-span-2" />
        </ListRow>
      ))}
      <AddButton
        onClick={() =>
          spacers.append({
            axle: axle || 'front',
            thicknessMm: '',
            hubCentric: true,
            mounting: 'slip_on',
            material: 'aluminium',
            quantity: '2',
            notes: '',
          })
        }
        disabled={spacers.fields.length >= 4}
      >
        Add a wheel spacer
      </AddButton>
    </FormSection>
  );
}

export function MachiningSection() {
  const { control } = useFormContext<FormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'data.machining' });
  return (
    <FormSection
      id="machining"
      title="Machining steps"
      lead="Grinding, machining, drilling or trimming the install needs. Leave empty if it bolts straight on. Work on a knuckle, hub, caliper body, bracket or subframe counts as structural, whatever the operation."
    >
      {fields.map((f, i) => (
        <ListRow key={f.id} label={`Step ${i + 1}`} onRemove={() => remove(i)}>
          <FSelect name={`data.machining.${i}.component`} label="Part worked on" options={options(machiningComponentLabels)} />
          <FSelect
            name={`data.machining.${i}.operation`}
            label="Operation"
            options={machiningOperations.map((o) => ({ value: o, label: operationLabels[o] }))}
          />
          <FText name={`data.machining.${i}.where`} label="Where" className="sm:col-span-2" />
          <FNum name={`data.machining.${i}.amountMm`} label="Material removed" quantity="length" hint="If measured" />
          <FCheck
            name={`data.machining.${i}.required`}
            label="Required"
            hint="Untick if the step is optional"
            className="sm:pt-6"
          />
          <FText name={`data.machining.${i}.notes`} label="Notes" className="sm:col-span-2" />
        </ListRow>
      ))}
      <AddButton
        onClick={() => append({ component: 'other', operation: 'grind', where: '', required: true, amountMm: '', notes: '' })}
      >
        Add a machining step
      </AddButton>
    </FormSection>
  );
}

export function FastenersSection() {
  const { control, getValues } = useFormContext<FormValues>();
  const { system } = useUnits();
  const { fields, append, remove } = useFieldArray({ control, name: 'data.fasteners' });
  return (
    <FormSection
      id="torque"
      title="Fasteners and torque"
      lead={`One line per fastener the install touches, with its torque in ${unitOf('torque', system)}. Reviewers check that the caliper, bracket and wheel fasteners are all here.`}
    >
      <ListError name="data.fasteners" />
      {fields.map((f, i) => (
        <ListRow key={f.id} label={`Fastener ${i + 1}`} onRemove={() => remove(i)}>
          <FSelect name={`data.fasteners.${i}.kind`} label="Kind of fastener" options={options(fastenerKindLabels)} />
          <FText name={`data.fasteners.${i}.label`} label="Fastener" placeholder="caliper to adapter, radial bolts" />
          <FText name={`data.fasteners.${i}.thread`} label="Thread" placeholder="M12x1.5" />
          <FNum name={`data.fasteners.${i}.nm`} label="Torque" quantity="torque" />
          <FSelect name={`data.fasteners.${i}.lubrication`} label="Threads" options={options(lubricationLabels)} />
          <FText name={`data.fasteners.${i}.notes`} label="Notes" placeholder="new copper washers…" />
          <MoreFields summary="Length, class, angle">
            <FNum name={`data.fasteners.${i}.lengthMm`} label="Length" quantity="length" />
            <FText name={`data.fasteners.${i}.propertyClass`} label="Property class" placeholder="10.9" />
            <FNum name={`data.fasteners.${i}.quantity`} label="How many" />
            <FNum name={`data.fasteners.${i}.angleDeg`} label="Then turn by" unit="°" hint="Torque-angle tightening" />
            <FCheck name={`data.fasteners.${i}.singleUse`} label="Single use" hint="Replace after loosening" />
          </MoreFields>
        </ListRow>
      ))}
      <AddButton onClick={() => append(emptyFastener('other', getValues('data.fasteners')))}>Add a fastener</AddButton>
    </FormSection>
  );
}
