import { FitmentInputError, requireInteger, requireNonNegative, requirePositive } from './errors';

export interface ShimStack {
  /** thickest first */
  pieces: number[];
  totalMm: number;
  /** total − target */
  errorMm: number;
}

export const MAX_SHIM_PIECES = 8;
export const MAX_SHIM_SIZES = 16;

const EPSILON = 1e-9;
const round6 = (x: number) => Math.round(x * 1e6) / 1e6;

/**
 * Closest stack to the target from the available sizes (a size may repeat), fewest pieces on a tie,
 * then the thinner stack, which still fits the gap.
 */
export function shimStack(targetMm: number, sizesMm: number[], maxPieces = 4): ShimStack {
  const target = requireNonNegative(targetMm, 'targetMm');
  if (!Array.isArray(sizesMm) || sizesMm.length === 0) {
    throw new FitmentInputError('sizesMm', 'sizesMm must list at least one shim thickness');
  }
  sizesMm.forEach((size, i) => requirePositive(size, `sizesMm.${i}`));
  const limit = requireInteger(maxPieces, 'maxPieces', 1, MAX_SHIM_PIECES);
  const sizes = [...new Set(sizesMm)].sort((a, b) => a - b);
  if (sizes.length > MAX_SHIM_SIZES) {
    throw new FitmentInputError('sizesMm', `sizesMm may hold at most ${MAX_SHIM_SIZES} different thicknesses`);
  }

  let best: number[] = [];
  let bestTotal = 0;
  let bestAbs = target;
  const stack: number[] = [];

  const consider = (total: number) => {
    const abs = Math.abs(total - target);
    const better =
      abs < bestAbs - EPSILON ||
      (abs <= bestAbs + EPSILON && (stack.length < best.length || (stack.length === best.length && total < bestTotal - EPSILON)));
    if (better) {
      best = [...stack];
      bestTotal = total;
      bestAbs = abs;
    }
  };

  // Combinations with repetition in non-decreasing order; sizes ascend, so once a stack overshoots
  // by more than the best error every larger continuation does too.
  const search = (start: number, total: number) => {
    if (stack.length === limit) return;
    for (let i = start; i < sizes.length; i++) {
      const next = total + sizes[i];
      if (next - target > bestAbs + EPSILON) break;
      stack.push(sizes[i]);
      consider(next);
      search(i, next);
      stack.pop();
    }
  };
  search(0, 0);

  const pieces = [...best].sort((a, b) => b - a);
  return { pieces, totalMm: round6(bestTotal), errorMm: round6(bestTotal - target) };
}
