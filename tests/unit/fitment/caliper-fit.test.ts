import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  bleedScrewAtBottom,
  caliperRotorFit,
  CENTRING_TOLERANCE_MM,
  lineFittingCheck,
  padOuterRadiusMm,
  padOverhangMm,
  type CaliperRotorFitInput,
} from '../../../shared/fitment/caliper-fit';
import { shimStack } from '../../../shared/fitment/shims';
import { effectiveRadiusMm } from '../../../shared/fitment/brakes';
import { FitmentInputError } from '../../../shared/fitment/errors';

const within = (actual: number, expected: number, tol: number) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol);

// A caliper designed around a 330 mm rotor, pad edge 2 mm inside it, 50 mm pad; a 28 mm thick rotor 50 mm tall.
const base: CaliperRotorFitInput = {
  caliper: {
    designRotorDiameterMm: 330,
    padEdgeStepMm: 2,
    padHeightMm: 50,
    rotorThicknessMinMm: 26,
    rotorThicknessMaxMm: 30,
    centreFromMountMm: 25.5,
  },
  bracket: { radialLiftMm: 0, mountFaceInboardMm: 60 },
  rotor: { diameterMm: 330, thicknessMm: 28, hatHeightMm: 50, frictionRingInnerDiameterMm: 210 },
};

const check = (r: ReturnType<typeof caliperRotorFit>, id: string) => {
  const found = r.checks.find((c) => c.id === id);
  if (!found) throw new Error(`no check ${id}`);
  return found;
};

describe('padOverhangMm', () => {
  it('when the caliper sits on the rotor it was designed for, then the pad edge stays inside by the edge step', () => {
    // plane geometry: 330/2 − 2 + 0 − 330/2 = −2
    expect(padOverhangMm({ designRotorDiameterMm: 330, padEdgeStepMm: 2, radialLiftMm: 0, rotorDiameterMm: 330 })).toBe(-2);
  });

  it('when a bracket lifts the caliper onto a smaller rotor, then the pad overhangs by the difference', () => {
    // plane geometry: 330/2 − 2 + 10 − 320/2 = +13 (fail)
    expect(padOverhangMm({ designRotorDiameterMm: 330, padEdgeStepMm: 2, radialLiftMm: 10, rotorDiameterMm: 320 })).toBe(13);
  });

  it('is the designed edge radius − step + lift − rotor radius for any inputs', () => {
    // plane geometry, written out
    fc.assert(
      fc.property(
        fc.double({ min: 240, max: 400, noNaN: true }),
        fc.double({ min: 0, max: 10, noNaN: true }),
        fc.double({ min: -30, max: 40, noNaN: true }),
        fc.double({ min: 240, max: 400, noNaN: true }),
        (design, step, lift, rotor) => {
          const input = { designRotorDiameterMm: design, padEdgeStepMm: step, radialLiftMm: lift, rotorDiameterMm: rotor };
          within(padOverhangMm(input), design / 2 - step + lift - rotor / 2, 1e-9);
          within(padOuterRadiusMm(input), design / 2 - step + lift, 1e-9);
        },
      ),
    );
  });

  it('when an input is impossible, then the field is named', () => {
    const good = { designRotorDiameterMm: 330, padEdgeStepMm: 2, radialLiftMm: 0, rotorDiameterMm: 330 };
    expect(() => padOverhangMm({ ...good, designRotorDiameterMm: 0 })).toThrow(
      expect.objectContaining({ field: 'designRotorDiameterMm' }),
    );
    expect(() => padOverhangMm({ ...good, padEdgeStepMm: -1 })).toThrow(expect.objectContaining({ field: 'padEdgeStepMm' }));
    expect(() => padOverhangMm({ ...good, padEdgeStepMm: 200 })).toThrow(expect.objectContaining({ field: 'padEdgeStepMm' }));
    expect(() => padOverhangMm({ ...good, radialLiftMm: Number.NaN })).toThrow(
      expect.objectContaining({ field: 'radialLiftMm' }),
    );
    expect(() => padOverhangMm({ ...good, radialLiftMm: -200 })).toThrow(expect.objectContaining({ field: 'radialLiftMm' }));
    expect(() => padOverhangMm({ ...good, rotorDiameterMm: -330 })).toThrow(
      expect.objectContaining({ field: 'rotorDiameterMm' }),
    );
  });
});

