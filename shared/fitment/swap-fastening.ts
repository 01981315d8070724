import type { Axle } from '../schemas/enums';
import type { Fastener, SwapData, TestedWheel, WheelOutcome } from '../schemas/swap-data';
import type { ChassisWheelFastening } from '../schemas/wheel-fastening';
import type { FitCheck } from './fit-check';
import {
  centreBoreCheck,
  hubCentricRing,
  seatCheck,
  seatName,
  spigotCheck,
  SEAT_MISMATCH_CAUTION,
  SPIGOT_CAUTION,
  wheelFasteningChain,
  type HubRing,
  type SeatSpec,
  type SpacerMounting,
} from './fastening';
import { boltLengthWithSpacer, parseThread, type HubMaterial, type ParsedThread, type ThreadEngagement } from './threads';
import { FitmentInputError } from './errors';

// The wheel fastening of one corner of a swap: the chassis' factory fastener and hub (recorded once per chassis)
// with a wheel's seat and thickness, a spacer and the bolts actually used. Shared by the sheet's wheel check,
// the record's tested wheels and the review desk, so all three word a failure the same way.

export type FasteningChassis = {
  wheelBoltThread: string;
  /** the hub spigot's diameter */
  centreBoreMm: number;
  wheelFastening: ChassisWheelFastening | null;
};

export type FasteningSpacer = {
  thicknessMm: number;
  mounting: SpacerMounting;
  material: HubMaterial;
  /** with its own spigot the spacer centres the wheel; null when nobody said */
  hubCentric: boolean | null;
};

export type FasteningQuestion = {
  axle: Axle;
  /** the seat the wheel is made for; unknown: the seat is not checked */
  wheelSeat?: SeatSpec | null;
  /** the seat of the bolts or nuts used, when not the factory ones */
  fastenerSeat?: SeatSpec | null;
  /** wheel thickness at the fastener, from where its seat ends to the mounting face */
  clampMm?: number;
  /** bolt length, or stud length out of the hub face, measured the way the chassis records its stock length */
  lengthMm?: number;
  wheelBoreMm?: number;
  spacer?: FasteningSpacer | null;
};

export type FasteningResult = {
  fastener: ChassisWheelFastening['fastener'];
  thread: ParsedThread;
  /** the seat of the fasteners that were checked */
  fastenerSeat: SeatSpec;
  /** each check made from recorded and measured figures, with its verdict */
  checks: FitCheck[];
  engagement: ThreadEngagement | null;
  /** whose fastener length was used */
  lengthBasis: 'given' | 'stock' | null;
  /** stock length plus a slip-on spacer: what keeps the stock engagement */
  lengthWithSpacerMm: number | null;
  hubRing: HubRing | null;
  /** figures not given, so the checks needing them did not run */
  missing: string[];
  /** what failed, in words ("too little thread", "the seat does not match", …) */
  failures: string[];
  cautions: string[];
  notes: string[];
};

/** Short words for each fastening check, passed and failed; the failed ones say what failed. */
export const fasteningCheckWords: Record<string, { pass: string; fail: string }> = {
  seat: { pass: 'Seats match', fail: 'Seat does not match' },
  engagement: { pass: 'Enough thread', fail: 'Too little thread' },
  bottoming: { pass: 'Clear of the bottom', fail: 'Bottoms out' },
  'too-long': { pass: 'Clear behind the hub', fail: 'Too long' },
  spigot: { pass: 'Centres on the hub', fail: 'Spigot swallowed' },
  'centre-bore': { pass: 'Fits over the spigot', fail: 'Bore too small' },
};

const failureWords: Record<string, (r: { fastener: ChassisWheelFastening['fastener'] }) => string> = {
  seat: () => 'the seat does not match',
  engagement: () => 'too little thread',
  bottoming: (r) => (r.fastener === 'stud_nut' ? 'the stud bottoms out in the closed nut' : 'the bolt bottoms out'),
  'too-long': () => 'the bolt is too long for what sits behind the hub',
  spigot: () => 'the spacer swallows the hub spigot',
  'centre-bore': () => 'the centre bore is smaller than the hub spigot',
};

export const factorySeatOf = (f: ChassisWheelFastening): SeatSpec =>
  f.seat === 'ball' ? { type: 'ball', ballRadiusMm: f.ballRadiusMm } : { type: f.seat };

export const fastenerNoun = (f: Pick<ChassisWheelFastening, 'fastener'>) => (f.fastener === 'stud_nut' ? 'nut' : 'bolt');

