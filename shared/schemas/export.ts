import { z } from 'zod';
import { axleSchema, categorySchema } from './enums';
import { brakeCornerSchema, swapDataSchema } from './swap-data';
import { vehicleDataSchema } from './vehicle';
import { chassisWheelFasteningSchema } from './wheel-fastening';

// The open data: every approved swap at its current revision, as GET /api/export/swaps.json and .csv and the
// daily dump serve it. The licence travels with every file.

export const OPEN_DATA_LICENCE = {
  name: 'Creative Commons Attribution-ShareAlike 4.0 International',
  spdx: 'CC-BY-SA-4.0',
  url: 'https://creativecommons.org/licenses/by-sa/4.0/',
  attribution: 'Swapyard contributors',
} as const;

/** one line that names the licence and what it asks, as every export file states it */
export const licenceLine = (siteUrl: string) =>
  `Swapyard open data (${siteUrl}) by ${OPEN_DATA_LICENCE.attribution}, licensed under ${OPEN_DATA_LICENCE.name} (${OPEN_DATA_LICENCE.spdx}, ${OPEN_DATA_LICENCE.url}). Credit Swapyard and link each record's permalink; share what you build from it under the same licence.`;

const stockCornerSchema = z.intersection(brakeCornerSchema, z.object({ description: z.string() }));

/** the chassis a swap fits, with the figures the swap's checks read (hub, wheel bolts, stock wheel and brakes, vehicle) */
export const exportChassisSchema = z.object({
  slug: z.string(),
  make: z.string(),
  model: z.string(),
  code: z.string(),
  yearFrom: z.number().int(),
  yearTo: z.number().int().nullable(),
  lugCount: z.number().int(),
  pcdMm: z.number(),
  centreBoreMm: z.number(),
  wheelBoltThread: z.string(),
  stockWheel: z.object({ diameterIn: z.number(), widthIn: z.number(), offsetMm: z.number(), tyre: z.string() }),
  stockBrakes: z.object({ front: stockCornerSchema, rear: stockCornerSchema }),
  /** the stock figures the brake-distribution check reads (mass, axle load, centre of gravity, valve); null when unknown */
  vehicle: vehicleDataSchema.nullable(),
  /** the hub's wheel fastening the wheel-bolt check reads (thread depth, hole, hub material); null when unknown */
  wheelFastening: chassisWheelFasteningSchema.nullable(),
});

export const exportedSwapSchema = z.object({
  slug: z.string(),
  /** the address of this revision, which never changes */
  permalink: z.string(),
  axle: axleSchema,
  category: categorySchema,
  revision: z.object({ number: z.number().int(), approvedAt: z.string() }),
  author: z.string(),
  chassis: exportChassisSchema,
  /** the structured record (version 2); with `chassis` it holds every input of the swap's checks */
  record: swapDataSchema,
  /** the write-up, markdown */
  writeUp: z.string(),
});
export type ExportedSwap = z.infer<typeof exportedSwapSchema>;

export const swapExportSchema = z.object({
  licence: z.object({
    name: z.string(),
    spdx: z.string(),
    url: z.string(),
    attribution: z.string(),
    notice: z.string(),
  }),
  /** when the newest exported revision was approved (null when there is none): the same data gives the same file */
  asOf: z.string().nullable(),
  swaps: z.array(exportedSwapSchema),
  /** written last, once every swap is out */
  count: z.number().int(),
});
export type SwapExport = z.infer<typeof swapExportSchema>;
