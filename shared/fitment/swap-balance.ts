import type { Caliper, SwapData } from '../schemas/swap-data';
import type { VehicleFigures } from '../schemas/vehicle';
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
import { round1 } from './units';

// A swap's effect on the brake balance, as the sheet, the submission form and the review desk state it:
// the front share of brake torque before and after, and with the car's figures which axle locks first.

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
