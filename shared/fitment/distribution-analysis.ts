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

export type LoadState = 'unladen' | 'laden';
export type Axle = 'front' | 'rear';

/** What stands between the master cylinder and the rear brakes. */
export type RearPressureLaw =
  | { kind: 'none' }
  | { kind: 'proportioning'; kneeBar: number; slope: number }
  /** a load-sensing valve moves its knee with the load on the rear axle: one knee per load state */
  | { kind: 'load-sensing'; kneeBarUnladen: number; kneeBarLaden: number; slope: number }
  | { kind: 'electronic' };

export interface BrakeSetup {
  front: AxleBrakes;
  rear: AxleBrakes;
  rearValve: RearPressureLaw;
}

export interface PedalInput {
  masterCylinderBoreMm: number;
  /** pedal lever ratio, e.g. 3.5 */
  pedalRatio: number;
  /** servo output force over input force; 1 without a booster */
  boosterRatio: number;
}

export interface DistributionInput {
  unladen: DistributionVehicle;
  laden?: DistributionVehicle;
  tyreLoadedRadiusMm: { front: number; rear: number };
  before: BrakeSetup;
  after?: BrakeSetup;
  /** what turns "before" into "after", as the summary's subject: "The swap" (default) or "The plan" */
  change?: string;
  pedal?: PedalInput;
  /** top of the curves in g (default 1) */
  maxDecelerationG?: number;
}

export interface CurvePoint {
  /** deceleration, g */
  z: number;
  /** adhesion utilisation of each axle: the friction coefficient it needs at z */
  front: number;
  rear: number;
  /** share of the brake force the front axle takes at z */
  frontShare: number;
  frontBar: number;
  rearBar: number;
}

export interface ZRange {
  fromG: number;
  toG: number;
}

export interface EfficiencyPoint {
  /** tyre–road adhesion coefficient */
  k: number;
  /** highest deceleration before the first axle reaches k; null when it lies beyond the range looked at */
  decelerationG: number | null;
  /** z / k */
  efficiency: number | null;
  limitedBy: Axle | null;
}

export interface ReferenceReading {
  /** decelerations inside the band's range where the rear curve lies above the front one */
  rearAboveFront: ZRange[];
  /** of those, the parts the passenger-car allowance (rear within ideal + 0.05 between 0.30 and 0.45 g) does not cover */
  outsideAllowance: ZRange[];
  /** decelerations where an axle needs more friction than the minimum-deceleration line allows */
  aboveMinimumLine: ZRange[];
  inside: boolean;
}

export interface StateAnalysis {
  state: LoadState;
  curve: CurvePoint[];
  /** first deceleration in the range where both axles lock together; null when they do not meet there */
  lockTogetherG: number | null;
  lockOrder: Array<ZRange & { first: Axle }>;
  /** lowest deceleration from which the rear locks first; null when the front leads throughout the range */
  rearFirstFromG: number | null;
  efficiency: EfficiencyPoint[];
  reference: ReferenceReading;
  /** below any valve knee */
  pedal: { lineBarPerG: number; pedalForceNPerG: number | null };
}

export interface SetupAnalysis {
  frontAxleNPerBar: number;
  rearAxleNPerBar: number;
  /** front share of brake force at equal line pressure (below any valve knee) */
  hydraulicFrontShare: number;
  states: StateAnalysis[];
  /** fluid the calipers take per mm of pad travel; null when an axle is a drum or given as a torque only */
  fluid: { mm3PerMmPadTravel: number; pedalTravelMmPerMmPadTravel: number | null } | null;
}

export interface DistributionComparison {
  direction: 'front' | 'rear' | 'unchanged';
  /** hydraulic front share before and after, 0..1 */
  frontShareBefore: number;
  frontShareAfter: number;
  /** fluid after / before, when both are known */
  fluidRatio: number | null;
}

export interface DistributionAnalysis {
  maxDecelerationG: number;
  before: SetupAnalysis;
  after: SetupAnalysis | null;
  comparison: DistributionComparison | null;
  /** one plain sentence: the direction of the change and which axle locks first */
  summary: string;
  assumptions: string[];
  rules: string[];
  reference: typeof PASSENGER_CAR_REFERENCE;
}

/**
 * The reference band for passenger cars. The z range and the minimum-deceleration line are confirmed in
 * Crolla (ed.), *Automotive Engineering: Powertrain, Chassis System and Vehicle Body* (2009), §12.1.2 and
 * Fig. 12.1-2, which quote the same requirement from EEC Directive 71/320 Annex II for category M1; that
 * UN Regulation No. 13-H Annex 5 carries the same figures, and the allowance's numbers, are from memory.
 */
