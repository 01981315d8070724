import { brakeTorqueNm, DEFAULT_PAD_MU, type BrakeCorner } from './brakes';
import { FitmentInputError, requirePositive } from './errors';

/**
 * One axle's brakes as the distribution analysis takes them: a description of one wheel's brake (the axle has
 * two), or the whole axle's torque per bar when it is known from elsewhere (a drum, a maker's figure).
 */
export type AxleBrakes = ({ type: 'disc' } & BrakeCorner) | { type: 'torque-per-bar'; axleTorqueNmPerBar: number };

const WHEELS_PER_AXLE = 2;

/** Brake torque of both wheels of an axle per bar of line pressure, N·m/bar. The one place a corner becomes a torque. */
export function axleTorqueNmPerBar(axle: AxleBrakes, prefix = ''): number {
  switch (axle?.type) {
    case 'disc':
      // Disc torque is proportional to line pressure, so its value at 1 bar is the torque per bar.
      return (
        WHEELS_PER_AXLE *
        withPrefix(prefix, () => brakeTorqueNm({ ...axle, padMu: axle.padMu ?? DEFAULT_PAD_MU, linePressureBar: 1 }))
      );
    case 'torque-per-bar':
      return requirePositive(axle.axleTorqueNmPerBar, `${prefix}axleTorqueNmPerBar`);
    default:
      throw new FitmentInputError(`${prefix}type`, `${prefix}type must be 'disc' or 'torque-per-bar'`);
  }
}

function withPrefix<T>(prefix: string, compute: () => T): T {
  try {
    return compute();
  } catch (error) {
    if (!(error instanceof FitmentInputError) || !prefix) throw error;
    throw new FitmentInputError(`${prefix}${error.field}`, `${prefix}${error.message}`);
  }
}
