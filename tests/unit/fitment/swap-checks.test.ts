import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import {
  brakeBalanceOf,
  checkWheelForSwap,
  describeBalanceShift,
  jobTouches,
  pistonsPerSideOf,
  rotorDiameterOf,
  testedWheelVerdicts,
  wheelCheckSummary,
  BARREL_ALLOWANCE_MM,
} from '../../../shared/fitment/swap-checks';
import { machiningLevel, swapDataSchema, type SwapDataInput, type testedWheelSchema } from '../../../shared/schemas/swap-data';

const MM_PER_IN = 25.4; // NIST SP 811, B.8: 1 in = 25.4 mm exactly

function record(extra: Partial<SwapDataInput> = {}) {
  return swapDataSchema.parse({
    schemaVersion: 2,
    title: 'Four-piston calipers on 330 mm rotors',
    parts: [{ role: 'Front caliper', kind: 'caliper', name: 'Four-piston caliper', quantity: 2 }],
    ...extra,
  });
}

const noFastening = { wheelBoltThread: 'M12x1.5', centreBoreMm: 66.6, wheelFastening: null };
const boltChassis = {
  wheelBoltThread: 'M12x1.5',
  centreBoreMm: 66.6,
  wheelFastening: {
    fastener: 'bolt' as const,
    seat: 'cone60' as const,
    stockLengthMm: 26,
    lengthFrom: 'seat_end' as const,
    nutClosed: false,
    hubMaterial: 'steel' as const,
    front: { threadDepthMm: 20, hole: 'through' as const, spigotLengthMm: 9 },
    rear: {},
  },
};

const wheelReq = (testedWheels: z.input<typeof testedWheelSchema>[], extra = {}) => ({
  minDiameterIn: 16,
  barrelInnerDiameterMm: 378,
  caliperRadialProjectionMm: 20,
  caliperOutboardMm: 34,
  testedWheels,
  ...extra,
});

describe('rotorDiameterOf', () => {
  it('when front and rear rotors differ, then each axle gets its own', () => {
    const data = record({
      rotors: [
        { axle: 'front', diameterMm: 330, thicknessMm: 28, vented: true },
        { axle: 'rear', diameterMm: 300, thicknessMm: 12, vented: false },
      ],
    });
    expect(rotorDiameterOf(data, 'front')).toBe(330);
    expect(rotorDiameterOf(data, 'rear')).toBe(300);
  });

  it('when an axle has no rotor row, then its after-swap disc figures stand in, and a drum gives none', () => {
    const data = record({
      brakes: {
        before: {
          front: { kind: 'disc', pistonsPerSideMm: [54], rotorDiameterMm: 280, padHeightMm: 50 },
          rear: { kind: 'drum', wheelCylinderBoreMm: 20.64, drumDiameterMm: 228.6, shoeType: 'leading_trailing' },
        },
        after: {
          front: { kind: 'disc', pistonsPerSideMm: [54], rotorDiameterMm: 300, padHeightMm: 50 },
          rear: { kind: 'drum', wheelCylinderBoreMm: 20.64, drumDiameterMm: 228.6, shoeType: 'leading_trailing' },
        },
      },
    });
    expect(rotorDiameterOf(data, 'front')).toBe(300);
    expect(rotorDiameterOf(data, 'rear')).toBeNull();
  });
});

