import { FitmentInputError, requireNonNegative, requirePositive } from './errors';
import { MM_PER_IN } from './units';

export type HubMaterial = 'steel' | 'aluminium';
export type ThreadSystem = 'metric' | 'unified';
/** a blind hole ends in metal (a bolt that reaches its bottom clamps nothing); a through hole opens behind the hub */
export type HoleKind = 'blind' | 'through';

export interface ParsedThread {
  system: ThreadSystem;
  diameterMm: number;
  pitchMm: number;
  /** threads per inch, unified threads only */
  tpi?: number;
  /** normalised designation, e.g. "M12×1.5" or "1/2-20 UNF" */
  label: string;
}

export interface ThreadEngagementInput {
  diameterMm: number;
  pitchMm: number;
  boltLengthMm: number;
  /** everything between the bolt's seat and the hub threads: wheel centre, spacer */
  clampedMm: number;
  hubMaterial: HubMaterial;
  /** usable thread depth of the hub (or nut); engagement cannot exceed it */
  hubThreadDepthMm?: number;
  hole?: HoleKind;
}

export interface ThreadEngagement {
  engagementMm: number;
  turns: number;
  requiredMm: number;
  marginMm: number;
  ok: boolean;
  rule: string;
  /** how far the bolt reaches beyond the clamped stack */
  reachMm: number;
  /** what ends the engagement: the bolt's own length or the depth of thread it screws into */
  limitedBy: 'bolt' | 'hub_thread';
  /** the bolt reaches the bottom of a blind hole before the joint is tight: it clamps nothing */
  bottomsOut: boolean;
}

export interface ThreadBasics {
  pitchDiameterMm: number;
  minorDiameterMm: number;
  stressAreaMm2: number;
  tapDrillMm: number;
}

export interface UnifiedThreadBasics {
  pitchDiameterIn: number;
  stressAreaIn2: number;
}

export const ENGAGEMENT_FACTOR: Record<HubMaterial, number> = { steel: 1.0, aluminium: 1.5 };

export const ENGAGEMENT_RULES: Record<HubMaterial, string> = {
  steel: 'Thread engagement at least 1.0 × bolt diameter in a steel hub (common practice)',
  aluminium: 'Thread engagement at least 1.5 × bolt diameter in an aluminium hub (common practice)',
};

export const BOTTOMING_RULE =
  'A bolt must stop short of the bottom of a blind hole; one that reaches it clamps nothing (plane geometry)';

// ISO 724 basic profile with H = (√3/2)·P: d₂ = d − ¾H, d₁ = d − 1¼H; ISO 898-1 stress diameter (d₂ + d₃)/2, d₃ = d₁ − H/6.
const SQRT3 = Math.sqrt(3);
const PITCH_DIAMETER_K = (3 * SQRT3) / 8; // 0.649519
const MINOR_DIAMETER_K = (5 * SQRT3) / 8; // 1.082532
const STRESS_DIAMETER_K = (13 * SQRT3) / 24; // 0.938194

// ASME B1.1 prints the unified formulas with these rounded coefficients; the standard's tables are computed from them.
const ASME_PITCH_DIAMETER_K = 0.649519;
const ASME_STRESS_K = 0.9743;
const ASME_QUARTER_PI = 0.7854;

const EPSILON = 1e-9;

function checkedThread(diameterMm: number, pitchMm: number): { d: number; p: number } {
  const d = requirePositive(diameterMm, 'diameterMm');
  const p = requirePositive(pitchMm, 'pitchMm');
  if (d - MINOR_DIAMETER_K * p <= 0) {
    throw new FitmentInputError('pitchMm', `A ${p} mm pitch is too coarse for a ${d} mm thread`);
  }
  return { d, p };
}

export function threadBasics(diameterMm: number, pitchMm: number): ThreadBasics {
  const { d, p } = checkedThread(diameterMm, pitchMm);
  const stressDiameter = d - STRESS_DIAMETER_K * p;
  return {
    pitchDiameterMm: d - PITCH_DIAMETER_K * p,
    minorDiameterMm: d - MINOR_DIAMETER_K * p,
    stressAreaMm2: (Math.PI / 4) * stressDiameter * stressDiameter,
    tapDrillMm: d - p,
  };
}

/** ASME B1.1 basic pitch diameter E = D − 0.649519/n and tensile stress area A_s = 0.7854 (D − 0.9743/n)², D in inches. */
export function unifiedThreadBasics(diameterIn: number, tpi: number): UnifiedThreadBasics {
  const d = requirePositive(diameterIn, 'diameterIn');
  const n = requirePositive(tpi, 'tpi');
  if (d - MINOR_DIAMETER_K / n <= 0) {
    throw new FitmentInputError('tpi', `${n} threads per inch is too coarse for a ${d} in thread`);
  }
  const stressDiameter = d - ASME_STRESS_K / n;
  return {
    pitchDiameterIn: d - ASME_PITCH_DIAMETER_K / n,
    stressAreaIn2: ASME_QUARTER_PI * stressDiameter * stressDiameter,
  };
}

