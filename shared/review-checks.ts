import type { SwapData } from './schemas/swap-data';
import type { Axle, Category } from './schemas/enums';
import type { CheckResult } from './schemas/submissions';
import { brakeBalanceOf, checkWheelForSwap, rotorDiameterOf, BALANCE_ATTENTION_POINTS } from './fitment/swap-checks';
import { MIN_CLEARANCE_MM } from './fitment/clearance';

// The automatic checks the review desk shows for a revision. The submission form runs the same
// function, so a member sees what the reviewer will see before sending it.

export type ReviewCheckInput = {
  data: SwapData;
  body: string;
  photoCount: number;
  chassis: { wheelBoltThread: string };
  axle: Axle;
  /** when absent, a wheel requirement is expected whenever a caliper, rotor or spacer is listed */
  category?: Category;
  /** approved swaps on the same chassis and axle with the same donor caliper (see donorCaliperKeys) */
  duplicates: { slug: string; title: string }[];
};

export const checkIds = ['required', 'photos', 'torque', 'clearance', 'balance', 'costs', 'duplicate'] as const;

const wheelCategories: readonly Category[] = ['brakes', 'wheels_tyres'];
const wheelKinds = new Set(['caliper', 'rotor', 'spacer']);

export function needsWheelRequirement(data: SwapData, category?: Category): boolean {
  if (category) return wheelCategories.includes(category);
  return data.parts.some((p) => wheelKinds.has(p.kind));
}

/** Words that name what kind of fastener something is, not which one; they never make a match on their own. */
const genericWords = new Set([
  'bolt',
  'bolts',
  'screw',
  'screws',
  'stud',
  'studs',
  'nut',
  'nuts',
  'washer',
  'washers',
  'hardware',
  'fastener',
  'fasteners',
  'included',
  'with',
  'long',
  'short',
  'grade',
  'zinc',
  'steel',
  'plated',
  'kit',
  'set',
  'pair',
  'pack',
  'each',
  'front',
  'rear',
  'left',
  'right',
  'side',
  'new',
  'used',
  'from',
  'into',
  'onto',
  'the',
  'and',
  'for',
]);

function keyWords(text: string): Set<string> {
  const lower = text.toLowerCase();
  const words = new Set<string>();
  for (const thread of lower.match(/\bm\d{1,2}\b/g) ?? []) words.add(thread);
  for (const w of lower.split(/[^a-z]+/)) if (w.length >= 4 && !genericWords.has(w)) words.add(w);
  return words;
}

export type Fastener = { label: string; matches: (torqueRow: string) => boolean; rule: string };

/**
 * The fasteners a record lists, each with the rule its torque row must meet:
 * - a part of kind `caliper` → a torque row naming "caliper";
 * - a part of kind `adapter`, or the record's adapter → a row naming "adapter" or "bracket";
 * - a bolt-on wheel spacer → a row naming "spacer";
 * - a part of kind `hardware` and every item of the adapter's included hardware → a row sharing a key word
 *   with it: a metric thread size (M10, M12) or a word of four letters or more that is not a generic
 *   fastener word (bolt, screw, stud, nut, washer, …).
 */
export function fastenersOf(data: SwapData): Fastener[] {
  const naming =
    (...words: string[]) =>
    (row: string) =>
      words.some((w) => new RegExp(`\\b${w}`, 'i').test(row));
  const sharing = (item: string) => {
    const keys = keyWords(item);
    return (row: string) => [...keyWords(row)].some((w) => keys.has(w));
  };
  const list: Fastener[] = [];
  for (const p of data.parts) {
    if (p.kind === 'caliper')
      list.push({ label: `${p.name} (mounting bolts)`, matches: naming('caliper'), rule: 'a torque row naming the caliper' });
    if (p.kind === 'adapter')
      list.push({ label: p.name, matches: naming('adapter', 'bracket'), rule: 'a torque row naming the adapter or bracket' });
    if (p.kind === 'hardware') list.push({ label: p.name, matches: sharing(p.name), rule: 'a torque row naming this hardware' });
  }
  if (data.adapter && !data.parts.some((p) => p.kind === 'adapter')) {
    list.push({
      label: data.adapter.name,
      matches: naming('adapter', 'bracket'),
      rule: 'a torque row naming the adapter or bracket',
    });
  }
  for (const item of data.adapter?.hardwareIncluded ?? []) {
    list.push({ label: item, matches: sharing(item), rule: 'a torque row naming this hardware' });
  }
  if (data.spacers.some((s) => s.mounting === 'bolt_on')) {
    list.push({ label: 'Bolt-on wheel spacers', matches: naming('spacer'), rule: 'a torque row naming the spacers' });
  }
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
  const fasteners = fastenersOf(data);
  const label = 'Torque specs';
  if (fasteners.length === 0)
    return { id: 'torque', label, status: 'pass', detail: 'No fasteners are listed, so no torque values are needed.' };
  const missing = fasteners.filter((f) => !data.torque.some((t) => f.matches(t.fastener)));
  if (missing.length === 0)
    return { id: 'torque', label, status: 'pass', detail: `Every listed fastener (${fasteners.length}) has a torque value.` };
  return {
    id: 'torque',
    label,
    status: 'fail',
    detail: `No torque value for: ${missing.map((f) => `${f.label} (needs ${f.rule})`).join('; ')}.`,
  };
}