describe('checkWheelForSwap: a verdict only from a measurement', () => {
  const data = record({
    rotors: [{ axle: 'front', diameterMm: 330, thicknessMm: 28, vented: true }],
    wheel: wheelReq([
      { diameterIn: 17, widthIn: 7.5, offsetMm: 42, outcome: 'fits', radialClearanceMm: 17, spokeClearanceMm: 6 },
    ]),
  });

  it('when the reader measured barrel and spokes, then both get a verdict against the 3 mm rule (common practice, no source)', () => {
    // radial: 400 / 2 − (330 / 2 + 20) = 15 mm; spokes: 40 + 0 − 34 = 6 mm (plane geometry, radius and axial differences)
    const check = checkWheelForSwap(data, 'front', noFastening, {
      diameterIn: 17,
      widthIn: 8,
      offsetMm: 30,
      spacerMm: 0,
      barrelInnerDiameterMm: 400,
      spokeInsetMm: 40,
    });
    expect(check.radial).toMatchObject({ basis: 'measured', clearanceMm: 15, ok: true });
    expect(check.spoke).toMatchObject({ basis: 'measured', clearanceMm: 6, ok: true });
    expect(wheelCheckSummary(check)).toMatchObject({
      tone: 'pass',
      headline: 'Clears by your measurements',
      leastClearanceMm: 6,
    });
  });

  it('when a lower-offset, wider wheel is estimated from a measured one, then it gains no room and carries no verdict', () => {
    // the 17×7.5 ET42 wheel was measured at 6 mm; for a 17×8 ET30 the rim edge moves 12 + 6.35 mm outboard, but the
    // spokes need not follow, so the estimate keeps 6 mm rather than the 24.35 mm the rim edge would suggest
    const check = checkWheelForSwap(data, 'front', noFastening, { diameterIn: 17, widthIn: 8, offsetMm: 30, spacerMm: 0 });
    expect(check.spoke?.basis).toBe('estimated');
    expect(check.spoke?.clearanceMm).toBeCloseTo(6, 9);
    expect(check.spoke).not.toHaveProperty('ok');
    expect(check.spoke?.basisNote).toMatch(/Estimate/);
  });

  it('when the estimated wheel has a higher offset, then the spokes come closer by the full shift', () => {
    // 17×7.5 ET52: the rim edge moves 10 mm inboard → 6 − 10 = −4 mm (errs towards less clearance)
    const check = checkWheelForSwap(data, 'front', noFastening, { diameterIn: 17, widthIn: 7.5, offsetMm: 52, spacerMm: 0 });
    expect(check.spoke?.clearanceMm).toBeCloseTo(-4, 9);
    expect(wheelCheckSummary(check).tone).toBe('open');
    // an estimate never reads as a verdict, not even in the short line
    expect(wheelCheckSummary(check).headline).toMatch(/^Not settled/);
  });

  it('when a spacer is added, then the spoke estimate moves by exactly its thickness (the wheel moves outboard by t)', () => {
    const without = checkWheelForSwap(data, 'front', noFastening, { diameterIn: 17, widthIn: 7.5, offsetMm: 42, spacerMm: 0 });
    const withSpacer = checkWheelForSwap(data, 'front', noFastening, {
      diameterIn: 17,
      widthIn: 7.5,
      offsetMm: 42,
      spacerMm: 10,
    });
    expect(withSpacer.spoke!.clearanceMm - without.spoke!.clearanceMm).toBeCloseTo(10, 9);
  });

  it('when the barrel is estimated, then the smallest of the bases is used', () => {
    // bases for a 17″ wheel: nominal 17 × 25.4 − 28 = 403.8 mm → 403.8/2 − 185 = 16.9 mm;
    // the record's 378 mm barrel on 16″ scaled by 25.4 mm → 403.4 mm → 16.7 mm; the measured 17″ wheel: 17 mm
    const check = checkWheelForSwap(data, 'front', noFastening, { diameterIn: 17, widthIn: 8, offsetMm: 30, spacerMm: 0 });
    expect(check.radial?.basis).toBe('estimated');
    expect(check.radial?.clearanceMm).toBeCloseTo((378 + MM_PER_IN) / 2 - 185, 9);
    expect(BARREL_ALLOWANCE_MM).toBe(28);
  });

  it('when the record measured a wheel of this size that did not fit, then the estimate for that size is no better', () => {
    const withMisfit = record({
      rotors: [{ axle: 'front', diameterMm: 330, thicknessMm: 28, vented: true }],
      wheel: wheelReq([{ diameterIn: 15, widthIn: 6, offsetMm: 38, outcome: 'does_not_fit', radialClearanceMm: -9 }]),
    });
    const check = checkWheelForSwap(withMisfit, 'front', noFastening, {
      diameterIn: 15,
      widthIn: 6.5,
      offsetMm: 35,
      spacerMm: 0,
    });
    expect(check.radial?.clearanceMm).toBeLessThanOrEqual(-9);
    expect(check.minDiameter?.ok).toBe(false);
    expect(wheelCheckSummary(check)).toMatchObject({ tone: 'fail' });
    expect(wheelCheckSummary(check).text).toContain('below the 16″ minimum');
    expect(wheelCheckSummary(check).headline).toBe('Does not fit: the wheel is below the 16″ minimum');
  });

  it('when the wheel bolt is too short, then the summary names the thread, not the clearance', () => {
    // M12×1.5 into a steel hub: 1.0 × d = 12 mm of thread (common practice, no source); 36 − (10 + 16) = 10 mm < 12 mm
    const check = checkWheelForSwap(data, 'front', boltChassis, {
      diameterIn: 17,
      widthIn: 7.5,
      offsetMm: 42,
      spacerMm: 10,
      fastening: { clampMm: 16, lengthMm: 36, wheelSeat: { type: 'cone60' }, spacerHubCentric: true },
    });
    expect(check.fastening?.engagement).toMatchObject({ engagementMm: 10, ok: false });
    expect(wheelCheckSummary(check).text).toContain('too little thread');
    expect(wheelCheckSummary(check).text).not.toMatch(/clear/);
    expect(wheelCheckSummary(check).headline).toMatch(/^Does not fit: .*too little thread/);
  });

  it('when the chassis has no wheel fastening on record, then no fastening verdict is given', () => {
    const check = checkWheelForSwap(data, 'front', noFastening, {
      diameterIn: 17,
      widthIn: 7.5,
      offsetMm: 42,
      spacerMm: 0,
      fastening: { clampMm: 16, lengthMm: 36 },
    });
    expect(check.fastening).toBeNull();
  });
});

