import { describe, expect, it } from 'vitest';
import { fasteningFor, testedWheelFastenings, type FasteningChassis } from '../../../shared/fitment/swap-fastening';
import { SEAT_MISMATCH_CAUTION } from '../../../shared/fitment/fastening';
import { automaticChecks } from '../../../shared/review-checks';
import type { z } from 'zod';
import { swapDataSchema, type SwapDataInput, type testedWheelSchema } from '../../../shared/schemas/swap-data';
import { chassisWheelFasteningSchema, type ChassisWheelFasteningInput } from '../../../shared/schemas/wheel-fastening';

const MM_PER_IN = 25.4; // NIST SP 811, B.8: 1 in = 25.4 mm exactly

const chassisWith = (thread: string, fastening: ChassisWheelFasteningInput): FasteningChassis => ({
  wheelBoltThread: thread,
  centreBoreMm: 66.6,
  wheelFastening: chassisWheelFasteningSchema.parse(fastening),
});

/** bolts into a steel hub: through holes at the front, a drum-in-hat parking brake 6 mm behind the rear hub */
const boltCar = chassisWith('M12×1.5', {
  fastener: 'bolt',
  seat: 'cone60',
  seatHeightMm: 6,
  stockLengthMm: 26,
  lengthFrom: 'seat_end',
  hubMaterial: 'steel',
  front: { threadDepthMm: 16, hole: 'through', spigotLengthMm: 9 },
  rear: { threadDepthMm: 16, hole: 'through', spigotLengthMm: 9, clearanceBehindMm: 6 },
});

/** pressed-in 1/2-20 UNF studs, 38 mm out of the hub face, open 60° cone nuts with 16 mm of thread */
const studCar = chassisWith('1/2-20 UNF', {
  fastener: 'stud_nut',
  seat: 'cone60',
  stockLengthMm: 38,
  nutThreadMm: 16,
  hubMaterial: 'steel',
  front: { spigotLengthMm: 8 },
});

const cone = { type: 'cone60' as const };
const ball13 = { type: 'ball' as const, ballRadiusMm: 13 };

