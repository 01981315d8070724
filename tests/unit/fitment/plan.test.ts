import { describe, expect, it } from 'vitest';
import {
  brakeAxlesChanged,
  carBrakesAsIs,
  computePlan,
  machiningInOrder,
  mergedParts,
  mergedTools,
  planCosts,
  planTime,
  type PlanInput,
  type PlanSwap,
} from '../../../shared/fitment/plan';
import { swapDataSchema, type BrakeCorner, type SwapDataInput } from '../../../shared/schemas/swap-data';
import type { VehicleData } from '../../../shared/schemas/vehicle';
import { brakeBalanceOf } from '../../../shared/fitment/swap-checks';

// Hand-worked figures. Disc torque per wheel T = 2 μ p A r_eff with A the piston area of one side
// (Σ π d²/4) and r_eff = D/2 − h/2 (pad centre with the pad's outer edge at the rotor edge; Limpert,
// Brake Design and Safety, disc brake torque). At equal μ and p the front share is
// A_f r_f / (A_f r_f + A_r r_r).
//   stock front  [54] 280/50:  A = 2290.22 mm², r = 115 mm  → A·r = 263 375
//   stock rear   [36] 260/40:  A = 1017.88 mm², r = 110 mm  → A·r = 111 967
//   four-piston  [40,44] 330/55: A = 2777.17 mm², r = 137.5 → A·r = 381 861
//   bigger rear  [38] 300/44:  A = 1134.11 mm², r = 128 mm  → A·r = 145 166
//   single-piston upgrade [57] 300/52: A = 2551.76, r = 124  → A·r = 316 418

const disc = (pistonsPerSideMm: number[], rotorDiameterMm: number, padHeightMm: number): BrakeCorner => ({
  kind: 'disc',
  pistonsPerSideMm,
  rotorDiameterMm,
  padHeightMm,
});
const STOCK = { front: disc([54], 280, 50), rear: disc([36], 260, 40) };
const FOUR_PISTON = disc([40, 44], 330, 55);
const BIGGER_REAR = disc([38], 300, 44);
const SINGLE_UPGRADE = disc([57], 300, 52);

function swap(slug: string, axle: 'front' | 'rear', extra: Partial<SwapDataInput> = {}): PlanSwap {
  const data = swapDataSchema.parse({
    schemaVersion: 2,
    title: `The ${slug} swap`,
    parts: [{ role: 'Caliper', kind: 'caliper', name: `${slug} caliper`, quantity: 2 }],
    ...extra,
  });
  return { slug, title: data.title, axle, revisionNumber: 1, data };
}

const brakes = (after: { front?: BrakeCorner; rear?: BrakeCorner }) => ({
  before: STOCK,
  after: { front: after.front ?? STOCK.front, rear: after.rear ?? STOCK.rear },
});

const front = swap('four-piston-front', 'front', { brakes: brakes({ front: FOUR_PISTON }) });
const rear = swap('bigger-rear', 'rear', { brakes: brakes({ rear: BIGGER_REAR }) });
const fittedFront = swap('single-piston-front', 'front', { brakes: brakes({ front: SINGLE_UPGRADE }) });

/** ψ = 0.6, h = 500 mm, L = 2500 mm, so χ = h/L = 0.2; no valve. */
const VEHICLE: VehicleData = {
  unladen: { massKg: 1200, frontStaticFraction: 0.6, cgHeightMm: 500 },
  laden: null,
  wheelbaseMm: 2500,
  tyreLoadedRadiusMm: { front: 300, rear: 300 },
  rearValve: { kind: 'none' },
  basis: '',
};

const wheel = { diameterIn: 16, widthIn: 7, offsetMm: 38, spacerMm: 0 };
const input = (swaps: PlanSwap[], fitted: PlanSwap[] = [], vehicle: VehicleData | null = VEHICLE): PlanInput => ({
  chassis: { stockBrakes: STOCK, vehicle, wheelBoltThread: 'M12x1.5', centreBoreMm: 66.6, wheelFastening: null },
  car: { wheel, vehicle: null, fitted },
  swaps,
});

