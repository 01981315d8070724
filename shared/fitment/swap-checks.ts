import { isStructural, rotorsOn, type Caliper, type SwapData, type WheelOutcome } from '../schemas/swap-data';
import type { Axle, Category } from '../schemas/enums';
import {
  radialClearance,
  spokeClearance,
  maxRotorRuleOfThumbMm,
  MAX_ROTOR_RULE,
  MIN_CLEARANCE_MM,
  RADIAL_CLEARANCE_RULE,
  SPOKE_CLEARANCE_RULE,
} from './clearance';
import { spacerEffect, type SpacerEffect } from './wheel';
import { fasteningFor, type FasteningChassis, type FasteningResult, type FasteningSpacer } from './swap-fastening';
import type { SeatSpec } from './fastening';
import { FitmentInputError } from './errors';
import { routeTotals, savingsAgainstNewKit } from './costs';
import { cornerTorqueNm as anyCornerTorqueNm, type AnyBrakeCorner } from './brakes';
import { BALANCE_UNCHANGED_POINTS, PASSENGER_CAR_REFERENCE, type DistributionAnalysis } from './distribution-analysis';
import {
  cornersOnCar,
  fitmentCorner,
  lockOrderOf,
  recordCorners,
  swapDistribution,
  type LockOrderReading,
  type RearFirst,
  type RecordCorners,
} from './swap-distribution';
import type { VehicleFigures } from '../schemas/vehicle';
import { MM_PER_IN } from './units';

// The checks a swap sheet, the submission form and the review desk run on one swap record.
// They combine the single-purpose functions beside this file with the record's own measurements.
//
// Verdict rule: only a figure measured on the reader's own wheel (or in the record, on the wheel it
// names) is held against a rule and gets a pass or fail. A figure carried over from another wheel or
// from a rule of thumb is an estimate: it says so, names its basis, errs towards less clearance and
// carries no verdict.

export type WheelUnderTest = {
  diameterIn: number;
  widthIn: number;
  offsetMm: number;
  spacerMm: number;
  /** measured on the reader's wheel; estimated from the record when absent */
  barrelInnerDiameterMm?: number;
  spokeInsetMm?: number;
  /** the wheel fastening, as far as the reader measured or chose it */
  fastening?: {
    wheelSeat?: SeatSpec | null;
    /** bolts or nuts other than the factory ones */
    fastenerSeat?: SeatSpec | null;
    /** wheel thickness at the fastener, from where its seat ends to the mounting face */
    clampMm?: number;
    /** the reader's own bolt or stud length, measured as the chassis records its stock length */
    lengthMm?: number;
    wheelBoreMm?: number;
    spacerMounting?: FasteningSpacer['mounting'];
    spacerMaterial?: FasteningSpacer['material'];
    spacerHubCentric?: boolean | null;
  };
};

export type MeasuredFigure = {
  basis: 'measured';
  clearanceMm: number;
  marginMm: number;
  ok: boolean;
  rule: string;
  basisNote: string;
};
export type EstimatedFigure = { basis: 'estimated'; clearanceMm: number; basisNote: string };
export type ClearanceFigure = MeasuredFigure | EstimatedFigure;

export type WheelCheck = {
  minDiameter: { ok: boolean; requiredIn: number; givenIn: number; rule: string } | null;
  radial: ClearanceFigure | null;
  spoke: ClearanceFigure | null;
  offset: SpacerEffect;
  /** null when the chassis has no wheel fastening on record */
  fastening: FasteningResult | null;
  /** why the fastening could not be checked (a thread or figure the computations refuse) */
  fasteningError: string | null;
  boltNote: string;
  /** rule of thumb, never a verdict */
  maxRotor: { maxRotorMm: number; rotorMm: number; withinRule: boolean; rule: string } | null;
  spacerNote: string | null;
};

/** a barrel usually sits about 28 mm inside the nominal diameter at the caliper (common practice, no source) */
export const BARREL_ALLOWANCE_MM = 28;
export const BOLT_ON_SPACER_FROM_MM = 20;

