import { FitmentInputError, requireFinite, requireNonNegative, requirePositive } from './errors';

/**
 * Braking dynamics of a two-axle car (Limpert, *Brake Design and Safety*, ch. 7; the automotive handbooks'
 * braking chapter). z is the deceleration in g; χ = h / L; with a fixed front share Φ of the brake force
 * the front axle's adhesion utilisation is Φ z / (ψ + χ z) and the rear's (1 − Φ) z / (1 − ψ − χ z).
 */

/** NIST SP 811: standard acceleration of gravity, m/s². */
export const STANDARD_GRAVITY = 9.80665;

export interface DistributionVehicle {
  massKg: number;
  /** ψ: share of the static weight on the front axle, 0..1 exclusive */
  frontStaticFraction: number;
  cgHeightMm: number;
  wheelbaseMm: number;
}

export type LockingAxle = 'front' | 'rear' | 'together';

export interface ValveKnee {
  kneeBar: number;
  /** rear pressure rise per bar of input above the knee, 0..1 */
  slope: number;
}

/** Shares this close are the same to every decimal the product shows. */
const SAME = 1e-9;

interface Checked {
  massKg: number;
  psi: number;
  chi: number;
}

function checkVehicle(vehicle: DistributionVehicle): Checked {
  if (typeof vehicle !== 'object' || vehicle === null) throw new FitmentInputError('vehicle', 'vehicle is required');
  const massKg = requirePositive(vehicle.massKg, 'massKg');
  const psi = requireFinite(vehicle.frontStaticFraction, 'frontStaticFraction');
  if (psi <= 0 || psi >= 1) {
    throw new FitmentInputError('frontStaticFraction', `frontStaticFraction must be between 0 and 1, exclusive (got ${psi})`);
  }
  const h = requirePositive(vehicle.cgHeightMm, 'cgHeightMm');
  const wheelbase = requirePositive(vehicle.wheelbaseMm, 'wheelbaseMm');
  return { massKg, psi, chi: h / wheelbase };
}

function checkShare(frontShare: number): number {
  const share = requireFinite(frontShare, 'frontShare');
  if (share < 0 || share > 1) throw new FitmentInputError('frontShare', `frontShare must be between 0 and 1 (got ${share})`);
  return share;
}

/** Deceleration at which the rear axle carries no load any more (the car would pitch over its front wheels). */
function rearUnloadsAt(v: Checked): number {
  return (1 - v.psi) / v.chi;
}

function checkDeceleration(z: number, v: Checked, rearMustCarry: boolean): number {
  const value = requireNonNegative(z, 'z');
  const limit = rearUnloadsAt(v);
  if (value > limit || (rearMustCarry && value >= limit)) {
    throw new FitmentInputError('z', `z must be below ${limit.toFixed(3)} g, where the rear axle carries no load (got ${value})`);
  }
  return value;
}

/** Dynamic axle loads at deceleration z: N_f = m g (ψ + χ z), N_r = m g (1 − ψ − χ z). */
export function axleLoadsN(vehicle: DistributionVehicle, z: number): { frontN: number; rearN: number } {
  const v = checkVehicle(vehicle);
  const dec = checkDeceleration(z, v, false);
  const weight = v.massKg * STANDARD_GRAVITY;
  return { frontN: weight * (v.psi + v.chi * dec), rearN: weight * (1 - v.psi - v.chi * dec) };
}

/** Friction each axle needs at deceleration z when the front takes the fixed share Φ of the brake force. */
export function adhesionUtilisation(
  vehicle: DistributionVehicle,
  frontShare: number,
  z: number,
): { front: number; rear: number } {
  const v = checkVehicle(vehicle);
  const share = checkShare(frontShare);
  const dec = checkDeceleration(z, v, true);
  return {
    front: (share * dec) / (v.psi + v.chi * dec),
    rear: ((1 - share) * dec) / (1 - v.psi - v.chi * dec),
  };
}

/** The front share that makes both axles use the same friction at z: ψ + χ z. */
export function idealFrontShare(vehicle: DistributionVehicle, z: number): number {
  const v = checkVehicle(vehicle);
  const dec = checkDeceleration(z, v, false);
  return v.psi + v.chi * dec;
}

/**
 * Deceleration at which both axles reach the same utilisation with a fixed split: (Φ − ψ) / χ.
 * Below it the front locks first; above it the rear. Zero or less means the rear locks first at every deceleration.
 */
export function lockTogetherDeceleration(vehicle: DistributionVehicle, frontShare: number): number {
  const v = checkVehicle(vehicle);
  const share = checkShare(frontShare);
  return (share - v.psi) / v.chi;
}

/**
 * Which axle reaches its grip first at deceleration z. f_f > f_r exactly when Φ > ψ + χ z, so the comparison
 * with the ideal share also answers at z = 0, where both utilisations are still zero.
 */
export function firstToLock(vehicle: DistributionVehicle, frontShare: number, z: number): LockingAxle {
  adhesionUtilisation(vehicle, frontShare, z);
  const difference = frontShare - idealFrontShare(vehicle, z);
  if (Math.abs(difference) <= SAME) return 'together';
  return difference > 0 ? 'front' : 'rear';
}

/** Rear line pressure behind a proportioning valve: the input up to the knee, then the knee plus slope × the rest. */
export function proportionedPressureBar(inputBar: number, valve: ValveKnee): number {
  const input = requireNonNegative(inputBar, 'inputBar');
  if (typeof valve !== 'object' || valve === null) throw new FitmentInputError('valve', 'valve is required');
  const knee = requireNonNegative(valve.kneeBar, 'kneeBar');
  const slope = requireFinite(valve.slope, 'slope');
  if (slope < 0 || slope > 1) throw new FitmentInputError('slope', `slope must be between 0 and 1 (got ${slope})`);
  return input <= knee ? input : knee + slope * (input - knee);
}
