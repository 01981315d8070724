import { isStructural, rotorsOn, type SwapData, type WheelOutcome } from '../schemas/swap-data';
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
import { MM_PER_IN, round1 } from './units';

// the brake balance has its own module; callers read it from here with the other checks
export * from './swap-balance';

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
        : // no figure in the words: the page shows the spacer and the length in the reader's own units beside them
          `A slip-on spacer needs ${noun} longer than stock by its own thickness to keep the stock thread engagement.`;
  const spacerNote =
    wheel.spacerMm > BOLT_ON_SPACER_FROM_MM
      ? `Spacers this thick are usually the bolt-on kind with their own studs (common practice, no source).`
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

export type WheelCheckSummary = {
  tone: 'pass' | 'fail' | 'open';
  /** the verdict in a few words, for the one line at the top of the check */
  headline: string;
  text: string;
  leastClearanceMm?: number;
};

/** The one line above the wheel check: a failure from a measurement, a pass only when everything was measured. */
export function wheelCheckSummary(check: WheelCheck): WheelCheckSummary {
  const fails: string[] = [];
  if (check.minDiameter && !check.minDiameter.ok) fails.push(`the wheel is below the ${check.minDiameter.requiredIn}″ minimum`);
  if (check.radial?.basis === 'measured' && !check.radial.ok) fails.push('too little room at the barrel');
  if (check.spoke?.basis === 'measured' && !check.spoke.ok) fails.push('too little room at the spokes');
  if (check.fastening) fails.push(...check.fastening.failures);
  if (fails.length > 0)
    return { tone: 'fail', headline: `Does not fit: ${fails[0]}`, text: `Does not fit as entered: ${fails.join('; ')}.` };
  const figures = [check.radial, check.spoke].filter((f): f is ClearanceFigure => f !== null);
  const estimated = figures.filter((f) => f.basis === 'estimated');
  if (figures.length > 0 && estimated.length === 0) {
    const least = Math.min(...figures.map((f) => f.clearanceMm));
    return {
      tone: 'pass',
      headline: 'Clears by your measurements',
      text: 'Clears by your measurements.',
      leastClearanceMm: least,
    };
  }
  if (estimated.some((f) => f.clearanceMm < MIN_CLEARANCE_MM))
    return {
      tone: 'open',
      headline: 'Not settled: the estimates are tight, measure your wheel',
      text: 'Not settled, and the estimates are tight or overlapping: measure your barrel and spokes before buying anything.',
    };
  const which = estimated.map((f) => (f === check.radial ? 'barrel' : 'spoke'));
  return {
    tone: 'open',
    headline: 'Not settled: estimates only, measure your wheel',
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