/** The fastening checks of one corner; null when the chassis has no wheel fastening on record. */
export function fasteningFor(chassis: FasteningChassis, q: FasteningQuestion): FasteningResult | null {
  const f = chassis.wheelFastening;
  if (!f) return null;
  const thread = parseThread(chassis.wheelBoltThread);
  const hub = f[q.axle];
  const stud = f.fastener === 'stud_nut';
  const fastenerSeat = q.fastenerSeat ?? factorySeatOf(f);
  const spacer = q.spacer && q.spacer.thicknessMm > 0 ? q.spacer : null;
  const slipOnMm = spacer?.mounting === 'slip_on' ? spacer.thicknessMm : 0;
  const lengthBasis = q.lengthMm !== undefined ? 'given' : f.stockLengthMm !== undefined ? 'stock' : null;
  const lengthMm = q.lengthMm ?? f.stockLengthMm;
  const missing: string[] = [];
  const notes: string[] = [];
  const cautions: string[] = [];
  let checks: FitCheck[] = [];
  let engagement: ThreadEngagement | null = null;

  if (!q.wheelSeat) missing.push('the wheel’s seat');
  if (q.clampMm === undefined) missing.push(`the wheel’s thickness at the ${fastenerNoun(f)}, from where its seat ends`);
  if (lengthMm === undefined) missing.push(stud ? 'the stud length' : 'the bolt length');
  if (stud && f.nutThreadMm === undefined) missing.push('the nut’s thread length');
  // A bolt-on spacer on a stud car carries studs of its own: the factory stud length says nothing about them.
  const ownStudsUnknown = stud && spacer?.mounting === 'bolt_on' && q.lengthMm === undefined;
  if (ownStudsUnknown) missing.push('the length of the spacer’s own studs');
  const hubCentricUnknown = spacer?.mounting === 'slip_on' && spacer.hubCentric === null;
  if (hubCentricUnknown) notes.push('Whether the spacer is hub-centric is not recorded, so the spigot is not checked.');
  const spigotMm = spacer?.hubCentric || hubCentricUnknown ? undefined : hub.spigotLengthMm;
  if (spacer?.hubCentric && spacer.mounting === 'slip_on')
    notes.push('The spacer is hub-centric: its own spigot centres the wheel, and the hub spigot centres the spacer.');

  const canChain =
    q.clampMm !== undefined && lengthMm !== undefined && (!stud || f.nutThreadMm !== undefined) && !ownStudsUnknown;
  if (canChain) {
    const chain = wheelFasteningChain({
      fastener: f.fastener,
      thread: chassis.wheelBoltThread,
      seat: { ...fastenerSeat, heightMm: f.seatHeightMm },
      wheelSeat: q.wheelSeat ?? fastenerSeat,
      wheelClampMm: q.clampMm!,
      hubMaterial: f.hubMaterial,
      spacer: spacer ? { mounting: spacer.mounting, thicknessMm: spacer.thicknessMm, material: spacer.material } : null,
      boltLengthMm: stud ? undefined : lengthMm,
      boltLengthFrom: f.lengthFrom,
      hubThreadDepthMm: stud ? undefined : hub.threadDepthMm,
      hole: stud ? undefined : hub.hole,
      clearanceBehindHubMm: stud ? undefined : hub.clearanceBehindMm,
      studLengthMm: stud ? lengthMm : undefined,
      nutThreadMm: f.nutThreadMm,
      nutClosed: f.nutClosed,
      hubSpigotLengthMm: spigotMm,
      hubBoreMm: q.wheelBoreMm === undefined ? undefined : chassis.centreBoreMm,
      wheelBoreMm: q.wheelBoreMm,
    });
    // With the wheel's seat unknown the chain compared the seat with itself: that is no check.
    checks = q.wheelSeat ? chain.checks : chain.checks.filter((c) => c.id !== 'seat');
    engagement = chain.engagement;
    cautions.push(...chain.cautions.filter((c) => q.wheelSeat || c !== SEAT_MISMATCH_CAUTION));
    notes.push(...chain.notes);
  } else {
    if (q.wheelSeat) checks.push(seatCheck(fastenerSeat, q.wheelSeat));
    if (spigotMm !== undefined && spacer?.mounting !== 'bolt_on') checks.push(spigotCheck(spigotMm, slipOnMm));
    if (q.wheelBoreMm !== undefined) checks.push(centreBoreCheck(chassis.centreBoreMm, q.wheelBoreMm));
    if (checks.some((c) => c.id === 'seat' && !c.ok)) cautions.push(SEAT_MISMATCH_CAUTION);
    if (checks.some((c) => c.id === 'spigot' && !c.ok)) cautions.push(SPIGOT_CAUTION);
  }

  return {
    fastener: f.fastener,
    thread,
    fastenerSeat,
    checks,
    engagement,
    lengthBasis: canChain ? lengthBasis : null,
    lengthWithSpacerMm: f.stockLengthMm !== undefined && slipOnMm > 0 ? boltLengthWithSpacer(f.stockLengthMm, slipOnMm) : null,
    hubRing: q.wheelBoreMm === undefined ? null : hubCentricRing(chassis.centreBoreMm, q.wheelBoreMm),
    missing,
    failures: checks.filter((c) => c.ok === false).map((c) => failureWords[c.id]?.({ fastener: f.fastener }) ?? c.label),
    cautions,
    notes,
  };
}