describe('fasteningFor: the chassis fastener with the reader’s wheel', () => {
  it('when a ball-seat wheel meets the factory cone bolts, then the seat does not match, always with its caution', () => {
    const r = fasteningFor(boltCar, { axle: 'front', wheelSeat: ball13 })!;
    expect(r.checks.find((c) => c.id === 'seat')).toMatchObject({ ok: false });
    expect(r.failures).toEqual(['the seat does not match']);
    expect(r.cautions).toContain(SEAT_MISMATCH_CAUTION);
    // nothing else was given: the engagement is not guessed
    expect(r.engagement).toBeNull();
    expect(r.missing.join(' ')).toMatch(/thickness at the bolt/);
  });

  it('when ball-seat bolts of the same radius are used, then the seats match', () => {
    const r = fasteningFor(boltCar, { axle: 'front', wheelSeat: ball13, fastenerSeat: ball13 })!;
    expect(r.failures).toEqual([]);
    expect(r.checks.find((c) => c.id === 'seat')?.ok).toBe(true);
  });

  it('when studs and open nuts hold a wheel, then the unified thread is engaged to the nut’s depth', () => {
    // ASME B1.1: 1/2-20 UNF is 0.5 in = 12.7 mm, pitch 1/20 in = 1.27 mm. Stud reach 38 − 14 = 24 mm beyond the wheel,
    // capped by the nut's 16 mm of thread; rule 1.0 × d = 12.7 mm in a steel nut (common practice, no source).
    const r = fasteningFor(studCar, { axle: 'front', wheelSeat: cone, clampMm: 14 })!;
    expect(r.thread).toMatchObject({ system: 'unified', tpi: 20 });
    expect(r.thread.diameterMm).toBeCloseTo(0.5 * MM_PER_IN, 9);
    expect(r.engagement).toMatchObject({ engagementMm: 16, limitedBy: 'hub_thread', bottomsOut: false });
    expect(r.engagement!.marginMm).toBeCloseTo(16 - 12.7, 9);
    expect(r.lengthBasis).toBe('stock');
    expect(r.failures).toEqual([]);
  });

  it('when a 12 mm slip-on spacer goes under the stock studs, then there is too little thread', () => {
    // 38 − (14 + 12) = 12 mm < 12.7 mm
    const r = fasteningFor(studCar, {
      axle: 'front',
      wheelSeat: cone,
      clampMm: 14,
      spacer: { thicknessMm: 12, mounting: 'slip_on', material: 'aluminium', hubCentric: true },
    })!;
    expect(r.engagement?.engagementMm).toBeCloseTo(12, 9);
    expect(r.failures).toEqual(['too little thread']);
    expect(r.lengthWithSpacerMm).toBe(50);
  });

  it('when a long bolt goes into a blind hole, then it bottoms out and clamps nothing', () => {
    const blind = chassisWith('M12x1.5', {
      fastener: 'bolt',
      seat: 'cone60',
      stockLengthMm: 28,
      hubMaterial: 'steel',
      front: { threadDepthMm: 18, hole: 'blind' },
    });
    // reach 36 − 12 = 24 mm ≥ 18 mm of hole (plane geometry)
    const r = fasteningFor(blind, { axle: 'front', wheelSeat: cone, clampMm: 12, lengthMm: 36 })!;
    expect(r.engagement?.bottomsOut).toBe(true);
    expect(r.failures).toContain('the bolt bottoms out');
    expect(r.lengthBasis).toBe('given');
  });

  it('when the bolt reaches further behind the hub than the recorded clearance, then it is too long', () => {
    // reach 36 − 12 = 24 mm; 24 − 16 mm of hub thread = 8 mm behind the hub > 6 mm to the parking-brake drum
    const r = fasteningFor(boltCar, { axle: 'rear', wheelSeat: cone, clampMm: 12, lengthMm: 36 })!;
    const tooLong = r.checks.find((c) => c.id === 'too-long')!;
    expect(tooLong).toMatchObject({ ok: false, valueMm: 8, marginMm: -2 });
    expect(r.failures).toEqual(['the bolt is too long for what sits behind the hub']);
    // the same bolt at the front, with nothing recorded behind the hub, is not judged for length
    expect(
      fasteningFor(boltCar, { axle: 'front', wheelSeat: cone, clampMm: 12, lengthMm: 36 })!.checks.map((c) => c.id),
    ).not.toContain('too-long');
  });

  it('when a plain slip-on spacer is as thick as the spigot is long, then the spigot is swallowed; a hub-centric one is not judged so', () => {
    const plain = fasteningFor(boltCar, {
      axle: 'front',
      spacer: { thicknessMm: 10, mounting: 'slip_on', material: 'aluminium', hubCentric: false },
    })!;
    // 9 − 10 = −1 mm of spigot left in the wheel (plane geometry)
    expect(plain.checks.find((c) => c.id === 'spigot')).toMatchObject({ ok: false, valueMm: -1 });
    expect(plain.failures).toEqual(['the spacer swallows the hub spigot']);
    const centred = fasteningFor(boltCar, {
      axle: 'front',
      spacer: { thicknessMm: 10, mounting: 'slip_on', material: 'aluminium', hubCentric: true },
    })!;
    expect(centred.checks.map((c) => c.id)).not.toContain('spigot');
    expect(centred.notes.join(' ')).toMatch(/own spigot centres the wheel/);
  });

  it('when the wheel bore is larger than the hub spigot, then the hub-centric ring is sized from the two bores', () => {
    const r = fasteningFor(boltCar, { axle: 'front', wheelBoreMm: 72.6 })!;
    expect(r.hubRing).toMatchObject({ needed: true, outerDiameterMm: 72.6, innerDiameterMm: 66.6, label: '72.6 → 66.6 mm' });
    const small = fasteningFor(boltCar, { axle: 'front', wheelBoreMm: 60.1 })!;
    expect(small.failures).toEqual(['the centre bore is smaller than the hub spigot']);
  });

  it('when the chassis has no wheel fastening on record, then there is nothing to check', () => {
    expect(fasteningFor({ ...boltCar, wheelFastening: null }, { axle: 'front', wheelSeat: cone })).toBeNull();
  });
});

