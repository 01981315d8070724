import { z } from 'zod';
import { costRouteSchema, machiningOperations, partKindSchema } from './enums';

// Version 1 of a revision's structured data, as every revision stored before version 2 holds it.
// Kept only so upgradeSwapData (swap-data-upgrade.ts) can read old rows; nothing writes it any more.

const text = (max: number) => z.string().trim().max(max);
const mm = z.number().positive().max(2000);
const mmOrZero = z.number().min(0).max(2000);

export const swapPartV1Schema = z.object({
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

export const adapterV1Schema = z.object({
  name: text(120).min(2, 'Name the adapter'),
  maker: text(80).default(''),
  partNumber: text(40).default(''),
  hardwareIncluded: z.array(text(120).min(1)).max(20).default([]),
  notes: text(500).default(''),
});

export const shimV1Schema = z.object({
  location: text(120).min(1, 'Say where the shim goes'),
  thicknessMm: z.number().positive().max(20),
  quantity: z.number().int().min(1).max(16),
});

export const spacerV1Schema = z.object({
  thicknessMm: z.number().positive().max(60),
  hubCentric: z.boolean(),
  mounting: z.enum(['slip_on', 'bolt_on']),
  quantity: z.number().int().min(1).max(8),
  notes: text(300).default(''),
});

export const rotorV1Schema = z.object({
  diameterMm: mm,
  thicknessMm: z.number().positive().max(60),
  vented: z.boolean(),
  partNumber: text(40).default(''),
  notes: text(300).default(''),
});

export const machiningStepV1Schema = z.object({
  operation: z.enum(machiningOperations),
  where: text(200).min(2, 'Say where the work is done'),
  required: z.boolean(),
  notes: text(500).default(''),
});

export const torqueSpecV1Schema = z.object({
  fastener: text(120).min(2, 'Name the fastener'),
  nm: z.number().positive().max(1000),
  notes: text(200).default(''),
});

export const testedWheelV1Schema = z.object({
  diameterIn: z.number().min(10).max(24),
  widthIn: z.number().min(4).max(13),
  offsetMm: z.number().min(-80).max(80),
  spacerMm: mmOrZero.max(60).default(0),
  radialClearanceMm: z.number().min(-50).max(200).optional(),
  spokeClearanceMm: z.number().min(-50).max(200).optional(),
  note: text(200).default(''),
});

export const wheelRequirementV1Schema = z.object({
  minDiameterIn: z.number().min(10).max(24),
  /** inner diameter of the wheel barrel at the caliper, on the smallest wheel that clears */
  barrelInnerDiameterMm: mm.optional(),
  /** how far the caliper reaches outward beyond the rotor edge */
  caliperRadialProjectionMm: mmOrZero.max(100),
  /** how far the caliper's outer face stands outboard of the hub face */
  caliperOutboardMm: z.number().min(-100).max(200),
  testedWheels: z.array(testedWheelV1Schema).max(20).default([]),
  notes: text(500).default(''),
});

export const brakeCornerV1Schema = z.object({
  pistonsPerSideMm: z.array(z.number().positive().max(80)).min(1).max(6),
  rotorDiameterMm: mm,
  padHeightMm: z.number().positive().max(120),
});

export const brakeFiguresV1Schema = z.object({
  linePressureBar: z.number().positive().max(300).default(50),
  padMu: z.number().positive().max(1).default(0.4),
  before: z.object({ front: brakeCornerV1Schema, rear: brakeCornerV1Schema }),
  after: z.object({ front: brakeCornerV1Schema, rear: brakeCornerV1Schema }),
});

export const costLineV1Schema = z.object({
  route: costRouteSchema,
  item: text(120).min(1, 'Name the item'),
  amountMinor: z.number().int().min(0).max(100_000_000),
});

export const swapDataV1Schema = z.object({
  title: text(120).min(8, 'A title of at least 8 characters'),
  summary: text(400).default(''),
  parts: z.array(swapPartV1Schema).min(1, 'List at least one part').max(40),
  adapter: adapterV1Schema.nullable().default(null),
  shims: z.array(shimV1Schema).max(20).default([]),
  /** centring gap the shims must fill, when measured */
  shimTargetMm: z.number().min(0).max(20).nullable().default(null),
  spacers: z.array(spacerV1Schema).max(4).default([]),
  rotors: z.array(rotorV1Schema).max(4).default([]),
  machining: z.array(machiningStepV1Schema).max(20).default([]),
  torque: z.array(torqueSpecV1Schema).max(30).default([]),
  wheel: wheelRequirementV1Schema.nullable().default(null),
  brakes: brakeFiguresV1Schema.nullable().default(null),
  currency: z
    .string()
    .regex(/^[A-Z]{3}$/, 'A three-letter currency code')
    .default('EUR'),
  costs: z.array(costLineV1Schema).max(60).default([]),
  installHours: z.number().min(0).max(200).nullable().default(null),
  difficulty: z.number().int().min(1).max(5).nullable().default(null),
  tools: z.array(text(80).min(1)).max(30).default([]),
  /** null when the axle has no parking brake */
  parkingBrakeKept: z.boolean().nullable().default(null),
});
export type SwapDataV1 = z.infer<typeof swapDataV1Schema>;
