import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { caliperTypeLabels, mountTypeLabels } from '@shared/schemas/swap-data-labels';
import { emptyCaliper, emptyRotor, type FormValues } from '../lib/form-values';
import { AddButton, FCheck, FLengthList, FNum, FSelect, FText, FormSection, ListRow, MoreFields } from './form-controls';
import { axleOptions, options } from './parts-sections';

const listHint = (unit: string) => `${unit}, separated by semicolons or spaces: ${unit === 'mm' ? '“40; 44”' : '“1.57; 1.73”'}`;

export function CalipersSection() {
  const { control } = useFormContext<FormValues>();
  const axle = useWatch<FormValues, 'axle'>({ name: 'axle' });
  const { fields, append, remove } = useFieldArray({ control, name: 'data.calipers' });
  return (
    <FormSection
      id="calipers"
      title="Calipers"
      lead="The caliper on each corner as fitted: its pistons, how it mounts and the rotor it was made for. These let the sheet check that it sits on the rotor you give it."
    >
      {fields.map((f, i) => (
        <CaliperRow key={f.id} index={i} onRemove={() => remove(i)} />
      ))}
      <AddButton onClick={() => append(emptyCaliper(axle || 'front'))} disabled={fields.length >= 4}>
        Add a caliper
      </AddButton>
    </FormSection>
  );
}

function CaliperRow({ index: i, onRemove }: { index: number; onRemove: () => void }) {
  const type = useWatch<FormValues, `data.calipers.${number}.type`>({ name: `data.calipers.${i}.type` });
  return (
    <ListRow label={`Caliper ${i + 1}`} onRemove={onRemove}>
      <FText name={`data.calipers.${i}.name`} label="Caliper" className="sm:col-span-2" placeholder="four-piston fixed caliper, left" />
      <FSelect name={`data.calipers.${i}.axle`} label="Axle" options={axleOptions} />
      <FSelect name={`data.calipers.${i}.type`} label="Type" options={options(caliperTypeLabels)} />
      <FLengthList
        name={`data.calipers.${i}.inboardMm`}
        label={type === 'fixed' ? 'Pistons, inboard side' : 'Pistons'}
        hint={listHint}
      />
      {type === 'fixed' && <FLengthList name={`data.calipers.${i}.outboardMm`} label="Pistons, outboard side" hint={listHint} />}
      <FSelect name={`data.calipers.${i}.mountType`} label="Mounting" options={options(mountTypeLabels)} />
      <FSelect
        name={`data.calipers.${i}.bleedScrewWhenFitted`}
        label="Bleed screw as fitted"
        options={[
          { value: '', label: 'Not checked' },
          { value: 'top', label: 'At the top' },
          { value: 'bottom', label: 'At the bottom' },
        ]}
      />
      <MoreFields summary="Mounting bolts, design rotor, pad">
        <FNum name={`data.calipers.${i}.mountSpacingMm`} label="Mounting bolt spacing" quantity="length" />
        <FText name={`data.calipers.${i}.mountThread`} label="Mounting bolt thread" placeholder="M10x1.25" />
        <FNum name={`data.calipers.${i}.designDiameterMm`} label="Made for rotor Ø" quantity="length" />
        <FNum name={`data.calipers.${i}.padHeightMm`} label="Pad height" quantity="length" />
        <FNum name={`data.calipers.${i}.designThicknessMinMm`} label="Rotor thickness from" quantity="length" />
        <FNum name={`data.calipers.${i}.designThicknessMaxMm`} label="Rotor thickness to" quantity="length" />
        <FText name={`data.calipers.${i}.notes`} label="Notes" className="sm:col-span-2" />
      </MoreFields>
    </ListRow>
  );
}

