import { describe, expect, it } from 'vitest';
import { swapDataSchema, type SwapDataInput } from '../../../shared/schemas/swap-data';
import { chassisFigures, vehicleDataSchema, type VehicleDataInput } from '../../../shared/schemas/vehicle';
import { lockOrderOf, recordCorners, swapDistribution } from '../../../shared/fitment/swap-distribution';
import { brakeBalanceOf, describeBalanceShift, LOCK_ORDER_UNKNOWN } from '../../../shared/fitment/swap-checks';
import { automaticChecks } from '../../../shared/review-checks';
import { STANDARD_GRAVITY } from '../../../shared/fitment/distribution';
import { DRUM_BRAKE_FACTORS } from '../../../shared/fitment/brakes';

// REFERENCES.md, "Braking dynamics" (Limpert, Brake Design and Safety, ch. 7): m 1450 kg, ψ 0.58, h 520 mm,
// L 2700 mm → χ = 0.192593; with a fixed front share Φ both axles lock together at z = (Φ − ψ) / χ.
const PSI = 0.58;
const CHI = 520 / 2700;
const referenceCar = (extra: Partial<VehicleDataInput> = {}) =>
  vehicleDataSchema.parse({
    unladen: { massKg: 1450, frontStaticFraction: PSI, cgHeightMm: 520 },
    wheelbaseMm: 2700,
    tyreLoadedRadiusMm: { front: 300, rear: 300 },
    rearValve: { kind: 'none' },
    basis: 'Worked example',
    ...extra,
  });
const figures = (extra: Partial<VehicleDataInput> = {}) =>
  chassisFigures({ make: 'Halden', model: 'H31', vehicle: referenceCar(extra) })!;

// Disc corners whose torques split exactly 70 : 30 at equal pressure (T = 2 μ p A r, textbook form; r = (D − pad) / 2):
// front 54 mm piston, r = (274 − 50) / 2 = 112 mm; rear 36 mm piston, r = (256 − 40) / 2 = 108 mm;
// 3 × 54² × 112 = 7 × 36² × 108 = 979 776, so Φ = 0.70 (recomputed by hand).
const stockFront = { kind: 'disc' as const, pistonsPerSideMm: [54], rotorDiameterMm: 274, padHeightMm: 50 };
const stockRear = { kind: 'disc' as const, pistonsPerSideMm: [36], rotorDiameterMm: 256, padHeightMm: 40 };
// the swap: bigger rear calipers on bigger rotors, r = (280 − 44) / 2 = 118 mm
const swappedRear = { kind: 'disc' as const, pistonsPerSideMm: [38], rotorDiameterMm: 280, padHeightMm: 44 };

function record(after: { front: typeof stockFront; rear: typeof stockRear }, extra: Partial<SwapDataInput> = {}) {
  return swapDataSchema.parse({
    schemaVersion: 2,
    title: 'Bigger rear calipers on bigger rotors',
    parts: [{ role: 'Rear caliper', kind: 'caliper', name: 'Single-piston caliper', quantity: 2 }],
    brakes: { linePressureBar: 50, padMu: 0.4, before: { front: stockFront, rear: stockRear }, after },
    ...extra,
  });
}

/** Φ from T = 2 μ p A r per corner, the same μ and p on both axles, so only A r counts (hand recomputation). */
const shareOf = (front: typeof stockFront, rear: typeof stockRear) => {
  const ar = (c: typeof stockFront) =>
    c.pistonsPerSideMm.reduce((s, d) => s + (Math.PI * d * d) / 4, 0) * ((c.rotorDiameterMm - c.padHeightMm) / 2);
  return ar(front) / (ar(front) + ar(rear));
};

