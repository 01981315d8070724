import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  boltLengthWithSpacer,
  parseMetricThread,
  parseThread,
  threadBasics,
  threadEngagement,
  unifiedThreadBasics,
} from '../../../shared/fitment/threads';
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

describe('parseThread', () => {
  it.each([
    ['M12x1.5', 12, 1.5, 'M12×1.5'],
    ['M14 × 1.25', 14, 1.25, 'M14×1.25'],
    ['m12 x 1,5', 12, 1.5, 'M12×1.5'],
    ['M10*1.25', 10, 1.25, 'M10×1.25'],
    ['M12x1.5-6g', 12, 1.5, 'M12×1.5'],
  ])('when given %j, then it reads a metric thread (ISO 724 designation M d × P)', (text, d, p, label) => {
    const t = parseThread(text);
    expect(t).toEqual({ system: 'metric', diameterMm: d, pitchMm: p, label });
    expect(t.tpi).toBeUndefined();
  });

  it.each([
    ['1/2-20 UNF', 0.5, 20, '1/2-20 UNF'],
    ['7/16-20', 0.4375, 20, '7/16-20 UNF'],
    ['9/16"-18 UNF-2A', 0.5625, 18, '9/16-18 UNF'],
    ['1/2 - 13 unc', 0.5, 13, '1/2-13 UNC'],
    ['0,5-20', 0.5, 20, '1/2-20 UNF'],
    ['1 1/8-12', 1.125, 12, '1.125-12'],
    ['1/2-24 UN', 0.5, 24, '1/2-24 UN'],
  ])(
    'when given %j, then it reads a unified thread in mm (ASME B1.1 designation D-n, 25.4 mm per inch)',
    (text, dIn, tpi, label) => {
      const t = parseThread(text);
      expect(t.system).toBe('unified');
      expect(t.tpi).toBe(tpi);
      expect(t.label).toBe(label);
      // NIST SP 811: 1 in = 25.4 mm exactly; pitch = 25.4 / n
      expect(t.diameterMm).toBeCloseTo(dIn * 25.4, 12);
      expect(t.pitchMm).toBeCloseTo(25.4 / tpi, 12);
    },
  );

  it('when a series does not match the ASME B1.1 table, then it is refused and the right pitch is named', () => {
    // ASME B1.1: 1/2 in is 13 UNC, 20 UNF, 28 UNEF
    expect(() => parseThread('1/2-13 UNF')).toThrow(/1\/2-20/);
    expect(() => parseThread('1/2-13 UNF')).toThrow(expect.objectContaining({ field: 'thread' }));
  });

  it.each(['', 'M12', '12x1.5', 'M12x12', 'M0x1', '1/2', '1/2-0', '1/2-1', '1/2-200 UNF', 'UNF 1/2-20', '1/0-20', 'wheel bolt'])(
    'when given %j, then it is refused with field "thread"',
    (text) => {
      expect(() => parseThread(text)).toThrow(FitmentInputError);
      expect(() => parseThread(text)).toThrow(expect.objectContaining({ field: 'thread' }));
    },
  );

  it('when given a non-string, then it is refused with field "thread"', () => {
    expect(() => parseThread(12 as unknown as string)).toThrow(expect.objectContaining({ field: 'thread' }));
  });

  it('when a metric designation parses, then parseMetricThread agrees with it', () => {
    // one parser for both: today's callers keep their result
    fc.assert(
      fc.property(fc.constantFrom(8, 10, 12, 14, 16), fc.constantFrom(1, 1.25, 1.5), fc.boolean(), (d, p, comma) => {
        const text = `M${d}x${comma ? String(p).replace('.', ',') : p}`;
        const t = parseThread(text);
        expect(parseMetricThread(text)).toEqual({ diameterMm: t.diameterMm, pitchMm: t.pitchMm });
      }),
    );
  });
});

