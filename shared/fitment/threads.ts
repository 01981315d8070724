import { FitmentInputError, requireNonNegative, requirePositive } from './errors';

export type HubMaterial = 'steel' | 'aluminium';

export interface ThreadEngagementInput {
  diameterMm: number;
  pitchMm: number;
  boltLengthMm: number;
  /** everything between the bolt head and the hub threads: wheel centre, spacer */
  clampedMm: number;
  hubMaterial: HubMaterial;
}

export interface ThreadEngagement {
  engagementMm: number;
  turns: number;
  requiredMm: number;
  marginMm: number;
  ok: boolean;
  rule: string;
}

export interface ThreadBasics {
  pitchDiameterMm: number;
  minorDiameterMm: number;
  stressAreaMm2: number;
  tapDrillMm: number;
}

export const ENGAGEMENT_FACTOR: Record<HubMaterial, number> = { steel: 1.0, aluminium: 1.5 };

export const ENGAGEMENT_RULES: Record<HubMaterial, string> = {
  steel: 'Thread engagement at least 1.0 × bolt diameter in a steel hub (common practice)',
  aluminium: 'Thread engagement at least 1.5 × bolt diameter in an aluminium hub (common practice)',
};

// ISO 724 basic profile with H = (√3/2)·P: d₂ = d − ¾H, d₁ = d − 1¼H; ISO 898-1 stress diameter (d₂ + d₃)/2, d₃ = d₁ − H/6.
const SQRT3 = Math.sqrt(3);
const PITCH_DIAMETER_K = (3 * SQRT3) / 8; // 0.649519
const MINOR_DIAMETER_K = (5 * SQRT3) / 8; // 1.082532
const STRESS_DIAMETER_K = (13 * SQRT3) / 24; // 0.938194

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

const METRIC_THREAD = /^M\s*(\d+(?:[.,]\d+)?)\s*[X×*]\s*(\d+(?:[.,]\d+)?)$/;

export function parseMetricThread(designation: string): { diameterMm: number; pitchMm: number } {
  const text = typeof designation === 'string' ? designation.trim().toUpperCase() : '';
  const match = METRIC_THREAD.exec(text);
  if (!match) {
    throw new FitmentInputError('thread', `"${String(designation)}" is not a metric thread like M12x1.5 (give the pitch)`);
  }
  const diameterMm = Number(match[1].replace(',', '.'));
  const pitchMm = Number(match[2].replace(',', '.'));
  try {
    checkedThread(diameterMm, pitchMm);
  } catch (error) {
    if (error instanceof FitmentInputError) throw new FitmentInputError('thread', error.message);
    throw error;
  }
  return { diameterMm, pitchMm };
}

export function threadEngagement(input: ThreadEngagementInput): ThreadEngagement {
  const { d, p } = checkedThread(input?.diameterMm, input?.pitchMm);
  const boltLengthMm = requirePositive(input.boltLengthMm, 'boltLengthMm');
  const clampedMm = requireNonNegative(input.clampedMm, 'clampedMm');
  const material = input.hubMaterial;
  if (material !== 'steel' && material !== 'aluminium') {
    throw new FitmentInputError('hubMaterial', `hubMaterial must be "steel" or "aluminium" (got ${String(material)})`);
  }

  // A bolt shorter than the clamped stack does not reach the hub at all.
  const engagementMm = Math.max(0, boltLengthMm - clampedMm);
  const requiredMm = ENGAGEMENT_FACTOR[material] * d;
  const marginMm = engagementMm - requiredMm;
  return {
    engagementMm,
    turns: engagementMm / p,
    requiredMm,
    marginMm,
    ok: marginMm >= -1e-9,
    rule: ENGAGEMENT_RULES[material],
  };
}

/** A slip-on spacer of thickness t needs a bolt (or stud) at least t longer. */
export function boltLengthWithSpacer(stockLengthMm: number, spacerMm: number): number {
  return requirePositive(stockLengthMm, 'stockLengthMm') + requireNonNegative(spacerMm, 'spacerMm');
}