describe('the brakes of a plan', () => {
  it('when a swap changes only the front figures, then it changes the front axle only', () => {
    expect(brakeAxlesChanged(front.data)).toEqual(['front']);
    expect(brakeAxlesChanged(rear.data)).toEqual(['rear']);
  });

  it('when a front and a rear swap are planned on a stock car, then the front share is both swaps’ corners together (hand-worked)', () => {
    const plan = computePlan(input([front, rear]));
    // stock: 263 375 / (263 375 + 111 967) = 0.7017; planned: 381 861 / (381 861 + 145 166) = 0.7246
    expect(plan.brakes.frontShareAsIs).toBeCloseTo(0.7017, 3);
    expect(plan.brakes.frontSharePlanned).toBeCloseTo(0.7246, 3);
    expect(plan.brakes.shift.direction).toBe('forward');
    expect(plan.brakes.planned.front.source).toEqual({ kind: 'swap', slug: 'four-piston-front', title: front.title });
    expect(plan.brakes.planned.rear.source).toMatchObject({ kind: 'swap', slug: 'bigger-rear' });
  });

  it('when the car already has a front swap fitted, then the plan starts from it, not from stock (hand-worked)', () => {
    const plan = computePlan(input([rear], [fittedFront]));
    // as it is: 316 418 / (316 418 + 111 967) = 0.7386; with the bigger rear: 316 418 / (316 418 + 145 166) = 0.6855
    expect(plan.brakes.asIs.front.source).toMatchObject({ kind: 'swap', slug: 'single-piston-front' });
    expect(plan.brakes.frontShareAsIs).toBeCloseTo(0.7386, 3);
    expect(plan.brakes.frontSharePlanned).toBeCloseTo(0.6855, 3);
    expect(plan.brakes.shift.direction).toBe('rearward');
    expect(plan.brakes.shift.severity).toBe('hazard');
  });

  it('when the rear swap is planned alone, then the rear locks first from a lower deceleration than stock (Limpert ch. 7: rear first above z = (φ − ψ)/χ)', () => {
    // With no valve, the front locks first while φ > ψ + χz. Stock: (0.7017 − 0.6)/0.2 = 0.508 g.
    // Rear swap alone: φ = 263 375 / (263 375 + 145 166) = 0.6447 → (0.6447 − 0.6)/0.2 = 0.223 g.
    const alone = computePlan(input([rear])).brakes.distribution!;
    expect(alone.before.states[0]!.rearFirstFromG).toBeCloseTo(0.508, 1);
    expect(alone.after!.states[0]!.rearFirstFromG).toBeCloseTo(0.223, 1);
    // With the four-piston front as well: φ = 0.7246 → 0.623 g, later than stock: the front still leads.
    const both = computePlan(input([front, rear])).brakes.distribution!;
    expect(both.after!.states[0]!.rearFirstFromG).toBeCloseTo(0.623, 1);
    expect(both.summary).toMatch(/front/i);
  });

  it('when the rear swap’s sheet is opened for a car with a front swap fitted, then its balance starts from the car as it is (hand-worked, as the plan above)', () => {
    const asIs = carBrakesAsIs(STOCK, [fittedFront]);
    const corners = { front: asIs.front.corner, rear: asIs.rear.corner };
    const onCar = brakeBalanceOf(rear.data, null, { brakesAsIs: corners, fittedHere: false })!;
    // before: the fitted single-piston front with the stock rear, 0.7386; after: the bigger rear added, 0.6855
    expect(onCar.frontShareBefore).toBeCloseTo(0.7386, 3);
    expect(onCar.frontShareAfter).toBeCloseTo(0.6855, 3);
    expect(onCar.shift.direction).toBe('rearward');
    // from a stock car the same sheet reads 0.7017 → 0.6447: the car as it is moves further
    const stock = brakeBalanceOf(rear.data)!;
    expect(stock.frontShareBefore).toBeCloseTo(0.7017, 3);
    expect(stock.frontShareAfter).toBeCloseTo(0.6447, 3);
  });

  it('when a front swap’s sheet is opened for a car with another front swap fitted, then the fitted one is what it replaces', () => {
    const asIs = carBrakesAsIs(STOCK, [fittedFront]);
    const onCar = brakeBalanceOf(front.data, null, {
      brakesAsIs: { front: asIs.front.corner, rear: asIs.rear.corner },
      fittedHere: false,
    })!;
    // before 316 418 / (316 418 + 111 967) = 0.7386; after 381 861 / (381 861 + 111 967) = 0.7733
    expect(onCar.frontShareBefore).toBeCloseTo(0.7386, 3);
    expect(onCar.frontShareAfter).toBeCloseTo(0.7733, 3);
  });

  it('when a sheet is opened for a car that already has that swap fitted, then “before” is the car without it', () => {
    const asIs = carBrakesAsIs(STOCK, [fittedFront, rear]);
    const onCar = brakeBalanceOf(rear.data, null, {
      brakesAsIs: { front: asIs.front.corner, rear: asIs.rear.corner },
      fittedHere: true,
    })!;
    // before: the fitted front with the stock rear it replaced, 0.7386; after: the car as it is, 0.6855
    expect(onCar.frontShareBefore).toBeCloseTo(0.7386, 3);
    expect(onCar.frontShareAfter).toBeCloseTo(0.6855, 3);
  });

  it('when a plan changes the lock order, then its sentence names the plan, not a swap', () => {
    const plan = computePlan(input([rear], [fittedFront]));
    expect(plan.brakes.distribution!.summary).toMatch(/^The plan moves the balance toward the rear/);
  });

  it('when neither the car nor the chassis has vehicle figures, then no lock order is claimed', () => {
    const plan = computePlan(input([front, rear], [], null));
    expect(plan.brakes.distribution).toBeNull();
    expect(plan.brakes.vehicleSource).toBeNull();
  });
});

