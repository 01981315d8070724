import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { boltLengthWithSpacer, parseMetricThread, threadBasics, threadEngagement } from '../../../shared/fitment/threads';
import { FitmentInputError } from '../../../shared/fitment/errors';

const within = (actual: number, expected: number, tol: number) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol);

describe('threadBasics', () => {
  // ISO 724: d₂ = d − 0.649519P, d₁ = d − 1.082532P; ISO 898-1: A_s = π/4 (d − 0.938194P)²; tap drill ≈ d − P
  const rows = [
    { d: 10, p: 1.25, d2: 9.188, d1: 8.647, as: 61.2, drill: 8.75 },
    { d: 12, p: 1.5, d2: 11.026, d1: 10.376, as: 88.13, drill: 10.5 },
    { d: 14, p: 1.5, d2: 13.026, d1: 12.376, as: 124.55, drill: 12.5 },
  ];
  for (const row of rows) {
    it(`M${row.d}×${row.p} matches the ISO 724 / ISO 898-1 table`, () => {
      const t = threadBasics(row.d, row.p);
      // recomputed with the printed coefficients (they are rounded to 6 places)
      within(t.pitchDiameterMm, row.d - 0.649519 * row.p, 1e-5);
      within(t.minorDiameterMm, row.d - 1.082532 * row.p, 1e-5);
      within(t.stressAreaMm2, (Math.PI / 4) * (row.d - 0.938194 * row.p) ** 2, 1e-4);
      // printed table, to its last digit
      within(t.pitchDiameterMm, row.d2, 0.0005);
      within(t.minorDiameterMm, row.d1, 0.0005);
      within(t.stressAreaMm2, row.as, 0.005);
      within(t.tapDrillMm, row.drill, 1e-9);
    });
  }

  it('rejects impossible threads', () => {
    expect(() => threadBasics(0, 1.5)).toThrow(expect.objectContaining({ field: 'diameterMm' }));
    expect(() => threadBasics(12, 0)).toThrow(expect.objectContaining({ field: 'pitchMm' }));
    expect(() => threadBasics(12, 12)).toThrow(expect.objectContaining({ field: 'pitchMm' }));
    expect(() => threadBasics(Number.NaN, 1.5)).toThrow(FitmentInputError);
  });
});

describe('parseMetricThread', () => {
  it.each(['M12x1.5', 'M12×1.5', 'm12 x 1.5', 'M12X1.5', ' M12 × 1,5 '])('reads %j as M12 × 1.5', (text) => {
    // ISO 724 designation: M d × P
    expect(parseMetricThread(text)).toEqual({ diameterMm: 12, pitchMm: 1.5 });
  });

  it('reads M10×1.25', () => {
    // ISO 724 designation
    expect(parseMetricThread('M10x1.25')).toEqual({ diameterMm: 10, pitchMm: 1.25 });
  });

  it.each(['M12', '12x1.5', 'M12x', 'Mx1.5', 'M12x1.5x2', 'UNF 1/2-20', '', 'M12x12', 'M0x1'])(
    'rejects %j with field "thread"',
    (text) => {
      expect(() => parseMetricThread(text)).toThrow(FitmentInputError);
      expect(() => parseMetricThread(text)).toThrow(expect.objectContaining({ field: 'thread' }));
    },
  );
});

