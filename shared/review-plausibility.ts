import type { CostLine, Fastener, FastenerKind, SwapData } from './schemas/swap-data';
import { costRouteLabels, type CostRoute } from './schemas/enums';
import { fastenerKindLabels } from './schemas/swap-data-labels';
import { parseThread, threadBasics, unifiedThreadBasics } from './fitment/threads';
import { routeTotals } from './fitment/costs';
import { FitmentInputError } from './fitment/errors';

// Whether a record's figures are believable, not only present: the review checks add these problems to the torque
// and cost checks, each with the reason a moderator can repeat to the author.

export type PlausibleTorque = { minNm: number; maxNm: number };

export const TORQUE_RANGE_BASIS =
  'usual for passenger cars and light vans (common practice, no source); the maker’s figure for the exact part decides';

/** Tightening torques seen on passenger cars per kind of fastener (common practice, no source). */
export const plausibleTorque: Record<FastenerKind, PlausibleTorque> = {
  wheel: { minNm: 60, maxNm: 200 },
  spacer_mount: { minNm: 40, maxNm: 200 },
  caliper_mount: { minNm: 20, maxNm: 250 },
  bracket_mount: { minNm: 40, maxNm: 300 },
  guide_pin: { minNm: 15, maxNm: 60 },
  banjo: { minNm: 10, maxNm: 50 },
  bleed_screw: { minNm: 3, maxNm: 20 },
  rotor_screw: { minNm: 3, maxNm: 25 },
  suspension: { minNm: 10, maxNm: 500 },
  other: { minNm: 1, maxNm: 600 },
};

/**
 * ISO 898-1 proof stress by property class, MPa (from memory); 8.8 is 580 up to 16 mm and 600 above. A bolt with no
 * class stated is taken as 12.9, the strongest common class, so the ceiling never flags a figure a stronger bolt takes.
 */
const PROOF_STRESS_MPA: Record<string, number> = {
  '4.6': 225,
  '4.8': 310,
  '5.6': 280,
  '5.8': 380,
  '6.8': 440,
  '8.8': 580,
  '9.8': 650,
  '10.9': 830,
  '12.9': 970,
};
/** the highest nut factor in the usual handbook table (dry, unplated steel): the most torque a given preload takes (from memory) */
export const NUT_FACTOR_CEILING = 0.3;
export const PROOF_TORQUE_BASIS =
  'T = K·F·d with the bolt at its proof load (ISO 898-1 stress area and proof stress, from memory) and K = 0.3, the highest nut factor for dry unplated steel (from memory)';

/** The torque that takes this fastener to its proof load, dry and unplated; null when the thread cannot be read. */
export function proofLoadTorqueNm(fastener: Pick<Fastener, 'thread' | 'propertyClass'>): { nm: number; label: string } | null {
  if (!fastener.thread) return null;
  let thread;
  try {
    thread = parseThread(fastener.thread);
  } catch (err) {
    if (err instanceof FitmentInputError) return null;
    throw err;
  }
  const stressArea =
    thread.system === 'unified' && thread.tpi
      ? unifiedThreadBasics(thread.diameterMm / 25.4, thread.tpi).stressAreaIn2 * 645.16
      : threadBasics(thread.diameterMm, thread.pitchMm).stressAreaMm2;
  const stated = fastener.propertyClass.trim();
  const known = PROOF_STRESS_MPA[stated];
  const cls = known ? stated : '12.9';
  const proofMpa = cls === '8.8' && thread.diameterMm > 16 ? 600 : PROOF_STRESS_MPA[cls]!;
  // mm² × N/mm² × mm = N·mm
  const nm = (NUT_FACTOR_CEILING * stressArea * proofMpa * thread.diameterMm) / 1000;
  return { nm, label: `${thread.label} class ${cls}${known ? '' : ' (no class stated, the strongest assumed)'}` };
}

const round = (nm: number) => (nm >= 20 ? Math.round(nm) : Math.round(nm * 10) / 10);

