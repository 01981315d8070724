/**
 * One rule-based check of a fit: the measured figure, the margin against the rule (positive: on the safe side),
 * the rule in words and where the rule comes from. `ok` is null for a figure shown without a verdict.
 */
export interface FitCheck {
  id: string;
  label: string;
  ok: boolean | null;
  valueMm: number | null;
  marginMm: number | null;
  rule: string;
  source: string;
}

export const SOURCE = {
  geometry: 'plane geometry',
  practice: 'common practice, no source',
  asme: 'ASME B1.1 (Unified Inch Screw Threads)',
  iso724: 'ISO 724 (ISO general-purpose metric screw threads)',
  caliperData: 'the caliper’s own design data, as recorded',
} as const;

export const EPSILON_MM = 1e-9;
