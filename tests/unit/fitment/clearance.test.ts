import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { MIN_CLEARANCE_MM, maxRotorRuleOfThumbMm, radialClearance, spokeClearance } from '../../../shared/fitment/clearance';

const within = (actual: number, expected: number, tol: number) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol);

describe('radialClearance', () => {
  it('barrel radius minus rotor radius and caliper projection', () => {
    // common practice, no source: barrel radius ≥ rotor radius + projection + 3 mm
    const r = radialClearance({ barrelInnerDiameterMm: 400, rotorDiameterMm: 330, caliperRadialProjectionMm: 30 });
    within(r.clearanceMm, 200 - (165 + 30), 1e-9);
    within(r.marginMm, 5 - 3, 1e-9);
    expect(r.ok).toBe(true);
    expect(r.rule).toMatch(/3 mm/);
    expect(r.rule).toMatch(/common practice/);
  });

  it('fails below 3 mm and passes at exactly 3 mm', () => {
    // common practice, no source: minimum about 3 mm (1/8 in)
    expect(MIN_CLEARANCE_MM).toBe(3);
    const tight = radialClearance({ barrelInnerDiameterMm: 396, rotorDiameterMm: 330, caliperRadialProjectionMm: 31 });
    within(tight.clearanceMm, 2, 1e-9);
    expect(tight.ok).toBe(false);
    const exact = radialClearance({ barrelInnerDiameterMm: 398, rotorDiameterMm: 330, caliperRadialProjectionMm: 31 });
    within(exact.marginMm, 0, 1e-9);
    expect(exact.ok).toBe(true);
  });

  it('reports a negative clearance when the caliper hits the barrel', () => {
    // common practice, no source
    const r = radialClearance({ barrelInnerDiameterMm: 380, rotorDiameterMm: 330, caliperRadialProjectionMm: 30 });
    within(r.clearanceMm, -5, 1e-9);
    expect(r.ok).toBe(false);
  });

  it('names the wrong field', () => {
    const good = { barrelInnerDiameterMm: 400, rotorDiameterMm: 330, caliperRadialProjectionMm: 30 };
    for (const field of ['barrelInnerDiameterMm', 'rotorDiameterMm'] as const) {
      expect(() => radialClearance({ ...good, [field]: 0 })).toThrow(expect.objectContaining({ field }));
    }
    expect(() => radialClearance({ ...good, caliperRadialProjectionMm: -1 })).toThrow(
      expect.objectContaining({ field: 'caliperRadialProjectionMm' }),
    );
    expect(() => radialClearance({ ...good, rotorDiameterMm: Number.NaN })).toThrow(
      expect.objectContaining({ field: 'rotorDiameterMm' }),
    );
  });
});

describe('spokeClearance', () => {
  it('spoke inset + spacer − caliper outboard', () => {
    // common practice, no source: a spacer gives the spokes + t of axial room
    const without = spokeClearance({ spokeInsetMm: 20, caliperOutboardMm: 19 });
    within(without.clearanceMm, 1, 1e-9);
    expect(without.ok).toBe(false);
    const withSpacer = spokeClearance({ spokeInsetMm: 20, caliperOutboardMm: 19, spacerMm: 5 });
    within(withSpacer.clearanceMm, 6, 1e-9);
    within(withSpacer.marginMm, 3, 1e-9);
    expect(withSpacer.ok).toBe(true);
    expect(withSpacer.rule).toMatch(/spokes/);
  });

  it('a spacer adds exactly its thickness to the spoke clearance', () => {
    // common practice, no source: axial room at the spokes + t
    fc.assert(
      fc.property(
        fc.double({ min: -20, max: 60, noNaN: true }),
        fc.double({ min: -20, max: 60, noNaN: true }),
        fc.double({ min: 0, max: 30, noNaN: true }),
        (spokeInsetMm, caliperOutboardMm, spacerMm) => {
          const a = spokeClearance({ spokeInsetMm, caliperOutboardMm });
          const b = spokeClearance({ spokeInsetMm, caliperOutboardMm, spacerMm });
          within(b.clearanceMm - a.clearanceMm, spacerMm, 1e-9);
        },
      ),
    );
  });

  it('names the wrong field', () => {
    expect(() => spokeClearance({ spokeInsetMm: Number.NaN, caliperOutboardMm: 10 })).toThrow(
      expect.objectContaining({ field: 'spokeInsetMm' }),
    );
    expect(() => spokeClearance({ spokeInsetMm: 20, caliperOutboardMm: Number.POSITIVE_INFINITY })).toThrow(
      expect.objectContaining({ field: 'caliperOutboardMm' }),
    );
    expect(() => spokeClearance({ spokeInsetMm: 20, caliperOutboardMm: 10, spacerMm: -2 })).toThrow(
      expect.objectContaining({ field: 'spacerMm' }),
    );
  });
});

describe('maxRotorRuleOfThumbMm', () => {
  it('wheel diameter − 4 in, in mm', () => {
    // common practice, no source: max rotor ≈ wheel − 4 in (advisory)
    within(maxRotorRuleOfThumbMm(17), 13 * 25.4, 1e-9);
    within(maxRotorRuleOfThumbMm(17), 330.2, 1e-9);
    within(maxRotorRuleOfThumbMm(18), 355.6, 1e-9);
  });

  it('rejects wheels of 4 in or less', () => {
    for (const d of [4, 0, -17, Number.NaN]) {
      expect(() => maxRotorRuleOfThumbMm(d)).toThrow(expect.objectContaining({ field: 'wheelDiameterIn' }));
    }
  });
});