const round1 = (x: number) => Math.round(x * 10) / 10;

/** The rotor diameter on one axle: the record's rotors on that axle, else the after-swap brake figures. */
export function rotorDiameterOf(data: SwapData, axle: Axle): number | null {
  const own = rotorsOn(data, axle);
  if (own.length > 0) return Math.max(...own.map((r) => r.diameterMm));
  const corner = data.brakes?.after[axle];
  return corner?.kind === 'disc' ? corner.rotorDiameterMm : null;
}

function measured(
  result: { clearanceMm: number; marginMm: number; ok: boolean; rule: string },
  basisNote: string,
): MeasuredFigure {
  return { basis: 'measured', ...result, basisNote };
}

/** The smallest of several estimates, with the basis of the one chosen. */
function leastOf(candidates: { mm: number; note: string }[]): { mm: number; note: string } | null {
  if (candidates.length === 0) return null;
  return candidates.reduce((least, c) => (c.mm < least.mm ? c : least));
}

function radialEstimate(data: SwapData, rotorMm: number, wheel: WheelUnderTest): EstimatedFigure | null {
  const req = data.wheel!;
  const fromBarrel = (barrelMm: number) => barrelMm / 2 - (rotorMm / 2 + req.caliperRadialProjectionMm);
  const candidates: { mm: number; note: string }[] = [
    {
      mm: fromBarrel(wheel.diameterIn * MM_PER_IN - BARREL_ALLOWANCE_MM),
      note: `a barrel ${BARREL_ALLOWANCE_MM} mm inside the nominal ${wheel.diameterIn}″ diameter (common practice, no source)`,
    },
  ];
  if (req.barrelInnerDiameterMm) {
    candidates.push({
      mm: fromBarrel(req.barrelInnerDiameterMm + (wheel.diameterIn - req.minDiameterIn) * MM_PER_IN),
      note: `the barrel measured on the record's ${req.minDiameterIn}″ wheel, scaled to ${wheel.diameterIn}″`,
    });
  }
  for (const t of req.testedWheels) {
    if (t.diameterIn === wheel.diameterIn && t.radialClearanceMm !== undefined) {
      candidates.push({
        mm: t.radialClearanceMm,
        note: `the ${t.diameterIn}×${t.widthIn} ET${t.offsetMm} wheel measured in this record`,
      });
    }
  }
  const least = leastOf(candidates)!;
  return {
    basis: 'estimated',
    clearanceMm: least.mm,
    basisNote: `Estimate, the least of ${candidates.length} ${candidates.length === 1 ? 'basis' : 'bases'}: ${least.note}. Barrels differ between wheels of one size; measure yours for a verdict.`,
  };
}

function spokeEstimate(data: SwapData, wheel: WheelUnderTest): EstimatedFigure | null {
  const req = data.wheel!;
  const refs = req.testedWheels.filter((t) => t.spokeClearanceMm !== undefined);
  if (refs.length === 0) return null;
  const nearest = Math.min(...refs.map((t) => Math.abs(t.diameterIn - wheel.diameterIn)));
  const candidates = refs
    .filter((t) => Math.abs(t.diameterIn - wheel.diameterIn) === nearest)
    .map((ref) => {
      // the reference wheel's spoke face, from its mounting face
      const refInsetMm = ref.spokeClearanceMm! + req.caliperOutboardMm - ref.spacerMm;
      // a lower offset or a wider rim moves the outer rim edge outboard, but the spokes need not follow:
      // only a change that brings them closer is carried over, so the estimate never gains room
      const rimEdgeShiftMm = ref.offsetMm - wheel.offsetMm + ((wheel.widthIn - ref.widthIn) * MM_PER_IN) / 2;
      const insetMm = refInsetMm + Math.min(0, rimEdgeShiftMm);
      return {
        mm: insetMm + wheel.spacerMm - req.caliperOutboardMm,
        note: `the spokes of the ${ref.diameterIn}×${ref.widthIn} ET${ref.offsetMm} wheel measured in this record${rimEdgeShiftMm < 0 ? `, moved ${round1(-rimEdgeShiftMm)} mm closer for your wheel's offset and width` : ', with no credit for your wheel’s lower offset or width'}`,
      };
    });
  const least = leastOf(candidates)!;
  return {
    basis: 'estimated',
    clearanceMm: least.mm,
    basisNote: `Estimate from ${least.note}. Spoke shapes differ between wheels; measure yours for a verdict.`,
  };
}

