import { axleTorqueNmPerBar, type AxleBrakes } from './axle-torque';
import { pistonAreaPerSideMm2 } from './brakes';
import {
  adhesionUtilisation,
  idealFrontShare,
  proportionedPressureBar,
  STANDARD_GRAVITY,
  type DistributionVehicle,
} from './distribution';
import { FitmentInputError, requireFinite, requirePositive } from './errors';
import { BALANCE_UNCHANGED_POINTS, minimumLineK, PASSENGER_CAR_REFERENCE } from './distribution-reference';
import { summarise } from './distribution-summary';
import type {
  Axle,
  BrakeSetup,
  CurvePoint,
  DistributionAnalysis,
  DistributionComparison,
  DistributionInput,
  EfficiencyPoint,
  LoadState,
  PedalInput,
  RearPressureLaw,
  SetupAnalysis,
  StateAnalysis,
  ZRange,
} from './distribution-types';

export * from './distribution-types';
export { BALANCE_UNCHANGED_POINTS, minimumLineK, PASSENGER_CAR_REFERENCE } from './distribution-reference';

const CURVE_STEP_G = 0.01;
const SCAN_STEP_G = 0.001;
const EFFICIENCY_KS = Array.from({ length: 19 }, (_, i) => Math.round((0.1 + i * 0.05) * 100) / 100);
const N_PER_MM2_PER_BAR = 0.1;

interface AxleRates {
  /** brake force per bar of line pressure, N/bar */
  front: number;
  rear: number;
}

interface Operating {
  frontShare: number;
  frontBar: number;
  rearBar: number;
}

function checkVehicle(vehicle: DistributionVehicle, state: LoadState): DistributionVehicle {
  try {
    idealFrontShare(vehicle, 0);
  } catch (error) {
    if (error instanceof FitmentInputError) throw new FitmentInputError(`${state}.${error.field}`, `${state}.${error.message}`);
    throw error;
  }
  return vehicle;
}

function forcesPerBar(setup: BrakeSetup, radius: { front: number; rear: number }, prefix: string): AxleRates {
  const frontR = requirePositive(radius?.front, 'tyreLoadedRadiusMm.front');
  const rearR = requirePositive(radius?.rear, 'tyreLoadedRadiusMm.rear');
  // N·m per bar → N per bar at the tyre's contact patch: T / r with r in metres
  return {
    front: (axleTorqueNmPerBar(setup?.front, `${prefix}front.`) * 1000) / frontR,
    rear: (axleTorqueNmPerBar(setup?.rear, `${prefix}rear.`) * 1000) / rearR,
  };
}

function checkValve(valve: RearPressureLaw, prefix: string): RearPressureLaw {
  const slope = (value: number) => {
    const s = requireFinite(value, `${prefix}rearValve.slope`);
    if (s < 0 || s > 1)
      throw new FitmentInputError(`${prefix}rearValve.slope`, `${prefix}rearValve.slope must be between 0 and 1 (got ${s})`);
  };
  const knee = (value: number, name: string) => requirePositive(value, `${prefix}rearValve.${name}`);
  switch (valve?.kind) {
    case 'none':
    case 'electronic':
      return valve;
    case 'proportioning':
      knee(valve.kneeBar, 'kneeBar');
      slope(valve.slope);
      return valve;
    case 'load-sensing':
      knee(valve.kneeBarUnladen, 'kneeBarUnladen');
      knee(valve.kneeBarLaden, 'kneeBarLaden');
      slope(valve.slope);
      return valve;
    default:
      throw new FitmentInputError(
        `${prefix}rearValve.kind`,
        `${prefix}rearValve.kind must be 'none', 'proportioning', 'load-sensing' or 'electronic'`,
      );
  }
}

function kneeFor(valve: RearPressureLaw, state: LoadState): { kneeBar: number; slope: number } | null {
  if (valve.kind === 'proportioning') return { kneeBar: valve.kneeBar, slope: valve.slope };
  if (valve.kind === 'load-sensing') {
    return { kneeBar: state === 'laden' ? valve.kneeBarLaden : valve.kneeBarUnladen, slope: valve.slope };
  }
  return null;
}

