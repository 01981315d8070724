import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { shimStack } from '../../../shared/fitment/shims';

const sum = (xs: number[]) => xs.reduce((s, x) => s + x, 0);

// Independent brute force over every multiset up to maxPieces (plane arithmetic, no source needed).
function bruteBestError(target: number, sizes: number[], maxPieces: number): number {
  let best = Math.abs(target);
  const walk = (start: number, depth: number, total: number) => {
    best = Math.min(best, Math.abs(total - target));
    if (depth === maxPieces) return;
    for (let i = start; i < sizes.length; i++) walk(i, depth + 1, total + sizes[i]);
  };
  walk(0, 0, 0);
  return best;
}

describe('shimStack', () => {
  it('finds an exact stack', () => {
    // common practice, no source: centring shims stack to fill the gap
    const r = shimStack(1.75, [0.25, 0.5, 1]);
    expect(r.pieces).toEqual([1, 0.5, 0.25]);
    expect(r.totalMm).toBe(1.75);
    expect(r.errorMm).toBe(0);
  });

  it('repeats a size when that is closest', () => {
    // common practice, no source
    const r = shimStack(1.5, [0.5], 4);
    expect(r.pieces).toEqual([0.5, 0.5, 0.5]);
    expect(r.errorMm).toBe(0);
  });

  it('prefers fewer pieces on a tie', () => {
    // common practice, no source: 1.0 alone beats 0.5 + 0.5
    expect(shimStack(1, [0.5, 1]).pieces).toEqual([1]);
    expect(shimStack(2, [0.5, 1, 2], 6).pieces).toEqual([2]);
  });

  it('reports the closest stack and its signed error when nothing is exact', () => {
    // common practice, no source
    const r = shimStack(1.3, [0.5], 4);
    expect(r.pieces).toEqual([0.5, 0.5, 0.5]);
    expect(r.totalMm).toBe(1.5);
    expect(r.errorMm).toBeCloseTo(0.2, 9);
    const capped = shimStack(3, [0.5], 2);
    expect(capped.pieces).toEqual([0.5, 0.5]);
    expect(capped.errorMm).toBeCloseTo(-2, 9);
  });

  it('an empty stack is the answer for a zero gap or a gap far thinner than any shim', () => {
    // common practice, no source
    expect(shimStack(0, [0.5, 1])).toEqual({ pieces: [], totalMm: 0, errorMm: 0 });
    expect(shimStack(0.1, [0.5, 1])).toEqual({ pieces: [], totalMm: 0, errorMm: -0.1 });
  });

  it('prints decimal totals without float noise', () => {
    const r = shimStack(0.3, [0.1, 0.2]);
    expect(r.totalMm).toBe(0.3);
    expect(r.errorMm).toBe(0);
  });

  it('is fast for 10 sizes and 6 pieces', () => {
    const sizes = [0.05, 0.1, 0.15, 0.2, 0.25, 0.3, 0.4, 0.5, 0.75, 1.0];
    const start = performance.now();
    for (let i = 0; i < 20; i++) shimStack(7.77 + i / 100, sizes, 6);
    const perCall = (performance.now() - start) / 20;
    expect(perCall).toBeLessThan(20);
    // and it is still the optimum
    const r = shimStack(5.87, sizes, 6);
    expect(Math.abs(r.errorMm)).toBeCloseTo(bruteBestError(5.87, sizes, 6), 9);
  });

  it('never exceeds maxPieces, is never worse than any single piece, and matches a brute-force optimum', () => {
    // common practice, no source; property of the search
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 6, noNaN: true }),
        fc.uniqueArray(
          fc.integer({ min: 1, max: 200 }).map((n) => n / 100),
          { minLength: 1, maxLength: 6 },
        ),
        fc.integer({ min: 1, max: 4 }),
        (target, sizes, maxPieces) => {
          const r = shimStack(target, sizes, maxPieces);
          expect(r.pieces.length).toBeLessThanOrEqual(maxPieces);
          for (const p of r.pieces) expect(sizes).toContain(p);
          expect(r.totalMm).toBeCloseTo(sum(r.pieces), 6);
          expect(r.errorMm).toBeCloseTo(r.totalMm - target, 6);
          for (const s of sizes) expect(Math.abs(r.errorMm)).toBeLessThanOrEqual(Math.abs(s - target) + 1e-6);
          expect(Math.abs(r.errorMm)).toBeLessThanOrEqual(bruteBestError(target, sizes, maxPieces) + 1e-6);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('names the wrong field', () => {
    expect(() => shimStack(-1, [0.5])).toThrow(expect.objectContaining({ field: 'targetMm' }));
    expect(() => shimStack(Number.NaN, [0.5])).toThrow(expect.objectContaining({ field: 'targetMm' }));
    expect(() => shimStack(1, [])).toThrow(expect.objectContaining({ field: 'sizesMm' }));
    expect(() => shimStack(1, [0.5, 0])).toThrow(expect.objectContaining({ field: 'sizesMm.1' }));
    expect(() => shimStack(1, [0.5, -0.25])).toThrow(expect.objectContaining({ field: 'sizesMm.1' }));
    expect(() => shimStack(1, [0.5], 0)).toThrow(expect.objectContaining({ field: 'maxPieces' }));
    expect(() => shimStack(1, [0.5], 2.5)).toThrow(expect.objectContaining({ field: 'maxPieces' }));
    expect(() => shimStack(1, [0.5], 9)).toThrow(expect.objectContaining({ field: 'maxPieces' }));
    const many = Array.from({ length: 17 }, (_, i) => (i + 1) / 10);
    expect(() => shimStack(1, many)).toThrow(expect.objectContaining({ field: 'sizesMm' }));
  });
});