describe('swapDistribution: the record on the car', () => {
  it('when the swap changes nothing on the worked-example car, then both axles lock together at 0.623077 g and the utilisations at 0.5 g are the published ones', () => {
    const data = record({ front: stockFront, rear: stockRear });
    const analysis = swapDistribution(recordCorners(data)!, referenceCar());
    const unladen = analysis.after!.states[0];
    expect(analysis.after!.hydraulicFrontShare).toBeCloseTo(0.7, 12);
    // REFERENCES (Limpert ch. 7): lock together at (0.70 − 0.58) / 0.192593 = 0.623077 g
    expect(unladen.lockTogetherG).toBeCloseTo(0.623077, 5);
    expect(unladen.rearFirstFromG).toBeCloseTo((0.7 - PSI) / CHI, 5);
    // REFERENCES: at 0.5 g, f_f = 0.517525 and f_r = 0.463387
    const at05 = unladen.curve.find((p) => p.z === 0.5)!;
    expect(at05.front).toBeCloseTo(0.517525, 6);
    expect(at05.rear).toBeCloseTo(0.463387, 6);
    expect(analysis.comparison!.direction).toBe('unchanged');
  });

  it('when the rear brakes grow, then the lock-together point falls to (Φ − ψ) / χ of the new share and the rear locks first from there', () => {
    const data = record({ front: stockFront, rear: swappedRear });
    const phiAfter = shareOf(stockFront, swappedRear);
    // by hand: 2916 × 112 / (2916 × 112 + 1444 × 118) = 0.657148
    expect(phiAfter).toBeCloseTo(0.657148, 6);
    const analysis = swapDistribution(recordCorners(data)!, referenceCar());
    expect(analysis.after!.hydraulicFrontShare).toBeCloseTo(phiAfter, 9);
    // Limpert ch. 7: z = (Φ − ψ) / χ = (0.657148 − 0.58) / 0.192593 = 0.400576 g
    expect(analysis.after!.states[0].lockTogetherG).toBeCloseTo((phiAfter - PSI) / CHI, 5);
    expect(analysis.after!.states[0].lockTogetherG).toBeCloseTo(0.400576, 5);

    const reading = lockOrderOf(analysis);
    expect(reading.madeRearFirstInBand).toHaveLength(1);
    expect(reading.madeRearFirstInBand[0]).toMatchObject({ state: 'unladen' });
    expect(reading.madeRearFirstInBand[0].fromG).toBeCloseTo(0.400576, 5);
    expect(reading.madeRearFirstInBand[0].beforeFromG).toBeCloseTo(0.623077, 5);
  });

  it('when a proportioning valve cuts the rear pressure in below the new lock-together point, then the front locks first throughout and the swap is no hazard', () => {
    const data = record({ front: stockFront, rear: swappedRear });
    // Line pressure per g below the knee: m g / (axle force per bar). Knee at 0.3 g of it, slope 0.2.
    const forcePerBar = (c: typeof stockFront) =>
      (2 *
        2 *
        0.4 *
        0.1 *
        c.pistonsPerSideMm.reduce((s, d) => s + (Math.PI * d * d) / 4, 0) *
        ((c.rotorDiameterMm - c.padHeightMm) / 2)) /
      300;
    const barPerG = (1450 * STANDARD_GRAVITY) / (forcePerBar(stockFront) + forcePerBar(swappedRear));
    const valve = { kind: 'proportioning' as const, kneeBar: Math.round(barPerG * 0.3 * 10) / 10, slope: 0.2 };
    const analysis = swapDistribution(recordCorners(data)!, referenceCar({ rearValve: valve }));
    expect(analysis.after!.states[0].rearFirstFromG).toBeNull();
    const balance = brakeBalanceOf(data, figures({ rearValve: valve }))!;
    expect(balance.shift.direction).toBe('rearward');
    expect(balance.shift.severity).toBe('advisory');
    expect(balance.shift.headline).toContain('the front still locks first up to 1.00 g unladen');
  });

  it('when the brake factor of a drum is not given, then its shoe type supplies one and the corner becomes a drum', () => {
    const data = record(
      { front: stockFront, rear: stockRear },
      {
        brakes: {
          linePressureBar: 50,
          padMu: 0.4,
          before: {
            front: stockFront,
            rear: { kind: 'drum', wheelCylinderBoreMm: 19.05, drumDiameterMm: 228, shoeType: 'leading_trailing' },
          },
          after: { front: stockFront, rear: stockRear },
        },
      },
    );
    const corners = recordCorners(data)!;
    expect(corners.before.rear.kind).toBe('drum');
    // Limpert, drum brake factor of a leading/trailing shoe (from memory, as brakes.ts says)
    expect(corners.before.rear).toEqual({
      kind: 'drum',
      wheelCylinderBoreMm: 19.05,
      drumDiameterMm: 228,
      brakeFactor: DRUM_BRAKE_FACTORS.leading_trailing.brakeFactor,
    });
  });
});