function clearanceCheck(input: ReviewCheckInput): CheckResult {
  const { data, axle } = input;
  const label = 'Wheel clearance';
  const req = data.wheel;
  if (!req) {
    return needsWheelRequirement(data, input.category)
      ? { id: 'clearance', label, status: 'fail', detail: 'No wheel requirement, so the clearance cannot be computed.' }
      : { id: 'clearance', label, status: 'pass', detail: 'No wheel requirement applies to this record.' };
  }
  if (!rotorDiameterOf(data, axle)) {
    return {
      id: 'clearance',
      label,
      status: 'attention',
      detail: 'No rotor diameter (rotors or brake figures), so the radial clearance cannot be computed.',
    };
  }
  // the record's own smallest wheel: its smallest tested wheel, or a wheel of the stated minimum diameter
  const tested = [...req.testedWheels].sort((a, b) => a.diameterIn - b.diameterIn)[0];
  const wheel = tested ?? { diameterIn: req.minDiameterIn, widthIn: 7, offsetMm: 35, spacerMm: 0 };
  const check = checkWheelForSwap(data, axle, input.chassis.wheelBoltThread, { ...wheel, spacerMm: wheel.spacerMm ?? 0 });
  const computed = check.radial!;
  const measured = req.testedWheels.filter((t) => t.radialClearanceMm !== undefined && t.radialClearanceMm < MIN_CLEARANCE_MM);
  const spokeMeasured = req.testedWheels.filter((t) => t.spokeClearanceMm !== undefined && t.spokeClearanceMm < MIN_CLEARANCE_MM);
  const where = `${wheel.diameterIn}″ wheel`;
  if (!computed.ok) {
    return {
      id: 'clearance',
      label,
      status: 'fail',
      detail: `Computed caliper-to-barrel clearance on the ${where} is ${fmt(computed.clearanceMm)}, below the ${MIN_CLEARANCE_MM} mm minimum (${computed.basisNote})`,
    };
  }
  if (measured.length || spokeMeasured.length) {
    const worst = [
      ...measured.map((t) => `${t.diameterIn}″ barrel ${fmt(t.radialClearanceMm!)}`),
      ...spokeMeasured.map((t) => `${t.diameterIn}″ spokes ${fmt(t.spokeClearanceMm!)}`),
    ];
    return {
      id: 'clearance',
      label,
      status: 'fail',
      detail: `Measured clearance below ${MIN_CLEARANCE_MM} mm: ${worst.join(', ')}.`,
    };
  }
  return {
    id: 'clearance',
    label,
    status: 'pass',
    detail: `Computed caliper-to-barrel clearance on the ${where} is ${fmt(computed.clearanceMm)} (at least ${MIN_CLEARANCE_MM} mm).`,
  };
}

function balanceCheck(input: ReviewCheckInput): CheckResult {
  const label = 'Brake balance';
  const balance = brakeBalanceOf(input.data);
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
  const share = (x: number) => `${Math.round(x * 1000) / 10} %`;
  const shift = Math.round(balance.shiftPoints * 10) / 10;
  const detail = `Front share ${share(balance.frontShareBefore)} → ${share(balance.frontShareAfter)} (${shift > 0 ? '+' : ''}${shift} points).`;
  return balance.attention
    ? { id: 'balance', label, status: 'attention', detail: `${detail} It moves more than ${BALANCE_ATTENTION_POINTS} points.` }
    : { id: 'balance', label, status: 'pass', detail };
}

function costsCheck(data: SwapData): CheckResult {
  const routes = new Set(data.costs.map((c) => c.route));
  return routes.size > 0
    ? {
        id: 'costs',
        label: 'Costs',
        status: 'pass',
        detail: `Costs given for ${routes.size} route${routes.size === 1 ? '' : 's'}.`,
      }
    : { id: 'costs', label: 'Costs', status: 'fail', detail: 'No cost lines: give the costs for at least one route.' };
}

function duplicateCheck(duplicates: ReviewCheckInput['duplicates']): CheckResult {
  if (duplicates.length === 0)
    return {
      id: 'duplicate',
      label: 'Likely duplicate',
      status: 'pass',
      detail: 'No approved swap with the same chassis, axle and donor caliper.',
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
    balanceCheck(input),
    costsCheck(input.data),
    duplicateCheck(input.duplicates),
  ];
}
