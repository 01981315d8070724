import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { machiningOperations, partKinds } from '@shared/schemas/enums';
import { useUnits } from '../../../lib/units';
import { emptyPart, unitOf, type FormValues } from '../lib/form-values';
import { AddButton, FArea, FCheck, FNum, FSelect, FText, FormSection, ListError, ListRow } from './form-controls';

const kindLabels: Record<(typeof partKinds)[number], string> = {
  caliper: 'Caliper',
  rotor: 'Rotor',
  pad: 'Pads',
  adapter: 'Adapter bracket',
  shim: 'Shim',
  spacer: 'Wheel spacer',
  line: 'Brake line',
  hardware: 'Hardware',
};
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
          <FSelect
            name={`data.parts.${i}.kind`}
            label="Kind"
            options={partKinds.map((k) => ({ value: k, label: kindLabels[k] }))}
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
  const shims = useFieldArray({ control, name: 'data.shims' });
  const spacers = useFieldArray({ control, name: 'data.spacers' });
  return (
    <FormSection
      id="shims"
      title="Shims and spacers"
      lead="Centring shims between adapter and caliper; wheel spacers between hub and wheel."
    >
      <h3 className="text-sm font-extrabold text-ink">Centring shims</h3>
      <FNum
        name="data.shimTargetMm"
        label="Centring gap the shims fill"
        quantity="length"
        hint="If you measured it"
        className="sm:max-w-xs"
      />
      {shims.fields.map((f, i) => (
        <ListRow key={f.id} label={`Shim ${i + 1}`} onRemove={() => shims.remove(i)}>
          <FText name={`data.shims.${i}.location`} label="Where it goes" className="sm:col-span-2" />
          <FNum name={`data.shims.${i}.thicknessMm`} label="Thickness" quantity="length" />
          <FNum name={`data.shims.${i}.quantity`} label="Quantity" />
        </ListRow>
      ))}
      <AddButton onClick={() => shims.append({ location: '', thicknessMm: '', quantity: '2' })}>Add a shim</AddButton>
      <h3 className="border-t border-graphite/10 pt-4 text-sm font-extrabold text-ink">Wheel spacers</h3>
      {spacers.fields.map((f, i) => (
        <ListRow key={f.id} label={`Wheel spacer ${i + 1}`} onRemove={() => spacers.remove(i)}>
          <FNum name={`data.spacers.${i}.thicknessMm`} label="Thickness" quantity="length" />
          <FNum name={`data.spacers.${i}.quantity`} label="Quantity" />
          <FSelect
            name={`data.spacers.${i}.mounting`}
            label="Mounting"
            options={[
              { value: 'slip_on', label: 'Slip-on (longer wheel bolts)' },
              { value: 'bolt_on', label: 'Bolt-on (own studs)' },
            ]}
          />
          <FCheck name={`data.spacers.${i}.hubCentric`} label="Hub-centric" className="sm:pt-6" />
          <FText name={`data.spacers.${i}.notes`} label="Notes" className="sm:col-span-2" />
        </ListRow>
      ))}
      <AddButton
        onClick={() => spacers.append({ thicknessMm: '', hubCentric: true, mounting: 'slip_on', quantity: '2', notes: '' })}
        disabled={spacers.fields.length >= 4}
      >
        Add a wheel spacer
      </AddButton>
    </FormSection>
  );
}

export function RotorsSection() {
  const { control } = useFormContext<FormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'data.rotors' });
  return (
    <FormSection id="rotors" title="Rotors">
      {fields.map((f, i) => (
        <ListRow key={f.id} label={`Rotor ${i + 1}`} onRemove={() => remove(i)}>
          <FNum name={`data.rotors.${i}.diameterMm`} label="Diameter" quantity="length" />
          <FNum name={`data.rotors.${i}.thicknessMm`} label="Thickness" quantity="length" />
          <FText name={`data.rotors.${i}.partNumber`} label="Part number" />
          <FCheck name={`data.rotors.${i}.vented`} label="Vented" className="sm:pt-6" />
          <FText name={`data.rotors.${i}.notes`} label="Notes" className="sm:col-span-2" />
        </ListRow>
      ))}
      <AddButton
        onClick={() => append({ diameterMm: '', thicknessMm: '', vented: true, partNumber: '', notes: '' })}
        disabled={fields.length >= 4}
      >
        Add a rotor
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
      lead="Grinding, machining, drilling or trimming the install needs. Leave empty if it bolts straight on."
    >
      {fields.map((f, i) => (
        <ListRow key={f.id} label={`Step ${i + 1}`} onRemove={() => remove(i)}>
          <FSelect
            name={`data.machining.${i}.operation`}
            label="Operation"
            options={machiningOperations.map((o) => ({ value: o, label: operationLabels[o] }))}
          />
          <FCheck
            name={`data.machining.${i}.required`}
            label="Required"
            hint="Untick if the step is optional"
            className="sm:pt-6"
          />
          <FText name={`data.machining.${i}.where`} label="Where" className="sm:col-span-2" />
          <FText name={`data.machining.${i}.notes`} label="Notes" className="sm:col-span-2" />
        </ListRow>
      ))}
      <AddButton onClick={() => append({ operation: 'grind', where: '', required: true, notes: '' })}>
        Add a machining step
      </AddButton>
    </FormSection>
  );
}

export function TorqueSection() {
  const { control } = useFormContext<FormValues>();
  const { system } = useUnits();
  const { fields, append, remove } = useFieldArray({ control, name: 'data.torque' });
  return (
    <FormSection
      id="torque"
      title="Torque specs"
      lead={`One line per fastener the install touches, in ${unitOf('torque', system)}. Reviewers check every fastener has a value.`}
    >
      {fields.map((f, i) => (
        <ListRow key={f.id} label={`Fastener ${i + 1}`} onRemove={() => remove(i)}>
          <FText name={`data.torque.${i}.fastener`} label="Fastener" placeholder="caliper to adapter" />
          <FNum name={`data.torque.${i}.nm`} label="Torque" quantity="torque" />
          <FText
            name={`data.torque.${i}.notes`}
            label="Notes"
            placeholder="thread locker, new bolts…"
            className="sm:col-span-2"
          />
        </ListRow>
      ))}
      <AddButton onClick={() => append({ fastener: '', nm: '', notes: '' })}>Add a torque spec</AddButton>
    </FormSection>
  );
}