/** How the brake force splits at deceleration z: the line pressure that gives m g z, and the rear pressure behind the valve. */
function operatingPoint(
  vehicle: DistributionVehicle,
  rates: AxleRates,
  valve: RearPressureLaw,
  state: LoadState,
  z: number,
): Operating {
  const weightN = vehicle.massKg * STANDARD_GRAVITY;
  const needed = weightN * z;
  const knee = kneeFor(valve, state);
  let frontShare: number;
  if (knee && needed > (rates.front + rates.rear) * knee.kneeBar) {
    // above the knee: F = (a_f + a_r s) p + a_r p_knee (1 − s)
    const p = (needed - rates.rear * knee.kneeBar * (1 - knee.slope)) / (rates.front + rates.rear * knee.slope);
    frontShare = (rates.front * p) / needed;
  } else {
    frontShare = rates.front / (rates.front + rates.rear);
  }
  if (valve.kind === 'electronic') frontShare = Math.max(frontShare, idealFrontShare(vehicle, z));
  return {
    frontShare,
    frontBar: (frontShare * needed) / rates.front,
    rearBar: knee ? proportionedPressureBar((frontShare * needed) / rates.front, knee) : ((1 - frontShare) * needed) / rates.rear,
  };
}

/** Positive while the front leads (f_f > f_r), negative while the rear does. */
function lead(vehicle: DistributionVehicle, rates: AxleRates, valve: RearPressureLaw, state: LoadState, z: number): number {
  return operatingPoint(vehicle, rates, valve, state, z).frontShare - idealFrontShare(vehicle, z);
}

function bisect(f: (z: number) => number, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  const fa = f(a) > 0;
  for (let i = 0; i < 60; i++) {
    const mid = (a + b) / 2;
    if (f(mid) > 0 === fa) a = mid;
    else b = mid;
  }
  return (a + b) / 2;
}

/** Ranges of z in [from, to] where test holds, found on a fine grid and refined at the edges. */
function rangesWhere(test: (z: number) => number, from: number, to: number): ZRange[] {
  const ranges: ZRange[] = [];
  let start: number | null = test(from) > 0 ? from : null;
  let previous = from;
  for (let z = from + SCAN_STEP_G; z <= to + 1e-12; z += SCAN_STEP_G) {
    const inside = test(z) > 0;
    if (inside && start === null) start = bisect(test, previous, z);
    if (!inside && start !== null) {
      ranges.push({ fromG: start, toG: bisect(test, previous, z) });
      start = null;
    }
    previous = z;
  }
  if (start !== null) ranges.push({ fromG: start, toG: to });
  return ranges;
}

