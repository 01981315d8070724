import { calipersOn, rotorsOn, type FastenerKind, type SwapData } from './schemas/swap-data';
import { axles, type Axle, type Category } from './schemas/enums';
import type { CheckResult } from './schemas/submissions';
import { brakeBalanceOf, pistonsPerSideOf, testedWheelVerdicts } from './fitment/swap-checks';
import { MIN_CLEARANCE_MM } from './fitment/clearance';
import { fastenerKindLabels } from './schemas/swap-data-labels';
import type { VehicleFigures } from './schemas/vehicle';
import { testedWheelFastenings } from './fitment/swap-fastening';
import { caliperFitsFor } from './fitment/swap-caliper-fit';
import type { ChassisWheelFastening } from './schemas/wheel-fastening';
import { implausibleTorques, routesMissingCalipers, savingsFromOneSidedLabour } from './review-plausibility';

// The automatic checks the review desk shows for a revision. The submission form runs the same
// function, so a member sees what the reviewer will see before sending it.

export type ReviewCheckInput = {
  data: SwapData;
  body: string;
  photoCount: number;
  /**
   * `figures`: the chassis' stock figures, which decide which axle locks first, when the catalogue has them;
   * the wheel fastening is checked when the chassis has one on record
   */
  chassis: {
    wheelBoltThread: string;
    figures?: VehicleFigures | null;
    centreBoreMm?: number;
    wheelFastening?: ChassisWheelFastening | null;
  };
  axle: Axle;
  /** when absent, a wheel requirement is expected whenever a caliper, rotor or spacer is listed */
  category?: Category;
  /** approved swaps on the same chassis and axle with the same donor caliper (see donorCaliperKeys) */
  duplicates: { slug: string; title: string }[];
};

export const checkIds = [
  'required',
  'photos',
  'torque',
  'clearance',
  'fastening',
  'caliper_fit',
  'figures',
  'balance',
  'costs',
  'duplicate',
] as const;

const wheelCategories: readonly Category[] = ['brakes', 'wheels_tyres'];
const wheelKinds = new Set(['caliper', 'rotor', 'spacer']);

export function needsWheelRequirement(data: SwapData, category?: Category): boolean {
  if (category) return wheelCategories.includes(category);
  return data.parts.some((p) => wheelKinds.has(p.kind));
}

export type RequiredFastener = { kind: FastenerKind; because: string };

/**
 * The fasteners a record must list (each with a torque row), from what the job contains:
 * a caliper → its mounting bolts; an adapter or bracket → the bolts that hold it; a bolt-on spacer →
 * the bolts or nuts that hold it to the hub; any wheel spacer → the wheel bolts, which change length.
 */
export function requiredFasteners(data: SwapData): RequiredFastener[] {
  const list: RequiredFastener[] = [];
  if (data.calipers.length > 0 || data.parts.some((p) => p.kind === 'caliper'))
    list.push({ kind: 'caliper_mount', because: 'the record fits a caliper' });
  if (data.adapter || data.parts.some((p) => p.kind === 'adapter'))
    list.push({ kind: 'bracket_mount', because: 'the record fits an adapter or bracket' });
  if (data.spacers.some((s) => s.mounting === 'bolt_on')) list.push({ kind: 'spacer_mount', because: 'the spacers bolt on' });
  if (data.spacers.length > 0) list.push({ kind: 'wheel', because: 'a spacer changes the wheel-bolt length' });
  return list;
}

const normalPartNumber = (pn: string) => pn.toLowerCase().replace(/[^a-z0-9]/g, '');

/** Keys that identify the donor caliper(s) of a record: catalogue ids and part numbers without separators or case. */
export function donorCaliperKeys(data: SwapData): Set<string> {
  const keys = new Set<string>();
  for (const p of data.parts) {
    if (p.kind !== 'caliper') continue;
    if (p.partId) keys.add(`id:${p.partId}`);
    for (const pn of p.partNumbers) if (normalPartNumber(pn)) keys.add(`pn:${normalPartNumber(pn)}`);
  }
  return keys;
}

export function sameDonorCaliper(a: SwapData, b: SwapData): boolean {
  const keysA = donorCaliperKeys(a);
  return [...donorCaliperKeys(b)].some((k) => keysA.has(k));
}

