import { describe, expect, it } from 'vitest';
import { caliperFitsFor } from '../../../shared/fitment/swap-caliper-fit';
import { automaticChecks } from '../../../shared/review-checks';
import { swapDataSchema, type SwapDataInput } from '../../../shared/schemas/swap-data';

// A fixed four-piston caliper designed for a 330 × 26–28 mm rotor with a 55 mm pad (invented figures).
const vela = (side: 'left' | 'right', fit: object | undefined) => ({
  axle: 'front' as const,
  name: `Vela four-piston fixed front caliper, ${side}`,
  type: 'fixed' as const,
  pistons: [
    { diameterMm: 40, side: 'inboard' as const },
    { diameterMm: 44, side: 'inboard' as const },
    { diameterMm: 40, side: 'outboard' as const },
    { diameterMm: 44, side: 'outboard' as const },
  ],
  mount: { type: 'radial' as const },
  designRotor: { diameterMm: 330, thicknessMinMm: 26, thicknessMaxMm: 28 },
  padHeightMm: 55,
  fit,
});

function record(rotorDiameterMm: number, fit: object | undefined, extra: Partial<SwapDataInput> = {}) {
  return swapDataSchema.parse({
    schemaVersion: 2,
    title: 'Vela calipers on the H31',
    parts: [{ role: 'Front calipers', kind: 'caliper', name: 'Vela four-piston fixed front caliper', quantity: 2 }],
    calipers: [vela('left', fit), vela('right', fit)],
    rotors: [
      {
        axle: 'front',
        diameterMm: rotorDiameterMm,
        thicknessMm: 28,
        hatHeightMm: 46,
        frictionRingInnerDiameterMm: 212,
        vented: true,
      },
    ],
    shims: [
      { joint: 'bracket_to_knuckle', direction: 'axial', thicknessMm: 1, quantity: 4 },
      { joint: 'bracket_to_knuckle', direction: 'axial', thicknessMm: 0.5, quantity: 4 },
    ],
    ...extra,
  });
}

const centred = { padEdgeStepMm: 2, radialLiftMm: 0, centreFromMountMm: 20, mountFaceInboardMm: 53.5, shimMoves: 'outboard' };

describe('caliperFitsFor: the record’s calipers on the record’s rotor', () => {
  it('when left and right have the same figures, then they are checked once, with every check worked out by hand', () => {
    const [fit, ...rest] = caliperFitsFor(record(330, centred), 'front');
    expect(rest).toEqual([]);
    expect(fit.label).toBe('Vela four-piston fixed front caliper (left and right)');
    const byId = Object.fromEntries(fit.fit!.checks.map((c) => [c.id, c]));
    // plane geometry: pad outer edge 330/2 − 2 + 0 = 163 mm against the 165 mm rotor radius → 2 mm inside
    expect(byId['pad-overhang']).toMatchObject({ ok: true });
    expect(byId['pad-overhang'].marginMm).toBeCloseTo(2, 9);
    // pad inner edge 163 − 55 = 108 mm against the ring's 212/2 = 106 mm → 2 mm on the ring
    expect(byId['pad-inner-edge'].marginMm).toBeCloseTo(2, 9);
    // thickness 28 in 26–28 → margin min(2, 0) = 0, in range
    expect(byId['rotor-thickness']).toMatchObject({ ok: true, marginMm: 0 });
    // ring centre 46 − 28/2 = 32 mm inboard; caliper centre 53.5 − 20 = 33.5 → 1.5 mm outboard, met by the 1.0 + 0.5 shims
    expect(fit.fit!.axial!.offsetMm).toBeCloseTo(1.5, 9);
    expect(fit.fit!.centringShim!.stack.totalMm).toBeCloseTo(1.5, 9);
    expect(byId['axial-centring'].ok).toBe(true);
    expect(fit.missing).toEqual([]);
  });

  it('when the same caliper goes on a 300 mm rotor, then the pad overhangs the edge by 13 mm and the desk fails it', () => {
    // 163 − 150 = 13 mm past the edge (plane geometry)
    const data = record(300, centred);
    const [fit] = caliperFitsFor(data, 'front');
    const overhang = fit.fit!.checks.find((c) => c.id === 'pad-overhang')!;
    expect(overhang.ok).toBe(false);
    expect(overhang.valueMm).toBeCloseTo(13, 9);
    const desk = automaticChecks({
      data,
      body: '',
      photoCount: 1,
      chassis: { wheelBoltThread: 'M12x1.5' },
      axle: 'front',
      duplicates: [],
    }).find((c) => c.id === 'caliper_fit')!;
    expect(desk.status).toBe('fail');
    expect(desk.detail).toMatch(/pad overhangs the rotor edge/);
  });

  it('when the record gives no fit figures, then nothing is worked out and the desk asks for them', () => {
    const [fit] = caliperFitsFor(record(330, undefined), 'front');
    expect(fit.fit).toBeNull();
    expect(fit.missing.join(' ')).toMatch(/edge step/);
    const desk = automaticChecks({
      data: record(330, undefined),
      body: '',
      photoCount: 1,
      chassis: { wheelBoltThread: 'M12x1.5' },
      axle: 'front',
      duplicates: [],
    }).find((c) => c.id === 'caliper_fit')!;
    expect(desk.status).toBe('attention');
  });

  it('when the shims push the caliper the wrong way, then the caliper is off centre', () => {
    const [fit] = caliperFitsFor(record(330, { ...centred, shimMoves: 'inboard' }), 'front');
    const centring = fit.fit!.checks.find((c) => c.id === 'axial-centring')!;
    expect(centring.ok).toBe(false);
    expect(fit.fit!.cautions.join(' ')).toMatch(/must move outboard/);
  });
});
