import { cornerTorqueNm, type AnyBrakeCorner } from './brakes';
import { FitmentInputError, requirePositive } from './errors';

/**
 * One axle's brakes as the distribution analysis takes them: one wheel's disc or drum corner (the axle has
 * two), or the whole axle's torque per bar when it is known from elsewhere (a maker's figure, a measurement).
 */
export type AxleBrakes = AnyBrakeCorner | { kind: 'torque-per-bar'; axleTorqueNmPerBar: number };

const WHEELS_PER_AXLE = 2;

/** Brake torque of both wheels of an axle per bar of line pressure, N·m/bar. The one place a corner becomes a torque. */
export function axleTorqueNmPerBar(axle: AxleBrakes, prefix = ''): number {
  if (typeof axle !== 'object' || axle === null)
    throw new FitmentInputError(`${prefix}kind`, `${prefix.replace(/\.$/, '')} is required`);
  if (axle.kind === 'torque-per-bar') return requirePositive(axle.axleTorqueNmPerBar, `${prefix}axleTorqueNmPerBar`);
  // Corner torque is proportional to line pressure, so its value at 1 bar is the torque per bar.
  return WHEELS_PER_AXLE * withPrefix(prefix, () => cornerTorqueNm(axle, 1));
}

function withPrefix<T>(prefix: string, compute: () => T): T {
  try {
    return compute();
  } catch (error) {
    if (!(error instanceof FitmentInputError) || !prefix) throw error;
    throw new FitmentInputError(`${prefix}${error.field}`, `${prefix}${error.message}`);
  }
}