const fmt = (mm: number) => `${Math.round(mm * 10) / 10} mm`;

function requiredCheck(input: ReviewCheckInput): CheckResult {
  const { data } = input;
  const missing: string[] = [];
  if (!data.title || data.title.trim().length < 8) missing.push('a title');
  if (data.parts.length === 0) missing.push('at least one part');
  if (needsWheelRequirement(data, input.category) && !data.wheel)
    missing.push('the wheel requirement (minimum wheel and caliper dimensions)');
  return missing.length
    ? { id: 'required', label: 'Required fields', status: 'fail', detail: `Missing: ${missing.join('; ')}.` }
    : { id: 'required', label: 'Required fields', status: 'pass', detail: 'Title, parts and wheel requirement are present.' };
}

function photosCheck(count: number): CheckResult {
  return count > 0
    ? { id: 'photos', label: 'Photos', status: 'pass', detail: `${count} photo${count === 1 ? '' : 's'} attached.` }
    : { id: 'photos', label: 'Photos', status: 'fail', detail: 'No photo yet: add at least one photo of the fitted parts.' };
}

function torqueCheck(data: SwapData): CheckResult {
  const label = 'Torque specs';
  const required = requiredFasteners(data);
  const kindsListed = new Set(data.fasteners.map((f) => f.kind));
  const missingKinds = required.filter((r) => !kindsListed.has(r.kind));
  const withTorque = new Set(data.torque.map((t) => t.fastenerId));
  const untorqued = data.fasteners.filter((f) => !withTorque.has(f.id));
  const problems = [
    ...missingKinds.map((r) => `no ${fastenerKindLabels[r.kind].toLowerCase()} listed (${r.because})`),
    ...untorqued.map((f) => `no torque value for ${f.label}`),
    ...implausibleTorques(data),
  ];
  if (problems.length > 0) return { id: 'torque', label, status: 'fail', detail: `${capitalise(problems.join('; '))}.` };
  if (data.fasteners.length === 0)
    return { id: 'torque', label, status: 'pass', detail: 'No fasteners are listed or needed, so no torque values are needed.' };
  return {
    id: 'torque',
    label,
    status: 'pass',
    detail: `Every listed fastener (${data.fasteners.length}) has a torque value within the usual range for its kind.`,
  };
}

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

function clearanceCheck(input: ReviewCheckInput): CheckResult {
  const { data } = input;
  const label = 'Wheel clearance';
  const req = data.wheel;
  if (!req) {
    return needsWheelRequirement(data, input.category)
      ? { id: 'clearance', label, status: 'fail', detail: 'No wheel requirement, so the clearance cannot be judged.' }
      : { id: 'clearance', label, status: 'pass', detail: 'No wheel requirement applies to this record.' };
  }
  const verdicts = testedWheelVerdicts(data);
  const contradictions = verdicts.filter((v) => v.contradiction);
  if (contradictions.length > 0) {
    return {
      id: 'clearance',
      label,
      status: 'fail',
      detail: `${contradictions.map((v) => `${v.label}: ${v.contradiction}`).join('; ')}. Mark it as not fitting, or correct the measurement.`,
    };
  }
  const fitting = verdicts.filter((v) => v.outcome !== 'does_not_fit');
  const measuredFits = fitting.filter((v) => v.figures.length > 0);
  const notFitting = verdicts.length - fitting.length;
  const documented =
    notFitting > 0
      ? ` It also documents ${notFitting} wheel${notFitting === 1 ? '' : 's'} that do${notFitting === 1 ? 'es' : ''} not fit.`
      : '';
  if (measuredFits.length === 0) {
    return {
      id: 'clearance',
      label,
      status: 'attention',
      detail: `No wheel that fits has a measured clearance, so the fit rests on estimates only. Ask for a measurement on the smallest wheel that fits.${documented}`,
    };
  }
  const tight = measuredFits.flatMap((v) =>
    v.figures.filter((f) => !f.ok).map((f) => `${v.label}: ${fmt(f.clearanceMm)} at the ${f.where}`),
  );
  if (tight.length > 0) {
    return {
      id: 'clearance',
      label,
      status: 'attention',
      detail: `Measured below the ${MIN_CLEARANCE_MM} mm rule of thumb (common practice, no source) on a wheel that fits: ${tight.join('; ')}. Worth a second look at how it was measured.${documented}`,
    };
  }
  const smallest = Math.min(...measuredFits.flatMap((v) => v.figures.map((f) => f.clearanceMm)));
  const belowMinimum = measuredFits.some((v) => data.wheel!.testedWheels[v.index].diameterIn < req.minDiameterIn);
  if (belowMinimum) {
    return {
      id: 'clearance',
      label,
      status: 'attention',
      detail: `A wheel smaller than the stated ${req.minDiameterIn}″ minimum is recorded as fitting: lower the minimum or correct the outcome.`,
    };
  }
  return {
    id: 'clearance',
    label,
    status: 'pass',
    detail: `Measured on ${measuredFits.length} wheel${measuredFits.length === 1 ? '' : 's'} that fit${measuredFits.length === 1 ? 's' : ''}: the least clearance is ${fmt(smallest)} (at least ${MIN_CLEARANCE_MM} mm, common practice).${documented}`,
  };
}

