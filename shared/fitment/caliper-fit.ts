import { FitmentInputError, requireFinite, requireNonNegative, requirePositive } from './errors';
import { EPSILON_MM, SOURCE, type FitCheck } from './fit-check';
import { effectiveRadiusMm } from './brakes';
import { shimStack } from './shims';
import { parseThread, type ParsedThread } from './threads';
import type {
  AxialPosition,
  BleedOrientation,
  CaliperRotorFit,
  CaliperRotorFitInput,
  CentringShim,
  EffectiveRadius,
  LineFitting,
  LineFittingKind,
  PadOverhangInput,
} from './caliper-fit-types';

// Does this caliper, on this bracket, sit on this rotor? Radial (pad on the friction ring), axial (centred on the
// ring, with the shim that centres it), rotor thickness, the brake-line joints and where the bleed screw ends up.
// Axial positions are measured along the axle from the hub's mounting face, positive inboard (towards the car).

export * from './caliper-fit-types';

/** within this the caliper counts as centred on the ring (common practice, no source) */
export const CENTRING_TOLERANCE_MM = 0.25;

export const PAD_OVERHANG_RULE =
  'The pad’s outer edge must stay on the rotor: designed rotor Ø/2 − pad edge step + bracket radial lift ≤ fitted rotor radius';
export const PAD_INNER_RULE =
  'The pad’s inner edge must stay on the friction ring; below the ring’s inner diameter it rides on the hat or vanes';
export const THICKNESS_RULE = 'Rotor thickness inside the range the caliper is designed for';
export const CENTRING_RULE = `Caliper centre plane within ${CENTRING_TOLERANCE_MM} mm of the friction ring’s centre plane`;
export const FITTING_RULE =
  'Both halves of a brake-line joint must be the same seal (banjo to banjo, inverted flare to inverted flare, bubble flare to bubble flare) and the same thread';
export const BLEED_RULE =
  'The bleed screw must be at the top of the caliper so air can leave; a caliper moved to the other side of the car, or from behind to ahead of the axle, turns upside down';
export const SHIM_PLACEMENT =
  'On the axial joint, between the caliper’s mount face and the bracket, so the mounting bolts clamp it along the axle; never under radial-mount ears, which would lift the caliper instead of centring it. The caliper bolts lose that much thread engagement: check them.';
export const EFFECTIVE_RADIUS_RULE =
  'Effective radius = middle of the band where the pad touches the friction ring, in place of (D − h)/2';

const fittingNames: Record<LineFittingKind, string> = {
  banjo: 'banjo',
  inverted_flare: 'inverted flare',
  bubble_flare: 'bubble flare',
};

function optionalPositive(value: unknown, field: string): number | undefined {
  return value === undefined || value === null ? undefined : requirePositive(value, field);
}

function optionalFinite(value: unknown, field: string): number | undefined {
  return value === undefined || value === null ? undefined : requireFinite(value, field);
}

/** Radius of the pad's outer edge as the bracket places it. */
export function padOuterRadiusMm(input: Omit<PadOverhangInput, 'rotorDiameterMm'>): number {
  const design = requirePositive(input?.designRotorDiameterMm, 'designRotorDiameterMm');
  const step = requireNonNegative(input.padEdgeStepMm, 'padEdgeStepMm');
  const lift = requireFinite(input.radialLiftMm, 'radialLiftMm');
  if (step >= design / 2) {
    throw new FitmentInputError(
      'padEdgeStepMm',
      `padEdgeStepMm (${step}) must be less than the designed rotor radius (${design / 2})`,
    );
  }
  const radius = design / 2 - step + lift;
  if (radius <= 0) throw new FitmentInputError('radialLiftMm', `radialLiftMm (${lift}) puts the pad edge at or below the axle`);
  return radius;
}

/** Pad outer edge radius − rotor radius; positive: the pad overhangs the rotor's edge (a failure). */
export function padOverhangMm(input: PadOverhangInput): number {
  const outer = padOuterRadiusMm(input);
  const rotor = requirePositive(input.rotorDiameterMm, 'rotorDiameterMm');
  return outer - rotor / 2;
}