describe('describeBalanceShift with the car figures: direction and which axle locks first', () => {
  it('when the swap makes the rear lock first below 0.8 g, then it is a hazard in the analysis words and says where', () => {
    const balance = brakeBalanceOf(record({ front: stockFront, rear: swappedRear }), figures())!;
    expect(balance.shift).toMatchObject({ direction: 'rearward', severity: 'hazard' });
    expect(balance.shift.headline).toBe(balance.distribution!.summary);
    expect(balance.shift.headline).toBe(
      'The swap moves the balance toward the rear (front share 70.0 % → 65.7 %): after it the rear locks first above 0.40 g when unladen (before it: above 0.62 g when unladen) — fit a proportioning valve or keep the stock rear brakes.',
    );
    expect(balance.shift.risk).toContain('above 0.40 g when unladen, below 0.80 g');
    expect(balance.figures!.label).toBe('the Halden H31 stock figures');
  });

  it('when the car figures are not known, then the shift keeps its direction, makes no lock-order claim and says what is missing', () => {
    const balance = brakeBalanceOf(record({ front: stockFront, rear: swappedRear }))!;
    expect(balance.distribution).toBeNull();
    expect(balance.shift.lockOrder).toBeNull();
    expect(balance.shift.headline).toBe('Balance moves toward the rear: front share 70.0 % → 65.7 % (−4.3 points).');
    expect(balance.shift.severity).toBe('hazard');
    expect(balance.shift.risk).toContain(LOCK_ORDER_UNKNOWN);
  });

  it('when the rear already locked first before and the swap moves it later, then it is advisory, not a hazard', () => {
    // the reverse swap: the bigger rear brakes come off again
    const data = swapDataSchema.parse({
      ...record({ front: stockFront, rear: stockRear }),
      brakes: {
        linePressureBar: 50,
        padMu: 0.4,
        before: { front: stockFront, rear: swappedRear },
        after: { front: stockFront, rear: stockRear },
      },
    });
    const balance = brakeBalanceOf(data, figures())!;
    expect(balance.shift.direction).toBe('forward');
    expect(balance.shift.severity).toBe('advisory');
    expect(balance.shift.headline).toContain(
      'the rear still locks first above 0.62 g when unladen, later than before (above 0.40 g when unladen)',
    );
  });

  it('when the same analysis is described twice, then the words are the same (sheet, form and desk share them)', () => {
    const data = record({ front: stockFront, rear: swappedRear });
    const analysis = swapDistribution(recordCorners(data)!, referenceCar());
    const a = describeBalanceShift(
      analysis.comparison!.frontShareBefore,
      analysis.comparison!.frontShareAfter,
      lockOrderOf(analysis),
    );
    expect(a).toEqual(brakeBalanceOf(data, figures())!.shift);
  });
});

describe('the review desk: rear locking first below the band', () => {
  const input = (data: ReturnType<typeof record>, withFigures: boolean) => ({
    data,
    body: '',
    photoCount: 3,
    chassis: { wheelBoltThread: 'M12×1.5', figures: withFigures ? figures() : null },
    axle: 'rear' as const,
    category: 'suspension' as const,
    duplicates: [],
  });

  it('when the stock figures say the swap makes the rear lock first at 0.40 g, then the balance check is a hazard naming the figures', () => {
    const balance = automaticChecks(input(record({ front: stockFront, rear: swappedRear }), true)).find(
      (c) => c.id === 'balance',
    )!;
    expect(balance.status).toBe('attention');
    expect(balance.detail).toMatch(/^Hazard: The swap moves the balance toward the rear/);
    expect(balance.detail).toContain('the rear locks first above 0.40 g when unladen');
    expect(balance.detail).toContain('(Worked out with the Halden H31 stock figures.)');
  });

  it('when the car already locked its rear first at 0.62 g and the swap leaves the brakes as they were, then it asks for attention without calling it a hazard', () => {
    const balance = automaticChecks(input(record({ front: stockFront, rear: stockRear }), true)).find((c) => c.id === 'balance')!;
    expect(balance.status).toBe('attention');
    expect(balance.detail).not.toMatch(/^Hazard/);
    expect(balance.detail).toContain('about where it was');
    expect(balance.detail).toContain('The rear already locked first above 0.62 g when unladen before the change');
  });

  it('when the swap leaves the brakes as they were on a car whose front locks first, then the check passes', () => {
    const ok = { ...input(record({ front: stockFront, rear: stockRear }), true) };
    ok.chassis = { ...ok.chassis, figures: { ...figures(), vehicle: referenceCar({ rearValve: { kind: 'electronic' } }) } };
    const balance = automaticChecks(ok).find((c) => c.id === 'balance')!;
    expect(balance.status).toBe('pass');
    expect(balance.detail).toContain('the front still locks first up to 1.00 g unladen');
  });
});
