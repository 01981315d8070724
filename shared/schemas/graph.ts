import { z } from 'zod';
import { axleSchema, partKindSchema } from './enums';
import { normalisePartNumber } from '../search/normalise';

// The interchange graph: catalogue parts joined to the chassis they fit through approved swaps.
// Answers of GET /api/graph/parts/:id, /api/graph/chassis/:slug and /api/graph/where-else.

export const chassisRefSchema = z.object({
  slug: z.string(),
  make: z.string(),
  model: z.string(),
  code: z.string(),
  yearFrom: z.number().int(),
  yearTo: z.number().int().nullable(),
});
export type ChassisRef = z.infer<typeof chassisRefSchema>;

export const partRefSchema = z.object({
  id: z.number().int(),
  slug: z.string(),
  kind: partKindSchema,
  name: z.string(),
  maker: z.string(),
  partNumbers: z.array(z.string()),
});
export type PartRef = z.infer<typeof partRefSchema>;

export const donorPartSchema = partRefSchema.extend({
  /** vehicles the part came on, as the catalogue records them */
  cameOn: z.array(z.string()),
});
export type DonorPart = z.infer<typeof donorPartSchema>;

/** one approved swap, at its current revision, that shows how a part fits */
export const swapLinkSchema = z.object({
  slug: z.string(),
  title: z.string(),
  axle: axleSchema,
  revisionNumber: z.number().int(),
  adapter: z.object({ name: z.string(), maker: z.string(), partNumber: z.string() }).nullable(),
  /** the catalogue record the swap's part line points at */
  partId: z.number().int(),
});
export type SwapLink = z.infer<typeof swapLinkSchema>;

/** how many swaps one list of links stands for; lists are cut at `shown` */
const listedSchema = { swapCount: z.number().int(), swaps: z.array(swapLinkSchema) };

/** one chassis a part reaches, with the swaps that fit it there and the catalogue adapters they use */
export const fitGroupSchema = z.object({
  chassis: chassisRefSchema,
  ...listedSchema,
  adapters: z.array(partRefSchema),
});
export type FitGroup = z.infer<typeof fitGroupSchema>;

/** every chassis and swap the part reaches; `fits` / `reaches` list the chassis with most swaps first, cut at 48 */
export const graphTotalsSchema = z.object({ chassis: z.number().int(), swaps: z.number().int() });
export type GraphTotals = z.infer<typeof graphTotalsSchema>;

export const numberSources = ['number', 'stamp'] as const;
/** a number a catalogue record carries (`number`) or its notes name as an older stamp (`stamp`) */
export const recordedNumberSchema = z.object({
  number: z.string(),
  partId: z.number().int(),
  source: z.enum(numberSources),
});
export type RecordedNumber = z.infer<typeof recordedNumberSchema>;

export const partGraphSchema = z.object({
  part: donorPartSchema,
  /** other catalogue records of the same part (they share a number) */
  sameAs: z.array(donorPartSchema),
  /** every number the part is known by across those records, its own first */
  numbers: z.array(recordedNumberSchema),
  /** vehicles it came on, across those records */
  cameOn: z.array(z.string()),
  fits: z.array(fitGroupSchema),
  totals: graphTotalsSchema,
});
export type PartGraph = z.infer<typeof partGraphSchema>;

export const chassisDonorSchema = z.object({ part: donorPartSchema, ...listedSchema });
export type ChassisDonor = z.infer<typeof chassisDonorSchema>;

export const chassisGraphSchema = z.object({
  chassis: chassisRefSchema,
  /** in the catalogue's order of kinds; a kind no swap uses is left out */
  kinds: z.array(z.object({ kind: partKindSchema, partCount: z.number().int(), parts: z.array(chassisDonorSchema) })),
  totals: z.object({ parts: z.number().int(), swaps: z.number().int() }),
});
export type ChassisGraph = z.infer<typeof chassisGraphSchema>;

export const whereElseQuerySchema = z.object({
  number: z
    .string()
    .trim()
    .min(1, 'Type a part number')
    .max(60, 'A part number is at most 60 characters')
    .refine((v) => normalisePartNumber(v).length > 0, 'A part number has letters or digits'),
});

export const whereElseSchema = z.object({
  /** as typed, and as compared (case and separators ignored) */
  number: z.string(),
  key: z.string(),
  /** catalogue records of the part: those carrying the number, and those recorded as the same part */
  parts: z.array(donorPartSchema.extend({ matched: z.enum(['number', 'stamp', 'same_part']) })),
  /** the other numbers recorded for the same part (the typed one left out) */
  otherNumbers: z.array(recordedNumberSchema),
  cameOn: z.array(z.string()),
  reaches: z.array(fitGroupSchema),
  totals: graphTotalsSchema,
});
export type WhereElse = z.infer<typeof whereElseSchema>;
