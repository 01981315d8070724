import type { Axle } from '../schemas/enums';
import type { Caliper, SwapData } from '../schemas/swap-data';
import { caliperRotorFit, type CaliperRotorFit } from './caliper-fit';
import { FitmentInputError } from './errors';

// Does each caliper of a record sit on the rotor the record gives its axle? The record's caliper (its design rotor, pad
// height and fit figures), the axle's rotor and the record's axial shims, through the caliper–rotor fit. Shared by the
// sheet and the review desk, so both show the same checks in the same words.

export type RecordCaliperFit = {
  /** the caliper's name; a left and right pair with the same figures is shown once */
  label: string;
  count: number;
  fit: CaliperRotorFit | null;
  /** figures the fit needs that the record does not give */
  missing: string[];
  /** a figure the computations refuse, in words */
  error: string | null;
};

/** Left and right of one caliper have the same figures: check them once. */
const sameFigures = (a: Caliper, b: Caliper) =>
  JSON.stringify({ ...a, name: '', bleedScrewWhenFitted: null }) ===
  JSON.stringify({ ...b, name: '', bleedScrewWhenFitted: null });

export function caliperFitsFor(data: SwapData, axle: Axle): RecordCaliperFit[] {
  const rotor = data.rotors.find((r) => r.axle === axle);
  const calipers = data.calipers.filter((c) => c.axle === axle);
  const groups: { caliper: Caliper; names: string[] }[] = [];
  for (const c of calipers) {
    const group = groups.find((g) => sameFigures(g.caliper, c));
    if (group) group.names.push(c.name);
    else groups.push({ caliper: c, names: [c.name] });
  }
  const axialShims = data.shims.filter((s) => s.direction === 'axial').map((s) => s.thicknessMm);
  return groups.map(({ caliper: c, names }) => {
    const label = names.length > 1 ? `${c.name.replace(/,? (left|right)$/i, '')} (left and right)` : c.name;
    const missing: string[] = [];
    if (!rotor) missing.push(`the ${axle} rotor`);
    if (c.designRotor.diameterMm === undefined) missing.push('the rotor diameter the caliper was designed for');
    if (!c.fit) missing.push('the pad’s edge step and the bracket’s radial lift');
    if (!rotor || c.designRotor.diameterMm === undefined || !c.fit)
      return { label, count: names.length, fit: null, missing, error: null };
    const thicknessRange = c.designRotor.thicknessMinMm !== undefined && c.designRotor.thicknessMaxMm !== undefined;
    try {
      const fit = caliperRotorFit({
        caliper: {
          designRotorDiameterMm: c.designRotor.diameterMm,
          padEdgeStepMm: c.fit.padEdgeStepMm,
          padHeightMm: c.padHeightMm,
          rotorThicknessMinMm: thicknessRange ? c.designRotor.thicknessMinMm : undefined,
          rotorThicknessMaxMm: thicknessRange ? c.designRotor.thicknessMaxMm : undefined,
          centreFromMountMm: c.fit.centreFromMountMm,
        },
        bracket: { radialLiftMm: c.fit.radialLiftMm, mountFaceInboardMm: c.fit.mountFaceInboardMm },
        rotor: {
          diameterMm: rotor.diameterMm,
          thicknessMm: rotor.thicknessMm,
          hatHeightMm: rotor.hatHeightMm,
          frictionRingInnerDiameterMm: rotor.frictionRingInnerDiameterMm,
        },
        centring: c.fit.shimMoves && axialShims.length > 0 ? { shimSizesMm: axialShims, shimMoves: c.fit.shimMoves } : undefined,
      });
      if (c.fit.centreFromMountMm === undefined || c.fit.mountFaceInboardMm === undefined || rotor.hatHeightMm === undefined)
        missing.push('the axial figures (caliper centre from its mount face, mount face from the hub face, rotor hat height)');
      return { label, count: names.length, fit, missing, error: null };
    } catch (error) {
      if (!(error instanceof FitmentInputError)) throw error;
      return { label, count: names.length, fit: null, missing, error: error.message };
    }
  });
}

/** Short words for each caliper–rotor check, passed and failed (the calculator and the sheet use the same). */
export const caliperFitCheckWords: Record<string, { pass: string; fail: string }> = {
  'pad-overhang': { pass: 'On the rotor', fail: 'Overhangs' },
  'pad-inner-edge': { pass: 'On the ring', fail: 'Below the ring' },
  'rotor-thickness': { pass: 'In range', fail: 'Out of range' },
  'axial-centring': { pass: 'Centred', fail: 'Off centre' },
  'line-caliper-end': { pass: 'Fittings match', fail: 'Fittings differ' },
  'line-chassis-end': { pass: 'Fittings match', fail: 'Fittings differ' },
  'bleed-screw': { pass: 'Bleeds', fail: 'Air stays in' },
};
