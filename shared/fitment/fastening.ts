import { FitmentInputError, requireNonNegative, requirePositive } from './errors';
import { EPSILON_MM, SOURCE, type FitCheck } from './fit-check';
import {
  BOTTOMING_RULE,
  parseThread,
  requireHubMaterial,
  threadEngagement,
  type HoleKind,
  type HubMaterial,
  type ParsedThread,
  type ThreadEngagement,
} from './threads';

// The whole wheel fastening chain of one corner: fastener and seat, wheel, spacer, the thread it screws into,
// what lies behind the hub, and how the wheel centres. Plain inputs in millimetres.

export type FastenerKind = 'bolt' | 'stud_nut';
/** 60° cone (taper), ball (radius seat) or flat (with a washer) */
export type SeatType = 'cone60' | 'ball' | 'flat';
export type SpacerMounting = 'slip_on' | 'bolt_on';

export interface SeatSpec {
  type: SeatType;
  /** ball seats only: the sphere's radius (e.g. 12, 13 or 14 mm) */
  ballRadiusMm?: number;
}

export interface FastenerSeat extends SeatSpec {
  /** axial height of the cone or ball on the bolt head or nut, from under the head to where the seat ends */
  heightMm?: number;
}

export interface FasteningSpacer {
  mounting: SpacerMounting;
  thicknessMm: number;
  material: HubMaterial;
  /** bolt-on spacers: depth of the tapped holes the wheel bolts screw into (default: the thickness) */
  threadDepthMm?: number;
  /** bolt-on spacers: the hub face closes the holes from behind, so they count as blind unless said otherwise */
  hole?: HoleKind;
}

export interface WheelFasteningInput {
  fastener: FastenerKind;
  /** e.g. "M12x1.5" or "1/2-20 UNF" */
  thread: string;
  /** the seat of the bolt head or nut */
  seat: FastenerSeat;
  /** the seat the wheel's holes are made for */
  wheelSeat: SeatSpec;
  /** wheel thickness at the fastener, from where its seat ends (bottom of the cone or ball, or the flat face) to its mounting face */
  wheelClampMm: number;
  /** flat seats: the washer under the head or nut */
  washerMm?: number;
  /** hub material, from the chassis */
  hubMaterial: HubMaterial;
  spacer?: FasteningSpacer | null;

  /** bolts: length of the bolt */
  boltLengthMm?: number;
  /** where the bolt length was measured from: under the head (a cone or ball is included) or from where the seat ends */
  boltLengthFrom?: 'under_head' | 'seat_end';
  hubThreadDepthMm?: number;
  hole?: HoleKind;
  /** measured free space behind the hub's bolt holes, before a drum-in-hat parking brake or dust shield */
  clearanceBehindHubMm?: number;

  /** studs: length standing out of the hub face (or of a bolt-on spacer's face) */
  studLengthMm?: number;
  /** studs: threaded length inside the nut, from where its seat ends */
  nutThreadMm?: number;
  /** a closed (dome) nut is a blind hole: a stud that reaches its end clamps nothing */
  nutClosed?: boolean;

  /** length of the hub's centring spigot, from the hub face */
  hubSpigotLengthMm?: number;
  /** diameter of the hub's centring spigot */
  hubBoreMm?: number;
  /** the wheel's centre bore */
  wheelBoreMm?: number;
}

export interface HubRing {
  needed: boolean;
  outerDiameterMm: number;
  innerDiameterMm: number;
  label: string;
}

export interface WheelFastening {
  thread: ParsedThread;
  /** what the fastener's thread is in */
  into: 'hub' | 'spacer' | 'nut';
  /** material whose engagement rule applies */
  material: HubMaterial;
  /** taken off a bolt length measured under the head, so thread is counted from where the seat ends */
  seatAllowanceMm: number;
  /** from where the seat ends to where the thread it screws into begins */
  stackMm: number;
  engagement: ThreadEngagement;
  hubRing: HubRing | null;
  checks: FitCheck[];
  cautions: string[];
  notes: string[];
}

export const SEAT_RULE =
  'The seat of every wheel bolt or nut must be the seat the wheel is made for: 60° cone to 60° cone, ball to ball of the same radius, flat to flat';
export const SEAT_MISMATCH_CAUTION =
  'Mismatched seats touch on a line or a point instead of a surface: the joint loses its clamp and the wheel can come off. Fit bolts or nuts with the seat the wheel maker specifies.';
export const TOO_LONG_RULE =
  'A bolt through an open hub hole must stop short of what sits behind the hub (drum-in-hat parking brake, dust shield)';