describe('what a plan buys, does and uses', () => {
  const shim = { partId: 9, role: 'Shims', kind: 'shim' as const, name: 'Shim 0.5 mm', quantity: 4 };
  const bolts = { partId: 5, role: 'Wheel bolts', kind: 'hardware' as const, name: 'Bolt 36 mm', quantity: 10 };

  it('when the same part is used on both axles, then it is counted once per corner: the axles add up', () => {
    const merged = mergedParts([swap('f', 'front', { parts: [shim] }), swap('r', 'rear', { parts: [shim] })]);
    expect(merged).toHaveLength(1);
    expect(merged[0]).toMatchObject({ perAxle: { front: 4, rear: 4 }, total: 8, usedBy: ['f', 'r'] });
  });

  it('when two swaps on one axle need the same part, then they share it (the larger quantity counts)', () => {
    const merged = mergedParts([
      swap('a', 'front', { parts: [bolts] }),
      swap('b', 'front', { parts: [{ ...bolts, quantity: 5 }] }),
    ]);
    expect(merged[0]).toMatchObject({ perAxle: { front: 10, rear: 0 }, total: 10 });
  });

  it('when parts without a catalogue id have the same maker and number written differently, then they are one part', () => {
    const a = {
      role: 'Hose',
      kind: 'line' as const,
      name: 'Braided hose',
      maker: 'Northgate',
      partNumbers: ['NG-44.12'],
      quantity: 2,
    };
    const merged = mergedParts([
      swap('a', 'front', { parts: [a] }),
      swap('b', 'rear', { parts: [{ ...a, partNumbers: ['ng 4412'] }] }),
    ]);
    expect(merged).toHaveLength(1);
    expect(merged[0]!.total).toBe(4);
  });

  it('when swaps list machining, then required steps come first, each swap’s order kept, numbered through', () => {
    const a = swap('a', 'front', {
      machining: [
        { component: 'dust_shield', operation: 'trim', where: 'Front shield edge', required: false },
        { component: 'knuckle', operation: 'machine', where: 'Front knuckle lug face', required: true },
      ],
    });
    const b = swap('b', 'rear', {
      machining: [{ component: 'dust_shield', operation: 'trim', where: 'Rear shield edge', required: true }],
    });
    const steps = machiningInOrder([a, b]);
    expect(steps.map((s) => [s.n, s.where, s.structural])).toEqual([
      [1, 'Front knuckle lug face', true],
      [2, 'Rear shield edge', false],
      [3, 'Front shield edge', false],
    ]);
  });

  it('when two swaps name the same tool differently cased, then the tool is listed once', () => {
    const tools = mergedTools([
      swap('a', 'front', { tools: ['Torque wrench, 20–120 N·m'] }),
      swap('b', 'rear', { tools: ['torque wrench,  20–120 N·m', 'Tin snips'] }),
    ]);
    expect(tools.map((t) => t.name)).toEqual(['Torque wrench, 20–120 N·m', 'Tin snips']);
    expect(tools[0]!.usedBy).toEqual(['a', 'b']);
  });
});