export function checkWheelForSwap(data: SwapData, axle: Axle, chassis: FasteningChassis, wheel: WheelUnderTest): WheelCheck {
  const req = data.wheel;
  const offset = spacerEffect({ widthIn: wheel.widthIn, offsetMm: wheel.offsetMm }, wheel.spacerMm);
  const rotorMm = rotorDiameterOf(data, axle);

  let radial: WheelCheck['radial'] = null;
  if (req && rotorMm) {
    radial = wheel.barrelInnerDiameterMm
      ? measured(
          radialClearance({
            barrelInnerDiameterMm: wheel.barrelInnerDiameterMm,
            rotorDiameterMm: rotorMm,
            caliperRadialProjectionMm: req.caliperRadialProjectionMm,
          }),
          'From the barrel you measured and the caliper measured in this record.',
        )
      : radialEstimate(data, rotorMm, wheel);
  }

  let spoke: WheelCheck['spoke'] = null;
  if (req) {
    spoke =
      wheel.spokeInsetMm !== undefined
        ? measured(
            spokeClearance({
              spokeInsetMm: wheel.spokeInsetMm,
              caliperOutboardMm: req.caliperOutboardMm,
              spacerMm: wheel.spacerMm,
            }),
            'From the spoke inset you measured and the caliper measured in this record.',
          )
        : spokeEstimate(data, wheel);
  }

  const f = wheel.fastening ?? {};
  let fastening: FasteningResult | null = null;
  let fasteningError: string | null = null;
  try {
    fastening = fasteningFor(chassis, {
      axle,
      wheelSeat: f.wheelSeat,
      fastenerSeat: f.fastenerSeat,
      clampMm: f.clampMm,
      lengthMm: f.lengthMm,
      wheelBoreMm: f.wheelBoreMm,
      spacer:
        wheel.spacerMm > 0
          ? {
              thicknessMm: wheel.spacerMm,
              mounting: f.spacerMounting ?? 'slip_on',
              material: f.spacerMaterial ?? 'aluminium',
              hubCentric: f.spacerHubCentric ?? null,
            }
          : null,
    });
  } catch (error) {
    if (!(error instanceof FitmentInputError)) throw error;
    fasteningError = error.message;
  }
  const noun = chassis.wheelFastening?.fastener === 'stud_nut' ? 'studs' : 'wheel bolts';
  const boltOn = wheel.spacerMm > 0 && f.spacerMounting === 'bolt_on';
  const boltNote =
    wheel.spacerMm === 0
      ? `No spacer: the stock ${noun} apply.`
      : boltOn
        ? `A bolt-on spacer is held by its own fasteners; the wheel ${chassis.wheelFastening?.fastener === 'stud_nut' ? 'nuts run on its studs' : 'bolts screw into it'}.`
        : `A slip-on spacer of ${wheel.spacerMm} mm needs ${noun} ${wheel.spacerMm} mm longer than stock to keep the stock thread engagement.`;
  const spacerNote =
    wheel.spacerMm > BOLT_ON_SPACER_FROM_MM
      ? `Spacers beyond about ${BOLT_ON_SPACER_FROM_MM} mm are usually the bolt-on kind with their own studs (common practice, no source).`
      : null;

  return {
    minDiameter: req
      ? {
          ok: wheel.diameterIn >= req.minDiameterIn,
          requiredIn: req.minDiameterIn,
          givenIn: wheel.diameterIn,
          rule: `This swap needs at least a ${req.minDiameterIn}″ wheel.`,
        }
      : null,
    radial,
    spoke,
    offset,
    fastening,
    fasteningError,
    boltNote,
    maxRotor:
      rotorMm && wheel.diameterIn > 4
        ? {
            maxRotorMm: maxRotorRuleOfThumbMm(wheel.diameterIn),
            rotorMm,
            withinRule: rotorMm <= maxRotorRuleOfThumbMm(wheel.diameterIn),
            rule: MAX_ROTOR_RULE,
          }
        : null,
    spacerNote,
  };
}

