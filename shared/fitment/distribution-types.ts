import type { AxleBrakes } from './axle-torque';
import type { DistributionVehicle } from './distribution';
import type { PASSENGER_CAR_REFERENCE } from './distribution-reference';

// What the brake-distribution analysis takes and gives.

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