/** Torque figures no fastener of its kind takes, or that would take the bolt past its proof load; one sentence each. */
export function implausibleTorques(data: Pick<SwapData, 'fasteners' | 'torque'>): string[] {
  const problems: string[] = [];
  for (const spec of data.torque) {
    const fastener = data.fasteners.find((f) => f.id === spec.fastenerId);
    if (!fastener) continue;
    const range = plausibleTorque[fastener.kind];
    const kind = fastenerKindLabels[fastener.kind].toLowerCase();
    if (spec.nm < range.minNm || spec.nm > range.maxNm)
      problems.push(
        `${spec.nm} N·m for ${fastener.label} is outside ${range.minNm}–${range.maxNm} N·m, the range for ${kind} ${TORQUE_RANGE_BASIS}; check the figure and its unit`,
      );
    const ceiling = proofLoadTorqueNm(fastener);
    if (ceiling && spec.nm > ceiling.nm)
      problems.push(
        `${spec.nm} N·m would take ${fastener.label} (${ceiling.label}) past its proof load at about ${round(ceiling.nm)} N·m (${PROOF_TORQUE_BASIS})`,
      );
  }
  return problems;
}

// ---------- costs ----------

const CALIPER_WORDS = /\bcall?ipers?\b/i;
/** a line for the whole kit covers its calipers */
const WHOLE_KIT_WORDS = /\b(complete|full|whole|brake)\s+(kit|set)\b/i;
/** words that mark a cost line as paid work rather than parts (common practice, no source) */
const LABOUR_WORDS =
  /\b(labou?r|workshop time|mechanic|garage (fee|charge|time)|(fitting|install(ation)?) (fee|charge|cost|time)|fitted by|\d+(\.\d+)?\s*(h|hrs?|hours?))\b/i;

export const isLabourLine = (line: Pick<CostLine, 'item'>) => LABOUR_WORDS.test(line.item);

function isCaliperLine(data: SwapData, line: CostLine): boolean {
  if (CALIPER_WORDS.test(line.item) || WHOLE_KIT_WORDS.test(line.item)) return true;
  const item = line.item.toLowerCase().replace(/[^a-z0-9]/g, '');
  return data.parts.some(
    (p) =>
      p.kind === 'caliper' &&
      p.partNumbers.some((pn) => pn.length > 2 && item.includes(pn.toLowerCase().replace(/[^a-z0-9]/g, ''))),
  );
}

const routesOf = (data: SwapData): CostRoute[] => [...new Set(data.costs.map((c) => c.route))];
const money = (minor: number, currency: string) => `${currency} ${(minor / 100).toFixed(2)}`;

/**
 * The record fits calipers and prices several routes, but only some routes hold a line for them: the others'
 * totals leave the calipers out and look cheaper than they are.
 */
export function routesMissingCalipers(data: SwapData): string | null {
  const fitsCalipers = data.calipers.length > 0 || data.parts.some((p) => p.kind === 'caliper');
  const routes = routesOf(data);
  if (!fitsCalipers || routes.length < 2) return null;
  const withCalipers = routes.filter((r) => data.costs.some((c) => c.route === r && isCaliperLine(data, c)));
  const without = routes.filter((r) => !withCalipers.includes(r));
  if (withCalipers.length === 0 || without.length === 0) return null;
  const names = (rs: CostRoute[]) => rs.map((r) => costRouteLabels[r].toLowerCase()).join(' and ');
  return `only ${names(withCalipers)} ${withCalipers.length === 1 ? 'has' : 'have'} a line for the calipers; ${names(without)} ${without.length === 1 ? 'leaves' : 'leave'} them out, so ${without.length === 1 ? 'its total reads' : 'their totals read'} cheaper than the job is`;
}

/**
 * A route that reads cheaper than the new kit, where the new kit counts labour and the route counts none: part of
 * the saving is labour counted on one side only.
 */
export function savingsFromOneSidedLabour(data: SwapData): string[] {
  const labour = (route: CostRoute) =>
    data.costs.filter((c) => c.route === route && isLabourLine(c)).reduce((sum, c) => sum + c.amountMinor, 0);
  const totals = routeTotals(data.costs);
  const kit = totals.new_kit;
  const kitLabour = labour('new_kit');
  if (kit === null || kitLabour === 0) return [];
  const problems: string[] = [];
  for (const route of ['as_built', 'budget'] as const) {
    const total = totals[route];
    if (total === null || labour(route) > 0 || total >= kit) continue;
    const saving = kit - total;
    const without = saving - kitLabour;
    problems.push(
      `${costRouteLabels[route]} reads ${money(saving, data.currency)} cheaper than the new kit, but the new kit counts ${money(kitLabour, data.currency)} of labour and ${costRouteLabels[route].toLowerCase()} none; ${without > 0 ? `like for like the saving is ${money(without, data.currency)}` : 'like for like there is no saving'}. Count labour on both sides or on neither`,
    );
  }
  return problems;
}