export const PASSENGER_CAR_REFERENCE = {
  source: 'UN Regulation No. 13-H, Annex 5 (distribution of braking among the axles), passenger cars (category M1)',
  frontAboveRear: { fromG: 0.15, toG: 0.8 },
  allowance: { fromG: 0.3, toG: 0.45, aboveIdeal: 0.05 },
  minimumLine: { fromK: 0.2, toK: 0.8, text: 'z ≥ 0.10 + 0.85 (k − 0.20) for k between 0.20 and 0.80' },
  provenance:
    'Range 0.15–0.80 g and the line z ≥ 0.10 + 0.85 (k − 0.20): Crolla (ed.), Automotive Engineering (2009), §12.1.2, quoting the EEC braking directive for passenger cars; that Regulation 13-H Annex 5 uses the same figures, and the 0.30–0.45 g allowance, from memory.',
  caveat: 'Shown as a reference, not a verdict: approval is for the authority under your local rules.',
} as const;

/** The most friction an axle may need at z on the minimum-deceleration line, or null outside the line's k range. */
export function minimumLineK(z: number): number | null {
  const k = 0.2 + (z - 0.1) / 0.85;
  const { fromK, toK } = PASSENGER_CAR_REFERENCE.minimumLine;
  return k >= fromK - 1e-12 && k <= toK + 1e-12 ? k : null;
}

/** a move of the front share smaller than this (percentage points) is within the rounding of the figures */
export const BALANCE_UNCHANGED_POINTS = 0.5;

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

const g2 = (z: number) => `${z.toFixed(2)} g`;
const pct = (share: number) => `${(share * 100).toFixed(1)} %`;

function rearFirstClause(setup: SetupAnalysis): string | null {
  const parts = setup.states
    .filter((s) => s.rearFirstFromG !== null)
    .map((s) =>
      s.rearFirstFromG! < 0.005 ? `at any deceleration when ${s.state}` : `above ${g2(s.rearFirstFromG!)} when ${s.state}`,
    );
  return parts.length ? parts.join(' and ') : null;
}

function earliestRearFirst(setup: SetupAnalysis): number {
  return Math.min(...setup.states.map((s) => s.rearFirstFromG ?? Infinity));
}

function statesText(setup: SetupAnalysis): string {
  return setup.states.length === 2 ? 'laden and unladen' : setup.states[0].state;
}

function advice(before: BrakeSetup, after: BrakeSetup, beforeSetup: SetupAnalysis, afterSetup: SetupAnalysis): string {
  const rearGrew = afterSetup.rearAxleNPerBar > beforeSetup.rearAxleNPerBar * 1.005;
  const frontShrank = afterSetup.frontAxleNPerBar < beforeSetup.frontAxleNPerBar * 0.995;
  const valveFix =
    after.rearValve.kind === 'proportioning' || after.rearValve.kind === 'load-sensing'
      ? "lower the rear valve's knee"
      : before.rearValve.kind !== 'none' && before.rearValve.kind !== after.rearValve.kind
        ? 'refit the rear valve'
        : 'fit a proportioning valve';
  if (rearGrew) return `${valveFix} or keep the stock rear brakes`;
  if (frontShrank) return `${valveFix} or keep the stock front brakes`;
  return `${valveFix} or return to the stock balance`;
}

function summarise(
  input: DistributionInput,
  before: SetupAnalysis,
  after: SetupAnalysis | null,
  comparison: DistributionComparison | null,
  maxG: number,
): string {
  if (!after || !comparison || !input.after) {
    const rear = rearFirstClause(before);
    return rear
      ? `The rear locks first ${rear} — check the rear valve and the brake balance before driving hard.`
      : `The front locks first up to ${g2(maxG)} ${statesText(before)}, the stable order.`;
  }
  const shares = `front share ${pct(comparison.frontShareBefore)} → ${pct(comparison.frontShareAfter)}`;
  const change = input.change ?? 'The swap';
  const direction =
    comparison.direction === 'front'
      ? `${change} moves the balance toward the front (${shares})`
      : comparison.direction === 'rear'
        ? `${change} moves the balance toward the rear (${shares})`
        : `${change} leaves the front share about where it was (${shares})`;
  const rearAfter = rearFirstClause(after);
  const rearBefore = rearFirstClause(before);
  if (rearAfter) {
    if (rearBefore && earliestRearFirst(after) > earliestRearFirst(before) + 0.005) {
      return `${direction}: the rear still locks first ${rearAfter}, later than before (${rearBefore}).`;
    }
    const was = rearBefore ? ` (before it: ${rearBefore})` : '';
    return `${direction}: after it the rear locks first ${rearAfter}${was} — ${advice(input.before, input.after, before, after)}.`;
  }
  const still = rearBefore ? 'now' : 'still';
  return `${direction}: the front ${still} locks first up to ${g2(maxG)} ${statesText(after)}, the stable order.`;
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
