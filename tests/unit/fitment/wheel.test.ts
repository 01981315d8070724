import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { adjacentStudSpacingMm, backspacingMm, pcdFromAdjacentStuds, spacerEffect } from '../../../shared/fitment/wheel';
import { FitmentInputError } from '../../../shared/fitment/errors';

const within = (actual: number, expected: number, tol: number) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol);

describe('backspacingMm', () => {
  it('17×8 ET45 → 6.2717 in (159.30 mm)', () => {
    // common practice, no source: backspacing(in) = width/2 + 0.5 + ET/25.4
    const expectedIn = 8 / 2 + 0.5 + 45 / 25.4;
    within(backspacingMm({ widthIn: 8, offsetMm: 45 }), expectedIn * 25.4, 1e-9);
    within(backspacingMm({ widthIn: 8, offsetMm: 45 }) / 25.4, 6.2717, 0.0001);
    within(backspacingMm({ widthIn: 8, offsetMm: 45 }), 159.3, 0.01);
  });

  it('15×8 ET35 → 5.8780 in', () => {
    // common practice, no source
    within(backspacingMm({ widthIn: 8, offsetMm: 35 }) / 25.4, 5.878, 0.0001);
  });

  it('handles a negative offset', () => {
    // common practice, no source: ET −20 moves the mounting face inboard by 20 mm
    within(backspacingMm({ widthIn: 10, offsetMm: -20 }), (5 + 0.5) * 25.4 - 20, 1e-9);
  });

  it('rejects a zero or missing width and a non-finite offset', () => {
    expect(() => backspacingMm({ widthIn: 0, offsetMm: 45 })).toThrow(expect.objectContaining({ field: 'widthIn' }));
    expect(() => backspacingMm({ widthIn: -8, offsetMm: 45 })).toThrow(expect.objectContaining({ field: 'widthIn' }));
    expect(() => backspacingMm({ widthIn: 8, offsetMm: Number.NaN })).toThrow(expect.objectContaining({ field: 'offsetMm' }));
    expect(() => backspacingMm({ widthIn: 8 } as never)).toThrow(FitmentInputError);
  });
});

describe('spacerEffect', () => {
  it('17×8 ET45 + 15 mm → ET30, backspacing 5.6811 in, track + 30 mm', () => {
    // common practice, no source: ET − t, backspacing − t, track + 2t, wheel outboard by t
    const effect = spacerEffect({ widthIn: 8, offsetMm: 45 }, 15);
    expect(effect.offsetMm).toBe(30);
    within(effect.backspacingMm / 25.4, 5.6811, 0.0001);
    within(effect.backspacingMm, backspacingMm({ widthIn: 8, offsetMm: 30 }), 1e-9);
    expect(effect.trackChangeMm).toBe(30);
    expect(effect.outboardMm).toBe(15);
  });

  it('a spacer always lowers offset and backspacing by its thickness', () => {
    // common practice, no source
    fc.assert(
      fc.property(
        fc.double({ min: 4, max: 13, noNaN: true }),
        fc.double({ min: -80, max: 80, noNaN: true }),
        fc.double({ min: 0, max: 60, noNaN: true }),
        (widthIn, offsetMm, t) => {
          const effect = spacerEffect({ widthIn, offsetMm }, t);
          within(offsetMm - effect.offsetMm, t, 1e-9);
          within(backspacingMm({ widthIn, offsetMm }) - effect.backspacingMm, t, 1e-9);
          within(effect.trackChangeMm, 2 * t, 1e-9);
        },
      ),
    );
  });

  it('rejects a negative or non-finite spacer', () => {
    const wheel = { widthIn: 8, offsetMm: 45 };
    expect(() => spacerEffect(wheel, -5)).toThrow(expect.objectContaining({ field: 'spacerMm' }));
    expect(() => spacerEffect(wheel, Number.POSITIVE_INFINITY)).toThrow(expect.objectContaining({ field: 'spacerMm' }));
  });
});

describe('bolt pattern', () => {
  it('5-lug factor is 1/sin 36° = 1.7013016', () => {
    // plane geometry: PCD = s / sin(180°/n)
    within(pcdFromAdjacentStuds(5, 1), 1.7013016, 1e-7);
  });

  it.each([
    [5, 114.3, 67.184],
    [4, 100, 70.711],
    [6, 139.7, 69.85],
  ])('%i×%s → adjacent studs %s mm apart', (lugs, pcd, spacing) => {
    // plane geometry: chord s = PCD × sin(180°/n)
    within(adjacentStudSpacingMm(lugs, pcd), spacing, 0.01);
    within(adjacentStudSpacingMm(lugs, pcd), pcd * Math.sin(Math.PI / lugs), 1e-9);
    within(pcdFromAdjacentStuds(lugs, adjacentStudSpacingMm(lugs, pcd)), pcd, 1e-9);
  });

  it('5×4.5 in is 5×114.3 mm', () => {
    // NIST SP 811 (25.4 mm/in) and plane geometry
    within(pcdFromAdjacentStuds(5, adjacentStudSpacingMm(5, 4.5 * 25.4)), 114.3, 1e-9);
  });

  it('PCD and spacing are inverses', () => {
    // plane geometry
    fc.assert(
      fc.property(fc.integer({ min: 3, max: 10 }), fc.double({ min: 50, max: 250, noNaN: true }), (n, pcd) => {
        within(pcdFromAdjacentStuds(n, adjacentStudSpacingMm(n, pcd)), pcd, 1e-9 * pcd);
      }),
    );
  });

  it.each([0, 1, 2, 4.5, -5, Number.NaN])('rejects %s lugs', (lugs) => {
    expect(() => pcdFromAdjacentStuds(lugs, 67)).toThrow(expect.objectContaining({ field: 'lugCount' }));
    expect(() => adjacentStudSpacingMm(lugs, 114.3)).toThrow(expect.objectContaining({ field: 'lugCount' }));
  });

  it('rejects zero or negative distances', () => {
    expect(() => pcdFromAdjacentStuds(5, 0)).toThrow(expect.objectContaining({ field: 'spacingMm' }));
    expect(() => adjacentStudSpacingMm(5, -114.3)).toThrow(expect.objectContaining({ field: 'pcdMm' }));
  });
});
