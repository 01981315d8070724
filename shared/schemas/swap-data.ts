import { z } from 'zod';
import { axleSchema, costRouteSchema, machiningOperations, partKindSchema, type MachiningLevel } from './enums';
import { tyreSizeField } from './tyre-field';
import { fastenerSeats } from './wheel-fastening';

// The structured body of one swap revision, version 2. The seed, the submission form and the
// server all validate against this one schema. Revisions stored as version 1 are upgraded on
// read by upgradeSwapData (swap-data-upgrade.ts); nothing writes version 1 any more.

export const SWAP_DATA_VERSION = 2;

const text = (max: number) => z.string().trim().max(max);
const mm = z.number().positive().max(2000);
const mmOrZero = z.number().min(0).max(2000);
/** a short identifier a row keeps for life, so other rows (and a revision comparison) can point at it */
const rowId = z.string().regex(/^[a-z0-9][a-z0-9-]{0,39}$/, 'Lowercase letters, digits and hyphens');

export const swapPartSchema = z.object({
  /** catalogue part this line refers to; absent for a part proposed with the submission */
  partId: z.number().int().positive().optional(),
  role: text(60).min(1, 'Say what the part does in this swap'),
  kind: partKindSchema,
  name: text(120).min(2, 'Name the part'),
  maker: text(80).default(''),
  partNumbers: z.array(text(40).min(1)).max(12).default([]),
  cameOn: z.array(text(120).min(1)).max(20).default([]),
  quantity: z.number().int().min(1).max(16),
  notes: text(500).default(''),
});
export type SwapPart = z.infer<typeof swapPartSchema>;

export const adapterSchema = z.object({
  name: text(120).min(2, 'Name the adapter'),
  maker: text(80).default(''),
  partNumber: text(40).default(''),
  hardwareIncluded: z.array(text(120).min(1)).max(20).default([]),
  notes: text(500).default(''),
});

// ---------- calipers ----------

export const caliperTypes = ['fixed', 'floating'] as const;
export const pistonSides = ['inboard', 'outboard'] as const;
export const mountTypes = ['axial', 'radial'] as const;
export const bleedPositions = ['top', 'bottom'] as const;

export const pistonSchema = z.object({
  diameterMm: z.number().positive().max(80),
  side: z.enum(pistonSides),
});
export type Piston = z.infer<typeof pistonSchema>;

export const caliperSchema = z
  .object({
    axle: axleSchema,
    name: text(120).min(2, 'Name the caliper'),
    type: z.enum(caliperTypes),
    /** every piston with the side of the rotor it pushes from; a floating caliper's are all inboard */
    pistons: z.array(pistonSchema).min(1, 'List at least one piston').max(12),
    mount: z.object({
      type: z.enum(mountTypes),
      /** centre-to-centre distance of the two mounting bolts */
      spacingMm: mm.max(400).optional(),
      thread: text(30).default(''),
    }),
    /** the rotor the caliper was designed for */
    designRotor: z
      .object({
        diameterMm: mm.max(600).optional(),
        thicknessMinMm: z.number().positive().max(60).optional(),
        thicknessMaxMm: z.number().positive().max(60).optional(),
      })
      .default({}),
    padHeightMm: z.number().positive().max(120).optional(),
    /** how the caliper sits on the fitted rotor, for the caliper–rotor fit (each figure as measured or from the maker) */
    fit: z
      .object({
        /** how far the pad's outer edge sits inside the edge of the rotor the caliper was designed for */
        padEdgeStepMm: z.number().min(0).max(40),
        /** how far the bracket or adapter moves the caliper outward from its design position (negative: inward) */
        radialLiftMm: z.number().min(-60).max(60).default(0),
        /** from the caliper's mount face to its centre plane (half-way between the pad faces), positive outboard */
        centreFromMountMm: z.number().min(-150).max(150).optional(),
        /** from the hub face to the face the caliper mounts on, bracket fitted and before shims, positive inboard */
        mountFaceInboardMm: z.number().min(-150).max(250).optional(),
        /** which way a shim on the record's axial joint moves the caliper */
        shimMoves: z.enum(['outboard', 'inboard']).optional(),
      })
      .optional(),
    /** where the bleed screw ends up with the caliper fitted on this car; at the bottom the air stays in */
    bleedScrewWhenFitted: z.enum(bleedPositions).nullable().default(null),
    notes: text(300).default(''),
  })
  .superRefine((c, ctx) => {
    if (c.type === 'floating' && c.pistons.some((p) => p.side === 'outboard'))
      ctx.addIssue({ code: 'custom', path: ['pistons'], message: 'A floating caliper has its pistons on the inboard side only' });
    if (c.type === 'fixed' && !c.pistons.some((p) => p.side === 'outboard'))
      ctx.addIssue({ code: 'custom', path: ['pistons'], message: 'A fixed caliper has pistons on both sides' });
    const { thicknessMinMm: lo, thicknessMaxMm: hi } = c.designRotor;
    if (lo !== undefined && hi !== undefined && lo > hi)
      ctx.addIssue({
        code: 'custom',
        path: ['designRotor', 'thicknessMaxMm'],
        message: 'The largest thickness is below the smallest',
      });
  });
