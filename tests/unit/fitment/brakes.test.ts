import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  balanceShift,
  brakeTorqueNm,
  cornerTorqueNm,
  drumBrakeTorqueNm,
  DRUM_BRAKE_FACTORS,
  type DrumCorner,
  effectiveRadiusMm,
  frontShare,
  padForceN,
  pistonAreaPerSideMm2,
  uniformPressureRadiusMm,
  type BrakeCorner,
} from '../../../shared/fitment/brakes';
import { FitmentInputError } from '../../../shared/fitment/errors';

// REFERENCES: at 50 bar, μ 0.40. Opposed caliper: pistons listed for one side only.
const stockFront: BrakeCorner = { pistonsPerSideMm: [54], rotorDiameterMm: 280, padHeightMm: 50 };
const swappedFront: BrakeCorner = { pistonsPerSideMm: [40, 44], rotorDiameterMm: 330, padHeightMm: 55 };
const rear: BrakeCorner = { pistonsPerSideMm: [38], rotorDiameterMm: 280, padHeightMm: 40 };

const relWithin = (actual: number, expected: number, rel: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(Math.abs(expected) * rel);

// the disc-brake textbook formula, written out independently: T = 2 μ p A r, r = (D − h)/2
const textbookTorque = (c: BrakeCorner, mu = 0.4, bar = 50) => {
  const area = c.pistonsPerSideMm.reduce((s, d) => s + (Math.PI / 4) * d * d, 0);
  return (2 * mu * (bar / 10) * area * ((c.rotorDiameterMm - c.padHeightMm) / 2)) / 1000;
};

describe('brake chain at 50 bar, μ 0.40', () => {
  const rows = [
    { name: 'stock front', corner: stockFront, area: 2290.22, force: 11451.1, torque: 1053.5 },
    { name: 'swapped front', corner: swappedFront, area: 2777.17, force: 13885.8, torque: 1527.44 },
    { name: 'rear', corner: rear, area: 1134.11, force: 5670.6, torque: 544.38 },
  ];
  for (const row of rows) {
    it(`${row.name}: A_side, F and T match the reference table within 0.1 %`, () => {
      // the disc-brake textbook formula: F = p × A_side, T = 2 μ F r_eff
      const area = pistonAreaPerSideMm2(row.corner.pistonsPerSideMm);
      const force = padForceN(row.corner.pistonsPerSideMm, 50);
      const torque = brakeTorqueNm({ ...row.corner, padMu: 0.4, linePressureBar: 50 });
      relWithin(area, row.area, 0.001);
      relWithin(force, row.force, 0.001);
      relWithin(torque, row.torque, 0.001);
      relWithin(torque, textbookTorque(row.corner), 1e-12);
      relWithin(force, 5 * area, 1e-12);
    });
  }

  it('front share goes from 65.93 % to 73.72 % with the swap (± 0.01 points)', () => {
    // the disc-brake textbook formula: B = T_front / (T_front + T_rear), equal pressure and μ
    const before = frontShare(stockFront, rear) * 100;
    const after = frontShare(swappedFront, rear) * 100;
    expect(Math.abs(before - 65.93)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(after - 73.72)).toBeLessThanOrEqual(0.01);
    const recomputed = (f: BrakeCorner) => textbookTorque(f) / (textbookTorque(f) + textbookTorque(rear));
    relWithin(before / 100, recomputed(stockFront), 1e-12);
    relWithin(after / 100, recomputed(swappedFront), 1e-12);
  });

  it('balance shift is after − before in percentage points', () => {
    // the disc-brake textbook formula
    const shift = balanceShift({ front: stockFront, rear }, { front: swappedFront, rear });
    expect(Math.abs(shift - (73.72 - 65.93))).toBeLessThanOrEqual(0.02);
    relWithin(shift, (frontShare(swappedFront, rear) - frontShare(stockFront, rear)) * 100, 1e-9);
    expect(balanceShift({ front: swappedFront, rear }, { front: stockFront, rear })).toBeCloseTo(-shift, 12);
  });

  it('front share does not depend on the common line pressure', () => {
    // the disc-brake textbook formula: p cancels when front and rear see the same pressure
    expect(frontShare(swappedFront, rear, 20)).toBeCloseTo(frontShare(swappedFront, rear, 120), 12);
  });

  it('a per-corner pad μ changes the share', () => {
    // the disc-brake textbook formula: T ∝ μ
    const grippy = frontShare({ ...stockFront, padMu: 0.5 }, rear);
    const expected = (textbookTorque(stockFront, 0.5) / (textbookTorque(stockFront, 0.5) + textbookTorque(rear))) * 1;
    relWithin(grippy, expected, 1e-12);
    expect(grippy).toBeGreaterThan(frontShare(stockFront, rear));
  });
});

describe('radii', () => {
  it('effective radius is (D − h)/2', () => {
    // the disc-brake textbook formula
    expect(effectiveRadiusMm(280, 50)).toBe(115);
    expect(effectiveRadiusMm(330, 55)).toBe(137.5);
  });

  it('uniform-pressure radius: R_o 125, R_i 100 → 112.963 mm', () => {
    // the disc-brake textbook formula: ⅔ (R_o³ − R_i³)/(R_o² − R_i²)
    expect(Math.abs(uniformPressureRadiusMm(125, 100) - 112.963)).toBeLessThanOrEqual(0.001);
    expect(uniformPressureRadiusMm(125, 100)).toBeCloseTo(((2 / 3) * (125 ** 3 - 100 ** 3)) / (125 ** 2 - 100 ** 2), 9);
    // it always lies between the mean radius and the outer radius
    expect(uniformPressureRadiusMm(125, 100)).toBeGreaterThan(112.5);
  });

  it('rejects impossible radii', () => {
    expect(() => effectiveRadiusMm(0, 50)).toThrow(expect.objectContaining({ field: 'rotorDiameterMm' }));
    expect(() => effectiveRadiusMm(280, 0)).toThrow(expect.objectContaining({ field: 'padHeightMm' }));
    expect(() => effectiveRadiusMm(280, 140)).toThrow(expect.objectContaining({ field: 'padHeightMm' }));
    expect(() => uniformPressureRadiusMm(100, 125)).toThrow(expect.objectContaining({ field: 'innerRadiusMm' }));
    expect(() => uniformPressureRadiusMm(Number.NaN, 100)).toThrow(expect.objectContaining({ field: 'outerRadiusMm' }));
  });
});

describe('properties', () => {
  const corner = fc.record({
    pistonsPerSideMm: fc.array(fc.double({ min: 20, max: 60, noNaN: true }), { minLength: 1, maxLength: 4 }),
    rotorDiameterMm: fc.double({ min: 240, max: 400, noNaN: true }),
    padHeightMm: fc.double({ min: 30, max: 70, noNaN: true }),
  });

  it('a larger piston never lowers torque', () => {
    // the disc-brake textbook formula: T grows with A
    fc.assert(
      fc.property(corner, fc.nat({ max: 3 }), fc.double({ min: 0, max: 10, noNaN: true }), (c, k, grow) => {
        const i = k % c.pistonsPerSideMm.length;
        const bigger = c.pistonsPerSideMm.map((d, j) => (j === i ? d + grow : d));
        const input = { ...c, padMu: 0.4, linePressureBar: 50 };
        expect(brakeTorqueNm({ ...input, pistonsPerSideMm: bigger })).toBeGreaterThanOrEqual(brakeTorqueNm(input));
      }),
    );
  });

  it('front share stays strictly between 0 and 1', () => {
    // the disc-brake textbook formula
    fc.assert(
      fc.property(corner, corner, (f, r) => {
        const share = frontShare(f, r);
        expect(share).toBeGreaterThan(0);
        expect(share).toBeLessThan(1);
      }),
    );
  });
});

describe('bad input', () => {
  const good = { ...stockFront, padMu: 0.4, linePressureBar: 50 };

  it('names the wrong field of a torque input', () => {
    expect(() => brakeTorqueNm({ ...good, pistonsPerSideMm: [] })).toThrow(
      expect.objectContaining({ field: 'pistonsPerSideMm' }),
    );
    expect(() => brakeTorqueNm({ ...good, pistonsPerSideMm: [40, 0] })).toThrow(
      expect.objectContaining({ field: 'pistonsPerSideMm.1' }),
    );
    expect(() => brakeTorqueNm({ ...good, padMu: 0 })).toThrow(expect.objectContaining({ field: 'padMu' }));
    expect(() => brakeTorqueNm({ ...good, padMu: 1.4 })).toThrow(expect.objectContaining({ field: 'padMu' }));
    expect(() => brakeTorqueNm({ ...good, linePressureBar: -50 })).toThrow(expect.objectContaining({ field: 'linePressureBar' }));
    expect(() => brakeTorqueNm({ ...good, rotorDiameterMm: Number.POSITIVE_INFINITY })).toThrow(
      expect.objectContaining({ field: 'rotorDiameterMm' }),
    );
  });

  it('prefixes the corner in front share and balance shift', () => {
    expect(() => frontShare(stockFront, { ...rear, padHeightMm: -1 })).toThrow(
      expect.objectContaining({ field: 'rear.padHeightMm' }),
    );
    expect(() => frontShare({ ...stockFront, padMu: 2 }, rear)).toThrow(expect.objectContaining({ field: 'front.padMu' }));
    expect(() => frontShare(stockFront, rear, 0)).toThrow(expect.objectContaining({ field: 'linePressureBar' }));
    expect(() =>
      balanceShift({ front: stockFront, rear }, { front: { ...swappedFront, pistonsPerSideMm: [Number.NaN] }, rear }),
    ).toThrow(expect.objectContaining({ field: 'after.front.pistonsPerSideMm.0' }));
    expect(() => pistonAreaPerSideMm2('54' as never)).toThrow(FitmentInputError);
  });
});

describe('drum corners (Limpert, Brake Design and Safety: T = p × A_wc × C* × r_drum)', () => {
  // written out independently: A_wc = π/4 d², p in N/mm² = bar / 10, r = D/2, N·mm → N·m
  const limpertForm = (boreMm: number, drumMm: number, factor: number, bar: number) =>
    ((bar / 10) * ((Math.PI / 4) * boreMm * boreMm) * factor * (drumMm / 2)) / 1000;

  it('when a 20.64 mm wheel cylinder works a 203.2 mm drum at C* 2.2 and 40 bar, then the torque is 299.15 N·m', () => {
    // REFERENCES.md drum example, recomputed: A = 334.58 mm², F = 1338.3 N, × 2.2 × 101.6 mm = 299.14 N·m
    const t = drumBrakeTorqueNm({ wheelCylinderBoreMm: 20.64, drumDiameterMm: 203.2, brakeFactor: 2.2, linePressureBar: 40 });
    relWithin(t, limpertForm(20.64, 203.2, 2.2, 40), 1e-12);
    relWithin(t, 299.15, 0.001);
  });

  it('torque is linear in pressure, brake factor and drum diameter', () => {
    // Limpert's drum form is a product
    fc.assert(
      fc.property(
        fc.double({ min: 15, max: 30, noNaN: true }),
        fc.double({ min: 180, max: 300, noNaN: true }),
        fc.double({ min: 0.5, max: 10, noNaN: true }),
        fc.double({ min: 5, max: 120, noNaN: true }),
        (bore, drum, factor, bar) => {
          const t = drumBrakeTorqueNm({
            wheelCylinderBoreMm: bore,
            drumDiameterMm: drum,
            brakeFactor: factor,
            linePressureBar: bar,
          });
          relWithin(t, limpertForm(bore, drum, factor, bar), 1e-12);
          relWithin(
            drumBrakeTorqueNm({ wheelCylinderBoreMm: bore, drumDiameterMm: drum, brakeFactor: factor, linePressureBar: 2 * bar }),
            2 * t,
            1e-12,
          );
        },
      ),
    );
  });

  it('the brake factors per shoe arrangement say where they come from, and rise with self-servo', () => {
    // Limpert, Brake Design and Safety: leading/trailing < twin leading < duo-servo (values from memory)
    const { leading_trailing: lt, twin_leading: tl, duo_servo: ds } = DRUM_BRAKE_FACTORS;
    expect(lt.brakeFactor).toBeLessThan(tl.brakeFactor);
    expect(tl.brakeFactor).toBeLessThan(ds.brakeFactor);
    for (const f of [lt, tl, ds]) expect(f.source).toMatch(/Limpert.*from memory/);
  });

  it('when the rear corner is a drum, then the front share uses the drum torque, not a disc estimate', () => {
    // a 9 in (228.6 mm) leading/trailing drum with a 19.05 mm wheel cylinder, written out with the drum form
    const drum: DrumCorner = { kind: 'drum', wheelCylinderBoreMm: 19.05, drumDiameterMm: 228.6, brakeFactor: 2.0 };
    const front = textbookTorque(stockFront);
    const back = limpertForm(19.05, 228.6, 2.0, 50);
    relWithin(cornerTorqueNm(drum, 50), back, 1e-12);
    relWithin(frontShare(stockFront, drum, 50), front / (front + back), 1e-12);
    // the same drum computed as a disc of the drum's size (2 μ instead of C*, r = (D − h)/2 with a 40 mm shoe)
    // comes out about a third of the drum form: the error the drum corner removes
    const asDisc = textbookTorque({ pistonsPerSideMm: [19.05], rotorDiameterMm: 228.6, padHeightMm: 40 });
    expect(back / asDisc).toBeGreaterThan(2.5);
  });

  it('when a disc corner carries an effective radius from the real pad position, then the torque uses it', () => {
    // the disc-brake textbook formula with r_eff given
    const t = brakeTorqueNm({ ...stockFront, effectiveRadiusMm: 110, padMu: 0.4, linePressureBar: 50 });
    relWithin(t, textbookTorque(stockFront) * (110 / 115), 1e-12);
    expect(() => brakeTorqueNm({ ...stockFront, effectiveRadiusMm: 140, padMu: 0.4, linePressureBar: 50 })).toThrow(
      expect.objectContaining({ field: 'effectiveRadiusMm' }),
    );
  });

  it('when a drum input is impossible, then the field is named (with the corner in a share)', () => {
    const good = { wheelCylinderBoreMm: 20.64, drumDiameterMm: 203.2, brakeFactor: 2.2, linePressureBar: 40 };
    expect(() => drumBrakeTorqueNm({ ...good, wheelCylinderBoreMm: 0 })).toThrow(
      expect.objectContaining({ field: 'wheelCylinderBoreMm' }),
    );
    expect(() => drumBrakeTorqueNm({ ...good, drumDiameterMm: -1 })).toThrow(
      expect.objectContaining({ field: 'drumDiameterMm' }),
    );
    expect(() => drumBrakeTorqueNm({ ...good, brakeFactor: 0 })).toThrow(expect.objectContaining({ field: 'brakeFactor' }));
    expect(() => drumBrakeTorqueNm({ ...good, brakeFactor: 40 })).toThrow(expect.objectContaining({ field: 'brakeFactor' }));
    expect(() => drumBrakeTorqueNm({ ...good, linePressureBar: Number.NaN })).toThrow(
      expect.objectContaining({ field: 'linePressureBar' }),
    );
    expect(() => drumBrakeTorqueNm({ ...good, wheelCylinderBoreMm: 250 })).toThrow(
      expect.objectContaining({ field: 'wheelCylinderBoreMm' }),
    );
    const drum: DrumCorner = { kind: 'drum', ...good, brakeFactor: -2 };
    expect(() => frontShare(stockFront, drum)).toThrow(expect.objectContaining({ field: 'rear.brakeFactor' }));
    expect(() => drumBrakeTorqueNm(null as never)).toThrow(FitmentInputError);
  });
});
