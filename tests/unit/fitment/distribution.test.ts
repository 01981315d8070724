import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  adhesionUtilisation,
  axleLoadsN,
  firstToLock,
  idealFrontShare,
  lockTogetherDeceleration,
  proportionedPressureBar,
  STANDARD_GRAVITY,
  type DistributionVehicle,
} from '../../../shared/fitment/distribution';
import {
  analyseBrakeDistribution,
  minimumLineK,
  type BrakeSetup,
  type DistributionInput,
  type StateAnalysis,
} from '../../../shared/fitment/distribution-analysis';
import { axleTorqueNmPerBar } from '../../../shared/fitment/axle-torque';
import { FitmentInputError } from '../../../shared/fitment/errors';

const relWithin = (actual: number, expected: number, rel: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(Math.abs(expected) * rel);

const fieldOf = (fn: () => unknown): string | undefined => {
  try {
    fn();
  } catch (error) {
    if (error instanceof FitmentInputError) return error.field;
    throw error;
  }
  return undefined;
};

// Worked example (REFERENCES, braking dynamics; Limpert, Brake Design and Safety, ch. 7 and the automotive
// handbooks' braking chapter): m 1450 kg, ψ 0.58, h 520 mm, L 2700 mm, Φ 0.70.
const car: DistributionVehicle = { massKg: 1450, frontStaticFraction: 0.58, cgHeightMm: 520, wheelbaseMm: 2700 };
const ladenCar: DistributionVehicle = { massKg: 1800, frontStaticFraction: 0.52, cgHeightMm: 560, wheelbaseMm: 2700 };

// The textbook relations written out again, independently of the module.
const chi = (v: DistributionVehicle) => v.cgHeightMm / v.wheelbaseMm;
const textbook = {
  frontLoad: (v: DistributionVehicle, z: number) => v.massKg * 9.80665 * (v.frontStaticFraction + chi(v) * z),
  rearLoad: (v: DistributionVehicle, z: number) => v.massKg * 9.80665 * (1 - v.frontStaticFraction - chi(v) * z),
  ff: (v: DistributionVehicle, phi: number, z: number) => (phi * z) / (v.frontStaticFraction + chi(v) * z),
  fr: (v: DistributionVehicle, phi: number, z: number) => ((1 - phi) * z) / (1 - v.frontStaticFraction - chi(v) * z),
  lockTogether: (v: DistributionVehicle, phi: number) => (phi - v.frontStaticFraction) / chi(v),
};

const torqueAxles = (front: number, rear: number, rearValve: BrakeSetup['rearValve'] = { kind: 'none' }): BrakeSetup => ({
  front: { kind: 'torque-per-bar', axleTorqueNmPerBar: front },
  rear: { kind: 'torque-per-bar', axleTorqueNmPerBar: rear },
  rearValve,
});
const sameTyres = { front: 300, rear: 300 };
const stateOf = (states: StateAnalysis[], name: 'unladen' | 'laden') => states.find((s) => s.state === name)!;

describe('the worked example: m 1450 kg, ψ 0.58, h 520 mm, L 2700 mm, Φ 0.70 (Limpert ch. 7; REFERENCES)', () => {
  it('when the car brakes at 0.5 g, then the axle loads are 9616.69 N front and 4602.95 N rear', () => {
    const loads = axleLoadsN(car, 0.5);
    relWithin(loads.frontN, 9616.69, 1e-6);
    relWithin(loads.rearN, 4602.95, 1e-6);
    relWithin(loads.frontN, textbook.frontLoad(car, 0.5), 1e-12);
    relWithin(loads.rearN, textbook.rearLoad(car, 0.5), 1e-12);
    // the loads always add up to the weight: m g with g from NIST SP 811
    relWithin(loads.frontN + loads.rearN, 1450 * STANDARD_GRAVITY, 1e-12);
    expect(STANDARD_GRAVITY).toBe(9.80665);
  });

  it('when the split is 70 % front, then at 0.5 g the front needs 0.517525 and the rear 0.463387', () => {
    const u = adhesionUtilisation(car, 0.7, 0.5);
    relWithin(u.front, 0.517525, 1e-6);
    relWithin(u.rear, 0.463387, 1e-6);
    relWithin(u.front, textbook.ff(car, 0.7, 0.5), 1e-12);
    relWithin(u.rear, textbook.fr(car, 0.7, 0.5), 1e-12);
    // f = F / N: the front's brake force is Φ m g z
    relWithin(u.front, (0.7 * 1450 * STANDARD_GRAVITY * 0.5) / axleLoadsN(car, 0.5).frontN, 1e-12);
  });

  it('when χ = 520 / 2700 = 0.192593, then the ideal front share at 0.5 g is 0.676296 and both axles lock together at 0.623077 g', () => {
    relWithin(idealFrontShare(car, 0.5), 0.676296, 1e-6);
    relWithin(idealFrontShare(car, 0), 0.58, 1e-12);
    relWithin(lockTogetherDeceleration(car, 0.7), 0.623077, 1e-6);
    relWithin(lockTogetherDeceleration(car, 0.7), textbook.lockTogether(car, 0.7), 1e-12);
    // at the lock-together point the two utilisations meet, and both equal z (the ideal line)
    const z = lockTogetherDeceleration(car, 0.7);
    const u = adhesionUtilisation(car, 0.7, z);
    relWithin(u.front, u.rear, 1e-12);
    relWithin(u.front, z, 1e-12);
  });

  it('when the deceleration passes 0.623 g, then the first axle to lock changes from the front (stable) to the rear', () => {
    expect(firstToLock(car, 0.7, 0)).toBe('front');
    expect(firstToLock(car, 0.7, 0.5)).toBe('front');
    expect(firstToLock(car, 0.7, lockTogetherDeceleration(car, 0.7))).toBe('together');
    expect(firstToLock(car, 0.7, 0.7)).toBe('rear');
    expect(firstToLock(car, 0.5, 0.1)).toBe('rear');
  });

  it('when the brakes are given per axle, then the analyser finds the same lock-together point and the textbook efficiency z / k', () => {
    const analysis = analyseBrakeDistribution({ unladen: car, tyreLoadedRadiusMm: sameTyres, before: torqueAxles(70, 30) });
    const state = analysis.before.states[0];
    relWithin(analysis.before.hydraulicFrontShare, 0.7, 1e-12);
    relWithin(state.lockTogetherG!, 0.623077, 1e-6);
    expect(state.rearFirstFromG).toBeCloseTo(state.lockTogetherG!, 9);
    expect(state.lockOrder.map((s) => s.first)).toEqual(['front', 'rear']);
    // Braking efficiency η = z / μ (Crolla (ed.), Automotive Engineering, 2009, §12.1.4.3). With a fixed split the
    // front locks at z = k ψ / (Φ − k χ) and the rear at z = k (1 − ψ) / (1 − Φ + k χ), whichever comes first.
    const expectedZ = (k: number) => Math.min((k * 0.58) / (0.7 - k * chi(car)), (k * 0.42) / (0.3 + k * chi(car)));
    const at = (k: number) => state.efficiency.find((e) => e.k === k)!;
    relWithin(at(0.3).decelerationG!, 0.270934, 1e-5); // front-limited: 0.174 / 0.642222
    relWithin(at(0.8).decelerationG!, 0.739967, 1e-5); // rear-limited: 0.336 / 0.454074
    expect(at(0.3).limitedBy).toBe('front');
    expect(at(0.8).limitedBy).toBe('rear');
    for (const point of state.efficiency) {
      relWithin(point.decelerationG!, expectedZ(point.k), 1e-6);
      relWithin(point.efficiency!, expectedZ(point.k) / point.k, 1e-6);
    }
    // the curve holds the textbook utilisations at every point
    for (const p of state.curve.filter((_, i) => i % 10 === 0)) {
      expect(p.front).toBeCloseTo(textbook.ff(car, 0.7, p.z), 12);
      expect(p.rear).toBeCloseTo(textbook.fr(car, 0.7, p.z), 12);
    }
  });
});

describe('proportioning valve', () => {
  it('when the input is below the knee, then the rear gets it unchanged; above, the knee plus slope × the rest (Limpert ch. 7)', () => {
    const valve = { kneeBar: 30, slope: 0.3 };
    expect(proportionedPressureBar(0, valve)).toBe(0);
    expect(proportionedPressureBar(20, valve)).toBe(20);
    expect(proportionedPressureBar(30, valve)).toBe(30);
    expect(proportionedPressureBar(50, valve)).toBeCloseTo(36, 12); // 30 + 0.3 × 20
    expect(proportionedPressureBar(100, { kneeBar: 40, slope: 0 })).toBe(40); // slope 0: a pressure limiter
  });

  it('when a valve sits in the rear line, then the analyser splits the force so that front + rear = m g z at the pressures it reports', () => {
    const knee = 5; // reached at about 0.13 g, below where this split crosses (0.25 g)
    const slope = 0.35;
    const analysis = analyseBrakeDistribution({
      unladen: car,
      tyreLoadedRadiusMm: { front: 300, rear: 290 },
      before: torqueAxles(70, 40, { kind: 'proportioning', kneeBar: knee, slope }),
    });
    const setup = analysis.before;
    // axle force per bar = torque per bar / loaded radius (m)
    relWithin(setup.frontAxleNPerBar, 70 / 0.3, 1e-12);
    relWithin(setup.rearAxleNPerBar, 40 / 0.29, 1e-12);
    const weight = 1450 * 9.80665;
    for (const p of setup.states[0].curve.filter((q) => q.z > 0)) {
      const front = setup.frontAxleNPerBar * p.frontBar;
      const rear = setup.rearAxleNPerBar * p.rearBar;
      relWithin(front + rear, weight * p.z, 1e-9);
      expect(p.rearBar).toBeCloseTo(p.frontBar <= knee ? p.frontBar : knee + slope * (p.frontBar - knee), 9);
      relWithin(p.frontShare, front / (front + rear), 1e-9);
    }
    // the valve holds the rear back, so the car locks together later than without it
    const plain = analyseBrakeDistribution({
      unladen: car,
      tyreLoadedRadiusMm: { front: 300, rear: 290 },
      before: torqueAxles(70, 40),
    });
    expect(setup.states[0].lockTogetherG ?? Infinity).toBeGreaterThan(plain.before.states[0].lockTogetherG!);
    const at05 = (c: (typeof setup.states)[0]['curve']) => c.find((q) => q.z === 0.5)!;
    expect(at05(setup.states[0].curve).front).toBeGreaterThan(at05(setup.states[0].curve).rear);
    expect(at05(plain.before.states[0].curve).rear).toBeGreaterThan(at05(plain.before.states[0].curve).front);
    expect(plain.before.states[0].lockTogetherG!).toBeCloseTo(textbook.lockTogether(car, plain.before.hydraulicFrontShare), 6);
  });

  it('when the valve senses load, then the laden car uses the laden knee and the unladen car the unladen one', () => {
    const analysis = analyseBrakeDistribution({
      unladen: car,
      laden: ladenCar,
      tyreLoadedRadiusMm: sameTyres,
      before: torqueAxles(70, 40, { kind: 'load-sensing', kneeBarUnladen: 20, kneeBarLaden: 45, slope: 0.3 }),
    });
    const kneeSeen = (state: StateAnalysis) => {
      const above = state.curve.find((p) => p.rearBar < p.frontBar - 1e-9)!;
      // back out the knee from rear = knee + s (front − knee)
      return (above.rearBar - 0.3 * above.frontBar) / 0.7;
    };
    expect(kneeSeen(stateOf(analysis.before.states, 'unladen'))).toBeCloseTo(20, 6);
    expect(kneeSeen(stateOf(analysis.before.states, 'laden'))).toBeCloseTo(45, 6);
  });

  it('when the car has electronic distribution, then the rear never needs more friction than the front, and below the crossing nothing changes', () => {
    const input = (rearValve: BrakeSetup['rearValve']): DistributionInput => ({
      unladen: car,
      tyreLoadedRadiusMm: sameTyres,
      before: torqueAxles(60, 40, rearValve),
    });
    const ebd = analyseBrakeDistribution(input({ kind: 'electronic' }));
    const plain = analyseBrakeDistribution(input({ kind: 'none' }));
    const crossing = plain.before.states[0].lockTogetherG!; // (0.6 − 0.58) / χ = 0.103846 g
    relWithin(crossing, 0.02 / chi(car), 1e-6);
    for (const [i, p] of ebd.before.states[0].curve.entries()) {
      expect(p.rear).toBeLessThanOrEqual(p.front + 1e-12);
      if (p.z < crossing) expect(p.rear).toBeCloseTo(plain.before.states[0].curve[i].rear, 12);
    }
    expect(ebd.before.states[0].rearFirstFromG).toBeNull();
    expect(ebd.assumptions.join(' ')).toContain('Electronic brake-force distribution is modelled as keeping the rear');
  });
});

describe('before and after a swap, with disc corners from the brake-chain reference', () => {
  // REFERENCES (disc-brake textbook formula): stock front 1 × 54 mm 280/50, rear 1 × 38 mm 280/40,
  // swapped front 40 + 44 mm 330/55; front share 65.93 % → 73.72 % at equal pressure and μ 0.40.
  const stock: BrakeSetup = {
    front: { kind: 'disc', pistonsPerSideMm: [54], rotorDiameterMm: 280, padHeightMm: 50 },
    rear: { kind: 'disc', pistonsPerSideMm: [38], rotorDiameterMm: 280, padHeightMm: 40 },
    rearValve: { kind: 'none' },
  };
  const swapped: BrakeSetup = {
    ...stock,
    front: { kind: 'disc', pistonsPerSideMm: [40, 44], rotorDiameterMm: 330, padHeightMm: 55 },
  };

  it('when a corner is described, then the adapter gives twice its torque at 1 bar (1053.50 N·m at 50 bar per stock front wheel)', () => {
    relWithin(axleTorqueNmPerBar(stock.front), (2 * 1053.5) / 50, 1e-5);
    relWithin(axleTorqueNmPerBar(swapped.front), (2 * 1527.44) / 50, 1e-5);
    relWithin(axleTorqueNmPerBar({ kind: 'torque-per-bar', axleTorqueNmPerBar: 12.5 }), 12.5, 0);
  });

  it('when the rear has drums, then the adapter takes the drum formula: 20.64 mm, 203.2 mm, C* 2.2 give 299.15 N·m per wheel at 40 bar', () => {
    // REFERENCES, drum brakes (Limpert, Brake Design and Safety, from memory): T = p × A_wc × C* × r_drum
    const drum = { kind: 'drum', wheelCylinderBoreMm: 20.64, drumDiameterMm: 203.2, brakeFactor: 2.2 } as const;
    relWithin(axleTorqueNmPerBar(drum), (2 * 299.15) / 40, 1e-4);
    relWithin(axleTorqueNmPerBar(drum), (2 * 0.1 * (Math.PI / 4) * 20.64 ** 2 * 2.2 * 101.6) / 1000, 1e-12);
    const analysis = analyseBrakeDistribution({ unladen: car, tyreLoadedRadiusMm: sameTyres, before: { ...stock, rear: drum } });
    relWithin(analysis.before.rearAxleNPerBar, (axleTorqueNmPerBar(drum) * 1000) / 300, 1e-12);
    // a drum's shoes take fluid in a way the piston area alone does not tell
    expect(analysis.before.fluid).toBeNull();
    const tooWide = { ...drum, wheelCylinderBoreMm: 210 };
    expect(
      fieldOf(() =>
        analyseBrakeDistribution({ unladen: car, tyreLoadedRadiusMm: sameTyres, before: { ...stock, rear: tooWide } }),
      ),
    ).toBe('before.rear.wheelCylinderBoreMm');
  });

  it('when the bigger front calipers go on, then the balance moves to the front, the crossing moves from 0.41 g to 0.82 g and the sentence says so', () => {
    const analysis = analyseBrakeDistribution({ unladen: car, tyreLoadedRadiusMm: sameTyres, before: stock, after: swapped });
    expect(analysis.comparison!.direction).toBe('front');
    expect(analysis.comparison!.frontShareBefore * 100).toBeCloseTo(65.93, 2);
    expect(analysis.comparison!.frontShareAfter * 100).toBeCloseTo(73.72, 2);
    const before = analysis.before.states[0].lockTogetherG!;
    const after = analysis.after!.states[0].lockTogetherG!;
    relWithin(before, textbook.lockTogether(car, analysis.comparison!.frontShareBefore), 1e-6);
    relWithin(after, textbook.lockTogether(car, analysis.comparison!.frontShareAfter), 1e-6);
    expect(before).toBeCloseTo(0.4117, 3);
    expect(after).toBeCloseTo(0.8162, 3);
    expect(analysis.summary).toBe(
      'The swap moves the balance toward the front (front share 65.9 % → 73.7 %): the rear still locks first above 0.82 g when unladen, later than before (above 0.41 g when unladen).',
    );
  });

  it('when the opposed calipers take more fluid, then the fluid per mm of pad travel grows by the piston area (×1.142) and the pedal travel with it', () => {
    const analysis = analyseBrakeDistribution({
      unladen: car,
      tyreLoadedRadiusMm: sameTyres,
      before: stock,
      after: swapped,
      pedal: { masterCylinderBoreMm: 22.2, pedalRatio: 3.5, boosterRatio: 4 },
    });
    // each wheel takes 2 × A_side per mm: A_side 2290.22 / 1134.11 / 2777.17 mm² (REFERENCES)
    relWithin(analysis.before.fluid!.mm3PerMmPadTravel, 4 * 2290.22 + 4 * 1134.11, 1e-5);
    relWithin(analysis.after!.fluid!.mm3PerMmPadTravel, 4 * 2777.17 + 4 * 1134.11, 1e-5);
    relWithin(analysis.comparison!.fluidRatio!, (2777.17 + 1134.11) / (2290.22 + 1134.11), 1e-5);
    const masterArea = (Math.PI / 4) * 22.2 ** 2;
    relWithin(analysis.before.fluid!.pedalTravelMmPerMmPadTravel!, ((4 * 2290.22 + 4 * 1134.11) / masterArea) * 3.5, 1e-5);
  });
});

describe('pedal side (Pascal: p = F / A)', () => {
  it('when the master cylinder is 22.2 mm, the pedal ratio 3.5 and the booster 4, then 1 g takes 42.66 bar and 117.9 N at the pedal', () => {
    const analysis = analyseBrakeDistribution({
      unladen: car,
      tyreLoadedRadiusMm: sameTyres,
      before: torqueAxles(70, 30),
      pedal: { masterCylinderBoreMm: 22.2, pedalRatio: 3.5, boosterRatio: 4 },
    });
    // 100 N·m/bar on a 0.3 m radius is 333.33 N/bar; m g = 14219.64 N → 42.6589 bar per g
    const barPerG = (1450 * 9.80665) / (100 / 0.3);
    relWithin(analysis.before.states[0].pedal.lineBarPerG, barPerG, 1e-12);
    relWithin(barPerG, 42.6589, 1e-5);
    // F_pedal = p × A_mc / (pedal ratio × booster ratio), 1 bar = 0.1 N/mm²
    relWithin(analysis.before.states[0].pedal.pedalForceNPerG!, (barPerG * 0.1 * (Math.PI / 4) * 22.2 ** 2) / 14, 1e-12);
    relWithin(analysis.before.states[0].pedal.pedalForceNPerG!, 117.94, 1e-4);
  });
});

describe('the passenger-car reference band (UN R13-H Annex 5; figures as confirmed in the source note)', () => {
  it('when the line is z = 0.10 + 0.85 (k − 0.20), then k 0.2 sits at 0.10 g and k 0.8 at 0.61 g, and nothing outside', () => {
    // Crolla (ed.), Automotive Engineering (2009), §12.1.2, quoting the EEC braking directive for category M1
    expect(minimumLineK(0.1)).toBeCloseTo(0.2, 12);
    expect(minimumLineK(0.61)).toBeCloseTo(0.8, 12);
    expect(minimumLineK(0.5)).toBeCloseTo(0.2 + 0.4 / 0.85, 12);
    expect(minimumLineK(0.05)).toBeNull();
    expect(minimumLineK(0.7)).toBeNull();
  });

  it('when the rear overtakes the front at 0.41 g, then the reading shows the rear above between 0.41 and 0.8 g, and the 0.30–0.45 g allowance covers only its start', () => {
    // Φ 0.6593 → crossing (0.6593 − 0.58) / χ; f_r(0.45) = 0.3407 × 0.45 / 0.33333 = 0.460 < 0.45 + 0.05
    const analysis = analyseBrakeDistribution({ unladen: car, tyreLoadedRadiusMm: sameTyres, before: torqueAxles(65.93, 34.07) });
    const reading = analysis.before.states[0].reference;
    const crossing = textbook.lockTogether(car, 0.6593);
    expect(reading.rearAboveFront).toHaveLength(1);
    expect(reading.rearAboveFront[0].fromG).toBeCloseTo(crossing, 6);
    expect(reading.rearAboveFront[0].toG).toBeCloseTo(0.8, 9);
    expect(reading.outsideAllowance).toHaveLength(1);
    expect(reading.outsideAllowance[0].fromG).toBeCloseTo(0.45, 6);
    expect(reading.inside).toBe(false);
    expect(analysis.reference.caveat).toContain('not a verdict');
  });

  it('when the rear brakes are far too strong, then the rear needs more friction than the minimum line allows at low deceleration', () => {
    // Φ 0.30: f_r(0.3) = 0.7 × 0.3 / (0.42 − 0.057778) = 0.5798 > 0.2 + 0.2 / 0.85 = 0.4353
    const analysis = analyseBrakeDistribution({ unladen: car, tyreLoadedRadiusMm: sameTyres, before: torqueAxles(30, 70) });
    const reading = analysis.before.states[0].reference;
    expect(reading.aboveMinimumLine.length).toBeGreaterThan(0);
    expect(reading.aboveMinimumLine[0].fromG).toBeLessThanOrEqual(0.3);
    expect(analysis.before.states[0].rearFirstFromG).toBe(0);
    expect(analysis.summary).toBe(
      'The rear locks first at any deceleration when unladen — check the rear valve and the brake balance before driving hard.',
    );
  });

  it('when a front-biased car is well inside the band laden and unladen, then the reading says inside and the sentence names the stable order', () => {
    const analysis = analyseBrakeDistribution({
      unladen: car,
      laden: ladenCar,
      tyreLoadedRadiusMm: sameTyres,
      before: torqueAxles(80, 20),
    });
    for (const state of analysis.before.states) {
      expect(state.reference.inside).toBe(true);
      expect(state.rearFirstFromG).toBeNull();
    }
    expect(analysis.summary).toBe('The front locks first up to 1.00 g laden and unladen, the stable order.');
  });
});

describe('the sentence on a rear-biased swap', () => {
  it('when bigger rear brakes go on, then it says the balance moves to the rear, where the rear locks first, and what to do', () => {
    const analysis = analyseBrakeDistribution({
      unladen: car,
      laden: ladenCar,
      tyreLoadedRadiusMm: sameTyres,
      before: torqueAxles(80, 20),
      after: torqueAxles(80, 45),
    });
    // after: Φ = 80 / 125 = 0.64 → unladen crossing (0.64 − 0.58) / 0.192593 = 0.3115 g; laden (0.64 − 0.52) / 0.207407 = 0.5786 g
    expect(stateOf(analysis.after!.states, 'unladen').rearFirstFromG).toBeCloseTo(0.06 / chi(car), 6);
    expect(stateOf(analysis.after!.states, 'laden').rearFirstFromG).toBeCloseTo(0.12 / chi(ladenCar), 6);
    expect(analysis.summary).toBe(
      'The swap moves the balance toward the rear (front share 80.0 % → 64.0 %): after it the rear locks first above 0.31 g when unladen and above 0.58 g when laden — fit a proportioning valve or keep the stock rear brakes.',
    );
  });

  it('when the car already has a proportioning valve, then the advice is to lower its knee', () => {
    const valve = { kind: 'proportioning', kneeBar: 60, slope: 0.3 } as const;
    const analysis = analyseBrakeDistribution({
      unladen: car,
      tyreLoadedRadiusMm: sameTyres,
      before: torqueAxles(80, 20, valve),
      after: torqueAxles(80, 45, valve),
    });
    expect(analysis.summary).toMatch(
      /after it the rear locks first above 0\.\d\d g when unladen — lower the rear valve's knee or keep the stock rear brakes\.$/,
    );
  });
});

describe('impossible input is refused with the field named', () => {
  it('when a vehicle figure is impossible, then each function names it', () => {
    expect(fieldOf(() => axleLoadsN({ ...car, massKg: 0 }, 0.5))).toBe('massKg');
    expect(fieldOf(() => axleLoadsN({ ...car, frontStaticFraction: 1 }, 0.5))).toBe('frontStaticFraction');
    expect(fieldOf(() => idealFrontShare({ ...car, cgHeightMm: -1 }, 0.5))).toBe('cgHeightMm');
    expect(fieldOf(() => lockTogetherDeceleration({ ...car, wheelbaseMm: Number.NaN }, 0.7))).toBe('wheelbaseMm');
    expect(fieldOf(() => adhesionUtilisation(car, 1.2, 0.5))).toBe('frontShare');
    expect(fieldOf(() => firstToLock(car, -0.1, 0.5))).toBe('frontShare');
    expect(fieldOf(() => adhesionUtilisation(car, 0.7, -0.1))).toBe('z');
    // the rear axle carries nothing from z = (1 − ψ) / χ = 2.1808 g on
    expect(fieldOf(() => axleLoadsN(car, 2.2))).toBe('z');
    const liftOff = (1 - car.frontStaticFraction) / chi(car);
    expect(fieldOf(() => adhesionUtilisation(car, 0.7, liftOff))).toBe('z');
    expect(axleLoadsN(car, liftOff).rearN).toBeCloseTo(0, 6);
    expect(fieldOf(() => proportionedPressureBar(-1, { kneeBar: 30, slope: 0.3 }))).toBe('inputBar');
    expect(fieldOf(() => proportionedPressureBar(40, { kneeBar: -5, slope: 0.3 }))).toBe('kneeBar');
    expect(fieldOf(() => proportionedPressureBar(40, { kneeBar: 30, slope: 1.5 }))).toBe('slope');
  });

  it('when the analyser gets an impossible figure, then the error names where it sits', () => {
    const base: DistributionInput = { unladen: car, laden: ladenCar, tyreLoadedRadiusMm: sameTyres, before: torqueAxles(70, 30) };
    expect(fieldOf(() => analyseBrakeDistribution({ ...base, laden: { ...ladenCar, massKg: -3 } }))).toBe('laden.massKg');
    expect(fieldOf(() => analyseBrakeDistribution({ ...base, tyreLoadedRadiusMm: { front: 0, rear: 300 } }))).toBe(
      'tyreLoadedRadiusMm.front',
    );
    expect(
      fieldOf(() =>
        analyseBrakeDistribution({
          ...base,
          after: { ...torqueAxles(70, 30), rear: { kind: 'disc', pistonsPerSideMm: [38], rotorDiameterMm: 60, padHeightMm: 40 } },
        }),
      ),
    ).toBe('after.rear.padHeightMm');
    expect(
      fieldOf(() =>
        analyseBrakeDistribution({ ...base, before: torqueAxles(70, 30, { kind: 'proportioning', kneeBar: 30, slope: 2 }) }),
      ),
    ).toBe('before.rearValve.slope');
    expect(fieldOf(() => analyseBrakeDistribution({ ...base, before: torqueAxles(70, 0) }))).toBe(
      'before.rear.axleTorqueNmPerBar',
    );
    expect(
      fieldOf(() => analyseBrakeDistribution({ ...base, pedal: { masterCylinderBoreMm: 22, pedalRatio: 3, boosterRatio: 0.5 } })),
    ).toBe('pedal.boosterRatio');
  });
});

describe('properties', () => {
  const vehicles = fc.record({
    massKg: fc.double({ min: 500, max: 3500, noNaN: true }),
    frontStaticFraction: fc.double({ min: 0.3, max: 0.7, noNaN: true }),
    cgHeightMm: fc.double({ min: 350, max: 800, noNaN: true }),
    wheelbaseMm: fc.double({ min: 2000, max: 3500, noNaN: true }),
  });
  const torque = fc.double({ min: 5, max: 200, noNaN: true });

  it('when rear torque is added to a front-first car, then the lock-together deceleration never rises', () => {
    fc.assert(
      fc.property(vehicles, torque, torque, fc.double({ min: 0.01, max: 100, noNaN: true }), (vehicle, front, rear, extra) => {
        const before = front / (front + rear);
        const after = front / (front + rear + extra);
        fc.pre(lockTogetherDeceleration(vehicle, before) > 0);
        expect(lockTogetherDeceleration(vehicle, after)).toBeLessThanOrEqual(lockTogetherDeceleration(vehicle, before));
      }),
    );
  });

  it('when rear torque is added behind any rear valve, then the analysed crossing never rises', () => {
    const valves = fc.constantFrom<BrakeSetup['rearValve']>(
      { kind: 'none' },
      { kind: 'proportioning', kneeBar: 30, slope: 0.3 },
      { kind: 'load-sensing', kneeBarUnladen: 25, kneeBarLaden: 50, slope: 0.25 },
    );
    fc.assert(
      fc.property(
        vehicles,
        torque,
        torque,
        fc.double({ min: 0.5, max: 100, noNaN: true }),
        valves,
        (vehicle, front, rear, extra, valve) => {
          const crossing = (rearTorque: number) => {
            const state = analyseBrakeDistribution({
              unladen: vehicle,
              tyreLoadedRadiusMm: sameTyres,
              before: torqueAxles(front, rearTorque, valve),
            }).before.states[0];
            // a car whose front leads to the end of the range crosses beyond it
            return state.rearFirstFromG ?? Infinity;
          };
          expect(crossing(rear + extra)).toBeLessThanOrEqual(crossing(rear) + 1e-9);
        },
      ),
      { numRuns: 40 },
    );
  });

  // z from 0 up to 1 g, or to where the rear axle would leave the ground on a tall, short car
  const upTo1g = (vehicle: DistributionVehicle, t: number) => t * Math.min(1, (1 - vehicle.frontStaticFraction) / chi(vehicle));

  it('when z runs from 0 to 1 g, then the ideal front share stays between ψ and ψ + χ', () => {
    fc.assert(
      fc.property(vehicles, fc.double({ min: 0, max: 1, noNaN: true }), (vehicle, t) => {
        const z = upTo1g(vehicle, t);
        const psi = vehicle.frontStaticFraction;
        const share = idealFrontShare(vehicle, z);
        expect(share).toBeGreaterThanOrEqual(psi);
        expect(share).toBeLessThanOrEqual(psi + chi(vehicle) + 1e-12);
      }),
    );
  });

  it('when the split equals the ideal share at z, then both axles need exactly z', () => {
    fc.assert(
      fc.property(vehicles, fc.double({ min: 0.01, max: 0.999, noNaN: true }), (vehicle, t) => {
        const z = upTo1g(vehicle, t);
        const u = adhesionUtilisation(vehicle, idealFrontShare(vehicle, z), z);
        expect(u.front).toBeCloseTo(z, 9);
        expect(u.rear).toBeCloseTo(z, 9);
      }),
    );
  });
});
