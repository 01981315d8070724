import { FitmentInputError, requirePositive } from './errors';

export const DEFAULT_PAD_MU = 0.4;
export const DEFAULT_LINE_PRESSURE_BAR = 50;
const N_PER_MM2_PER_BAR = 0.1;

export interface BrakeCorner {
  kind?: 'disc';
  /** pistons on ONE side of the rotor: all of a floating caliper's, half of an opposed caliper's */
  pistonsPerSideMm: number[];
  rotorDiameterMm: number;
  padHeightMm: number;
  padMu?: number;
  /** from the real pad position (caliper-fit.ts) when known; otherwise (D − h)/2 */
  effectiveRadiusMm?: number;
}

/** A drum corner: the brake factor C* already holds the lining friction and the shoes' self-servo. */
export interface DrumCorner {
  kind: 'drum';
  wheelCylinderBoreMm: number;
  drumDiameterMm: number;
  brakeFactor: number;
}

export type AnyBrakeCorner = BrakeCorner | DrumCorner;

export type DrumShoeArrangement = 'leading_trailing' | 'twin_leading' | 'duo_servo';

export interface DrumBrakeTorqueInput {
  wheelCylinderBoreMm: number;
  drumDiameterMm: number;
  brakeFactor: number;
  linePressureBar: number;
}

const LIMPERT_FROM_MEMORY =
  'Limpert, Brake Design and Safety (SAE), brake factor against lining friction for a lining μ of about 0.38; from memory, not checked against the printed figure';

/**
 * Typical brake factors C* by shoe arrangement. A measured or published value for the actual brake replaces these;
 * duo-servo brakes in particular swing widely with lining friction.
 */
export const DRUM_BRAKE_FACTORS: Record<DrumShoeArrangement, { brakeFactor: number; label: string; source: string }> = {
  leading_trailing: { brakeFactor: 2.0, label: 'Leading/trailing shoe', source: LIMPERT_FROM_MEMORY },
  twin_leading: { brakeFactor: 3.0, label: 'Twin leading shoe', source: LIMPERT_FROM_MEMORY },
  duo_servo: { brakeFactor: 5.0, label: 'Duo-servo', source: `${LIMPERT_FROM_MEMORY}; very sensitive to lining friction` },
};

export const DRUM_TORQUE_RULE = 'T = p × A_wc × C* × r_drum (Limpert, Brake Design and Safety, drum brake torque)';
export const MAX_BRAKE_FACTOR = 20;

export interface BrakeTorqueInput {
  pistonsPerSideMm: number[];
  rotorDiameterMm: number;
  padHeightMm: number;
  padMu: number;
  linePressureBar: number;
  effectiveRadiusMm?: number;
}

export interface AxlePair {
  front: AnyBrakeCorner;
  rear: AnyBrakeCorner;
}

function areaOf(pistons: number[], field: string): number {
  if (!Array.isArray(pistons) || pistons.length === 0) {
    throw new FitmentInputError(field, `${field} must list at least one piston diameter`);
  }
  return pistons.reduce((sum, d, i) => {
    const dia = requirePositive(d, `${field}.${i}`);
    return sum + (Math.PI * dia * dia) / 4;
  }, 0);
}

function radiusOf(rotorDiameterMm: number, padHeightMm: number, prefix: string): number {
  const rotor = requirePositive(rotorDiameterMm, `${prefix}rotorDiameterMm`);
  const pad = requirePositive(padHeightMm, `${prefix}padHeightMm`);
  if (pad >= rotor / 2) {
    throw new FitmentInputError(
      `${prefix}padHeightMm`,
      `${prefix}padHeightMm (${pad}) must be less than the rotor radius (${rotor / 2})`,
    );
  }
  return (rotor - pad) / 2;
}

function muOf(mu: unknown, field: string): number {
  const value = requirePositive(mu, field);
  if (value > 1) throw new FitmentInputError(field, `${field} must be at most 1 (got ${value})`);
  return value;
}

function torqueOf(
  corner: { pistonsPerSideMm: number[]; rotorDiameterMm: number; padHeightMm: number; effectiveRadiusMm?: number },
  mu: number,
  pressureBar: number,
  prefix: string,
): number {
  const area = areaOf(corner?.pistonsPerSideMm, `${prefix}pistonsPerSideMm`);
  const estimate = radiusOf(corner.rotorDiameterMm, corner.padHeightMm, prefix);
  const radius =
    corner.effectiveRadiusMm === undefined ? estimate : givenRadius(corner.effectiveRadiusMm, corner.rotorDiameterMm, prefix);
  const padForceN = pressureBar * N_PER_MM2_PER_BAR * area;
  return (2 * mu * padForceN * radius) / 1000;
}

function givenRadius(radiusMm: number, rotorDiameterMm: number, prefix: string): number {
  const radius = requirePositive(radiusMm, `${prefix}effectiveRadiusMm`);
  if (radius >= rotorDiameterMm / 2) {
    throw new FitmentInputError(
      `${prefix}effectiveRadiusMm`,
      `${prefix}effectiveRadiusMm (${radius}) must be less than the rotor radius (${rotorDiameterMm / 2})`,
    );
  }
  return radius;
}

