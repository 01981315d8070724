import { z } from 'zod';
import { costRouteSchema, machiningOperations, partKindSchema, type MachiningLevel } from './enums';

// The structured body of one swap revision. The seed, the submission form and the
// server all validate against this one schema.

const text = (max: number) => z.string().trim().max(max);
const mm = z.number().positive().max(2000);
const mmOrZero = z.number().min(0).max(2000);

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

export const shimSchema = z.object({
  location: text(120).min(1, 'Say where the shim goes'),
  thicknessMm: z.number().positive().max(20),
  quantity: z.number().int().min(1).max(16),
});

export const spacerSchema = z.object({
  thicknessMm: z.number().positive().max(60),
  hubCentric: z.boolean(),
  mounting: z.enum(['slip_on', 'bolt_on']),
  quantity: z.number().int().min(1).max(8),
  notes: text(300).default(''),
});

export const rotorSchema = z.object({
  diameterMm: mm,
  thicknessMm: z.number().positive().max(60),
  vented: z.boolean(),
  partNumber: text(40).default(''),
  notes: text(300).default(''),
});

export const machiningStepSchema = z.object({
  operation: z.enum(machiningOperations),
  where: text(200).min(2, 'Say where the work is done'),
  required: z.boolean(),
  notes: text(500).default(''),
});

export const torqueSpecSchema = z.object({
  fastener: text(120).min(2, 'Name the fastener'),
  nm: z.number().positive().max(1000),
  notes: text(200).default(''),
});

export const testedWheelSchema = z.object({
  diameterIn: z.number().min(10).max(24),
  widthIn: z.number().min(4).max(13),
  offsetMm: z.number().min(-80).max(80),
  spacerMm: mmOrZero.max(60).default(0),
  radialClearanceMm: z.number().min(-50).max(200).optional(),
  spokeClearanceMm: z.number().min(-50).max(200).optional(),
  note: text(200).default(''),
});

export const wheelRequirementSchema = z.object({
  minDiameterIn: z.number().min(10).max(24),
  /** inner diameter of the wheel barrel at the caliper, on the smallest wheel that clears */
  barrelInnerDiameterMm: mm.optional(),
  /** how far the caliper reaches outward beyond the rotor edge */
  caliperRadialProjectionMm: mmOrZero.max(100),
  /** how far the caliper's outer face stands outboard of the hub face */
  caliperOutboardMm: z.number().min(-100).max(200),
  testedWheels: z.array(testedWheelSchema).max(20).default([]),
  notes: text(500).default(''),
});

export const brakeCornerSchema = z.object({
  pistonsPerSideMm: z.array(z.number().positive().max(80)).min(1).max(6),
  rotorDiameterMm: mm,
  padHeightMm: z.number().positive().max(120),
});
export type BrakeCorner = z.infer<typeof brakeCornerSchema>;

export const brakeFiguresSchema = z.object({
  linePressureBar: z.number().positive().max(300).default(50),
  padMu: z.number().positive().max(1).default(0.4),
  before: z.object({ front: brakeCornerSchema, rear: brakeCornerSchema }),
  after: z.object({ front: brakeCornerSchema, rear: brakeCornerSchema }),
});

export const costLineSchema = z.object({
  route: costRouteSchema,
  item: text(120).min(1, 'Name the item'),
  amountMinor: z.number().int().min(0).max(100_000_000),
});
export type CostLine = z.infer<typeof costLineSchema>;

export const swapDataSchema = z.object({
  title: text(120).min(8, 'A title of at least 8 characters'),
  summary: text(400).default(''),
  parts: z.array(swapPartSchema).min(1, 'List at least one part').max(40),
  adapter: adapterSchema.nullable().default(null),
  shims: z.array(shimSchema).max(20).default([]),
  /** centring gap the shims must fill, when measured */
  shimTargetMm: z.number().min(0).max(20).nullable().default(null),
  spacers: z.array(spacerSchema).max(4).default([]),
  rotors: z.array(rotorSchema).max(4).default([]),
  machining: z.array(machiningStepSchema).max(20).default([]),
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
  /** null when the axle has no parking brake */
  parkingBrakeKept: z.boolean().nullable().default(null),
});
export type SwapData = z.infer<typeof swapDataSchema>;
export type SwapDataInput = z.input<typeof swapDataSchema>;

/** none: no machining; minor: only grinding/trimming or optional work; major: required machining or drilling */
export function machiningLevel(steps: SwapData['machining']): MachiningLevel {
  if (steps.length === 0) return 'none';
  const major = steps.some((s) => s.required && (s.operation === 'machine' || s.operation === 'drill'));
  return major ? 'major' : 'minor';
}