const record = (extra: Partial<SwapDataInput>) =>
  swapDataSchema.parse({
    schemaVersion: 2,
    title: 'Alloys on the stud-and-nut pickup',
    parts: [{ role: 'Nuts', kind: 'hardware', name: 'Wheel nuts', quantity: 10 }],
    ...extra,
  });

const wheel = (extra: Partial<z.input<typeof testedWheelSchema>>) => ({
  minDiameterIn: 16,
  caliperRadialProjectionMm: 10,
  caliperOutboardMm: 20,
  testedWheels: [
    { diameterIn: 16, widthIn: 7, offsetMm: 45, outcome: 'fits', seat: 'cone60', clampMm: 14 },
    { diameterIn: 16, widthIn: 7, offsetMm: 35, outcome: 'fits', seat: 'ball', ballRadiusMm: 13, clampMm: 13, ...extra },
  ] satisfies z.input<typeof testedWheelSchema>[],
});

describe('the record’s tested wheels on the chassis fastening', () => {
  it('when the record lists ball-seat nuts, then the ball-seat wheel is checked with them and the cone wheel with the cone nuts', () => {
    const data = record({
      fasteners: [
        { id: 'nuts', kind: 'wheel', label: 'Stock cone nuts', thread: '1/2-20 UNF', seat: 'cone60' },
        { id: 'ball-nuts', kind: 'wheel', label: 'Ball-seat nuts R13', thread: '1/2-20 UNF', seat: 'ball', ballRadiusMm: 13 },
      ],
      wheel: wheel({}),
    });
    const [coneWheel, ballWheel] = testedWheelFastenings(data, 'front', studCar);
    expect(coneWheel.fastenerLabel).toBe('Stock cone nuts');
    expect(ballWheel.fastenerLabel).toBe('Ball-seat nuts R13');
    expect([coneWheel, ballWheel].flatMap((w) => w.result.failures)).toEqual([]);
  });

  it('when a ball-seat wheel is marked as fitting with only cone nuts listed, then the review desk fails the fastening', () => {
    const data = record({
      fasteners: [{ id: 'nuts', kind: 'wheel', label: 'Stock cone nuts', thread: '1/2-20 UNF', seat: 'cone60' }],
      torque: [{ fastenerId: 'nuts', nm: 120 }],
      wheel: wheel({}),
    });
    const checks = automaticChecks({
      data,
      body: '',
      photoCount: 1,
      chassis: studCar,
      axle: 'front',
      category: 'wheels_tyres',
      duplicates: [],
    });
    const fastening = checks.find((c) => c.id === 'fastening')!;
    expect(fastening.status).toBe('fail');
    expect(fastening.detail).toContain('16×7 ET35: the seat does not match');
  });

  it('when the mismatched wheel is recorded as not fitting, then it documents the problem and the check passes', () => {
    const data = record({
      fasteners: [{ id: 'nuts', kind: 'wheel', label: 'Stock cone nuts', thread: '1/2-20 UNF', seat: 'cone60' }],
      wheel: wheel({ outcome: 'does_not_fit' }),
    });
    const checks = automaticChecks({
      data,
      body: '',
      photoCount: 1,
      chassis: studCar,
      axle: 'front',
      category: 'wheels_tyres',
      duplicates: [],
    });
    expect(checks.find((c) => c.id === 'fastening')).toMatchObject({ status: 'pass' });
  });
});