function drumTorqueOf(corner: DrumCorner, pressureBar: number, prefix: string): number {
  const bore = requirePositive(corner?.wheelCylinderBoreMm, `${prefix}wheelCylinderBoreMm`);
  const drum = requirePositive(corner.drumDiameterMm, `${prefix}drumDiameterMm`);
  const factor = requirePositive(corner.brakeFactor, `${prefix}brakeFactor`);
  if (bore >= drum) {
    throw new FitmentInputError(
      `${prefix}wheelCylinderBoreMm`,
      `${prefix}wheelCylinderBoreMm (${bore}) must be smaller than the drum (${drum})`,
    );
  }
  if (factor > MAX_BRAKE_FACTOR) {
    throw new FitmentInputError(
      `${prefix}brakeFactor`,
      `${prefix}brakeFactor must be at most ${MAX_BRAKE_FACTOR} (got ${factor})`,
    );
  }
  const wheelCylinderForceN = pressureBar * N_PER_MM2_PER_BAR * ((Math.PI * bore * bore) / 4);
  return (wheelCylinderForceN * factor * (drum / 2)) / 1000;
}

function cornerTorqueOf(corner: AnyBrakeCorner, pressureBar: number, prefix: string): number {
  if (corner?.kind === 'drum') return drumTorqueOf(corner, pressureBar, prefix);
  const disc = corner as BrakeCorner;
  return torqueOf(disc, muOf(disc?.padMu ?? DEFAULT_PAD_MU, `${prefix}padMu`), pressureBar, prefix);
}

/** Drum brake torque per wheel in N·m: T = p × A_wc × C* × r_drum. */
export function drumBrakeTorqueNm(input: DrumBrakeTorqueInput): number {
  const pressure = requirePositive(input?.linePressureBar, 'linePressureBar');
  return drumTorqueOf({ kind: 'drum', ...input }, pressure, '');
}

/** Torque of one corner, disc or drum, at a line pressure (disc corners use their padMu, else the default). */
export function cornerTorqueNm(corner: AnyBrakeCorner, linePressureBar = DEFAULT_LINE_PRESSURE_BAR): number {
  return cornerTorqueOf(corner, requirePositive(linePressureBar, 'linePressureBar'), '');
}

export function pistonAreaPerSideMm2(pistonsPerSideMm: number[]): number {
  return areaOf(pistonsPerSideMm, 'pistonsPerSideMm');
}

/** Clamp force of one pad: line pressure on the pistons of one side. */
export function padForceN(pistonsPerSideMm: number[], linePressureBar: number): number {
  const pressure = requirePositive(linePressureBar, 'linePressureBar');
  return pressure * N_PER_MM2_PER_BAR * areaOf(pistonsPerSideMm, 'pistonsPerSideMm');
}

/** Pad centre when the pad's outer edge sits at the rotor edge. */
export function effectiveRadiusMm(rotorDiameterMm: number, padHeightMm: number): number {
  return radiusOf(rotorDiameterMm, padHeightMm, '');
}

/** Alternative friction-radius model for a new pad under uniform pressure. */
export function uniformPressureRadiusMm(outerRadiusMm: number, innerRadiusMm: number): number {
  const ro = requirePositive(outerRadiusMm, 'outerRadiusMm');
  const ri = requirePositive(innerRadiusMm, 'innerRadiusMm');
  if (ri >= ro) {
    throw new FitmentInputError('innerRadiusMm', `innerRadiusMm (${ri}) must be less than outerRadiusMm (${ro})`);
  }
  return ((2 / 3) * (ro ** 3 - ri ** 3)) / (ro ** 2 - ri ** 2);
}

/** Torque per wheel in N·m: two pad faces, each pressed with p × A, acting at r_eff. */
export function brakeTorqueNm(input: BrakeTorqueInput): number {
  const mu = muOf(input?.padMu, 'padMu');
  const pressure = requirePositive(input.linePressureBar, 'linePressureBar');
  return torqueOf(input, mu, pressure, '');
}

/** Static share of brake torque on the front axle (0..1), equal line pressure front and rear. */
export function frontShare(front: AnyBrakeCorner, rear: AnyBrakeCorner, linePressureBar = DEFAULT_LINE_PRESSURE_BAR): number {
  return shareOf(front, rear, linePressureBar, '');
}

function shareOf(front: AnyBrakeCorner, rear: AnyBrakeCorner, linePressureBar: number, prefix: string): number {
  const pressure = requirePositive(linePressureBar, 'linePressureBar');
  const frontTorque = cornerTorqueOf(front, pressure, `${prefix}front.`);
  const rearTorque = cornerTorqueOf(rear, pressure, `${prefix}rear.`);
  return frontTorque / (frontTorque + rearTorque);
}

/** Change of front share in percentage points (positive: more front bias after). */
export function balanceShift(before: AxlePair, after: AxlePair): number {
  const shareBefore = shareOf(before?.front, before?.rear, DEFAULT_LINE_PRESSURE_BAR, 'before.');
  const shareAfter = shareOf(after?.front, after?.rear, DEFAULT_LINE_PRESSURE_BAR, 'after.');
  return (shareAfter - shareBefore) * 100;
}