export type Caliper = z.infer<typeof caliperSchema>;

// ---------- rotors ----------

export const rotorSchema = z
  .object({
    axle: axleSchema,
    diameterMm: mm,
    thicknessMm: z.number().positive().max(60),
    minThicknessMm: z.number().positive().max(60).optional(),
    /**
     * Overall depth: from the face that sits against the hub to the friction ring's inboard face
     * (the face nearest the car). The ring's centre plane is hatHeight − thickness/2 inboard of the hub face.
     */
    hatHeightMm: z.number().positive().max(150).optional(),
    frictionRingInnerDiameterMm: mm.optional(),
    centreBoreMm: z.number().positive().max(200).optional(),
    vented: z.boolean(),
    directional: z.boolean().default(false),
    massKg: z.number().positive().max(40).optional(),
    /** drum-in-hat parking brake: the drum's inner diameter */
    parkingDrumDiameterMm: z.number().positive().max(400).optional(),
    partNumber: text(40).default(''),
    notes: text(300).default(''),
  })
  .superRefine((r, ctx) => {
    if (r.minThicknessMm !== undefined && r.minThicknessMm > r.thicknessMm)
      ctx.addIssue({ code: 'custom', path: ['minThicknessMm'], message: 'The minimum thickness is above the thickness' });
    if (r.frictionRingInnerDiameterMm !== undefined && r.frictionRingInnerDiameterMm >= r.diameterMm)
      ctx.addIssue({
        code: 'custom',
        path: ['frictionRingInnerDiameterMm'],
        message: 'The friction ring starts inside the rotor diameter',
      });
  });
export type Rotor = z.infer<typeof rotorSchema>;

// ---------- shims and spacers ----------

/** the joint a shim sits in: between the bracket and the knuckle (or hub carrier), or between the caliper and the bracket */
export const shimJoints = ['bracket_to_knuckle', 'caliper_to_bracket'] as const;
export const shimDirections = ['axial', 'radial'] as const;

export const shimSchema = z.object({
  joint: z.enum(shimJoints),
  /**
   * which way a shim in this joint moves the caliper: along the axle (axial, centres it over the rotor)
   * or away from it (radial, lifts it for a larger rotor). It follows the joint's bolts: shims under radial
   * mounting ears lift; shims on axial bolts centre.
   */
  direction: z.enum(shimDirections),
  thicknessMm: z.number().positive().max(20),
  quantity: z.number().int().min(1).max(16),
  notes: text(200).default(''),
});
export type Shim = z.infer<typeof shimSchema>;

/** the measured gap that centres the caliper over the rotor, and the joint whose shims fill it */
export const centringSchema = z.object({
  joint: z.enum(shimJoints),
  gapMm: z.number().min(0).max(20),
  /** bolt positions at that joint that each take a stack (two per caliper on most brackets, so four per axle) */
  positions: z.number().int().min(1).max(16),
});
export type Centring = z.infer<typeof centringSchema>;

