import type { SwapData } from '../schemas/swap-data';
import type { Axle } from '../schemas/enums';
import { radialClearance, spokeClearance, maxRotorRuleOfThumbMm, MAX_ROTOR_RULE, type ClearanceResult } from './clearance';
import { spacerEffect, type SpacerEffect } from './wheel';
import { parseMetricThread, threadEngagement, type ThreadEngagement } from './threads';
import { brakeTorqueNm, frontShare, balanceShift } from './brakes';
import { routeTotals, savingsAgainstNewKit } from './costs';
import { MM_PER_IN } from './units';

// The checks a swap sheet, the submission form and the review desk run on one swap record.
// They combine the single-purpose functions beside this file with the record's own measurements.

export type WheelUnderTest = {
  diameterIn: number;
  widthIn: number;
  offsetMm: number;
  spacerMm: number;
  /** measured on the reader's wheel; estimated from the record when absent */
  barrelInnerDiameterMm?: number;
  spokeInsetMm?: number;
  /** for the thread-engagement check */
  boltLengthMm?: number;
  seatThicknessMm?: number;
};

export type Estimated<T> = T & { basis: 'measured' | 'estimated'; basisNote: string };

export type WheelCheck = {
  minDiameter: { ok: boolean; requiredIn: number; givenIn: number; rule: string } | null;
  radial: Estimated<ClearanceResult> | null;
  spoke: Estimated<ClearanceResult> | null;
  offset: SpacerEffect;
  engagement: ThreadEngagement | null;
  boltNote: string;
  /** rule of thumb, never a hard verdict */
  maxRotor: { maxRotorMm: number; rotorMm: number; withinRule: boolean; rule: string } | null;
  spacerNote: string | null;
};

/** a barrel usually sits about 28 mm inside the nominal diameter at the caliper (common practice, no source) */
export const BARREL_ALLOWANCE_MM = 28;
export const BOLT_ON_SPACER_FROM_MM = 20;

export function rotorDiameterOf(data: SwapData, axle: Axle): number | null {
  if (data.rotors.length > 0) return Math.max(...data.rotors.map((r) => r.diameterMm));
  return data.brakes?.after[axle].rotorDiameterMm ?? null;
}

function estimateBarrel(data: SwapData, wheel: WheelUnderTest): { mm: number; note: string } {
  const req = data.wheel;
  if (req?.barrelInnerDiameterMm) {
    const mm = req.barrelInnerDiameterMm + (wheel.diameterIn - req.minDiameterIn) * MM_PER_IN;
    return {
      mm,
      note: `Estimated from the barrel measured on a ${req.minDiameterIn}″ wheel in this record; measure yours to be sure.`,
    };
  }
  return {
    mm: wheel.diameterIn * MM_PER_IN - BARREL_ALLOWANCE_MM,
    note: `Estimated as nominal diameter − ${BARREL_ALLOWANCE_MM} mm (common practice, no source); measure your barrel to be sure.`,
  };
}

function estimateSpokeInset(data: SwapData, wheel: WheelUnderTest): { mm: number; note: string } | null {
  const req = data.wheel;
  if (!req) return null;
  const known = req.testedWheels.filter((t) => t.spokeClearanceMm !== undefined);
  if (known.length === 0) return null;
  const ref = known.reduce((best, t) =>
    Math.abs(t.diameterIn - wheel.diameterIn) < Math.abs(best.diameterIn - wheel.diameterIn) ? t : best,
  );
  const refInset = ref.spokeClearanceMm! + req.caliperOutboardMm - ref.spacerMm;
  // same spoke depth behind the outer rim edge; the edge sits at width/2 − ET from the mounting face
  const mm = refInset + (ref.offsetMm - wheel.offsetMm) + ((wheel.widthIn - ref.widthIn) * MM_PER_IN) / 2;
  return {
    mm,
    note: `Estimated from the tested ${ref.diameterIn}×${ref.widthIn} ET${ref.offsetMm} wheel, assuming the same spoke depth; spoke shapes differ, so measure yours.`,
  };
}

