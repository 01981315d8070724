import type { FitCheck } from './fit-check';
import type { ShimStack } from './shims';

// What the caliper–rotor fit takes and gives. Axial positions are along the axle from the hub's mounting
// face, positive inboard (towards the car).

export interface PadOverhangInput {
  /** the rotor diameter the caliper was designed around */
  designRotorDiameterMm: number;
  /** how far the pad's outer edge sits inside the designed rotor's edge */
  padEdgeStepMm: number;
  /** how far the bracket moves the caliper outward (negative: inward) compared with its design position */
  radialLiftMm: number;
  /** the rotor actually fitted */
  rotorDiameterMm: number;
}

export type LineFittingKind = 'banjo' | 'inverted_flare' | 'bubble_flare';

export interface LineFitting {
  kind: LineFittingKind;
  /** e.g. "M10x1", "3/8-24 UNF", "7/16-20 UNF" */
  thread: string;
}

export type Side = 'left' | 'right';
export type AxlePosition = 'ahead' | 'behind';

export interface BleedOrientation {
  /** the side of the car the caliper was made for */
  designedSide: Side;
  fittedSide: Side;
  /** ahead of or behind the axle line, on the donor and as fitted (default: unchanged) */
  designedPosition?: AxlePosition;
  fittedPosition?: AxlePosition;
  /** calipers with bleed screws at both ends bleed either way up */
  bleedersBothEnds?: boolean;
}

export interface CaliperRotorFitInput {
  caliper: {
    designRotorDiameterMm: number;
    padEdgeStepMm: number;
    /** radial height of the pad's friction surface */
    padHeightMm?: number;
    /** rotor thickness range the caliper is designed for */
    rotorThicknessMinMm?: number;
    rotorThicknessMaxMm?: number;
    /** from the caliper's mount face to its centre plane (half-way between the pad faces), positive outboard */
    centreFromMountMm?: number;
  };
  bracket: {
    radialLiftMm: number;
    /** from the hub face to the face the caliper mounts on (bracket fitted), positive inboard */
    mountFaceInboardMm?: number;
  };
  rotor: {
    diameterMm: number;
    thicknessMm?: number;
    /** overall height: from the rotor's mounting face (on the hub) to its inboard friction face */
    hatHeightMm?: number;
    /** inner diameter of the friction ring */
    frictionRingInnerDiameterMm?: number;
  };
  centring?: {
    /** shim thicknesses at hand, each may repeat */
    shimSizesMm: number[];
    /** which way a shim on the axial joint pushes the caliper (depends on which side of the mount face it sits) */
    shimMoves: 'outboard' | 'inboard';
    maxPieces?: number;
  };
  hydraulics?: {
    caliperPort?: LineFitting;
    lineCaliperEnd?: LineFitting;
    lineChassisEnd?: LineFitting;
    chassisPort?: LineFitting;
  };
  bleed?: BleedOrientation;
}

export interface AxialPosition {
  rotorCentreInboardMm: number;
  caliperCentreInboardMm: number;
  /** caliper centre − ring centre; positive: the caliper sits inboard and must move outboard */
  offsetMm: number;
  move: 'outboard' | 'inboard' | 'none';
}

export interface CentringShim {
  targetMm: number;
  stack: ShimStack;
  /** left after the stack: positive, the caliper now sits past the ring centre */
  residualMm: number;
  placement: string;
}

export interface EffectiveRadius {
  /** middle of the band where the pad actually touches the friction ring */
  fromPadMm: number;
  /** (D − h)/2, which assumes the pad's outer edge at the rotor edge */
  estimateMm: number;
  /** torque from the real pad position ÷ torque from the estimate */
  ratio: number;
  rule: string;
  source: string;
}

export interface CaliperRotorFit {
  padOuterRadiusMm: number;
  padInnerRadiusMm: number | null;
  checks: FitCheck[];
  effectiveRadius: EffectiveRadius | null;
  axial: AxialPosition | null;
  centringShim: CentringShim | null;
  cautions: string[];
}
