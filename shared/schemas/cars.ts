import { z } from 'zod';
import { singleLine } from './text';
import { vehicleDataSchema, type VehicleData, type VehicleFigures } from './vehicle';
import { tyreSizeField } from './tyre-field';
import type { ProfilePoint } from './swap-data';

export { tyreSizeField };
import { slugSchema } from './params';
import type { PlanFittedView } from './plans';
import type { RecordCorners } from '../fitment/swap-distribution';

// API contract of "my cars": a member's own cars, used to check swaps against their wheel.

/** Form fields arrive as numbers from JSON; an empty string means "not given". */
const num = (schema: z.ZodNumber, whenEmpty?: number) =>
  z.preprocess(
    (v) =>
      typeof v === 'string' ? (v.trim() === '' ? whenEmpty : Number(v.replace(',', '.'))) : v === undefined ? whenEmpty : v,
    schema,
  );

const carShape = {
  chassisId: num(z.number({ error: 'Pick the chassis' }).int().positive('Pick the chassis')),
  nickname: singleLine().trim().min(1, 'Give the car a name you will recognise').max(60, 'At most 60 characters'),
  wheelDiameterIn: num(
    z.number({ error: 'Enter the wheel diameter' }).min(10, 'Between 10 and 24 in').max(24, 'Between 10 and 24 in'),
  ),
  wheelWidthIn: num(z.number({ error: 'Enter the wheel width' }).min(4, 'Between 4 and 13 in').max(13, 'Between 4 and 13 in')),
  wheelOffsetMm: num(
    z.number({ error: 'Enter the offset (ET)' }).min(-80, 'Between −80 and 80 mm').max(80, 'Between −80 and 80 mm'),
  ),
  tyre: tyreSizeField,
  spacerMm: num(z.number().min(0, 'Between 0 and 60 mm').max(60, 'Between 0 and 60 mm')),
  /** the car's own brake-distribution figures; null: the chassis' stock figures apply */
  vehicle: vehicleDataSchema.nullable(),
  wheelInsideProfile: z
    .array(
      z.object({
        zMm: z
          .number({ error: 'Enter z in mm, outboard positive' })
          .min(-400, 'Between −400 and 400 mm')
          .max(400, 'Between −400 and 400 mm'),
        rMm: z.number({ error: 'Enter r in mm from the centre' }).min(0, 'A radius is 0 or more').max(500, 'At most 500 mm'),
      }),
    )
    .min(2, 'Measure at least two points: one on the barrel, one on the spokes’ back face')
    .max(40, 'At most 40 points')
    .superRefine((points, ctx) => {
      // One surface from the barrel inward (or the other way round): the radius never turns back.
      const inward = points.length > 1 && points[points.length - 1].rMm <= points[0].rMm;
      points.forEach((p, i) => {
        const before = points[i - 1];
        if (before && (inward ? p.rMm > before.rMm : p.rMm < before.rMm))
          ctx.addIssue({
            code: 'custom',
            path: [i, 'rMm'],
            message: `Radii run ${inward ? 'inward from the barrel' : 'outward to the barrel'}: this one turns back`,
          });
      });
    })
    .nullable(),
  /** approved swaps already fitted to the car: the car as it is */
  fittedSwapSlugs: z
    .array(slugSchema)
    .max(12, 'At most 12 fitted swaps')
    .refine((v) => new Set(v).size === v.length, 'A swap is listed twice'),
  otherChanges: z.string().trim().max(1000, 'At most 1,000 characters'),
};

export const carInputSchema = z.object({
  ...carShape,
  tyre: carShape.tyre.default(''),
  spacerMm: num(z.number().min(0, 'Between 0 and 60 mm').max(60, 'Between 0 and 60 mm'), 0),
  vehicle: carShape.vehicle.default(null),
  wheelInsideProfile: carShape.wheelInsideProfile.default(null),
  fittedSwapSlugs: carShape.fittedSwapSlugs.default([]),
  otherChanges: carShape.otherChanges.default(''),
});
export type CarInput = z.infer<typeof carInputSchema>;

/** PATCH: only the fields sent change (no defaults here, or a missing field would be reset). */
export const carUpdateSchema = z
  .object(carShape)
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Send at least one field to change' });
export type CarUpdate = z.infer<typeof carUpdateSchema>;

export const MAX_CARS = 20;

export type CarView = {
  id: number;
  nickname: string;
  chassis: { id: number; slug: string; make: string; model: string; code: string; yearFrom: number; yearTo: number | null };
  wheelDiameterIn: number;
  wheelWidthIn: number;
  wheelOffsetMm: number;
  tyre: string;
  spacerMm: number;
  /** the car's own brake-distribution figures, or null when the chassis' stock figures apply */
  vehicle: VehicleData | null;
  /** the wheel's inside in the plane through the axle (mounting face at z = 0, outboard positive); null until measured */
  wheelInsideProfile: ProfilePoint[] | null;
  /** approved swaps fitted to the car, at the revision fitted */
  fitted: PlanFittedView[];
  /**
   * the car's brakes as they are when a fitted swap changed them (the stock corners elsewhere), for a sheet's
   * brake balance to start from; null when the car's brakes are stock
   */
  brakesAsIs: RecordCorners | null;
  otherChanges: string;
  createdAt: string;
  updatedAt: string;
};

/**
 * Where a sheet's brake balance starts from: the stock car, or one of the reader's cars as it is (its own
 * figures when it has them, and its brakes with the swaps already fitted).
 */
export type BalanceStart = {
  key: string;
  /** follows "Worked out for" */
  label: string;
  figures: VehicleFigures | null;
  brakesAsIs: RecordCorners | null;
  /** titles of the other swaps fitted to the car */
  fittedTitles: string[];
  /** the car already has this swap fitted: "before" is the car without it */
  fittedHere: boolean;
};

/** GET /api/cars */
export type CarList = { items: CarView[] };