function checkedFitting(fitting: LineFitting | undefined, field: string): { kind: LineFittingKind; thread: ParsedThread } {
  const kind = fitting?.kind;
  if (kind !== 'banjo' && kind !== 'inverted_flare' && kind !== 'bubble_flare') {
    throw new FitmentInputError(
      `${field}.kind`,
      `${field}.kind must be "banjo", "inverted_flare" or "bubble_flare" (got ${String(kind)})`,
    );
  }
  try {
    return { kind, thread: parseThread(fitting!.thread) };
  } catch (error) {
    if (error instanceof FitmentInputError) throw new FitmentInputError(`${field}.thread`, error.message);
    throw error;
  }
}

function sameThread(a: ParsedThread, b: ParsedThread): boolean {
  return a.system === b.system && Math.abs(a.diameterMm - b.diameterMm) < 0.01 && Math.abs(a.pitchMm - b.pitchMm) < 0.001;
}

/** Both halves of one brake-line joint. */
export function lineFittingCheck(
  id: string,
  label: string,
  a: LineFitting,
  aField: string,
  b: LineFitting,
  bField: string,
): FitCheck {
  const one = checkedFitting(a, aField);
  const two = checkedFitting(b, bField);
  const ok = one.kind === two.kind && sameThread(one.thread, two.thread);
  return {
    id,
    label: `${label}: ${fittingNames[one.kind]} ${one.thread.label} to ${fittingNames[two.kind]} ${two.thread.label}`,
    ok,
    valueMm: null,
    marginMm: null,
    rule: FITTING_RULE,
    source: `${SOURCE.iso724}; ${SOURCE.asme}`,
  };
}

/** The bleed screw ends up at the bottom when exactly one of side and fore/aft position changes. */
export function bleedScrewAtBottom(bleed: BleedOrientation): boolean {
  const sides = ['left', 'right'];
  const positions = ['ahead', 'behind'];
  for (const [key, allowed] of [
    ['designedSide', sides],
    ['fittedSide', sides],
  ] as const) {
    if (!allowed.includes(bleed?.[key] as string)) {
      throw new FitmentInputError(`bleed.${key}`, `bleed.${key} must be "left" or "right" (got ${String(bleed?.[key])})`);
    }
  }
  for (const key of ['designedPosition', 'fittedPosition'] as const) {
    if (bleed[key] !== undefined && !positions.includes(bleed[key])) {
      throw new FitmentInputError(`bleed.${key}`, `bleed.${key} must be "ahead" or "behind" (got ${String(bleed[key])})`);
    }
  }
  if (bleed.bleedersBothEnds) return false;
  const sideFlip = bleed.designedSide !== bleed.fittedSide;
  const positionFlip = (bleed.designedPosition ?? 'behind') !== (bleed.fittedPosition ?? bleed.designedPosition ?? 'behind');
  return sideFlip !== positionFlip;
}

function thicknessCheck(input: CaliperRotorFitInput): FitCheck | null {
  const min = optionalPositive(input.caliper.rotorThicknessMinMm, 'caliper.rotorThicknessMinMm');
  const max = optionalPositive(input.caliper.rotorThicknessMaxMm, 'caliper.rotorThicknessMaxMm');
  const thickness = optionalPositive(input.rotor.thicknessMm, 'rotor.thicknessMm');
  if (min === undefined && max === undefined) return null;
  if (min === undefined || max === undefined) {
    const missing = min === undefined ? 'caliper.rotorThicknessMinMm' : 'caliper.rotorThicknessMaxMm';
    throw new FitmentInputError(missing, 'Give both ends of the caliper’s rotor thickness range');
  }
  if (min > max)
    throw new FitmentInputError('caliper.rotorThicknessMaxMm', `The range's top (${max}) is below its bottom (${min})`);
  if (thickness === undefined) return null;
  const margin = Math.min(thickness - min, max - thickness);
  return {
    id: 'rotor-thickness',
    label: `Rotor thickness ${thickness} mm in a caliper for ${min}–${max} mm`,
    ok: margin >= -EPSILON_MM,
    valueMm: thickness,
    marginMm: margin,
    rule: THICKNESS_RULE,
    source: SOURCE.caliperData,
  };
}