export const spacerMaterials = ['aluminium', 'steel'] as const;

export const spacerSchema = z.object({
  axle: axleSchema,
  thicknessMm: z.number().positive().max(60),
  hubCentric: z.boolean(),
  mounting: z.enum(['slip_on', 'bolt_on']),
  material: z.enum(spacerMaterials).default('aluminium'),
  quantity: z.number().int().min(1).max(8),
  notes: text(300).default(''),
});
export type Spacer = z.infer<typeof spacerSchema>;

// ---------- machining ----------

export const machiningComponents = [
  'knuckle',
  'caliper_body',
  'bracket',
  'hub',
  'subframe',
  'dust_shield',
  'wheel',
  'other',
] as const;
export type MachiningComponent = (typeof machiningComponents)[number];
/** parts that carry braking or suspension loads: any work on them is structural, whatever the operation */
export const structuralComponents: ReadonlySet<MachiningComponent> = new Set([
  'knuckle',
  'caliper_body',
  'bracket',
  'hub',
  'subframe',
]);

export const machiningStepSchema = z.object({
  component: z.enum(machiningComponents),
  operation: z.enum(machiningOperations),
  where: text(200).min(2, 'Say where the work is done'),
  required: z.boolean(),
  /** depth or length of material removed, when it was measured */
  amountMm: z.number().positive().max(200).optional(),
  notes: text(500).default(''),
});
export type MachiningStep = z.infer<typeof machiningStepSchema>;

export function isStructural(step: Pick<MachiningStep, 'component'>): boolean {
  return structuralComponents.has(step.component);
}

// ---------- fasteners and torque ----------

export const fastenerKinds = [
  'caliper_mount',
  'bracket_mount',
  'guide_pin',
  'wheel',
  'spacer_mount',
  'banjo',
  'bleed_screw',
  'rotor_screw',
  'suspension',
  'other',
] as const;
export type FastenerKind = (typeof fastenerKinds)[number];

export const fastenerSchema = z.object({
  id: rowId,
  kind: z.enum(fastenerKinds),
  label: text(120).min(2, 'Name the fastener'),
  /** e.g. M12x1.5 or 1/2-20 UNF */
  thread: text(30).default(''),
  lengthMm: z.number().positive().max(300).optional(),
  /** ISO 898-1 property class (8.8, 10.9, 12.9) or a grade */
  propertyClass: text(12).default(''),
  quantity: z.number().int().min(1).max(64).optional(),
  /** wheel bolts and nuts: the seat of the head or nut, matched against each wheel's seat */
  seat: z.enum(fastenerSeats).optional(),
  /** ball seats: the sphere's radius */
  ballRadiusMm: z.number().positive().max(30).optional(),
});
export type Fastener = z.infer<typeof fastenerSchema>;

export const lubrications = ['dry', 'oiled', 'thread_locker', 'not_stated'] as const;

export const torqueSpecSchema = z.object({
  fastenerId: rowId,
  nm: z.number().positive().max(1000),
  lubrication: z.enum(lubrications).default('not_stated'),
  /** torque-angle tightening: the angle turned after the torque */
  angleDeg: z.number().positive().max(360).optional(),
  /** stretch bolts and nyloc nuts that must be replaced after loosening */
  singleUse: z.boolean().default(false),
  notes: text(200).default(''),
});
export type TorqueSpec = z.infer<typeof torqueSpecSchema>;

// ---------- wheels ----------

export const wheelOutcomes = ['fits', 'does_not_fit', 'fits_with_change'] as const;
export type WheelOutcome = (typeof wheelOutcomes)[number];
export const wheelMaterials = ['steel', 'alloy', 'not_stated'] as const;
export const seatTypes = ['cone60', 'ball', 'flat', 'not_stated'] as const;

export const profilePointSchema = z.object({ zMm: z.number().min(-400).max(400), rMm: z.number().min(0).max(500) });
export type ProfilePoint = z.infer<typeof profilePointSchema>;