// ---- designations ----------------------------------------------------------------------------

const NUMBER = String.raw`\d+(?:[.,]\d+)?`;
const METRIC_THREAD = new RegExp(String.raw`^M\s*(${NUMBER})\s*[X×*]\s*(${NUMBER})(?:\s*-\s*\d[GH])?$`);
// 1/2-20 UNF, 7/16-20, 9/16"-18 UNF-2A, 1 1/8-12 UNF, 1-1/8-12, 0,5-20
const UNIFIED_THREAD = new RegExp(
  String.raw`^(\d+(?:[ -]\d+\/\d+)?|\d+\/\d+|${NUMBER})\s*(?:"|″|IN)?\s*-\s*(\d+)(?:\s*(UNC|UNF|UNEF|UNS|UN))?(?:\s*-?\s*[123][AB])?$`,
);

type UnifiedSeries = 'UNC' | 'UNF' | 'UNEF';

// ASME B1.1 standard series for the sizes found on cars (1/4 to 1 in): threads per inch by nominal size.
const UNIFIED_SERIES: Record<string, Record<UnifiedSeries, number>> = {
  '1/4': { UNC: 20, UNF: 28, UNEF: 32 },
  '5/16': { UNC: 18, UNF: 24, UNEF: 32 },
  '3/8': { UNC: 16, UNF: 24, UNEF: 32 },
  '7/16': { UNC: 14, UNF: 20, UNEF: 28 },
  '1/2': { UNC: 13, UNF: 20, UNEF: 28 },
  '9/16': { UNC: 12, UNF: 18, UNEF: 24 },
  '5/8': { UNC: 11, UNF: 18, UNEF: 24 },
  '3/4': { UNC: 10, UNF: 16, UNEF: 20 },
  '7/8': { UNC: 9, UNF: 14, UNEF: 20 },
  '1': { UNC: 8, UNF: 12, UNEF: 20 },
};

function threadError(text: unknown, why: string): FitmentInputError {
  return new FitmentInputError('thread', `"${String(text)}" ${why}`);
}

function number(text: string): number {
  return Number(text.replace(',', '.'));
}

/** "1/2" → 0.5, "1 1/8" or "1-1/8" → 1.125, "0,5" → 0.5 */
function inches(text: string): number {
  const mixed = /^(\d+)[ -](\d+)\/(\d+)$/.exec(text);
  if (mixed) return Number(mixed[1]) + Number(mixed[2]) / Number(mixed[3]);
  const fraction = /^(\d+)\/(\d+)$/.exec(text);
  if (fraction) return Number(fraction[1]) / Number(fraction[2]);
  return number(text);
}

function sizeName(diameterIn: number): string | null {
  for (const name of Object.keys(UNIFIED_SERIES)) {
    if (Math.abs(inches(name) - diameterIn) < EPSILON) return name;
  }
  return null;
}

function withThreadField<T>(text: unknown, compute: () => T): T {
  try {
    return compute();
  } catch (error) {
    if (error instanceof FitmentInputError) throw threadError(text, `is not a usable thread: ${error.message}`);
    throw error;
  }
}

function parseUnified(text: string, original: unknown): ParsedThread | null {
  const match = UNIFIED_THREAD.exec(text);
  if (!match) return null;
  const diameterIn = inches(match[1]);
  const tpi = Number(match[2]);
  const given = match[3] as UnifiedSeries | 'UNS' | 'UN' | undefined;
  if (!Number.isFinite(diameterIn) || diameterIn <= 0) throw threadError(original, 'has no usable diameter');
  if (!Number.isSafeInteger(tpi) || tpi < 2 || tpi > 80) throw threadError(original, 'needs 2 to 80 threads per inch');
  withThreadField(original, () => unifiedThreadBasics(diameterIn, tpi));

  const size = sizeName(diameterIn);
  const series = size
    ? (Object.keys(UNIFIED_SERIES[size]) as UnifiedSeries[]).find((s) => UNIFIED_SERIES[size][s] === tpi)
    : undefined;
  if (given && given !== 'UN' && given !== 'UNS' && given !== series) {
    const expected = size ? UNIFIED_SERIES[size][given] : undefined;
    throw threadError(
      original,
      expected ? `is not ${given}: ${size}-${expected} is (ASME B1.1)` : `is not a standard ${given} size (ASME B1.1)`,
    );
  }
  const shownSize = size ?? String(Number(diameterIn.toFixed(4)));
  const label = `${shownSize}-${tpi}${series ? ` ${series}` : given ? ` ${given}` : ''}`;
  return { system: 'unified', diameterMm: diameterIn * MM_PER_IN, pitchMm: MM_PER_IN / tpi, tpi, label };
}