/** The seat of a record's tested wheel, or null when the record does not say. */
export function seatOfTestedWheel(t: Pick<TestedWheel, 'seat' | 'ballRadiusMm'>): SeatSpec | null {
  if (t.seat === 'not_stated') return null;
  if (t.seat === 'ball') return t.ballRadiusMm === undefined ? null : { type: 'ball', ballRadiusMm: t.ballRadiusMm };
  return { type: t.seat };
}

const seatOfFastener = (f: Fastener): SeatSpec | null =>
  f.seat === undefined
    ? null
    : f.seat === 'ball'
      ? f.ballRadiusMm === undefined
        ? null
        : { type: 'ball', ballRadiusMm: f.ballRadiusMm }
      : { type: f.seat };

const sameSeat = (a: SeatSpec, b: SeatSpec) =>
  a.type === b.type && (a.type !== 'ball' || Math.abs((a.ballRadiusMm ?? 0) - (b.ballRadiusMm ?? 0)) <= 0.05);

export type TestedWheelFastening = {
  index: number;
  label: string;
  outcome: WheelOutcome;
  /** the record's wheel fastener the wheel was checked with; null for the chassis' factory fastener */
  fastenerLabel: string | null;
  result: FasteningResult;
};

/**
 * Each tested wheel's fastening, with the record's own wheel bolts or nuts: the listed one whose seat is the wheel's
 * (a record that lists ball-seat nuts for a ball-seat wheel), else the first listed with a seat, else the factory one.
 */
export function testedWheelFastenings(data: SwapData, axle: Axle, chassis: FasteningChassis): TestedWheelFastening[] {
  if (!chassis.wheelFastening || !data.wheel) return [];
  const own = data.fasteners.filter((f) => f.kind === 'wheel');
  return data.wheel.testedWheels.flatMap((t, index) => {
    const wheelSeat = seatOfTestedWheel(t);
    const seated = own.filter((f) => seatOfFastener(f) !== null);
    const chosen = (wheelSeat && seated.find((f) => sameSeat(seatOfFastener(f)!, wheelSeat))) ?? seated[0] ?? own[0] ?? null;
    const spacerRow = t.spacerMm > 0 ? data.spacers.find((s) => s.axle === axle && s.thicknessMm === t.spacerMm) : undefined;
    try {
      const result = fasteningFor(chassis, {
        axle,
        wheelSeat,
        fastenerSeat: chosen ? seatOfFastener(chosen) : null,
        clampMm: t.clampMm,
        lengthMm: chosen?.lengthMm,
        wheelBoreMm: t.centreBoreMm,
        spacer:
          t.spacerMm > 0
            ? spacerRow
              ? {
                  thicknessMm: t.spacerMm,
                  mounting: spacerRow.mounting,
                  material: spacerRow.material,
                  hubCentric: spacerRow.hubCentric,
                }
              : { thicknessMm: t.spacerMm, mounting: 'slip_on', material: 'aluminium', hubCentric: null }
            : null,
      });
      if (!result) return [];
      return [
        {
          index,
          label: `${t.diameterIn}×${t.widthIn} ET${t.offsetMm}${t.spacerMm ? ` + ${t.spacerMm} mm spacer` : ''}`,
          outcome: t.outcome,
          fastenerLabel: chosen?.label ?? null,
          result,
        },
      ];
    } catch (error) {
      // a figure the computations refuse (a thread that does not read) leaves this wheel unchecked
      if (error instanceof FitmentInputError) return [];
      throw error;
    }
  });
}

/** "60° cone bolts in a ball R13 wheel seat" */
export function seatMismatchWords(fastener: SeatSpec, wheel: SeatSpec, noun: string): string {
  return `${seatName(fastener)} ${noun}s in a ${seatName(wheel)} wheel seat`;
}