function analyseState(
  vehicle: DistributionVehicle,
  state: LoadState,
  rates: AxleRates,
  valve: RearPressureLaw,
  maxG: number,
  pedal: PedalInput | undefined,
): StateAnalysis {
  const point = (z: number) => operatingPoint(vehicle, rates, valve, state, z);
  const utilisation = (z: number) => adhesionUtilisation(vehicle, point(z).frontShare, z);
  const leadAt = (z: number) => lead(vehicle, rates, valve, state, z);
  // the curves stop short of the deceleration where the rear wheels would leave the ground
  const top = Math.min(maxG, (0.999 * ((1 - vehicle.frontStaticFraction) * vehicle.wheelbaseMm)) / vehicle.cgHeightMm);

  const curve: CurvePoint[] = [];
  for (let i = 0; i * CURVE_STEP_G <= top + 1e-9; i++) {
    const z = Math.min(Math.round(i * CURVE_STEP_G * 1000) / 1000, top);
    const op = point(z);
    const u = adhesionUtilisation(vehicle, op.frontShare, z);
    curve.push({ z, front: u.front, rear: u.rear, frontShare: op.frontShare, frontBar: op.frontBar, rearBar: op.rearBar });
  }

  const rearLeads = rangesWhere((z) => -leadAt(z), 0, top);
  // A rear range that only touches the front's (the ideal line reached and left again) is not a change of order.
  const rearRanges = rearLeads.filter((r) => r.toG - r.fromG > 1e-6);
  const lockOrder: Array<ZRange & { first: Axle }> = [];
  let cursor = 0;
  for (const r of rearRanges) {
    if (r.fromG > cursor) lockOrder.push({ fromG: cursor, toG: r.fromG, first: 'front' });
    lockOrder.push({ ...r, first: 'rear' });
    cursor = r.toG;
  }
  if (cursor < top) lockOrder.push({ fromG: cursor, toG: top, first: 'front' });
  const crossings = lockOrder.slice(1).map((segment) => segment.fromG);

  // The friction the car needs at z is that of its hungrier axle; scan it once, then read off each k.
  const worst = (z: number) => {
    const u = utilisation(z);
    return Math.max(u.front, u.rear);
  };
  const grid: number[] = [];
  for (let z = 0; z <= top + 1e-12; z += SCAN_STEP_G) grid.push(z);
  const needs = grid.map(worst);
  const efficiency = EFFICIENCY_KS.map((k): EfficiencyPoint => {
    const i = needs.findIndex((need) => need >= k);
    if (i <= 0) return { k, decelerationG: null, efficiency: null, limitedBy: null };
    const z = bisect((x) => worst(x) - k, grid[i - 1], grid[i]);
    const u = utilisation(z);
    return { k, decelerationG: z, efficiency: z / k, limitedBy: u.front >= u.rear ? 'front' : 'rear' };
  });

  const band = PASSENGER_CAR_REFERENCE;
  const bandTop = Math.min(band.frontAboveRear.toG, top);
  const rearAboveFront =
    bandTop > band.frontAboveRear.fromG ? rangesWhere((z) => -leadAt(z), band.frontAboveRear.fromG, bandTop) : [];
  const outsideAllowance =
    bandTop > band.frontAboveRear.fromG
      ? rangesWhere(
          (z) => {
            if (leadAt(z) >= 0) return -1;
            const inAllowance = z >= band.allowance.fromG && z <= band.allowance.toG;
            return inAllowance ? utilisation(z).rear - (z + band.allowance.aboveIdeal) : 1;
          },
          band.frontAboveRear.fromG,
          bandTop,
        )
      : [];
  const lineTop = Math.min(0.1 + 0.85 * (band.minimumLine.toK - 0.2), top);
  const aboveMinimumLine = rangesWhere(
    (z) => {
      const limit = minimumLineK(z);
      if (limit === null) return -1;
      const u = utilisation(z);
      return Math.max(u.front, u.rear) - limit;
    },
    0.1,
    lineTop,
  );

  const lineBarPerG = (vehicle.massKg * STANDARD_GRAVITY) / (rates.front + rates.rear);
  const pedalForceNPerG = pedal
    ? (lineBarPerG * N_PER_MM2_PER_BAR * masterCylinderAreaMm2(pedal)) / (pedal.pedalRatio * pedal.boosterRatio)
    : null;

  return {
    state,
    curve,
    lockTogetherG: crossings[0] ?? null,
    lockOrder,
    rearFirstFromG: rearRanges[0]?.fromG ?? null,
    efficiency,
    reference: {
      rearAboveFront,
      outsideAllowance,
      aboveMinimumLine,
      inside: outsideAllowance.length === 0 && aboveMinimumLine.length === 0,
    },
    pedal: { lineBarPerG, pedalForceNPerG },
  };
}

function masterCylinderAreaMm2(pedal: PedalInput): number {
  const bore = pedal.masterCylinderBoreMm;
  return (Math.PI * bore * bore) / 4;
}

function checkPedal(pedal: PedalInput | undefined): PedalInput | undefined {
  if (pedal === undefined) return undefined;
  requirePositive(pedal?.masterCylinderBoreMm, 'pedal.masterCylinderBoreMm');
  requirePositive(pedal.pedalRatio, 'pedal.pedalRatio');
  const boost = requirePositive(pedal.boosterRatio, 'pedal.boosterRatio');
  if (boost < 1) throw new FitmentInputError('pedal.boosterRatio', `pedal.boosterRatio must be at least 1 (got ${boost})`);
  return pedal;
}

/**
 * Fluid the four calipers take per mm of pad travel: both pads of a wheel move, so each wheel takes 2 × A_side
 * (a floating caliper's pistons travel both pads' distance; an opposed caliper's two sides travel one each).
 */
function fluidPerMm(setup: BrakeSetup): number | null {
  const perWheel = (axle: AxleBrakes) =>
    axle.kind === undefined || axle.kind === 'disc' ? 2 * pistonAreaPerSideMm2(axle.pistonsPerSideMm) : null;
  const front = perWheel(setup.front);
  const rear = perWheel(setup.rear);
  return front === null || rear === null ? null : 2 * front + 2 * rear;
}