export function checkWheelForSwap(data: SwapData, axle: Axle, wheelBoltThread: string, wheel: WheelUnderTest): WheelCheck {
  const req = data.wheel;
  const offset = spacerEffect({ widthIn: wheel.widthIn, offsetMm: wheel.offsetMm }, wheel.spacerMm);
  const rotorMm = rotorDiameterOf(data, axle);

  let radial: WheelCheck['radial'] = null;
  if (req && rotorMm) {
    const barrel = wheel.barrelInnerDiameterMm
      ? { mm: wheel.barrelInnerDiameterMm, note: 'From your measured barrel.' }
      : estimateBarrel(data, wheel);
    radial = {
      ...radialClearance({
        barrelInnerDiameterMm: barrel.mm,
        rotorDiameterMm: rotorMm,
        caliperRadialProjectionMm: req.caliperRadialProjectionMm,
      }),
      basis: wheel.barrelInnerDiameterMm ? 'measured' : 'estimated',
      basisNote: barrel.note,
    };
  }

  let spoke: WheelCheck['spoke'] = null;
  if (req) {
    const inset =
      wheel.spokeInsetMm !== undefined
        ? { mm: wheel.spokeInsetMm, note: 'From your measured spoke inset.' }
        : estimateSpokeInset(data, wheel);
    if (inset) {
      spoke = {
        ...spokeClearance({ spokeInsetMm: inset.mm, caliperOutboardMm: req.caliperOutboardMm, spacerMm: wheel.spacerMm }),
        basis: wheel.spokeInsetMm !== undefined ? 'measured' : 'estimated',
        basisNote: inset.note,
      };
    }
  }

  let engagement: ThreadEngagement | null = null;
  let thread: { diameterMm: number; pitchMm: number } | null;
  try {
    thread = parseMetricThread(wheelBoltThread);
  } catch {
    thread = null;
  }
  if (thread && wheel.boltLengthMm && wheel.seatThicknessMm !== undefined) {
    engagement = threadEngagement({
      ...thread,
      boltLengthMm: wheel.boltLengthMm,
      clampedMm: wheel.seatThicknessMm + wheel.spacerMm,
      hubMaterial: 'steel',
    });
  }
  const boltNote =
    wheel.spacerMm > 0
      ? `A slip-on spacer of ${wheel.spacerMm} mm needs wheel bolts ${wheel.spacerMm} mm longer than stock${thread ? ` to keep at least ${thread.diameterMm} mm of ${wheelBoltThread} thread engaged in a steel hub` : ''}.`
      : 'No spacer: the stock wheel-bolt length applies.';
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
    engagement,
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

export type BrakeBalance = {
  linePressureBar: number;
  padMu: number;
  torqueNm: { before: { front: number; rear: number }; after: { front: number; rear: number } };
  frontShareBefore: number;
  frontShareAfter: number;
  shiftPoints: number;
  /** a front share moving more than this many points deserves a reviewer's attention */
  attention: boolean;
};

export const BALANCE_ATTENTION_POINTS = 5;

export function brakeBalanceOf(data: SwapData): BrakeBalance | null {
  const b = data.brakes;
  if (!b) return null;
  const withMu = <T extends object>(c: T) => ({ ...c, padMu: b.padMu });
  const torque = (c: (typeof b)['before']['front']) =>
    brakeTorqueNm({ ...c, padMu: b.padMu, linePressureBar: b.linePressureBar });
  const before = { front: withMu(b.before.front), rear: withMu(b.before.rear) };
  const after = { front: withMu(b.after.front), rear: withMu(b.after.rear) };
  const shift = balanceShift(before, after);
  return {
    linePressureBar: b.linePressureBar,
    padMu: b.padMu,
    torqueNm: {
      before: { front: torque(b.before.front), rear: torque(b.before.rear) },
      after: { front: torque(b.after.front), rear: torque(b.after.rear) },
    },
    frontShareBefore: frontShare(before.front, before.rear, b.linePressureBar),
    frontShareAfter: frontShare(after.front, after.rear, b.linePressureBar),
    shiftPoints: shift,
    attention: Math.abs(shift) > BALANCE_ATTENTION_POINTS,
  };
}

export function costSummaryOf(data: SwapData) {
  const totals = routeTotals(data.costs);
  return { totals, savings: savingsAgainstNewKit(totals), currency: data.currency };
}