export type WheelCheckSummary = { tone: 'pass' | 'fail' | 'open'; text: string; leastClearanceMm?: number };

/** The one line above the wheel check: a failure from a measurement, a pass only when everything was measured. */
export function wheelCheckSummary(check: WheelCheck): WheelCheckSummary {
  const fails: string[] = [];
  if (check.minDiameter && !check.minDiameter.ok) fails.push(`the wheel is below the ${check.minDiameter.requiredIn}″ minimum`);
  if (check.radial?.basis === 'measured' && !check.radial.ok) fails.push('too little room at the barrel');
  if (check.spoke?.basis === 'measured' && !check.spoke.ok) fails.push('too little room at the spokes');
  if (check.fastening) fails.push(...check.fastening.failures);
  if (fails.length > 0) return { tone: 'fail', text: `Does not fit as entered: ${fails.join('; ')}.` };
  const figures = [check.radial, check.spoke].filter((f): f is ClearanceFigure => f !== null);
  const estimated = figures.filter((f) => f.basis === 'estimated');
  if (figures.length > 0 && estimated.length === 0) {
    const least = Math.min(...figures.map((f) => f.clearanceMm));
    return { tone: 'pass', text: 'Clears by your measurements.', leastClearanceMm: least };
  }
  if (estimated.some((f) => f.clearanceMm < MIN_CLEARANCE_MM))
    return {
      tone: 'open',
      text: 'Not settled, and the estimates are tight or overlapping: measure your barrel and spokes before buying anything.',
    };
  const which = estimated.map((f) => (f === check.radial ? 'barrel' : 'spoke'));
  return {
    tone: 'open',
    text:
      which.length === 2
        ? 'Not settled: both clearances below are estimates from other wheels. Measure your barrel and spokes for a verdict.'
        : `Not settled: the ${which[0]} clearance below is an estimate from other wheels. Measure it for a verdict.`,
  };
}

// ---------- the record's own tested wheels ----------

export type TestedWheelVerdict = {
  index: number;
  label: string;
  outcome: WheelOutcome;
  /** measured figures held against the 3 mm rule of thumb */
  figures: { where: 'barrel' | 'spokes'; clearanceMm: number; marginMm: number; ok: boolean; rule: string }[];
  /** the outcome the author gave disagrees with what was measured */
  contradiction: string | null;
};

/** Each tested wheel's measured figures against the rule, and whether the stated outcome agrees with them. */
export function testedWheelVerdicts(data: SwapData): TestedWheelVerdict[] {
  return (data.wheel?.testedWheels ?? []).map((t, index) => {
    const figures: TestedWheelVerdict['figures'] = [];
    const add = (where: 'barrel' | 'spokes', mm: number | undefined, rule: string) => {
      if (mm === undefined) return;
      const marginMm = mm - MIN_CLEARANCE_MM;
      figures.push({ where, clearanceMm: mm, marginMm, ok: marginMm >= -1e-9, rule });
    };
    add('barrel', t.radialClearanceMm, RADIAL_CLEARANCE_RULE);
    add('spokes', t.spokeClearanceMm, SPOKE_CLEARANCE_RULE);
    const overlap = figures.find((f) => f.clearanceMm < 0);
    const contradiction =
      t.outcome !== 'does_not_fit' && overlap
        ? `marked as fitting, but the ${overlap.where} overlap the caliper by ${round1(-overlap.clearanceMm)} mm`
        : null;
    return {
      index,
      label: `${t.diameterIn}×${t.widthIn} ET${t.offsetMm}${t.spacerMm ? ` + ${t.spacerMm} mm spacer` : ''}`,
      outcome: t.outcome,
      figures,
      contradiction,
    };
  });
}