export function RotorsSection() {
  const { control } = useFormContext<FormValues>();
  const axle = useWatch<FormValues, 'axle'>({ name: 'axle' });
  const { fields, append, remove } = useFieldArray({ control, name: 'data.rotors' });
  return (
    <FormSection id="rotors" title="Rotors">
      {fields.map((f, i) => (
        <ListRow key={f.id} label={`Rotor ${i + 1}`} onRemove={() => remove(i)}>
          <FSelect name={`data.rotors.${i}.axle`} label="Axle" options={axleOptions} />
          <FText name={`data.rotors.${i}.partNumber`} label="Part number" />
          <FNum name={`data.rotors.${i}.diameterMm`} label="Diameter" quantity="length" />
          <FNum name={`data.rotors.${i}.thicknessMm`} label="Thickness" quantity="length" />
          <FCheck name={`data.rotors.${i}.vented`} label="Vented" />
          <FCheck name={`data.rotors.${i}.directional`} label="Directional vanes (left and right differ)" />
          <MoreFields summary="Hat height, friction ring, parking drum">
            <HatHeightHelp />
            <FNum name={`data.rotors.${i}.hatHeightMm`} label="Hat height" quantity="length" />
            <FNum name={`data.rotors.${i}.minThicknessMm`} label="Minimum thickness" quantity="length" />
            <FNum name={`data.rotors.${i}.frictionRingInnerDiameterMm`} label="Friction ring inner Ø" quantity="length" />
            <FNum name={`data.rotors.${i}.centreBoreMm`} label="Centre bore" quantity="length" />
            <FNum name={`data.rotors.${i}.parkingDrumDiameterMm`} label="Parking drum Ø (drum in hat)" quantity="length" />
            <FNum name={`data.rotors.${i}.massKg`} label="Mass" unit="kg" />
          </MoreFields>
          <FText name={`data.rotors.${i}.notes`} label="Notes" className="sm:col-span-2" />
        </ListRow>
      ))}
      <AddButton onClick={() => append(emptyRotor(axle || 'front'))} disabled={fields.length >= 4}>
        Add a rotor
      </AddButton>
    </FormSection>
  );
}

/** Swapyard's one convention for hat height, drawn: from the face on the hub to the ring's inboard face. */
function HatHeightHelp() {
  return (
    <figure className="sm:col-span-2 rounded-md border border-graphite/15 bg-paper-card p-2">
      <svg viewBox="0 0 240 110" className="h-auto w-full max-w-xs" role="img" aria-labelledby="hat-help-cap">
        <path d="M150 15 h14 v80 h-14 z" fill="#d9d2bf" stroke="#1d4d3a" />
        <path d="M150 40 h-70 v30 h70" fill="none" stroke="#1d4d3a" strokeWidth="3" />
        <path d="M80 40 v30" stroke="#1d4d3a" strokeWidth="3" />
        <text x="120" y="34" fontSize="10" textAnchor="middle" fill="#2b2b2b">
          friction ring
        </text>
        <line x1="80" y1="100" x2="164" y2="100" stroke="#b8892f" strokeWidth="2" markerEnd="url(#arr)" markerStart="url(#arr)" />
        <text x="122" y="96" fontSize="10" textAnchor="middle" fill="#7a5a14">
          hat height
        </text>
        <text x="170" y="58" fontSize="9" fill="#2b2b2b">
          face on the hub
        </text>
        <text x="72" y="58" fontSize="9" textAnchor="end" fill="#2b2b2b">
          inboard face
        </text>
        <defs>
          <marker id="arr" viewBox="0 0 6 6" refX="3" refY="3" markerWidth="5" markerHeight="5" orient="auto-start-reverse">
            <path d="M0 0 L6 3 L0 6 z" fill="#b8892f" />
          </marker>
        </defs>
      </svg>
      <figcaption id="hat-help-cap" className="text-xs text-graphite-soft">
        Hat height: from the face that sits on the hub to the friction ring’s inboard face (the face nearest the car), with a
        depth gauge across the ring.
      </figcaption>
    </figure>
  );
}