function parseMetric(text: string, original: unknown): ParsedThread | null {
  const match = METRIC_THREAD.exec(text);
  if (!match) return null;
  const diameterMm = number(match[1]);
  const pitchMm = number(match[2]);
  withThreadField(original, () => checkedThread(diameterMm, pitchMm));
  return { system: 'metric', diameterMm, pitchMm, label: `M${diameterMm}×${pitchMm}` };
}

/**
 * A metric (ISO 724, `M12x1.5`, `M14 × 1.25`) or unified (ASME B1.1, `1/2-20 UNF`, `7/16-20`) thread designation;
 * decimal commas are accepted. Anything else is a FitmentInputError on field "thread".
 */
export function parseThread(text: string): ParsedThread {
  const normalized = typeof text === 'string' ? text.trim().replace(/\s+/g, ' ').toUpperCase() : '';
  if (normalized === '') throw new FitmentInputError('thread', 'Give a thread like M12x1.5 or 1/2-20 UNF');
  const parsed = parseMetric(normalized, text) ?? parseUnified(normalized, text);
  if (!parsed) {
    throw threadError(
      text,
      'is not a thread like M12x1.5 (metric, with its pitch) or 1/2-20 UNF (unified, with threads per inch)',
    );
  }
  return parsed;
}

/** Metric only, kept for callers that store metric designations. */
export function parseMetricThread(designation: string): { diameterMm: number; pitchMm: number } {
  const text = typeof designation === 'string' ? designation.trim().toUpperCase() : '';
  const parsed = parseMetric(text, designation);
  if (!parsed) {
    throw new FitmentInputError('thread', `"${String(designation)}" is not a metric thread like M12x1.5 (give the pitch)`);
  }
  return { diameterMm: parsed.diameterMm, pitchMm: parsed.pitchMm };
}

// ---- engagement ------------------------------------------------------------------------------

export function requireHubMaterial(material: unknown, field = 'hubMaterial'): HubMaterial {
  if (material !== 'steel' && material !== 'aluminium') {
    throw new FitmentInputError(field, `${field} must be "steel" or "aluminium" (got ${String(material)})`);
  }
  return material;
}

export function threadEngagement(input: ThreadEngagementInput): ThreadEngagement {
  const { d, p } = checkedThread(input?.diameterMm, input?.pitchMm);
  const boltLengthMm = requirePositive(input.boltLengthMm, 'boltLengthMm');
  const clampedMm = requireNonNegative(input.clampedMm, 'clampedMm');
  const material = requireHubMaterial(input.hubMaterial);
  const depthMm = input.hubThreadDepthMm === undefined ? undefined : requirePositive(input.hubThreadDepthMm, 'hubThreadDepthMm');
  const hole = input.hole;
  if (hole !== undefined && hole !== 'blind' && hole !== 'through') {
    throw new FitmentInputError('hole', `hole must be "blind" or "through" (got ${String(hole)})`);
  }

  // A bolt shorter than the clamped stack does not reach the hub at all.
  const reachMm = Math.max(0, boltLengthMm - clampedMm);
  const limitedBy = depthMm !== undefined && reachMm > depthMm + EPSILON ? 'hub_thread' : 'bolt';
  const engagementMm = limitedBy === 'hub_thread' ? depthMm! : reachMm;
  // Touching the bottom already leaves no travel to clamp with, so equal counts as bottoming out.
  const bottomsOut = hole === 'blind' && depthMm !== undefined && reachMm >= depthMm - EPSILON;
  const requiredMm = ENGAGEMENT_FACTOR[material] * d;
  const marginMm = engagementMm - requiredMm;
  return {
    engagementMm,
    turns: engagementMm / p,
    requiredMm,
    marginMm,
    ok: marginMm >= -EPSILON && !bottomsOut,
    rule: bottomsOut ? `${ENGAGEMENT_RULES[material]}; ${BOTTOMING_RULE}` : ENGAGEMENT_RULES[material],
    reachMm,
    limitedBy,
    bottomsOut,
  };
}

/** A slip-on spacer of thickness t needs a bolt (or stud) at least t longer. */
export function boltLengthWithSpacer(stockLengthMm: number, spacerMm: number): number {
  return requirePositive(stockLengthMm, 'stockLengthMm') + requireNonNegative(spacerMm, 'spacerMm');
}
