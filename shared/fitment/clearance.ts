import { FitmentInputError, requireFinite, requireNonNegative, requirePositive } from './errors';
import { MM_PER_IN } from './units';

export const MIN_CLEARANCE_MM = 3;

export const RADIAL_CLEARANCE_RULE = 'At least 3 mm (about 1/8 in) between the caliper and the wheel barrel (common practice)';
export const SPOKE_CLEARANCE_RULE = 'At least 3 mm (about 1/8 in) between the caliper and the spokes (common practice)';
export const MAX_ROTOR_RULE =
  "Max rotor diameter ≈ wheel diameter − 4 in for typical four- and six-piston calipers (advisory; the wheel maker's clearance template governs)";

export interface ClearanceResult {
  clearanceMm: number;
  marginMm: number;
  ok: boolean;
  rule: string;
}

export interface RadialClearanceInput {
  barrelInnerDiameterMm: number;
  rotorDiameterMm: number;
  /** how far the caliper reaches outward beyond the rotor edge */
  caliperRadialProjectionMm: number;
}

export interface SpokeClearanceInput {
  /** how far the spoke's inner face stands outboard of the hub mounting face */
  spokeInsetMm: number;
  /** how far the caliper's outermost face stands outboard of the hub mounting face */
  caliperOutboardMm: number;
  spacerMm?: number;
}

function result(clearanceMm: number, rule: string): ClearanceResult {
  const marginMm = clearanceMm - MIN_CLEARANCE_MM;
  return { clearanceMm, marginMm, ok: marginMm >= -1e-9, rule };
}

export function radialClearance(input: RadialClearanceInput): ClearanceResult {
  const barrel = requirePositive(input?.barrelInnerDiameterMm, 'barrelInnerDiameterMm');
  const rotor = requirePositive(input.rotorDiameterMm, 'rotorDiameterMm');
  const projection = requireNonNegative(input.caliperRadialProjectionMm, 'caliperRadialProjectionMm');
  return result(barrel / 2 - (rotor / 2 + projection), RADIAL_CLEARANCE_RULE);
}

// A spacer pushes the spokes outboard by its thickness; the caliper stays put.
export function spokeClearance(input: SpokeClearanceInput): ClearanceResult {
  const inset = requireFinite(input?.spokeInsetMm, 'spokeInsetMm');
  const caliper = requireFinite(input.caliperOutboardMm, 'caliperOutboardMm');
  const spacer = requireNonNegative(input.spacerMm ?? 0, 'spacerMm');
  return result(inset + spacer - caliper, SPOKE_CLEARANCE_RULE);
}

/** Advisory only, see MAX_ROTOR_RULE. */
export function maxRotorRuleOfThumbMm(wheelDiameterIn: number): number {
  const wheel = requirePositive(wheelDiameterIn, 'wheelDiameterIn');
  if (wheel <= 4) {
    throw new FitmentInputError('wheelDiameterIn', `wheelDiameterIn must be more than 4 in (got ${wheel})`);
  }
  return (wheel - 4) * MM_PER_IN;
}
