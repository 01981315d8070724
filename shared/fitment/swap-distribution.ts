import type { BrakeCorner, SwapData } from '../schemas/swap-data';
import type { VehicleData } from '../schemas/vehicle';
import { DRUM_BRAKE_FACTORS, type AnyBrakeCorner } from './brakes';
import {
  analyseBrakeDistribution,
  PASSENGER_CAR_REFERENCE,
  type DistributionAnalysis,
  type DistributionInput,
  type LoadState,
} from './distribution-analysis';

// A swap record's brakes, as the brake computations take them, and what the record does to the car's
// lock order when the car's figures (a chassis' stock ones or a member's own) are known.

export type RecordCorners = { front: AnyBrakeCorner; rear: AnyBrakeCorner };

/** A record's brake corner as the brake computations take it: a drum without a stated brake factor gets its shoe type's usual one. */
export function fitmentCorner(corner: BrakeCorner, padMu: number): AnyBrakeCorner {
  if (corner.kind === 'drum') {
    return {
      kind: 'drum',
      wheelCylinderBoreMm: corner.wheelCylinderBoreMm,
      drumDiameterMm: corner.drumDiameterMm,
      brakeFactor: corner.brakeFactor ?? DRUM_BRAKE_FACTORS[corner.shoeType].brakeFactor,
    };
  }
  return { ...corner, padMu };
}

/** The record's corners before and after the swap, as the brake computations take them. */
export function recordCorners(data: SwapData): { before: RecordCorners; after: RecordCorners } | null {
  const b = data.brakes;
  if (!b) return null;
  return {
    before: { front: fitmentCorner(b.before.front, b.padMu), rear: fitmentCorner(b.before.rear, b.padMu) },
    after: {
      front: fitmentCorner(b.after.front, b.padMu),
      rear: fitmentCorner(b.after.rear, b.padMu),
    },
  };
}

const AXLES = ['front', 'rear'] as const;

function sameCorner(a: BrakeCorner, b: BrakeCorner): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/** The axles whose brakes a swap changes: where its brake figures differ before and after. */
export function brakeAxlesChanged(data: SwapData): Array<'front' | 'rear'> {
  const b = data.brakes;
  if (!b) return [];
  return AXLES.filter((axle) => !sameCorner(b.before[axle], b.after[axle]));
}

/**
 * The record's corners on a car that is not stock. After the swap: its brakes on the axles it changes, the
 * car's own on the others. Before it: the car's brakes as they are — or, on a car that already has this swap
 * fitted, the car without it (what the swap replaced on its axles).
 */
export function cornersOnCar(
  data: SwapData,
  asIs: RecordCorners,
  fittedHere = false,
): { before: RecordCorners; after: RecordCorners } | null {
  const own = recordCorners(data);
  if (!own) return null;
  const changed = brakeAxlesChanged(data);
  const pick = (axle: 'front' | 'rear', swapped: RecordCorners) => (changed.includes(axle) ? swapped[axle] : asIs[axle]);
  return {
    before: fittedHere ? { front: pick('front', own.before), rear: pick('rear', own.before) } : asIs,
    after: { front: pick('front', own.after), rear: pick('rear', own.after) },
  };
}

/** The stored figures as the analysis takes them: each load state with the car's wheelbase. */
export function vehicleStates(vehicle: VehicleData): Pick<DistributionInput, 'unladen' | 'laden' | 'tyreLoadedRadiusMm'> {
  const withWheelbase = (s: VehicleData['unladen']) => ({ ...s, wheelbaseMm: vehicle.wheelbaseMm });
  return {
    unladen: withWheelbase(vehicle.unladen),
    ...(vehicle.laden ? { laden: withWheelbase(vehicle.laden) } : {}),
    tyreLoadedRadiusMm: vehicle.tyreLoadedRadiusMm,
  };
}

// The analysis scans deceleration finely and costs milliseconds; the submission form asks for it on every
// keystroke (its live figures and its review checks), mostly with the same brakes and car. Keep the last one.
let last: { key: string; analysis: DistributionAnalysis } | null = null;

/**
 * Adhesion utilisation of the car before and after the swap, laden and unladen, with the car's own rear valve.
 * Callers with the same input share one result: treat it as read-only.
 */
export function swapDistribution(
  corners: { before: RecordCorners; after: RecordCorners },
  vehicle: VehicleData,
): DistributionAnalysis {
  const key = JSON.stringify([corners, vehicle]);
  if (last?.key === key) return last.analysis;
  const analysis = analyseBrakeDistribution({
    ...vehicleStates(vehicle),
    before: { ...corners.before, rearValve: vehicle.rearValve },
    after: { ...corners.after, rearValve: vehicle.rearValve },
  });
  last = { key, analysis };
  return analysis;
}

export type RearFirst = { state: LoadState; fromG: number; beforeFromG: number | null };

/** Which axle locks first, read off an analysis, in the terms the balance note and the review desk use. */
export type LockOrderReading = {
  /** one sentence: which way the balance moved and which axle locks first (the analysis' own) */
  sentence: string;
  /** load states in which the rear locks first after the change, from the lowest deceleration it does */
  rearFirst: RearFirst[];
  /** those where the change makes the rear lock first below the top of the reference band, or sooner than it did */
  madeRearFirstInBand: RearFirst[];
  /** the top of the reference band, g: below it the front should lock first */
  bandTopG: number;
  /** the highest deceleration looked at, g */
  maxG: number;
};

/** a rear-first point that moves by less than this is the same point, g */
const SAME_G = 0.005;

export function lockOrderOf(analysis: DistributionAnalysis): LockOrderReading {
  const bandTopG = PASSENGER_CAR_REFERENCE.frontAboveRear.toG;
  const final = analysis.after ?? analysis.before;
  const rearFirst: RearFirst[] = final.states
    .filter((s) => s.rearFirstFromG !== null)
    .map((s) => ({
      state: s.state,
      fromG: s.rearFirstFromG!,
      beforeFromG: analysis.after ? (analysis.before.states.find((b) => b.state === s.state)?.rearFirstFromG ?? null) : null,
    }));
  const madeRearFirstInBand = analysis.after
    ? rearFirst.filter((r) => r.fromG < bandTopG && (r.beforeFromG === null || r.fromG < r.beforeFromG - SAME_G))
    : [];
  return { sentence: analysis.summary, rearFirst, madeRearFirstInBand, bandTopG, maxG: analysis.maxDecelerationG };
}