// ---------- brake balance ----------

/**
 * The pistons that press one pad: all of a floating caliper's; one side of a fixed caliper's (the
 * smaller side when they differ, since the pads see the same pressure on equal areas).
 */
export function pistonsPerSideOf(caliper: Pick<Caliper, 'type' | 'pistons'>): number[] {
  const inboard = caliper.pistons.filter((p) => p.side === 'inboard').map((p) => p.diameterMm);
  if (caliper.type === 'floating') return caliper.pistons.map((p) => p.diameterMm);
  const outboard = caliper.pistons.filter((p) => p.side === 'outboard').map((p) => p.diameterMm);
  const area = (ds: number[]) => ds.reduce((a, d) => a + d * d, 0);
  return area(outboard) < area(inboard) ? outboard : inboard;
}

export type BalanceDirection = 'forward' | 'rearward' | 'unchanged';
export type BalanceSeverity = 'none' | 'advisory' | 'hazard';

export type BalanceShift = {
  direction: BalanceDirection;
  severity: BalanceSeverity;
  /** one sentence: which way the front share moved, by how much, and, with the car's figures, which axle locks first */
  headline: string;
  /** what that risks, in the right direction */
  risk: string;
  /** the thresholds applied */
  rule: string;
  /** which axle locks first, when the car's figures were known; null otherwise */
  lockOrder: LockOrderReading | null;
};

/** a forward move beyond this under-uses the rear brakes enough to mention */
export const BALANCE_FORWARD_ADVISORY_POINTS = 5;
/** a rearward move of this much or more is a hazard to check before driving, when the lock order is unknown */
export const BALANCE_REARWARD_HAZARD_POINTS = 2;

export const BALANCE_RULE = `A rearward move of ${BALANCE_REARWARD_HAZARD_POINTS} points or more is treated as a hazard and a forward move beyond ${BALANCE_FORWARD_ADVISORY_POINTS} points as advisory (common practice, no source); fronts locking first is the stable order, which brake regulations require of passenger cars.`;

const BAND = PASSENGER_CAR_REFERENCE.frontAboveRear;

export const LOCK_ORDER_RULE = `With the car's figures: a change that makes the rear axle lock first below ${BAND.toG.toFixed(2)} g — the top of the passenger-car reference band, inside which the front should lock first (${PASSENGER_CAR_REFERENCE.source}) — is a hazard; a forward move beyond ${BALANCE_FORWARD_ADVISORY_POINTS} points, or a rearward one of ${BALANCE_REARWARD_HAZARD_POINTS} points or more that keeps the fronts first, is advisory (common practice, no source). The band is a reference, not a verdict on road legality.`;

/** without the car's figures, which axle locks first cannot be worked out; say so rather than guess */
export const LOCK_ORDER_UNKNOWN =
  "Which axle locks first needs the car's mass, weight split, centre-of-gravity height and wheelbase: none are known here.";

const pct = (share: number) => `${(Math.round(share * 1000) / 10).toFixed(1)} %`;
const g2 = (z: number) => `${z.toFixed(2)} g`;

function rearFirstWords(list: RearFirst[]): string {
  return list
    .map((r) => (r.fromG < 0.005 ? `at any deceleration when ${r.state}` : `above ${g2(r.fromG)} when ${r.state}`))
    .join(' and ');
}

/**
 * What a change of the front share of braking means. Used by the sheet, the calculators, the submission form
 * and the review desk so all of them say the same thing about the same figures. With the car's figures
 * (`lockOrder`), the sentence also says which axle locks first and the lock order decides the severity.
 */