describe('caliperRotorFit: radial', () => {
  it('when everything sits as designed, then every radial check passes with its margin and source', () => {
    // plane geometry: pad 163 → 113 mm, friction ring from 105 mm
    const r = caliperRotorFit(base);
    expect(r.padOuterRadiusMm).toBe(163);
    expect(r.padInnerRadiusMm).toBe(113);
    expect(check(r, 'pad-overhang')).toMatchObject({ ok: true, valueMm: -2, marginMm: 2, source: 'plane geometry' });
    expect(check(r, 'pad-inner-edge')).toMatchObject({ ok: true, valueMm: 113, marginMm: 8, source: 'plane geometry' });
    for (const c of r.checks) {
      expect(c.rule.length).toBeGreaterThan(10);
      expect(c.source.length).toBeGreaterThan(5);
    }
  });

  it('when the bracket lifts the pad past the rotor edge, then pad overhang fails with a caution', () => {
    const r = caliperRotorFit({ ...base, bracket: { ...base.bracket, radialLiftMm: 5 } });
    expect(check(r, 'pad-overhang')).toMatchObject({ ok: false, valueMm: 3, marginMm: -3 });
    expect(r.cautions.join(' ')).toMatch(/hangs over the rotor edge/);
  });

  it('when a smaller rotor drops the ring below the pad, then the pad inner edge check fails', () => {
    // plane geometry: lift −20 → pad 143 → 93 mm against a 105 mm ring inner radius
    const r = caliperRotorFit({
      ...base,
      bracket: { ...base.bracket, radialLiftMm: -20 },
      rotor: { ...base.rotor, diameterMm: 300 },
    });
    expect(check(r, 'pad-overhang').ok).toBe(true);
    expect(check(r, 'pad-inner-edge')).toMatchObject({ ok: false, valueMm: 93, marginMm: -12 });
  });

  it('when the pad sits as designed, then the effective radius is the pad centre and replaces (D − h)/2', () => {
    // textbook disc brake form: pad band 113–163 → 138 mm against (330 − 50)/2 = 140 mm
    const r = caliperRotorFit(base);
    expect(r.effectiveRadius).toMatchObject({ fromPadMm: 138, estimateMm: effectiveRadiusMm(330, 50) });
    within(r.effectiveRadius!.ratio, 138 / 140, 1e-12);
  });

  it('when the pad overhangs, then only the band on the ring counts towards the effective radius', () => {
    // plane geometry: pad 168 → 118, rotor edge 165 → contact 118–165 → 141.5 mm
    const r = caliperRotorFit({ ...base, bracket: { ...base.bracket, radialLiftMm: 5 } });
    expect(r.effectiveRadius!.fromPadMm).toBe(141.5);
  });
});