describe('threadEngagement', () => {
  it('M12×1.5 in steel needs 12 mm, i.e. 8 turns', () => {
    // common practice, no source: 1.0 × d in steel
    const r = threadEngagement({ diameterMm: 12, pitchMm: 1.5, boltLengthMm: 42, clampedMm: 30, hubMaterial: 'steel' });
    expect(r.engagementMm).toBe(12);
    expect(r.turns).toBe(8);
    expect(r.requiredMm).toBe(12);
    expect(r.marginMm).toBe(0);
    expect(r.ok).toBe(true);
    expect(r.rule).toMatch(/1\.0 × bolt diameter/);
    expect(r.rule).toMatch(/steel/);
  });

  it('the same bolt falls short in an aluminium hub (1.5 × d = 18 mm)', () => {
    // common practice, no source: 1.5 × d in aluminium
    const r = threadEngagement({
      diameterMm: 12,
      pitchMm: 1.5,
      boltLengthMm: 42,
      clampedMm: 30,
      hubMaterial: 'aluminium',
    });
    expect(r.requiredMm).toBe(18);
    expect(r.marginMm).toBe(-6);
    expect(r.ok).toBe(false);
    expect(r.rule).toMatch(/1\.5 × bolt diameter/);
    expect(r.rule).toMatch(/aluminium/);
  });

  it('a spacer eats engagement unless the bolt grows by its thickness', () => {
    // common practice, no source: a slip-on spacer of thickness t needs a bolt at least t longer
    const base = { diameterMm: 12, pitchMm: 1.5, boltLengthMm: 45, clampedMm: 30, hubMaterial: 'steel' as const };
    expect(threadEngagement(base).engagementMm).toBe(15);
    expect(threadEngagement({ ...base, clampedMm: 30 + 10 }).ok).toBe(false);
    const longer = threadEngagement({ ...base, clampedMm: 40, boltLengthMm: boltLengthWithSpacer(45, 10) });
    expect(longer.engagementMm).toBe(15);
    expect(longer.ok).toBe(true);
  });

  it('a bolt shorter than the clamped stack engages nothing', () => {
    // plane geometry: no thread reaches the hub
    const r = threadEngagement({ diameterMm: 12, pitchMm: 1.5, boltLengthMm: 20, clampedMm: 30, hubMaterial: 'steel' });
    expect(r.engagementMm).toBe(0);
    expect(r.turns).toBe(0);
    expect(r.marginMm).toBe(-12);
    expect(r.ok).toBe(false);
  });

  it('turns × pitch equals engagement', () => {
    // ISO 724: each turn advances one pitch
    fc.assert(
      fc.property(
        fc.constantFrom([10, 1.25], [12, 1.25], [12, 1.5], [14, 1.5]),
        fc.double({ min: 20, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 60, noNaN: true }),
        fc.constantFrom('steel' as const, 'aluminium' as const),
        ([d, p], boltLengthMm, clampedMm, hubMaterial) => {
          const r = threadEngagement({ diameterMm: d, pitchMm: p, boltLengthMm, clampedMm, hubMaterial });
          within(r.turns * p, r.engagementMm, 1e-9);
          expect(r.ok).toBe(r.engagementMm >= r.requiredMm - 1e-9);
        },
      ),
    );
  });

  it('names the wrong field', () => {
    const good = { diameterMm: 12, pitchMm: 1.5, boltLengthMm: 42, clampedMm: 30, hubMaterial: 'steel' as const };
    expect(() => threadEngagement({ ...good, diameterMm: -12 })).toThrow(expect.objectContaining({ field: 'diameterMm' }));
    expect(() => threadEngagement({ ...good, pitchMm: 0 })).toThrow(expect.objectContaining({ field: 'pitchMm' }));
    expect(() => threadEngagement({ ...good, boltLengthMm: 0 })).toThrow(expect.objectContaining({ field: 'boltLengthMm' }));
    expect(() => threadEngagement({ ...good, clampedMm: -1 })).toThrow(expect.objectContaining({ field: 'clampedMm' }));
    expect(() => threadEngagement({ ...good, hubMaterial: 'titanium' as never })).toThrow(
      expect.objectContaining({ field: 'hubMaterial' }),
    );
  });
});

describe('boltLengthWithSpacer', () => {
  it('adds the spacer thickness', () => {
    // common practice, no source
    expect(boltLengthWithSpacer(45, 15)).toBe(60);
    expect(boltLengthWithSpacer(45, 0)).toBe(45);
  });

  it('rejects impossible lengths', () => {
    expect(() => boltLengthWithSpacer(0, 10)).toThrow(expect.objectContaining({ field: 'stockLengthMm' }));
    expect(() => boltLengthWithSpacer(45, -3)).toThrow(expect.objectContaining({ field: 'spacerMm' }));
  });
});