describe('testedWheelVerdicts', () => {
  it('when a wheel marked as fitting overlaps, then its outcome contradicts the measurement', () => {
    const data = record({
      wheel: wheelReq([
        { diameterIn: 16, widthIn: 7, offsetMm: 38, outcome: 'fits', radialClearanceMm: -1 },
        { diameterIn: 15, widthIn: 6, offsetMm: 38, outcome: 'does_not_fit', radialClearanceMm: -9 },
      ]),
    });
    const [fit, misfit] = testedWheelVerdicts(data);
    expect(fit.contradiction).toContain('overlap the caliper by 1 mm');
    expect(misfit.contradiction).toBeNull();
    expect(misfit.figures[0]).toMatchObject({ where: 'barrel', ok: false, marginMm: -12 });
  });
});

describe('brakeBalanceOf', () => {
  it('when a corner is a drum, then it is computed as a drum (Limpert, drum brake torque: 20.64 mm, 203.2 mm, C* 2.2, 40 bar → 299.15 N·m)', () => {
    const drum = {
      kind: 'drum' as const,
      wheelCylinderBoreMm: 20.64,
      drumDiameterMm: 203.2,
      shoeType: 'leading_trailing' as const,
      brakeFactor: 2.2,
    };
    const front = { kind: 'disc' as const, pistonsPerSideMm: [54], rotorDiameterMm: 280, padHeightMm: 50 };
    const balance = brakeBalanceOf(
      record({ brakes: { linePressureBar: 40, padMu: 0.4, before: { front, rear: drum }, after: { front, rear: drum } } }),
    )!;
    // T = p A C* r = 4 N/mm² × π/4 × 20.64² × 2.2 × 101.6 mm = 299 150 N·mm (recomputed)
    expect(balance.torqueNm.before.rear).toBeCloseTo((4 * Math.PI * 20.64 ** 2 * 2.2 * 101.6) / 4 / 1000, 6);
    expect(balance.torqueNm.before.rear).toBeCloseTo(299.15, 1);
    expect(balance.shift.direction).toBe('unchanged');
  });
});