export function describeBalanceShift(
  frontShareBefore: number,
  frontShareAfter: number,
  lockOrder: LockOrderReading | null = null,
): BalanceShift {
  const points = (frontShareAfter - frontShareBefore) * 100;
  const shown = `front share ${pct(frontShareBefore)} → ${pct(frontShareAfter)} (${points >= 0 ? '+' : '−'}${Math.abs(round1(points)).toFixed(1)} points)`;
  const direction: BalanceDirection =
    Math.abs(points) < BALANCE_UNCHANGED_POINTS ? 'unchanged' : points < 0 ? 'rearward' : 'forward';
  if (lockOrder) return withLockOrder(direction, points, lockOrder);

  if (direction === 'unchanged') {
    return {
      direction,
      severity: 'none',
      headline: `Balance unchanged: ${shown}.`,
      risk: 'The front and rear brakes keep the share of the work they had.',
      rule: BALANCE_RULE,
      lockOrder: null,
    };
  }
  if (direction === 'rearward') {
    return {
      direction,
      severity: -points >= BALANCE_REARWARD_HAZARD_POINTS ? 'hazard' : 'advisory',
      headline: `Balance moves toward the rear: ${shown}.`,
      risk: `The rear brakes now do more of the work, so the rear wheels reach their grip sooner. If the rears lock before the fronts the car can turn sideways and spin. ${LOCK_ORDER_UNKNOWN} Check which axle locks first for your car, and keep or fit a rear proportioning valve, or keep the stock rear pads.`,
      rule: BALANCE_RULE,
      lockOrder: null,
    };
  }
  return {
    direction,
    severity: points > BALANCE_FORWARD_ADVISORY_POINTS ? 'advisory' : 'none',
    headline: `Balance moves toward the front: ${shown}.`,
    risk: 'The front brakes now do more of the work. The fronts still lock first, which is the stable order, but the rear brakes are under-used, so a stop at the limit of grip is longer than the brakes together could give. A matching rear upgrade restores the balance.',
    rule: BALANCE_RULE,
    lockOrder: null,
  };
}

function withLockOrder(direction: BalanceDirection, points: number, lock: LockOrderReading): BalanceShift {
  const base = { direction, headline: lock.sentence, rule: LOCK_ORDER_RULE, lockOrder: lock };
  if (lock.madeRearFirstInBand.length > 0) {
    return {
      ...base,
      severity: 'hazard',
      risk: `The rear wheels lock before the fronts ${rearFirstWords(lock.madeRearFirstInBand)}, below ${g2(lock.bandTopG)}, where the front should lock first: in a hard stop the car can turn sideways and spin. Keep or fit a rear proportioning valve set for the new brakes, or keep the stock rear brakes, and have the balance checked on a brake tester.`,
    };
  }
  const rearInBand = lock.rearFirst.filter((r) => r.fromG < lock.bandTopG);
  if (rearInBand.length > 0) {
    return {
      ...base,
      severity: 'advisory',
      risk: `The rear already locked first ${rearFirstWords(rearInBand.map((r) => ({ ...r, fromG: r.beforeFromG ?? r.fromG })))} before the change, and it does no sooner now (${rearFirstWords(rearInBand)}). Check the rear valve.`,
    };
  }
  if (direction === 'rearward') {
    return {
      ...base,
      severity: -points >= BALANCE_REARWARD_HAZARD_POINTS ? 'advisory' : 'none',
      risk: `The rear brakes now do more of the work. With these figures the fronts still lock first up to ${g2(lock.bandTopG)}, the stable order, but with less margin: a heavier load, other tyres or a worn rear valve can change that.`,
    };
  }
  if (direction === 'forward') {
    return {
      ...base,
      severity: points > BALANCE_FORWARD_ADVISORY_POINTS ? 'advisory' : 'none',
      risk: 'The front brakes now do more of the work. The fronts still lock first, which is the stable order, but the rear brakes are under-used, so a stop at the limit of grip is longer than the brakes together could give. A matching rear upgrade restores the balance.',
    };
  }
  return { ...base, severity: 'none', risk: 'The front and rear brakes keep the share of the work they had.' };
}

