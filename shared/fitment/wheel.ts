import { requireFinite, requireInteger, requireNonNegative, requirePositive } from './errors';
import { MM_PER_IN } from './units';

export interface WheelFitment {
  widthIn: number;
  offsetMm: number;
}

export interface SpacerEffect {
  offsetMm: number;
  backspacingMm: number;
  /** per axle, with a spacer of this thickness on both sides */
  trackChangeMm: number;
  /** how far each wheel moves outboard */
  outboardMm: number;
}

export const BACKSPACING_RULE =
  'Backspacing = width/2 + 0.5 in + offset: nominal rim width is between the bead seats and each flange adds about 0.5 in (common practice)';

const FLANGE_IN = 0.5;

function checkedWheel(wheel: WheelFitment): { widthIn: number; offsetMm: number } {
  return {
    widthIn: requirePositive(wheel?.widthIn, 'widthIn'),
    offsetMm: requireFinite(wheel?.offsetMm, 'offsetMm'),
  };
}

export function backspacingMm(wheel: WheelFitment): number {
  const { widthIn, offsetMm } = checkedWheel(wheel);
  return (widthIn / 2 + FLANGE_IN) * MM_PER_IN + offsetMm;
}

export function spacerEffect(wheel: WheelFitment, spacerMm: number): SpacerEffect {
  const checked = checkedWheel(wheel);
  const t = requireNonNegative(spacerMm, 'spacerMm');
  return {
    offsetMm: checked.offsetMm - t,
    backspacingMm: backspacingMm(checked) - t,
    trackChangeMm: 2 * t,
    outboardMm: t,
  };
}

// Adjacent studs are a chord of the pitch circle subtending 360°/n.
export function pcdFromAdjacentStuds(lugCount: number, spacingMm: number): number {
  const n = requireInteger(lugCount, 'lugCount', 3);
  const s = requirePositive(spacingMm, 'spacingMm');
  return s / Math.sin(Math.PI / n);
}

export function adjacentStudSpacingMm(lugCount: number, pcdMm: number): number {
  const n = requireInteger(lugCount, 'lugCount', 3);
  const pcd = requirePositive(pcdMm, 'pcdMm');
  return pcd * Math.sin(Math.PI / n);
}