/**
 * The wheels the record says fit, held on the chassis' hubs with the record's wheel bolts or nuts: a seat that does not
 * match, too little thread, a bolt that bottoms out or reaches behind the hub is a failure; wheels recorded as not
 * fitting are documentation and are not held against the rules.
 */
function fasteningCheck(input: ReviewCheckInput): CheckResult {
  const label = 'Wheel fastening';
  const { data, chassis } = input;
  const touches = data.spacers.length > 0 || (data.wheel?.testedWheels.length ?? 0) > 0;
  if (!touches) return { id: 'fastening', label, status: 'pass', detail: 'No wheel or spacer in the record to fasten.' };
  if (!chassis.wheelFastening || chassis.centreBoreMm === undefined)
    return {
      id: 'fastening',
      label,
      status: 'attention',
      detail: 'The chassis has no wheel fastening on record (fastener, seat, hub thread), so the wheel bolts are not checked.',
    };
  const fastenings = testedWheelFastenings(data, input.axle, {
    wheelBoltThread: chassis.wheelBoltThread,
    centreBoreMm: chassis.centreBoreMm,
    wheelFastening: chassis.wheelFastening,
  }).filter((w) => w.outcome !== 'does_not_fit');
  const failed = fastenings.filter((w) => w.result.failures.length > 0);
  if (failed.length > 0)
    return {
      id: 'fastening',
      label,
      status: 'fail',
      detail: `${failed.map((w) => `${w.label}: ${w.result.failures.join(', ')}`).join('; ')}. Fit fasteners that match, or correct the outcome.`,
    };
  const engaged = fastenings.filter((w) => w.result.engagement !== null);
  if (data.spacers.some((s) => s.axle === input.axle) && engaged.length === 0)
    return {
      id: 'fastening',
      label,
      status: 'attention',
      detail:
        'A spacer changes the wheel-bolt length, but no fitting wheel has its thickness at the bolt recorded, so the thread engagement is not worked out. Ask for it.',
    };
  const seated = fastenings.filter((w) => w.result.checks.some((c) => c.id === 'seat'));
  const least = engaged.length ? Math.min(...engaged.map((w) => w.result.engagement!.engagementMm)) : null;
  return {
    id: 'fastening',
    label,
    status: 'pass',
    detail: [
      seated.length ? `Seats match on ${seated.length} wheel${seated.length === 1 ? '' : 's'}.` : 'No wheel seat stated.',
      least !== null
        ? `Least thread engagement ${fmt(least)}, within the rule.`
        : 'Thread engagement not worked out (no wheel thickness at the bolt).',
    ].join(' '),
  };
}

/**
 * Each caliper on the rotor the record gives its axle: a pad that overhangs the rotor edge or runs below the friction
 * ring, a rotor outside the caliper's thickness range, or a caliper left off the ring's centre is a failure.
 */