export const SPIGOT_RULE =
  'The hub spigot must still reach into the wheel’s centre bore (spigot length − slip-on spacer thickness > 0) for the wheel to centre on the hub';
export const CENTRE_BORE_RULE = 'The wheel’s centre bore must be at least the hub spigot’s diameter for the wheel to seat';
export const NUT_ENGAGEMENT_RULE = 'Thread engagement at least 1.0 × stud diameter in a steel nut (common practice)';
export const BOLT_ON_NOTE =
  'Wheel bolts into a bolt-on spacer screw into the spacer: its material’s engagement rule applies, and the spacer’s own fasteners to the hub need their own check.';

/** bores within this of each other need no ring (common practice, no source) */
export const RING_FREE_DIFFERENCE_MM = 0.1;
const BALL_RADIUS_TOLERANCE_MM = 0.05;

const seatNames: Record<SeatType, string> = { cone60: '60° cone', ball: 'ball', flat: 'flat' };

export function checkedSeat(seat: SeatSpec | undefined, field: string): SeatSpec {
  const type = seat?.type;
  if (type !== 'cone60' && type !== 'ball' && type !== 'flat') {
    throw new FitmentInputError(`${field}.type`, `${field}.type must be "cone60", "ball" or "flat" (got ${String(type)})`);
  }
  if (type === 'ball') return { type, ballRadiusMm: requirePositive(seat?.ballRadiusMm, `${field}.ballRadiusMm`) };
  return { type };
}

export function seatName(seat: SeatSpec): string {
  return seat.type === 'ball' && seat.ballRadiusMm ? `ball R${seat.ballRadiusMm}` : seatNames[seat.type];
}

/** Whether the fastener's seat is the seat the wheel is made for (a mismatch is always a failure). */
export function seatCheck(fastener: SeatSpec, wheel: SeatSpec): FitCheck {
  const same =
    fastener.type === wheel.type &&
    (fastener.type !== 'ball' || Math.abs(fastener.ballRadiusMm! - wheel.ballRadiusMm!) <= BALL_RADIUS_TOLERANCE_MM);
  return {
    id: 'seat',
    label: `Seat: ${seatName(fastener)} fastener in a ${seatName(wheel)} wheel seat`,
    ok: same,
    valueMm: null,
    marginMm: null,
    rule: SEAT_RULE,
    source: 'the wheel maker’s specified seat (common practice, no source)',
  };
}

function optionalNonNegative(value: unknown, field: string): number | undefined {
  return value === undefined || value === null ? undefined : requireNonNegative(value, field);
}

function optionalPositive(value: unknown, field: string): number | undefined {
  return value === undefined || value === null ? undefined : requirePositive(value, field);
}

function checkedHole(hole: unknown, field: string): HoleKind | undefined {
  if (hole === undefined || hole === null) return undefined;
  if (hole !== 'blind' && hole !== 'through') {
    throw new FitmentInputError(field, `${field} must be "blind" or "through" (got ${String(hole)})`);
  }
  return hole;
}

function checkedSpacer(spacer: FasteningSpacer | null | undefined): FasteningSpacer | null {
  if (spacer === undefined || spacer === null) return null;
  if (spacer.mounting !== 'slip_on' && spacer.mounting !== 'bolt_on') {
    throw new FitmentInputError(
      'spacer.mounting',
      `spacer.mounting must be "slip_on" or "bolt_on" (got ${String(spacer.mounting)})`,
    );
  }
  const thicknessMm = requirePositive(spacer.thicknessMm, 'spacer.thicknessMm');
  return {
    mounting: spacer.mounting,
    thicknessMm,
    material: requireHubMaterial(spacer.material, 'spacer.material'),
    threadDepthMm: optionalPositive(spacer.threadDepthMm, 'spacer.threadDepthMm'),
    hole: checkedHole(spacer.hole, 'spacer.hole'),
  };
}

/** Hub-centric ring from the hub spigot and the wheel bore; null when the wheel does not fit over the spigot. */
export function hubCentricRing(hubBoreMm: number, wheelBoreMm: number): HubRing | null {
  const hub = requirePositive(hubBoreMm, 'hubBoreMm');
  const wheel = requirePositive(wheelBoreMm, 'wheelBoreMm');
  if (wheel < hub - EPSILON_MM) return null;
  const needed = wheel - hub > RING_FREE_DIFFERENCE_MM;
  const shown = (n: number) => String(Number(n.toFixed(2)));
  return { needed, outerDiameterMm: wheel, innerDiameterMm: hub, label: `${shown(wheel)} → ${shown(hub)} mm` };
}