describe('unifiedThreadBasics', () => {
  // ASME B1.1 Table 2A (basic dimensions and tensile stress areas, UNF series):
  // E = D − 0.649519/n, A_s = 0.7854 (D − 0.9743/n)²
  const rows = [
    { name: '1/2-20 UNF', d: 0.5, n: 20, e: 0.4675, as: 0.1599 },
    { name: '7/16-20 UNF', d: 0.4375, n: 20, e: 0.405, as: 0.1187 },
    { name: '9/16-18 UNF', d: 0.5625, n: 18, e: 0.5264, as: 0.203 },
    { name: '3/8-24 UNF', d: 0.375, n: 24, e: 0.3479, as: 0.0878 },
  ];
  for (const row of rows) {
    it(`when computing ${row.name}, then it matches ASME B1.1`, () => {
      const t = unifiedThreadBasics(row.d, row.n);
      // recomputed from the printed formulas
      within(t.pitchDiameterIn, row.d - 0.649519 / row.n, 1e-12);
      within(t.stressAreaIn2, 0.7854 * (row.d - 0.9743 / row.n) ** 2, 1e-12);
      // printed table: E to its last digit; A_s within one unit of its last digit, because 1/2-20 recomputes to
      // 0.159953 in² where the table prints 0.1599 (other published charts print 0.160)
      within(t.pitchDiameterIn, row.e, 0.00005);
      within(t.stressAreaIn2, row.as, 0.0001);
    });
  }

  it('when the pitch is too coarse or an input is impossible, then the field is named', () => {
    expect(() => unifiedThreadBasics(0, 20)).toThrow(expect.objectContaining({ field: 'diameterIn' }));
    expect(() => unifiedThreadBasics(0.5, 0)).toThrow(expect.objectContaining({ field: 'tpi' }));
    expect(() => unifiedThreadBasics(0.05, 10)).toThrow(expect.objectContaining({ field: 'tpi' }));
    expect(() => unifiedThreadBasics(Number.NaN, 20)).toThrow(expect.objectContaining({ field: 'diameterIn' }));
  });
});

describe('threadEngagement with hub thread depth and hole kind', () => {
  const base = { diameterMm: 12, pitchMm: 1.5, clampedMm: 20, hubMaterial: 'steel' as const };

  it('when the bolt reaches past the hub thread of a through hole, then engagement is the thread depth and limitedBy says so', () => {
    // plane geometry: thread beyond the hub's depth engages nothing
    const r = threadEngagement({ ...base, boltLengthMm: 45, hubThreadDepthMm: 14, hole: 'through' });
    expect(r.reachMm).toBe(25);
    expect(r.engagementMm).toBe(14);
    expect(r.limitedBy).toBe('hub_thread');
    expect(r.bottomsOut).toBe(false);
    expect(r.ok).toBe(true);
  });

  it('when the bolt reaches the bottom of a blind hole, then it bottoms out and fails whatever its engagement', () => {
    // plane geometry: a bolt stopped by the bottom of its hole clamps nothing
    const r = threadEngagement({ ...base, boltLengthMm: 45, hubThreadDepthMm: 24, hole: 'blind' });
    expect(r.bottomsOut).toBe(true);
    expect(r.engagementMm).toBe(24);
    expect(r.marginMm).toBe(12);
    expect(r.ok).toBe(false);
    expect(r.rule).toMatch(/bottom of a blind hole/);
  });

  it('when the bolt stops short of the bottom, then the bolt limits the engagement', () => {
    // plane geometry
    const r = threadEngagement({ ...base, boltLengthMm: 40, hubThreadDepthMm: 24, hole: 'blind' });
    expect(r.limitedBy).toBe('bolt');
    expect(r.bottomsOut).toBe(false);
    expect(r.engagementMm).toBe(20);
    expect(r.ok).toBe(true);
  });

  it('when a unified 1/2-20 bolt is in steel, then it needs 12.7 mm (1.0 × d, common practice, no source)', () => {
    const t = parseThread('1/2-20 UNF');
    const r = threadEngagement({
      diameterMm: t.diameterMm,
      pitchMm: t.pitchMm,
      boltLengthMm: 32,
      clampedMm: 20,
      hubMaterial: 'steel',
    });
    within(r.requiredMm, 12.7, 1e-9);
    within(r.marginMm, -0.7, 1e-9);
    // ASME B1.1: one turn advances 1/n in
    within(r.turns, 12 / (25.4 / 20), 1e-9);
    expect(r.ok).toBe(false);
  });

  it('engagement never exceeds reach or thread depth, and a blind hole bottoms out exactly when reach ≥ depth', () => {
    // plane geometry
    fc.assert(
      fc.property(
        fc.double({ min: 20, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 60, noNaN: true }),
        fc.double({ min: 5, max: 40, noNaN: true }),
        fc.constantFrom('blind' as const, 'through' as const),
        (boltLengthMm, clampedMm, hubThreadDepthMm, hole) => {
          const r = threadEngagement({ ...base, boltLengthMm, clampedMm, hubThreadDepthMm, hole });
          expect(r.engagementMm).toBeLessThanOrEqual(Math.min(r.reachMm, hubThreadDepthMm) + 1e-9);
          expect(r.bottomsOut).toBe(hole === 'blind' && r.reachMm >= hubThreadDepthMm - 1e-9);
          if (r.bottomsOut) expect(r.ok).toBe(false);
        },
      ),
    );
  });

  it('when depth or hole are impossible, then the field is named', () => {
    expect(() => threadEngagement({ ...base, boltLengthMm: 40, hubThreadDepthMm: 0 })).toThrow(
      expect.objectContaining({ field: 'hubThreadDepthMm' }),
    );
    expect(() => threadEngagement({ ...base, boltLengthMm: 40, hole: 'open' as never })).toThrow(
      expect.objectContaining({ field: 'hole' }),
    );
  });
});