export type BrakeBalance = {
  linePressureBar: number;
  padMu: number;
  torqueNm: { before: { front: number; rear: number }; after: { front: number; rear: number } };
  /** front share of brake torque at equal line pressure */
  frontShareBefore: number;
  frontShareAfter: number;
  shiftPoints: number;
  shift: BalanceShift;
  /** adhesion utilisation before and after, when the car's figures are known */
  distribution: DistributionAnalysis | null;
  /** the figures the distribution used, and whose they are */
  figures: VehicleFigures | null;
};

export { fitmentCorner };

/**
 * Front share of brake torque at equal line pressure, before and after the swap, and what the change means.
 * With the car's figures (a chassis' stock ones or a member's own), also which axle locks first.
 */
export function brakeBalanceOf(
  data: SwapData,
  figures: VehicleFigures | null = null,
  /** the reader's car's brakes as they are (swaps fitted), instead of the stock brakes the record starts from */
  onCar: { brakesAsIs: RecordCorners; fittedHere: boolean } | null = null,
): BrakeBalance | null {
  const b = data.brakes;
  if (!b) return null;
  const corners = onCar ? cornersOnCar(data, onCar.brakesAsIs, onCar.fittedHere)! : recordCorners(data)!;
  const torque = (c: AnyBrakeCorner) => anyCornerTorqueNm(c, b.linePressureBar);
  const torqueNm = {
    before: { front: torque(corners.before.front), rear: torque(corners.before.rear) },
    after: { front: torque(corners.after.front), rear: torque(corners.after.rear) },
  };
  const share = (x: { front: number; rear: number }) => x.front / (x.front + x.rear);
  const frontShareBefore = share(torqueNm.before);
  const frontShareAfter = share(torqueNm.after);
  const distribution = figures ? swapDistribution(corners, figures.vehicle) : null;
  const shift = distribution?.comparison
    ? describeBalanceShift(
        distribution.comparison.frontShareBefore,
        distribution.comparison.frontShareAfter,
        lockOrderOf(distribution),
      )
    : describeBalanceShift(frontShareBefore, frontShareAfter);
  return {
    linePressureBar: b.linePressureBar,
    padMu: b.padMu,
    torqueNm,
    frontShareBefore,
    frontShareAfter,
    shiftPoints: (frontShareAfter - frontShareBefore) * 100,
    shift,
    distribution,
    figures: distribution ? figures : null,
  };
}

// ---------- costs ----------

export function costSummaryOf(data: SwapData) {
  const totals = routeTotals(data.costs);
  return { totals, savings: savingsAgainstNewKit(totals), currency: data.currency };
}

// ---------- what the job touches ----------

export type JobTouches = { brakes: boolean; wheelFastening: boolean; structural: boolean; suspension: boolean };

const brakeKinds = new Set(['caliper', 'rotor', 'pad', 'adapter', 'shim', 'line']);
const brakeFasteners = new Set(['caliper_mount', 'bracket_mount', 'guide_pin', 'banjo', 'bleed_screw', 'rotor_screw']);

/** Which cautions a record needs, from what the job touches rather than from its category. */
export function jobTouches(data: SwapData, category?: Category): JobTouches {
  return {
    brakes:
      category === 'brakes' ||
      data.parts.some((p) => brakeKinds.has(p.kind)) ||
      data.calipers.length > 0 ||
      data.rotors.length > 0 ||
      data.fasteners.some((f) => brakeFasteners.has(f.kind)) ||
      data.machining.some((m) => m.component === 'caliper_body' || m.component === 'bracket'),
    wheelFastening:
      category === 'wheels_tyres' ||
      data.spacers.length > 0 ||
      data.parts.some((p) => p.kind === 'spacer') ||
      data.fasteners.some((f) => f.kind === 'wheel' || f.kind === 'spacer_mount'),
    structural: data.machining.some(isStructural),
    suspension: category === 'suspension' || data.fasteners.some((f) => f.kind === 'suspension'),
  };
}