function analyseSetup(
  input: DistributionInput,
  setup: BrakeSetup,
  prefix: string,
  maxG: number,
  pedal: PedalInput | undefined,
): SetupAnalysis {
  if (typeof setup !== 'object' || setup === null)
    throw new FitmentInputError(prefix.slice(0, -1), `${prefix.slice(0, -1)} is required`);
  const rates = forcesPerBar(setup, input.tyreLoadedRadiusMm, prefix);
  const valve = checkValve(setup.rearValve, prefix);
  const states: Array<[LoadState, DistributionVehicle]> = [['unladen', input.unladen]];
  if (input.laden) states.push(['laden', input.laden]);
  const fluid = fluidPerMm(setup);
  return {
    frontAxleNPerBar: rates.front,
    rearAxleNPerBar: rates.rear,
    hydraulicFrontShare: rates.front / (rates.front + rates.rear),
    states: states.map(([state, vehicle]) => analyseState(vehicle, state, rates, valve, maxG, pedal)),
    fluid:
      fluid === null
        ? null
        : {
            mm3PerMmPadTravel: fluid,
            pedalTravelMmPerMmPadTravel: pedal ? (fluid / masterCylinderAreaMm2(pedal)) * pedal.pedalRatio : null,
          },
  };
}

const RULES = [
  'Axle loads: N_f = m g (ψ + χ z), N_r = m g (1 − ψ − χ z), χ = h / L, g = 9.80665 m/s² (Limpert, Brake Design and Safety, ch. 7; NIST SP 811)',
  'Adhesion utilisation: f = axle brake force / axle load; brake force = axle torque / loaded tyre radius',
  'Both axles lock together where the front share equals ψ + χ z; with a fixed split at z = (Φ − ψ) / χ',
  'Braking efficiency: the deceleration reached before the first axle locks, divided by the road adhesion k (z / k)',
  'Proportioning valve: rear pressure = input up to the knee, then knee + slope × (input − knee)',
];

/**
 * Brake distribution of a car before (and after) a change: adhesion utilisation of each axle against
 * deceleration, where they lock together, which axle locks first where, braking efficiency, and a reading
 * against the passenger-car reference band, for the unladen (and laden) car.
 */
export function analyseBrakeDistribution(input: DistributionInput): DistributionAnalysis {
  if (typeof input !== 'object' || input === null) throw new FitmentInputError('input', 'input is required');
  checkVehicle(input.unladen, 'unladen');
  if (input.laden !== undefined) checkVehicle(input.laden, 'laden');
  const maxG = input.maxDecelerationG === undefined ? 1 : requirePositive(input.maxDecelerationG, 'maxDecelerationG');
  if (maxG > 1.5) throw new FitmentInputError('maxDecelerationG', `maxDecelerationG must be at most 1.5 (got ${maxG})`);
  const pedal = checkPedal(input.pedal);

  const before = analyseSetup(input, input.before, 'before.', maxG, pedal);
  const after = input.after === undefined ? null : analyseSetup(input, input.after, 'after.', maxG, pedal);
  let comparison: DistributionComparison | null = null;
  if (after) {
    const change = after.hydraulicFrontShare - before.hydraulicFrontShare;
    comparison = {
      direction:
        change * 100 >= BALANCE_UNCHANGED_POINTS ? 'front' : change * 100 <= -BALANCE_UNCHANGED_POINTS ? 'rear' : 'unchanged',
      frontShareBefore: before.hydraulicFrontShare,
      frontShareAfter: after.hydraulicFrontShare,
      fluidRatio: before.fluid && after.fluid ? after.fluid.mm3PerMmPadTravel / before.fluid.mm3PerMmPadTravel : null,
    };
  }

  const valves = [input.before.rearValve, input.after?.rearValve];
  const assumptions = [
    'Brake torque rises in proportion to line pressure, with the same pad friction at every pressure and temperature.',
    'Axle loads are the static loads plus the load transfer m g z h / L; aerodynamic forces, rolling resistance and engine braking are left out.',
    'The loaded tyre radius is taken as entered and does not change while braking.',
  ];
  if (valves.some((v) => v?.kind === 'electronic')) {
    assumptions.push(
      "Electronic brake-force distribution is modelled as keeping the rear axle's adhesion utilisation at or below the front's; a real system works from measured wheel slip, with thresholds only its maker knows.",
    );
  }
  if (valves.some((v) => v?.kind === 'load-sensing')) {
    assumptions.push("A load-sensing valve's knee is taken as entered for each load state.");
  }

  return {
    maxDecelerationG: maxG,
    before,
    after,
    comparison,
    summary: summarise(input, before, after, comparison, maxG),
    assumptions,
    rules: RULES,
    reference: PASSENGER_CAR_REFERENCE,
  };
}