export const testedWheelSchema = z
  .object({
    diameterIn: z.number().min(10).max(24),
    widthIn: z.number().min(4).max(13),
    offsetMm: z.number().min(-80).max(80),
    spacerMm: mmOrZero.max(60).default(0),
    outcome: z.enum(wheelOutcomes),
    /** what had to change for it to fit (required when the outcome says so) */
    change: text(200).default(''),
    material: z.enum(wheelMaterials).default('not_stated'),
    centreBoreMm: z.number().positive().max(200).optional(),
    seat: z.enum(seatTypes).default('not_stated'),
    /** ball seats: the sphere's radius (wheels are made for 12, 13 or 14 mm and the bolts must match) */
    ballRadiusMm: z.number().positive().max(30).optional(),
    /** wheel thickness at the fastener, from where its seat ends to the mounting face: what the fastener clamps */
    clampMm: z.number().positive().max(60).optional(),
    tyre: tyreSizeField.default(''),
    /** measured gap between caliper and barrel; negative = overlap */
    radialClearanceMm: z.number().min(-50).max(200).optional(),
    /** measured gap between caliper face and the spokes' back face; negative = overlap */
    spokeClearanceMm: z.number().min(-50).max(200).optional(),
    /** where the smallest gap was found and how it was measured */
    measuredWhere: text(200).default(''),
    /** the wheel's inside surface in the plane through the axle, mounting face at z = 0, outboard positive */
    insideProfile: z.array(profilePointSchema).max(40).optional(),
    note: text(200).default(''),
  })
  .superRefine((w, ctx) => {
    if (w.outcome === 'fits_with_change' && !w.change)
      ctx.addIssue({ code: 'custom', path: ['change'], message: 'Say what had to change for the wheel to fit' });
  });
export type TestedWheel = z.infer<typeof testedWheelSchema>;

export const wheelRequirementSchema = z.object({
  minDiameterIn: z.number().min(10).max(24),
  /** inner diameter of the wheel barrel at the caliper, on the smallest wheel that clears */
  barrelInnerDiameterMm: mm.optional(),
  /** how far the caliper reaches outward beyond the rotor edge */
  caliperRadialProjectionMm: mmOrZero.max(100),
  /** how far the caliper's outer face stands outboard of the hub face */
  caliperOutboardMm: z.number().min(-100).max(200),
  /** the caliper's silhouette swept around the axle, as (z, r) points in the plane through the axle */
  caliperOutline: z.array(profilePointSchema).max(40).optional(),
  testedWheels: z.array(testedWheelSchema).max(20).default([]),
  notes: text(500).default(''),
});
export type WheelRequirement = z.infer<typeof wheelRequirementSchema>;

// ---------- brake figures ----------

export const drumShoeTypes = ['leading_trailing', 'twin_leading', 'duo_servo'] as const;

export const discCornerSchema = z.object({
  kind: z.literal('disc'),
  /** pistons on ONE side of the rotor: all of a floating caliper's, one side of a fixed caliper's */
  pistonsPerSideMm: z.array(z.number().positive().max(80)).min(1).max(6),
  rotorDiameterMm: mm,
  padHeightMm: z.number().positive().max(120),
});
export const drumCornerSchema = z.object({
  kind: z.literal('drum'),
  wheelCylinderBoreMm: z.number().positive().max(60),
  drumDiameterMm: z.number().positive().max(500),
  shoeType: z.enum(drumShoeTypes),
  /** brake factor C*, when the maker gives one; otherwise the shoe type's usual value applies */
  brakeFactor: z.number().positive().max(15).optional(),
});
export const brakeCornerSchema = z.discriminatedUnion('kind', [discCornerSchema, drumCornerSchema]);
export type BrakeCorner = z.infer<typeof brakeCornerSchema>;
export type DiscCorner = z.infer<typeof discCornerSchema>;

