import type {
  FastenerKind,
  MachiningComponent,
  WheelOutcome,
  caliperTypes,
  drumShoeTypes,
  lubrications,
  mountTypes,
  parkingBrakeTypes,
  seatTypes,
  shimDirections,
  shimJoints,
  wheelMaterials,
} from './swap-data';

// The words the UI uses for the swap record's enumerations, in one place for the sheet, the form,
// the review desk and the e-mails.

type Labels<T extends readonly string[]> = Record<T[number], string>;

export const fastenerKindLabels: Record<FastenerKind, string> = {
  caliper_mount: 'Caliper mounting bolts',
  bracket_mount: 'Bracket or adapter bolts',
  guide_pin: 'Caliper guide pins',
  wheel: 'Wheel bolts or nuts',
  spacer_mount: 'Spacer-to-hub bolts or nuts',
  banjo: 'Brake hose banjo bolt',
  bleed_screw: 'Bleed screw',
  rotor_screw: 'Rotor retaining screw',
  suspension: 'Suspension fastener',
  other: 'Other fastener',
};

export const machiningComponentLabels: Record<MachiningComponent, string> = {
  knuckle: 'Knuckle or hub carrier',
  caliper_body: 'Caliper body',
  bracket: 'Bracket or adapter',
  hub: 'Hub',
  subframe: 'Subframe',
  dust_shield: 'Dust shield',
  wheel: 'Wheel',
  other: 'Other',
};

export const wheelOutcomeLabels: Record<WheelOutcome, string> = {
  fits: 'Fits',
  does_not_fit: 'Does not fit',
  fits_with_change: 'Fits with a change',
};

export const caliperTypeLabels: Labels<typeof caliperTypes> = {
  fixed: 'Fixed (opposed pistons)',
  floating: 'Floating (sliding)',
};
export const mountTypeLabels: Labels<typeof mountTypes> = {
  axial: 'Axial (bolts along the axle)',
  radial: 'Radial (bolts towards the axle)',
};
export const shimJointLabels: Labels<typeof shimJoints> = {
  bracket_to_knuckle: 'Between bracket and knuckle',
  caliper_to_bracket: 'Between caliper and bracket',
};
export const shimDirectionLabels: Labels<typeof shimDirections> = {
  axial: 'Axial: centres the caliper over the rotor',
  radial: 'Radial: lifts the caliper outward',
};
export const lubricationLabels: Labels<typeof lubrications> = {
  dry: 'Dry, clean threads',
  oiled: 'Oiled threads',
  thread_locker: 'Thread-locker',
  not_stated: 'Not stated',
};
export const seatTypeLabels: Labels<typeof seatTypes> = {
  cone60: '60° cone',
  ball: 'Ball (radius)',
  flat: 'Flat with washer',
  not_stated: 'Not stated',
};
export const wheelMaterialLabels: Labels<typeof wheelMaterials> = { steel: 'Steel', alloy: 'Alloy', not_stated: 'Not stated' };
export const parkingBrakeTypeLabels: Labels<typeof parkingBrakeTypes> = {
  none: 'No parking brake on this axle',
  drum_in_hat: 'Drum in the rotor hat',
  in_caliper: 'In the caliper',
  transmission: 'On the transmission',
  not_stated: 'Not stated',
};
export const drumShoeTypeLabels: Labels<typeof drumShoeTypes> = {
  leading_trailing: 'Leading–trailing',
  twin_leading: 'Twin leading',
  duo_servo: 'Duo-servo',
};

/** an axle in a label: "Front", "Rear" */
export const axleWord = (axle: 'front' | 'rear') => (axle === 'front' ? 'Front' : 'Rear');
