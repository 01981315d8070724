// The reference band a car's brake distribution is read against, and what counts as no change.

/**
 * The reference band for passenger cars. The z range and the minimum-deceleration line are confirmed in
 * Crolla (ed.), *Automotive Engineering: Powertrain, Chassis System and Vehicle Body* (2009), §12.1.2 and
 * Fig. 12.1-2, which quote the same requirement from EEC Directive 71/320 Annex II for category M1; that
 * UN Regulation No. 13-H Annex 5 carries the same figures, and the allowance's numbers, are from memory.
 */
export const PASSENGER_CAR_REFERENCE = {
  source: 'UN Regulation No. 13-H, Annex 5 (distribution of braking among the axles), passenger cars (category M1)',
  frontAboveRear: { fromG: 0.15, toG: 0.8 },
  allowance: { fromG: 0.3, toG: 0.45, aboveIdeal: 0.05 },
  minimumLine: { fromK: 0.2, toK: 0.8, text: 'z ≥ 0.10 + 0.85 (k − 0.20) for k between 0.20 and 0.80' },
  provenance:
    'Range 0.15–0.80 g and the line z ≥ 0.10 + 0.85 (k − 0.20): Crolla (ed.), Automotive Engineering (2009), §12.1.2, quoting the EEC braking directive for passenger cars; that Regulation 13-H Annex 5 uses the same figures, and the 0.30–0.45 g allowance, from memory.',
  caveat: 'Shown as a reference, not a verdict: approval is for the authority under your local rules.',
} as const;

/** The most friction an axle may need at z on the minimum-deceleration line, or null outside the line's k range. */
export function minimumLineK(z: number): number | null {
  const k = 0.2 + (z - 0.1) / 0.85;
  const { fromK, toK } = PASSENGER_CAR_REFERENCE.minimumLine;
  return k >= fromK - 1e-12 && k <= toK + 1e-12 ? k : null;
}

/** a move of the front share smaller than this (percentage points) is within the rounding of the figures */
export const BALANCE_UNCHANGED_POINTS = 0.5;