describe('what a plan costs and takes', () => {
  const priced = (slug: string, axle: 'front' | 'rear', asBuilt: number, budget: number, newKit: number, hours: number | null) =>
    swap(slug, axle, {
      costs: [
        { route: 'as_built', item: 'Parts', amountMinor: asBuilt },
        { route: 'budget', item: 'Parts', amountMinor: budget },
        { route: 'new_kit', item: 'Kit', amountMinor: newKit },
      ],
      installHours: hours,
    });

  it('when both swaps price every route, then the plan totals are the sums, per axle too, with the saving against new kits', () => {
    const costs = planCosts([priced('f', 'front', 80_000, 52_000, 160_000, 6), priced('r', 'rear', 48_500, 33_800, 67_900, 4)]);
    expect(costs.currency).toBe('EUR');
    expect(costs.totals).toEqual({ as_built: 128_500, budget: 85_800, new_kit: 227_900 });
    expect(costs.perAxle.rear).toEqual({ as_built: 48_500, budget: 33_800, new_kit: 67_900 });
    // new kit − budget = 227 900 − 85 800 = 142 100, 62.35 % of 227 900
    expect(costs.savings.budget!.amountMinor).toBe(142_100);
    expect(costs.savings.budget!.percent).toBeCloseTo(62.35, 2);
  });

  it('when one swap does not price a route, then that route has no plan total and the gap is named', () => {
    const unpriced = swap('u', 'rear', { costs: [{ route: 'as_built', item: 'Parts', amountMinor: 1000 }] });
    const costs = planCosts([priced('f', 'front', 80_000, 52_000, 160_000, 6), unpriced]);
    expect(costs.totals).toEqual({ as_built: 81_000, budget: null, new_kit: null });
    expect(costs.missing).toEqual([
      { slug: 'u', route: 'budget' },
      { slug: 'u', route: 'new_kit' },
    ]);
  });

  it('when swaps price in different currencies, then nothing is added up', () => {
    const other = swap('g', 'rear', { currency: 'GBP', costs: [{ route: 'as_built', item: 'Parts', amountMinor: 1000 }] });
    const costs = planCosts([priced('f', 'front', 80_000, 52_000, 160_000, 6), other]);
    expect(costs.currency).toBeNull();
    expect(costs.totals).toEqual({ as_built: null, budget: null, new_kit: null });
  });

  it('when install times are stated, then they add up and the longest job is named; unstated ones are listed', () => {
    const time = planTime([
      priced('f', 'front', 1, 1, 1, 6),
      priced('r', 'rear', 1, 1, 1, 4),
      priced('x', 'rear', 1, 1, 1, null),
    ]);
    expect(time).toEqual({ totalHours: 10, longest: { slug: 'f', title: 'The f swap', hours: 6 }, unstated: ['x'] });
  });
});

describe('the wheels of a plan', () => {
  it('when swaps need different wheels, then the largest minimum diameter holds, and each swap is checked against the car’s wheel', () => {
    const a = swap('a', 'front', { wheel: { minDiameterIn: 16, caliperRadialProjectionMm: 12, caliperOutboardMm: 30 } });
    const b = swap('b', 'rear', {
      wheel: { minDiameterIn: 15, caliperRadialProjectionMm: 10, caliperOutboardMm: 20 },
      spacers: [{ axle: 'rear', thicknessMm: 10, hubCentric: true, mounting: 'slip_on', quantity: 2 }],
    });
    const plan = computePlan({ ...input([a, b]), car: { wheel: { ...wheel, diameterIn: 15 }, vehicle: null, fitted: [] } });
    expect(plan.wheels.minDiameterIn).toBe(16);
    expect(plan.wheels.minDiameterFrom).toBe('a');
    expect(plan.wheels.checks.map((c) => [c.slug, c.check.minDiameter?.ok])).toEqual([
      ['a', false],
      ['b', true],
    ]);
    expect(plan.wheels.spacers.rear).toEqual([
      { slug: 'b', thicknessMm: 10, mounting: 'slip_on', hubCentric: true, quantity: 2 },
    ]);
  });
});