export const SPIGOT_CAUTION =
  'The spacer swallows the hub spigot: the wheel centres on its fasteners only. Use a hub-centric spacer with its own spigot.';

/** How much of the hub spigot still reaches into the wheel's bore past a slip-on spacer. */
export function spigotCheck(spigotLengthMm: number, slipOnMm: number): FitCheck {
  const remainingMm = requirePositive(spigotLengthMm, 'hubSpigotLengthMm') - requireNonNegative(slipOnMm, 'spacerMm');
  return {
    id: 'spigot',
    label: slipOnMm > 0 ? 'Hub spigot left in the wheel bore past the spacer' : 'Hub spigot in the wheel bore',
    ok: remainingMm > EPSILON_MM,
    valueMm: remainingMm,
    marginMm: remainingMm,
    rule: SPIGOT_RULE,
    source: SOURCE.geometry,
  };
}

/** The wheel's centre bore against the hub spigot's diameter. */
export function centreBoreCheck(hubBoreMm: number, wheelBoreMm: number): FitCheck {
  const differenceMm = requirePositive(wheelBoreMm, 'wheelBoreMm') - requirePositive(hubBoreMm, 'hubBoreMm');
  return {
    id: 'centre-bore',
    label: 'Wheel centre bore over the hub spigot',
    ok: differenceMm >= -EPSILON_MM,
    valueMm: differenceMm,
    marginMm: differenceMm,
    rule: CENTRE_BORE_RULE,
    source: SOURCE.geometry,
  };
}