export const brakeFiguresSchema = z.object({
  linePressureBar: z.number().positive().max(300).default(50),
  padMu: z.number().positive().max(1).default(0.4),
  before: z.object({ front: brakeCornerSchema, rear: brakeCornerSchema }),
  after: z.object({ front: brakeCornerSchema, rear: brakeCornerSchema }),
});
export type BrakeFigures = z.infer<typeof brakeFiguresSchema>;

// ---------- costs, parking brake ----------

export const costLineSchema = z.object({
  route: costRouteSchema,
  item: text(120).min(1, 'Name the item'),
  amountMinor: z.number().int().min(0).max(100_000_000),
});
export type CostLine = z.infer<typeof costLineSchema>;

export const parkingBrakeTypes = ['none', 'drum_in_hat', 'in_caliper', 'transmission', 'not_stated'] as const;
export const parkingBrakeSchema = z.object({
  type: z.enum(parkingBrakeTypes),
  /** the car's own parking brake still works after the swap */
  kept: z.boolean(),
});

// ---------- the record ----------

export const swapDataSchema = z
  .object({
    schemaVersion: z.literal(SWAP_DATA_VERSION),
    title: text(120).min(8, 'A title of at least 8 characters'),
    summary: text(400).default(''),
    parts: z.array(swapPartSchema).min(1, 'List at least one part').max(40),
    adapter: adapterSchema.nullable().default(null),
    calipers: z.array(caliperSchema).max(4).default([]),
    rotors: z.array(rotorSchema).max(4).default([]),
    shims: z.array(shimSchema).max(20).default([]),
    centring: centringSchema.nullable().default(null),
    spacers: z.array(spacerSchema).max(4).default([]),
    machining: z.array(machiningStepSchema).max(20).default([]),
    fasteners: z.array(fastenerSchema).max(30).default([]),
    torque: z.array(torqueSpecSchema).max(30).default([]),
    wheel: wheelRequirementSchema.nullable().default(null),
    brakes: brakeFiguresSchema.nullable().default(null),
    currency: z
      .string()
      .regex(/^[A-Z]{3}$/, 'A three-letter currency code')
      .default('EUR'),
    costs: z.array(costLineSchema).max(60).default([]),
    installHours: z.number().min(0).max(200).nullable().default(null),
    difficulty: z.number().int().min(1).max(5).nullable().default(null),
    tools: z.array(text(80).min(1)).max(30).default([]),
    /** null when the record does not say */
    parkingBrake: parkingBrakeSchema.nullable().default(null),
  })
  .superRefine((d, ctx) => {
    const ids = new Set<string>();
    d.fasteners.forEach((f, i) => {
      if (ids.has(f.id)) ctx.addIssue({ code: 'custom', path: ['fasteners', i, 'id'], message: 'Two fasteners share this id' });
      ids.add(f.id);
    });
    d.torque.forEach((t, i) => {
      if (!ids.has(t.fastenerId))
        ctx.addIssue({ code: 'custom', path: ['torque', i, 'fastenerId'], message: 'Pick one of the fasteners listed above' });
    });
  });
export type SwapData = z.infer<typeof swapDataSchema>;
export type SwapDataInput = z.input<typeof swapDataSchema>;

/**
 * none: no machining; minor: trimming or grinding of non-structural parts, or optional work;
 * major: required machining or drilling of non-structural parts; structural: any work on a part that
 * carries braking or suspension loads (knuckle, hub, caliper body, bracket, subframe).
 */
export function machiningLevel(steps: SwapData['machining']): MachiningLevel {
  if (steps.length === 0) return 'none';
  if (steps.some(isStructural)) return 'structural';
  const major = steps.some((s) => s.required && (s.operation === 'machine' || s.operation === 'drill'));
  return major ? 'major' : 'minor';
}

/** the record's rotors on one axle */
export const rotorsOn = (data: Pick<SwapData, 'rotors'>, axle: z.infer<typeof axleSchema>) =>
  data.rotors.filter((r) => r.axle === axle);
export const calipersOn = (data: Pick<SwapData, 'calipers'>, axle: z.infer<typeof axleSchema>) =>
  data.calipers.filter((c) => c.axle === axle);