describe('caliperRotorFit: thickness and axial centring', () => {
  it('when the rotor is inside the caliper’s range, then the thickness check passes by the nearer end', () => {
    // the caliper's design data: 26–30 mm, rotor 28 mm → 2 mm either side
    expect(check(caliperRotorFit(base), 'rotor-thickness')).toMatchObject({ ok: true, marginMm: 2 });
    const thick = caliperRotorFit({ ...base, rotor: { ...base.rotor, thicknessMm: 32, hatHeightMm: 52 } });
    expect(check(thick, 'rotor-thickness')).toMatchObject({ ok: false, marginMm: -2 });
  });

  it('when the friction ring centre and the caliper centre differ, then the move and its direction are reported', () => {
    // plane geometry: ring centre 50 − 28/2 = 36 mm inboard; caliper centre 60 − 25.5 = 34.5 mm → move 1.5 mm inboard
    const r = caliperRotorFit(base);
    expect(r.axial).toEqual({ rotorCentreInboardMm: 36, caliperCentreInboardMm: 34.5, offsetMm: -1.5, move: 'inboard' });
    expect(check(r, 'axial-centring')).toMatchObject({
      ok: false,
      marginMm: CENTRING_TOLERANCE_MM - 1.5,
      source: 'common practice, no source',
    });
    expect(r.centringShim).toBeNull();
  });

  it('when shims push the caliper the way it must move, then the shim-stack solver gives the centring shim on the axial joint', () => {
    const sizes = [0.5, 1];
    const r = caliperRotorFit({ ...base, centring: { shimSizesMm: sizes, shimMoves: 'inboard' } });
    // the existing solver, called with the same target
    expect(r.centringShim!.stack).toEqual(shimStack(1.5, sizes, 4));
    expect(r.centringShim!.stack.pieces).toEqual([1, 0.5]);
    expect(r.centringShim!.residualMm).toBe(0);
    expect(r.centringShim!.placement).toMatch(/axial joint/);
    expect(r.centringShim!.placement).toMatch(/never under radial-mount ears/);
    expect(check(r, 'axial-centring')).toMatchObject({ ok: true, marginMm: CENTRING_TOLERANCE_MM });
  });

  it('when the nearest stack still leaves the caliper off centre, then centring fails by what is left', () => {
    // only 1 mm shims: 2 pieces = 2 mm against 1.5 → 0.5 mm past the centre
    const r = caliperRotorFit({ ...base, centring: { shimSizesMm: [1], shimMoves: 'inboard', maxPieces: 2 } });
    expect(r.centringShim!.stack.totalMm).toBe(1);
    expect(check(r, 'axial-centring')).toMatchObject({ ok: false, valueMm: -0.5 });
  });

  it('when shims would push the caliper the wrong way, then centring fails and says to machine or change the bracket', () => {
    const r = caliperRotorFit({ ...base, centring: { shimSizesMm: [0.5, 1], shimMoves: 'outboard' } });
    expect(r.centringShim).toBeNull();
    expect(check(r, 'axial-centring').ok).toBe(false);
    expect(r.cautions.join(' ')).toMatch(/machine the mount face by 1.50 mm/);
  });

  it('when the caliper is already within the tolerance, then no shim is asked for', () => {
    const r = caliperRotorFit({
      ...base,
      caliper: { ...base.caliper, centreFromMountMm: 24.1 },
      centring: { shimSizesMm: [0.5], shimMoves: 'inboard' },
    });
    expect(r.axial!.offsetMm).toBeCloseTo(-0.1, 9);
    expect(r.centringShim).toBeNull();
    expect(check(r, 'axial-centring').ok).toBe(true);
  });

  it('after the solver’s stack the caliper is never further off than before', () => {
    // the solver never picks a stack worse than no stack
    fc.assert(
      fc.property(fc.double({ min: -5, max: 5, noNaN: true }), (shift) => {
        const r = caliperRotorFit({
          ...base,
          caliper: { ...base.caliper, centreFromMountMm: 24 + shift },
          centring: { shimSizesMm: [0.25, 0.5, 1], shimMoves: shift < 0 ? 'outboard' : 'inboard' },
        });
        if (r.centringShim) expect(Math.abs(r.centringShim.residualMm)).toBeLessThanOrEqual(r.centringShim.targetMm + 1e-9);
      }),
    );
  });
});