export function wheelFasteningChain(input: WheelFasteningInput): WheelFastening {
  if (input === null || typeof input !== 'object') throw new FitmentInputError('fastener', 'Describe the wheel fastening');
  const kind = input.fastener;
  if (kind !== 'bolt' && kind !== 'stud_nut') {
    throw new FitmentInputError('fastener', `fastener must be "bolt" or "stud_nut" (got ${String(kind)})`);
  }
  const thread = parseThread(input.thread);
  const seat = checkedSeat(input.seat, 'seat');
  const wheelSeat = checkedSeat(input.wheelSeat, 'wheelSeat');
  const wheelClampMm = requirePositive(input.wheelClampMm, 'wheelClampMm');
  const washerMm = optionalNonNegative(input.washerMm, 'washerMm') ?? 0;
  if (washerMm > 0 && seat.type !== 'flat') {
    throw new FitmentInputError(
      'washerMm',
      'A washer belongs under a flat seat only; cone and ball seats bear on the wheel directly',
    );
  }
  const hubMaterial = requireHubMaterial(input.hubMaterial);
  const spacer = checkedSpacer(input.spacer);
  const slipOnMm = spacer?.mounting === 'slip_on' ? spacer.thicknessMm : 0;
  const boltOn = spacer?.mounting === 'bolt_on' ? spacer : null;

  const checks: FitCheck[] = [seatCheck(seat, wheelSeat)];
  const cautions: string[] = [];
  const notes: string[] = [];
  if (!checks[0].ok) cautions.push(SEAT_MISMATCH_CAUTION);

  const stackMm = washerMm + wheelClampMm + slipOnMm;
  let engagement: ThreadEngagement;
  let into: WheelFastening['into'];
  let material: HubMaterial;
  let seatAllowanceMm = 0;
  let hole: HoleKind | undefined;
  let depthMm: number | undefined;

  if (kind === 'bolt') {
    const lengthMm = requirePositive(input.boltLengthMm, 'boltLengthMm');
    const from = input.boltLengthFrom ?? 'under_head';
    if (from !== 'under_head' && from !== 'seat_end') {
      throw new FitmentInputError('boltLengthFrom', `boltLengthFrom must be "under_head" or "seat_end" (got ${String(from)})`);
    }
    if (from === 'under_head' && seat.type !== 'flat') {
      seatAllowanceMm = requirePositive(input.seat.heightMm, 'seat.heightMm');
      if (seatAllowanceMm >= lengthMm) {
        throw new FitmentInputError(
          'seat.heightMm',
          `The seat (${seatAllowanceMm} mm) cannot be as long as the bolt (${lengthMm} mm)`,
        );
      }
      notes.push(
        `Bolt length measured under the head includes the ${seatName(seat)} seat: ${seatAllowanceMm} mm are taken off, so thread is counted from where the seat ends.`,
      );
    }
    if (boltOn) {
      into = 'spacer';
      material = boltOn.material;
      depthMm = boltOn.threadDepthMm ?? boltOn.thicknessMm;
      hole = boltOn.hole ?? 'blind';
      notes.push(BOLT_ON_NOTE);
    } else {
      into = 'hub';
      material = hubMaterial;
      depthMm = optionalPositive(input.hubThreadDepthMm, 'hubThreadDepthMm');
      hole = checkedHole(input.hole, 'hole');
    }
    engagement = threadEngagement({
      diameterMm: thread.diameterMm,
      pitchMm: thread.pitchMm,
      boltLengthMm: lengthMm - seatAllowanceMm,
      clampedMm: stackMm,
      hubMaterial: material,
      hubThreadDepthMm: depthMm,
      hole,
    });
  } else {
    const studMm = requirePositive(input.studLengthMm, 'studLengthMm');
    depthMm = requirePositive(input.nutThreadMm, 'nutThreadMm');
    hole = input.nutClosed ? 'blind' : 'through';
    into = 'nut';
    material = 'steel';
    if (boltOn)
      notes.push('With a bolt-on spacer the wheel nuts run on the spacer’s own studs: give their length out of the spacer face.');
    engagement = threadEngagement({
      diameterMm: thread.diameterMm,
      pitchMm: thread.pitchMm,
      boltLengthMm: studMm,
      clampedMm: stackMm,
      hubMaterial: 'steel',
      hubThreadDepthMm: depthMm,
      hole,
    });
  }

  const where = into === 'nut' ? 'the nut' : into === 'spacer' ? `the ${material} bolt-on spacer` : `the ${material} hub`;
  checks.push({
    id: 'engagement',
    label: `Thread engagement in ${where}`,
    ok: engagement.ok,
    valueMm: engagement.engagementMm,
    marginMm: engagement.marginMm,
    rule:
      into === 'nut'
        ? engagement.bottomsOut
          ? `${NUT_ENGAGEMENT_RULE}; ${BOTTOMING_RULE}`
          : NUT_ENGAGEMENT_RULE
        : engagement.rule,
    source: SOURCE.practice,
  });

  if (hole === 'blind' && depthMm !== undefined) {
    checks.push({
      id: 'bottoming',
      label: into === 'nut' ? 'Stud against the end of the closed nut' : 'Bolt against the bottom of the blind hole',
      ok: !engagement.bottomsOut,
      valueMm: engagement.reachMm,
      marginMm: depthMm - engagement.reachMm,
      rule: BOTTOMING_RULE,
      source: SOURCE.geometry,
    });
    if (engagement.bottomsOut) {
      cautions.push(
        into === 'nut'
          ? 'The stud reaches the end of the closed nut before the wheel is clamped: use open nuts or shorter studs.'
          : 'The bolt reaches the bottom of its hole before the wheel is clamped: it feels tight but clamps nothing. Use a shorter bolt.',
      );
    }
  }

  if (kind === 'bolt' && hole === 'through' && depthMm !== undefined && input.clearanceBehindHubMm !== undefined) {
    const clearanceMm = requireNonNegative(input.clearanceBehindHubMm, 'clearanceBehindHubMm');
    const tipBehindMm = engagement.reachMm - depthMm;
    checks.push({
      id: 'too-long',
      label: 'Bolt tip behind the hub',
      ok: tipBehindMm <= clearanceMm + EPSILON_MM,
      valueMm: Math.max(0, tipBehindMm),
      marginMm: clearanceMm - Math.max(0, tipBehindMm),
      rule: TOO_LONG_RULE,
      source: SOURCE.geometry,
    });
    if (tipBehindMm > clearanceMm + EPSILON_MM) {
      cautions.push('The bolt is too long: its tip would reach the parking-brake drum or dust shield behind the hub.');
    }
  }

  if (input.hubSpigotLengthMm !== undefined) {
    const spigotMm = requirePositive(input.hubSpigotLengthMm, 'hubSpigotLengthMm');
    if (boltOn) {
      notes.push('A bolt-on spacer centres the wheel on its own spigot, if it has one; the hub spigot centres the spacer.');
    } else {
      const check = spigotCheck(spigotMm, slipOnMm);
      checks.push(check);
      if (!check.ok) cautions.push(SPIGOT_CAUTION);
    }
  }

  let hubRing: HubRing | null = null;
  if (input.hubBoreMm !== undefined && input.wheelBoreMm !== undefined) {
    const hubBoreMm = requirePositive(input.hubBoreMm, 'hubBoreMm');
    const wheelBoreMm = requirePositive(input.wheelBoreMm, 'wheelBoreMm');
    hubRing = hubCentricRing(hubBoreMm, wheelBoreMm);
    checks.push(centreBoreCheck(hubBoreMm, wheelBoreMm));
  }

  return { thread, into, material, seatAllowanceMm, stackMm, engagement, hubRing, checks, cautions, notes };
}
