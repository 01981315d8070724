import { FitmentInputError, requirePositive } from './errors';

export const DEFAULT_PAD_MU = 0.4;
export const DEFAULT_LINE_PRESSURE_BAR = 50;
const N_PER_MM2_PER_BAR = 0.1;

export interface BrakeCorner {
  /** pistons on ONE side of the rotor: all of a floating caliper's, half of an opposed caliper's */
  pistonsPerSideMm: number[];
  rotorDiameterMm: number;
  padHeightMm: number;
  padMu?: number;
}

export interface BrakeTorqueInput {
  pistonsPerSideMm: number[];
  rotorDiameterMm: number;
  padHeightMm: number;
  padMu: number;
  linePressureBar: number;
}

export interface AxlePair {
  front: BrakeCorner;
  rear: BrakeCorner;
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
  corner: { pistonsPerSideMm: number[]; rotorDiameterMm: number; padHeightMm: number },
  mu: number,
  pressureBar: number,
  prefix: string,
): number {
  const area = areaOf(corner?.pistonsPerSideMm, `${prefix}pistonsPerSideMm`);
  const radius = radiusOf(corner.rotorDiameterMm, corner.padHeightMm, prefix);
  const padForceN = pressureBar * N_PER_MM2_PER_BAR * area;
  return (2 * mu * padForceN * radius) / 1000;
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
export function frontShare(front: BrakeCorner, rear: BrakeCorner, linePressureBar = DEFAULT_LINE_PRESSURE_BAR): number {
  return shareOf(front, rear, linePressureBar, '');
}

function shareOf(front: BrakeCorner, rear: BrakeCorner, linePressureBar: number, prefix: string): number {
  const pressure = requirePositive(linePressureBar, 'linePressureBar');
  const frontTorque = torqueOf(front, muOf(front?.padMu ?? DEFAULT_PAD_MU, `${prefix}front.padMu`), pressure, `${prefix}front.`);
  const rearTorque = torqueOf(rear, muOf(rear?.padMu ?? DEFAULT_PAD_MU, `${prefix}rear.padMu`), pressure, `${prefix}rear.`);
  return frontTorque / (frontTorque + rearTorque);
}

/** Change of front share in percentage points (positive: more front bias after). */
export function balanceShift(before: AxlePair, after: AxlePair): number {
  const shareBefore = shareOf(before?.front, before?.rear, DEFAULT_LINE_PRESSURE_BAR, 'before.');
  const shareAfter = shareOf(after?.front, after?.rear, DEFAULT_LINE_PRESSURE_BAR, 'after.');
  return (shareAfter - shareBefore) * 100;
}
