import { z } from 'zod';
import { singleLine } from './text';

// The figures the brake-distribution analysis needs about a car: a chassis carries its stock figures,
// and a member's car in "my cars" may carry its own. Shapes match shared/fitment/distribution-analysis.ts,
// so the stored figures go into the analysis as they are.

const slope = z.number().min(0, 'Between 0 and 1').max(1, 'Between 0 and 1');
const kneeBar = z.number().positive('Above 0 bar').max(200, 'At most 200 bar');

/** What stands between the master cylinder and the rear brakes. */
export const rearValveSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('none') }),
  z.object({ kind: z.literal('proportioning'), kneeBar, slope }),
  /** a load-sensing valve moves its knee with the rear axle load: one knee per load state */
  z.object({ kind: z.literal('load-sensing'), kneeBarUnladen: kneeBar, kneeBarLaden: kneeBar, slope }),
  /** electronic brake-force distribution, modelled as keeping the rear below the front */
  z.object({ kind: z.literal('electronic') }),
]);
export type RearValve = z.infer<typeof rearValveSchema>;
export const rearValveKinds = ['none', 'proportioning', 'load-sensing', 'electronic'] as const;
export type RearValveKind = (typeof rearValveKinds)[number];

export const rearValveLabels: Record<RearValveKind, string> = {
  none: 'No valve: the rear gets the full line pressure',
  proportioning: 'Proportioning valve',
  'load-sensing': 'Load-sensing valve',
  electronic: 'Electronic distribution (with ABS)',
};

export const loadStateSchema = z.object({
  massKg: z.number().min(300, 'Between 300 and 6000 kg').max(6000, 'Between 300 and 6000 kg'),
  /** share of the standing weight on the front axle, 0..1 */
  frontStaticFraction: z.number().gt(0.2, 'Between 20 and 80 %').lt(0.8, 'Between 20 and 80 %'),
  /** centre of gravity above the ground */
  cgHeightMm: z.number().min(200, 'Between 200 and 1500 mm').max(1500, 'Between 200 and 1500 mm'),
});
export type LoadStateFigures = z.infer<typeof loadStateSchema>;

export const vehicleDataSchema = z
  .object({
    /** the car with its driver */
    unladen: loadStateSchema,
    /** the car at its permitted maximum mass; null when not known */
    laden: loadStateSchema.nullable().default(null),
    wheelbaseMm: z.number().min(1500, 'Between 1500 and 5000 mm').max(5000, 'Between 1500 and 5000 mm'),
    /** hub centre to the ground, per axle */
    tyreLoadedRadiusMm: z.object({
      front: z.number().min(150, 'Between 150 and 600 mm').max(600, 'Between 150 and 600 mm'),
      rear: z.number().min(150, 'Between 150 and 600 mm').max(600, 'Between 150 and 600 mm'),
    }),
    rearValve: rearValveSchema,
    /** where the figures come from */
    basis: singleLine().trim().max(300, 'At most 300 characters').default(''),
  })
  .superRefine((v, ctx) => {
    if (v.laden && v.laden.massKg < v.unladen.massKg)
      ctx.addIssue({ code: 'custom', path: ['laden', 'massKg'], message: 'The laden mass is below the unladen mass' });
    if (v.rearValve.kind === 'load-sensing' && v.rearValve.kneeBarLaden < v.rearValve.kneeBarUnladen)
      ctx.addIssue({
        code: 'custom',
        path: ['rearValve', 'kneeBarLaden'],
        message: 'A load-sensing valve opens further, not less, when laden',
      });
  });
export type VehicleData = z.infer<typeof vehicleDataSchema>;
export type VehicleDataInput = z.input<typeof vehicleDataSchema>;

/** A moderator sets a chassis' stock figures, or takes them away (null). */
export const chassisVehicleInputSchema = z.object({ vehicle: vehicleDataSchema.nullable() });
export type ChassisVehicleInput = z.infer<typeof chassisVehicleInputSchema>;

/** Which figures a computation used, so the page can say so. */
export type VehicleFigures = {
  vehicle: VehicleData;
  source: 'chassis' | 'car';
  /** e.g. "the Halden H31 stock figures" or "Green coupe’s own figures", to follow "worked out with" */
  label: string;
};

/** A chassis' stock figures, labelled for the page; null when the catalogue has none. */
export function chassisFigures(c: { make: string; model: string; vehicle: VehicleData | null }): VehicleFigures | null {
  return c.vehicle ? { vehicle: c.vehicle, source: 'chassis', label: `the ${c.make} ${c.model} stock figures` } : null;
}

/** A member's car's own figures, labelled for the page; null when the car uses its chassis' figures. */
export function carFigures(car: { nickname: string; vehicle: VehicleData | null }): VehicleFigures | null {
  return car.vehicle ? { vehicle: car.vehicle, source: 'car', label: `${car.nickname}’s own figures (my cars)` } : null;
}