describe('caliperRotorFit: hydraulics and bleeding', () => {
  it('when both ends of the line match in seal and thread, then both fitting checks pass (decimal commas too)', () => {
    const r = caliperRotorFit({
      ...base,
      hydraulics: {
        caliperPort: { kind: 'banjo', thread: 'M10x1' },
        lineCaliperEnd: { kind: 'banjo', thread: 'M10 × 1,0' },
        lineChassisEnd: { kind: 'inverted_flare', thread: '3/8-24 UNF' },
        chassisPort: { kind: 'inverted_flare', thread: '3/8-24' },
      },
    });
    expect(check(r, 'line-caliper-end').ok).toBe(true);
    expect(check(r, 'line-chassis-end').ok).toBe(true);
    expect(check(r, 'line-caliper-end').source).toMatch(/ISO 724/);
  });

  it('when the seal type or the thread differs, then the joint fails', () => {
    // ISO 724 / ASME B1.1: M10×1 (10 mm, 1 mm) is not 3/8-24 (9.525 mm, 1.058 mm)
    const banjo = { kind: 'banjo' as const, thread: 'M10x1' };
    expect(lineFittingCheck('x', 'Joint', banjo, 'a', { kind: 'banjo', thread: '3/8-24 UNF' }, 'b').ok).toBe(false);
    expect(
      lineFittingCheck(
        'x',
        'Joint',
        { kind: 'inverted_flare', thread: 'M10x1' },
        'a',
        { kind: 'bubble_flare', thread: 'M10x1' },
        'b',
      ).ok,
    ).toBe(false);
    expect(lineFittingCheck('x', 'Joint', banjo, 'a', { kind: 'banjo', thread: 'M10x1.25' }, 'b').ok).toBe(false);
    const r = caliperRotorFit({
      ...base,
      hydraulics: { caliperPort: banjo, lineCaliperEnd: { kind: 'inverted_flare', thread: 'M10x1' } },
    });
    expect(check(r, 'line-caliper-end').ok).toBe(false);
    expect(r.cautions.join(' ')).toMatch(/never force or mix fittings/);
  });

  it('when a caliper moves to the other side at the same fore/aft position, then its bleed screw ends up at the bottom', () => {
    // turning a caliper to the other side keeps its pistons inboard only upside down (common practice, no source)
    expect(bleedScrewAtBottom({ designedSide: 'left', fittedSide: 'right' })).toBe(true);
    expect(bleedScrewAtBottom({ designedSide: 'left', fittedSide: 'left' })).toBe(false);
    expect(
      bleedScrewAtBottom({ designedSide: 'left', fittedSide: 'right', designedPosition: 'behind', fittedPosition: 'ahead' }),
    ).toBe(false);
    expect(
      bleedScrewAtBottom({ designedSide: 'left', fittedSide: 'left', designedPosition: 'behind', fittedPosition: 'ahead' }),
    ).toBe(true);
    expect(bleedScrewAtBottom({ designedSide: 'left', fittedSide: 'right', bleedersBothEnds: true })).toBe(false);
    const r = caliperRotorFit({ ...base, bleed: { designedSide: 'right', fittedSide: 'left' } });
    expect(check(r, 'bleed-screw').ok).toBe(false);
    expect(r.cautions.join(' ')).toMatch(/air stays trapped/);
  });
});

describe('caliperRotorFit: bad input', () => {
  it.each([
    [{ caliper: { ...base.caliper, padHeightMm: 0 } }, 'caliper.padHeightMm'],
    [{ caliper: { ...base.caliper, padHeightMm: 200 } }, 'caliper.padHeightMm'],
    [{ caliper: { ...base.caliper, rotorThicknessMaxMm: undefined } }, 'caliper.rotorThicknessMaxMm'],
    [{ caliper: { ...base.caliper, rotorThicknessMinMm: 32 } }, 'caliper.rotorThicknessMaxMm'],
    [{ caliper: { ...base.caliper, centreFromMountMm: Number.NaN } }, 'caliper.centreFromMountMm'],
    [{ bracket: { radialLiftMm: Number.POSITIVE_INFINITY } }, 'radialLiftMm'],
    [{ rotor: { ...base.rotor, diameterMm: 0 } }, 'rotorDiameterMm'],
    [{ rotor: { ...base.rotor, hatHeightMm: 20 } }, 'rotor.hatHeightMm'],
    [{ rotor: { ...base.rotor, thicknessMm: undefined } }, 'rotor.thicknessMm'],
    [{ rotor: { ...base.rotor, frictionRingInnerDiameterMm: 340 } }, 'rotor.frictionRingInnerDiameterMm'],
    [{ centring: { shimSizesMm: [], shimMoves: 'inboard' } }, 'sizesMm'],
    [{ centring: { shimSizesMm: [0.5], shimMoves: 'sideways' } }, 'centring.shimMoves'],
    [
      { hydraulics: { caliperPort: { kind: 'banjo', thread: 'M10' }, lineCaliperEnd: { kind: 'banjo', thread: 'M10x1' } } },
      'hydraulics.caliperPort.thread',
    ],
    [
      { hydraulics: { caliperPort: { kind: 'pipe', thread: 'M10x1' }, lineCaliperEnd: { kind: 'banjo', thread: 'M10x1' } } },
      'hydraulics.caliperPort.kind',
    ],
    [{ bleed: { designedSide: 'left', fittedSide: 'middle' } }, 'bleed.fittedSide'],
    [{ bleed: { designedSide: 'left', fittedSide: 'left', fittedPosition: 'above' } }, 'bleed.fittedPosition'],
    [{ caliper: null }, 'caliper'],
  ])('when given %j, then field %s is named', (change, field) => {
    const input = { ...base, ...change } as CaliperRotorFitInput;
    expect(() => caliperRotorFit(input)).toThrow(FitmentInputError);
    expect(() => caliperRotorFit(input)).toThrow(expect.objectContaining({ field }));
  });
});