describe('describeBalanceShift: the direction and what it risks', () => {
  it('when the front share falls (the rear drum-in-hat swap: 70.2 % → 64.5 %), then it reads as a rearward hazard', () => {
    const shift = describeBalanceShift(0.702, 0.645);
    expect(shift.direction).toBe('rearward');
    expect(shift.severity).toBe('hazard');
    expect(shift.headline).toBe('Balance moves toward the rear: front share 70.2 % → 64.5 % (−5.7 points).');
    expect(shift.risk).toMatch(/rears lock before the fronts the car can turn sideways and spin/);
  });

  it('when the front share rises, then it reads as forward, with the fronts still locking first', () => {
    const shift = describeBalanceShift(0.6593, 0.7372);
    expect(shift.direction).toBe('forward');
    expect(shift.severity).toBe('advisory');
    expect(shift.headline).toContain('toward the front');
    expect(shift.risk).toContain('fronts still lock first');
  });

  it('when the move is small, then forward is no concern, a small rearward move is advisory and under half a point is unchanged', () => {
    expect(describeBalanceShift(0.7, 0.72).severity).toBe('none');
    expect(describeBalanceShift(0.7, 0.69)).toMatchObject({ direction: 'rearward', severity: 'advisory' });
    expect(describeBalanceShift(0.7, 0.702).direction).toBe('unchanged');
  });
});

describe('machining level and cautions by what the job touches', () => {
  it('when a knuckle is ground, then the work is structural whatever the operation', () => {
    expect(machiningLevel([{ component: 'knuckle', operation: 'grind', where: 'Casting lug', required: true, notes: '' }])).toBe(
      'structural',
    );
    expect(machiningLevel([{ component: 'dust_shield', operation: 'trim', where: 'Edge', required: true, notes: '' }])).toBe(
      'minor',
    );
    expect(machiningLevel([{ component: 'wheel', operation: 'machine', where: 'Barrel lip', required: true, notes: '' }])).toBe(
      'major',
    );
  });

  it('when a caliper-bracket thread is repaired, then the brake cautions apply although the category is repair', () => {
    const data = record({
      parts: [{ role: 'Thread insert', kind: 'hardware', name: 'Keyed insert kit', quantity: 1 }],
      machining: [{ component: 'knuckle', operation: 'drill', where: 'Bracket lug', required: true }],
      fasteners: [{ id: 'bracket-bolts', kind: 'bracket_mount', label: 'Caliper bracket bolts into the insert' }],
    });
    expect(jobTouches(data, 'repair')).toEqual({ brakes: true, wheelFastening: false, structural: true, suspension: false });
  });

  it('when a swap changes no wheel fastening, then no wheel caution applies', () => {
    const data = record({
      parts: [{ role: 'Anti-roll bar', kind: 'hardware', name: '22 mm bar', quantity: 1 }],
      fasteners: [{ id: 'links', kind: 'suspension', label: 'Drop link nuts' }],
    });
    expect(jobTouches(data, 'suspension')).toMatchObject({ brakes: false, wheelFastening: false, suspension: true });
  });
});

describe('pistonsPerSideOf', () => {
  it('takes every piston of a floating caliper and one side of a fixed one', () => {
    expect(
      pistonsPerSideOf({
        type: 'floating',
        pistons: [
          { diameterMm: 42, side: 'inboard' },
          { diameterMm: 42, side: 'inboard' },
        ],
      }),
    ).toEqual([42, 42]);
    const fixed = [40, 44].flatMap((d) => [
      { diameterMm: d, side: 'inboard' as const },
      { diameterMm: d, side: 'outboard' as const },
    ]);
    expect(pistonsPerSideOf({ type: 'fixed', pistons: fixed })).toEqual([40, 44]);
  });
});