function axialPosition(input: CaliperRotorFitInput): AxialPosition | null {
  const hat = optionalPositive(input.rotor.hatHeightMm, 'rotor.hatHeightMm');
  const mount = optionalFinite(input.bracket.mountFaceInboardMm, 'bracket.mountFaceInboardMm');
  const fromMount = optionalFinite(input.caliper.centreFromMountMm, 'caliper.centreFromMountMm');
  if (hat === undefined || mount === undefined || fromMount === undefined) return null;
  const thickness = requirePositive(input.rotor.thicknessMm, 'rotor.thicknessMm');
  if (hat < thickness) {
    throw new FitmentInputError(
      'rotor.hatHeightMm',
      `The rotor's overall height (${hat}) cannot be less than its thickness (${thickness})`,
    );
  }
  const rotorCentreInboardMm = hat - thickness / 2;
  const caliperCentreInboardMm = mount - fromMount;
  const offsetMm = caliperCentreInboardMm - rotorCentreInboardMm;
  const move = Math.abs(offsetMm) <= EPSILON_MM ? 'none' : offsetMm > 0 ? 'outboard' : 'inboard';
  return { rotorCentreInboardMm, caliperCentreInboardMm, offsetMm, move };
}

export function caliperRotorFit(input: CaliperRotorFitInput): CaliperRotorFit {
  if (input === null || typeof input !== 'object')
    throw new FitmentInputError('caliper', 'Describe the caliper, bracket and rotor');
  for (const part of ['caliper', 'bracket', 'rotor'] as const) {
    if (input[part] === null || typeof input[part] !== 'object') throw new FitmentInputError(part, `Give the ${part}'s figures`);
  }
  const { caliper, bracket, rotor } = input;
  const checks: FitCheck[] = [];
  const cautions: string[] = [];

  const outer = padOuterRadiusMm({ ...caliper, radialLiftMm: bracket.radialLiftMm });
  const overhang = padOverhangMm({ ...caliper, radialLiftMm: bracket.radialLiftMm, rotorDiameterMm: rotor.diameterMm });
  const rotorRadius = rotor.diameterMm / 2;
  checks.push({
    id: 'pad-overhang',
    label: overhang > EPSILON_MM ? 'Pad overhangs the rotor edge' : 'Pad outer edge inside the rotor edge',
    ok: overhang <= EPSILON_MM,
    valueMm: overhang,
    marginMm: -overhang,
    rule: PAD_OVERHANG_RULE,
    source: SOURCE.geometry,
  });
  if (overhang > EPSILON_MM) {
    cautions.push(
      'The pad hangs over the rotor edge: it wears a lip, loses area and can catch. Use a larger rotor or a bracket with less lift.',
    );
  }

  const padHeight = optionalPositive(caliper.padHeightMm, 'caliper.padHeightMm');
  const ringInnerDiameter = optionalPositive(rotor.frictionRingInnerDiameterMm, 'rotor.frictionRingInnerDiameterMm');
  if (ringInnerDiameter !== undefined && ringInnerDiameter >= rotor.diameterMm) {
    throw new FitmentInputError(
      'rotor.frictionRingInnerDiameterMm',
      'The friction ring’s inner diameter must be less than the rotor’s',
    );
  }
  let inner: number | null = null;
  if (padHeight !== undefined) {
    inner = outer - padHeight;
    if (inner <= 0)
      throw new FitmentInputError('caliper.padHeightMm', `A ${padHeight} mm pad does not fit below a ${outer} mm edge radius`);
    if (ringInnerDiameter !== undefined) {
      const margin = inner - ringInnerDiameter / 2;
      checks.push({
        id: 'pad-inner-edge',
        label: 'Pad inner edge on the friction ring',
        ok: margin >= -EPSILON_MM,
        valueMm: inner,
        marginMm: margin,
        rule: PAD_INNER_RULE,
        source: SOURCE.geometry,
      });
    }
  }

  let effectiveRadius: EffectiveRadius | null = null;
  if (padHeight !== undefined && inner !== null && padHeight < rotorRadius) {
    const contactOuter = Math.min(outer, rotorRadius);
    const contactInner = Math.max(inner, (ringInnerDiameter ?? 0) / 2);
    if (contactOuter > contactInner) {
      const fromPadMm = (contactOuter + contactInner) / 2;
      const estimateMm = effectiveRadiusMm(rotor.diameterMm, padHeight);
      effectiveRadius = {
        fromPadMm,
        estimateMm,
        ratio: fromPadMm / estimateMm,
        rule: EFFECTIVE_RADIUS_RULE,
        source: 'textbook disc brake torque form, T = 2 μ F r_eff',
      };
    }
  }

  const thickness = thicknessCheck(input);
  if (thickness) checks.push(thickness);

  const axial = axialPosition(input);
  let centringShim: CentringShim | null = null;
  if (axial) {
    const need = Math.abs(axial.offsetMm);
    const centring = input.centring;
    if (need <= CENTRING_TOLERANCE_MM + EPSILON_MM) {
      checks.push({
        id: 'axial-centring',
        label: 'Caliper centred on the friction ring',
        ok: true,
        valueMm: axial.offsetMm,
        marginMm: CENTRING_TOLERANCE_MM - need,
        rule: CENTRING_RULE,
        source: SOURCE.practice,
      });
    } else if (centring && centring.shimMoves !== 'outboard' && centring.shimMoves !== 'inboard') {
      throw new FitmentInputError(
        'centring.shimMoves',
        `centring.shimMoves must be "outboard" or "inboard" (got ${String(centring.shimMoves)})`,
      );
    } else if (centring && centring.shimMoves === axial.move) {
      const stack = shimStack(need, centring.shimSizesMm, centring.maxPieces ?? 4);
      const residualMm = stack.totalMm - need;
      centringShim = { targetMm: need, stack, residualMm, placement: SHIM_PLACEMENT };
      checks.push({
        id: 'axial-centring',
        label: `Caliper centred with a ${stack.totalMm} mm shim stack`,
        ok: Math.abs(residualMm) <= CENTRING_TOLERANCE_MM + EPSILON_MM,
        valueMm: residualMm,
        marginMm: CENTRING_TOLERANCE_MM - Math.abs(residualMm),
        rule: CENTRING_RULE,
        source: SOURCE.practice,
      });
    } else {
      checks.push({
        id: 'axial-centring',
        label: `Caliper off the ring centre: it must move ${need.toFixed(2)} mm ${axial.move}`,
        ok: false,
        valueMm: axial.offsetMm,
        marginMm: CENTRING_TOLERANCE_MM - need,
        rule: CENTRING_RULE,
        source: SOURCE.practice,
      });
      if (centring) {
        cautions.push(
          `A shim on the axial joint pushes this caliper ${centring.shimMoves}, but it must move ${axial.move}: machine the mount face by ${need.toFixed(2)} mm or use another bracket.`,
        );
      }
    }
  }

  const h = input.hydraulics;
  if (h?.caliperPort && h.lineCaliperEnd) {
    checks.push(
      lineFittingCheck(
        'line-caliper-end',
        'Line at the caliper',
        h.caliperPort,
        'hydraulics.caliperPort',
        h.lineCaliperEnd,
        'hydraulics.lineCaliperEnd',
      ),
    );
  }
  if (h?.chassisPort && h.lineChassisEnd) {
    checks.push(
      lineFittingCheck(
        'line-chassis-end',
        'Line at the chassis',
        h.lineChassisEnd,
        'hydraulics.lineChassisEnd',
        h.chassisPort,
        'hydraulics.chassisPort',
      ),
    );
  }
  if (checks.some((c) => c.id.startsWith('line-') && !c.ok)) {
    cautions.push(
      'A brake-line joint with mismatched seals or threads leaks or lets go under pressure: never force or mix fittings.',
    );
  }

  if (input.bleed) {
    const bottom = bleedScrewAtBottom(input.bleed);
    checks.push({
      id: 'bleed-screw',
      label: bottom ? 'Bleed screw at the bottom as fitted' : 'Bleed screw at the top as fitted',
      ok: !bottom,
      valueMm: null,
      marginMm: null,
      rule: BLEED_RULE,
      source: SOURCE.practice,
    });
    if (bottom)
      cautions.push(
        'With the bleed screw at the bottom, air stays trapped: use the caliper made for this side, or one with bleed screws at both ends.',
      );
  }

  return { padOuterRadiusMm: outer, padInnerRadiusMm: inner, checks, effectiveRadius, axial, centringShim, cautions };
}