function caliperFitCheck(input: ReviewCheckInput): CheckResult {
  const label = 'Caliper on the rotor';
  const fits = caliperFitsFor(input.data, input.axle);
  if (fits.length === 0) return { id: 'caliper_fit', label, status: 'pass', detail: 'No caliper in the record.' };
  const failed = fits.flatMap((f) =>
    (f.fit?.checks ?? []).filter((c) => c.ok === false).map((c) => `${f.label}: ${c.label.toLowerCase()} (${c.rule})`),
  );
  if (failed.length > 0)
    return { id: 'caliper_fit', label, status: 'fail', detail: `${failed.join('; ')}. Correct the figures or the parts.` };
  const refused = fits.filter((f) => f.error);
  if (refused.length > 0)
    return { id: 'caliper_fit', label, status: 'attention', detail: refused.map((f) => `${f.label}: ${f.error}`).join('; ') };
  const unchecked = fits.filter((f) => !f.fit);
  if (unchecked.length > 0)
    return {
      id: 'caliper_fit',
      label,
      status: 'attention',
      detail: `Not worked out for ${unchecked.map((f) => `${f.label} (needs ${f.missing.join(', ')})`).join('; ')}. Ask for the figures.`,
    };
  const overhang = fits.map((f) => f.fit!.checks.find((c) => c.id === 'pad-overhang')!.marginMm!);
  return {
    id: 'caliper_fit',
    label,
    status: 'pass',
    detail: `Pad edge ${fmt(Math.min(...overhang))} inside the rotor edge at the least${fits.some((f) => f.fit!.checks.some((c) => c.id === 'axial-centring')) ? '; centred on the friction ring' : ''}.`,
  };
}

/** The record's figures agree with each other: rotors and calipers with the brake figures of their axle, shims with the mounting. */
function figuresCheck(data: SwapData): CheckResult {
  const label = 'Figures agree';
  const problems: string[] = [];
  for (const axle of axles) {
    const corner = data.brakes?.after[axle];
    for (const r of rotorsOn(data, axle)) {
      if (corner?.kind === 'disc' && Math.abs(corner.rotorDiameterMm - r.diameterMm) > 0.5)
        problems.push(
          `the ${axle} rotor is ${fmt(r.diameterMm)} but the ${axle} brake figures say ${fmt(corner.rotorDiameterMm)}`,
        );
      if (corner?.kind === 'drum') problems.push(`a ${axle} rotor is listed but the ${axle} brake figures describe a drum`);
    }
    for (const c of calipersOn(data, axle)) {
      if (corner?.kind === 'disc') {
        const perSide = pistonsPerSideOf(c);
        const areaOf = (ds: number[]) => ds.reduce((a, d) => a + (Math.PI * d * d) / 4, 0);
        if (Math.abs(areaOf(perSide) - areaOf(corner.pistonsPerSideMm)) > 1)
          problems.push(
            `the ${axle} caliper's pistons (${perSide.join(' + ')} mm per side) differ from the ${axle} brake figures (${corner.pistonsPerSideMm.join(' + ')} mm)`,
          );
      }
      if (c.bleedScrewWhenFitted === 'bottom')
        problems.push(
          `the ${c.name} has its bleed screw at the bottom as fitted (left and right swapped?): air cannot be bled out`,
        );
      const { thicknessMinMm: lo, thicknessMaxMm: hi } = c.designRotor;
      for (const r of rotorsOn(data, axle)) {
        if ((lo !== undefined && r.thicknessMm < lo) || (hi !== undefined && r.thicknessMm > hi))
          problems.push(
            `the ${fmt(r.thicknessMm)} rotor is outside the ${c.name}'s designed range (${lo ?? '?'}–${hi ?? '?'} mm)`,
          );
      }
      const ownJoint = data.shims.filter((s) => s.joint === 'caliper_to_bracket');
      const wrongWay = ownJoint.filter((s) => s.direction !== (c.mount.type === 'radial' ? 'radial' : 'axial'));
      if (wrongWay.length > 0)
        problems.push(
          `shims between the caliper and the bracket of a ${c.mount.type}-mount caliper move it ${c.mount.type === 'radial' ? 'radially' : 'axially'}, not ${wrongWay[0].direction}ly`,
        );
    }
  }
  const centring = centringProblem(data);
  if (centring) problems.push(centring);
  if (problems.length > 0) return { id: 'figures', label, status: 'fail', detail: `${capitalise(problems.join('; '))}.` };
  return { id: 'figures', label, status: 'pass', detail: 'Rotors, calipers, shims and brake figures agree with each other.' };
}

/** tolerance of a feeler-gauge measurement of the centring gap (common practice, no source) */
export const CENTRING_TOLERANCE_MM = 0.1;

function centringProblem(data: SwapData): string | null {
  const c = data.centring;
  if (!c || c.gapMm === 0) return null;
  const atJoint = data.shims.filter((s) => s.joint === c.joint);
  const axial = atJoint.filter((s) => s.direction === 'axial');
  if (axial.length === 0) {
    return atJoint.length > 0
      ? `the shims at the centring joint are radial: they lift the caliper, they cannot centre it over the rotor`
      : `a ${fmt(c.gapMm)} centring gap is measured but no shims are listed at that joint`;
  }
  const perPosition = axial.reduce((sum, s) => sum + s.thicknessMm * s.quantity, 0) / c.positions;
  if (Math.abs(perPosition - c.gapMm) > CENTRING_TOLERANCE_MM)
    return `the centring shims add up to ${fmt(perPosition)} per bolt, but the measured gap is ${fmt(c.gapMm)}`;
  return null;
}

function balanceCheck(input: ReviewCheckInput): CheckResult {
  const label = 'Brake balance';
  const balance = brakeBalanceOf(input.data, input.chassis.figures ?? null);
  if (!balance) {
    return input.category === 'brakes'
      ? {
          id: 'balance',
          label,
          status: 'attention',
          detail: 'No brake figures before and after, so the change in front share is unknown.',
        }
      : { id: 'balance', label, status: 'pass', detail: 'No brake figures are needed for this record.' };
  }
  const { shift } = balance;
  const status = shift.severity === 'none' ? 'pass' : 'attention';
  const prefix = shift.severity === 'hazard' ? 'Hazard: ' : '';
  const basis = balance.figures ? ` (Worked out with ${balance.figures.label}.)` : '';
  return {
    id: 'balance',
    label,
    status,
    detail: `${prefix}${shift.headline} ${shift.severity === 'none' ? '' : shift.risk}${basis}`.replace(/\s+/g, ' ').trim(),
  };
}

function costsCheck(data: SwapData): CheckResult {
  const routes = new Set(data.costs.map((c) => c.route));
  if (routes.size === 0)
    return { id: 'costs', label: 'Costs', status: 'fail', detail: 'No cost lines: give the costs for at least one route.' };
  // both read item names, so they ask for a closer look rather than declare the costs wrong
  const doubts = [routesMissingCalipers(data), ...savingsFromOneSidedLabour(data)].filter((d): d is string => d !== null);
  if (doubts.length > 0) return { id: 'costs', label: 'Costs', status: 'attention', detail: `${capitalise(doubts.join('; '))}.` };
  return {
    id: 'costs',
    label: 'Costs',
    status: 'pass',
    detail: `Costs given for ${routes.size} route${routes.size === 1 ? '' : 's'}${routes.size > 1 ? ', compared like for like' : ''}.`,
  };
}

function duplicateCheck(duplicates: ReviewCheckInput['duplicates']): CheckResult {
  if (duplicates.length === 0)
    return {
      id: 'duplicate',
      label: 'Likely duplicate',
      status: 'pass',
      detail: 'No published swap with the same chassis, axle and donor caliper.',
    };
  return {
    id: 'duplicate',
    label: 'Likely duplicate',
    status: 'attention',
    detail: `Same chassis, axle and donor caliper as: ${duplicates.map((d) => d.title).join('; ')}.`,
    link: `/swaps/${duplicates[0].slug}`,
  };
}

export function automaticChecks(input: ReviewCheckInput): CheckResult[] {
  return [
    requiredCheck(input),
    photosCheck(input.photoCount),
    torqueCheck(input.data),
    clearanceCheck(input),
    fasteningCheck(input),
    caliperFitCheck(input),
    figuresCheck(input.data),
    balanceCheck(input),
    costsCheck(input.data),
    duplicateCheck(input.duplicates),
  ];
}
