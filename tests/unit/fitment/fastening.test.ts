import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { hubCentricRing, wheelFasteningChain, type WheelFasteningInput } from '../../../shared/fitment/fastening';
import { FitmentInputError } from '../../../shared/fitment/errors';

const within = (actual: number, expected: number, tol: number) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol);

// A cone-seat M12×1.5 bolt into a steel hub: 45 mm under the head, a 6 mm cone, 18 mm of wheel below the seat.
const coneBolt: WheelFasteningInput = {
  fastener: 'bolt',
  thread: 'M12x1.5',
  seat: { type: 'cone60', heightMm: 6 },
  wheelSeat: { type: 'cone60' },
  wheelClampMm: 18,
  hubMaterial: 'steel',
  boltLengthMm: 45,
};

const check = (r: ReturnType<typeof wheelFasteningChain>, id: string) => {
  const found = r.checks.find((c) => c.id === id);
  if (!found) throw new Error(`no check ${id}`);
  return found;
};

describe('wheelFasteningChain: where the thread is counted from', () => {
  it('when a cone-seat bolt is measured under the head, then the cone height is taken off before counting thread', () => {
    // plane geometry: 45 − 6 (cone) − 18 (wheel below the seat) = 21 mm; common practice, no source: 1.0 × d = 12 mm in steel
    const r = wheelFasteningChain(coneBolt);
    expect(r.seatAllowanceMm).toBe(6);
    expect(r.stackMm).toBe(18);
    expect(r.engagement.engagementMm).toBe(21);
    expect(r.engagement.turns).toBe(14);
    expect(check(r, 'engagement')).toMatchObject({ ok: true, valueMm: 21, marginMm: 9, source: 'common practice, no source' });
    expect(r.notes.join(' ')).toMatch(/60° cone seat: 6 mm/);
  });

  it('measuring from the top of the cone overstates engagement by exactly the cone height', () => {
    // plane geometry
    fc.assert(
      fc.property(fc.double({ min: 3, max: 10, noNaN: true }), fc.double({ min: 40, max: 70, noNaN: true }), (cone, length) => {
        const fromHead = wheelFasteningChain({ ...coneBolt, seat: { type: 'cone60', heightMm: cone }, boltLengthMm: length });
        const fromSeat = wheelFasteningChain({ ...coneBolt, boltLengthFrom: 'seat_end', boltLengthMm: length });
        within(fromSeat.engagement.engagementMm - fromHead.engagement.engagementMm, cone, 1e-9);
      }),
    );
  });

  it('when the seat is flat, then the washer joins the clamped stack and nothing is taken off the bolt', () => {
    // plane geometry: 40 − (2.5 washer + 14 wheel) = 23.5 mm
    const r = wheelFasteningChain({
      ...coneBolt,
      seat: { type: 'flat' },
      wheelSeat: { type: 'flat' },
      washerMm: 2.5,
      wheelClampMm: 14,
      boltLengthMm: 40,
    });
    expect(r.seatAllowanceMm).toBe(0);
    expect(r.stackMm).toBe(16.5);
    expect(r.engagement.engagementMm).toBe(23.5);
  });
});

describe('wheelFasteningChain: seats', () => {
  it('when a cone-seat bolt goes into a ball-seat wheel, then the seat check fails and a caution always follows', () => {
    // the wheel maker's seat governs (common practice, no source)
    const r = wheelFasteningChain({ ...coneBolt, wheelSeat: { type: 'ball', ballRadiusMm: 13 } });
    expect(check(r, 'seat')).toMatchObject({ ok: false });
    expect(r.cautions.join(' ')).toMatch(/wheel can come off/);
    // the rest of the chain still computes
    expect(check(r, 'engagement').ok).toBe(true);
  });

  it('when ball seats differ in radius, then they do not match; the same radius does', () => {
    const ball = { ...coneBolt, seat: { type: 'ball' as const, ballRadiusMm: 12, heightMm: 7 } };
    expect(check(wheelFasteningChain({ ...ball, wheelSeat: { type: 'ball', ballRadiusMm: 14 } }), 'seat').ok).toBe(false);
    const same = wheelFasteningChain({ ...ball, wheelSeat: { type: 'ball', ballRadiusMm: 12 } });
    expect(check(same, 'seat').ok).toBe(true);
    expect(same.cautions).toEqual([]);
    expect(same.seatAllowanceMm).toBe(7);
  });
});

describe('wheelFasteningChain: what the thread screws into', () => {
  it('when the bolt reaches the bottom of a blind hub hole, then it bottoms out and clamps nothing', () => {
    // plane geometry: reach 21 mm into a 20 mm blind hole
    const r = wheelFasteningChain({ ...coneBolt, hubThreadDepthMm: 20, hole: 'blind' });
    expect(r.engagement.bottomsOut).toBe(true);
    expect(check(r, 'bottoming')).toMatchObject({ ok: false, valueMm: 21, marginMm: -1, source: 'plane geometry' });
    expect(check(r, 'engagement').ok).toBe(false);
    expect(r.cautions.join(' ')).toMatch(/clamps nothing/);
  });

  it('when the bolt passes through an open hub hole, then its tip behind the hub is checked against the measured clearance', () => {
    // plane geometry: reach 21, hub thread 15 → the tip stands 6 mm behind the hub
    const tight = wheelFasteningChain({ ...coneBolt, hubThreadDepthMm: 15, hole: 'through', clearanceBehindHubMm: 4 });
    expect(tight.engagement.limitedBy).toBe('hub_thread');
    expect(tight.engagement.engagementMm).toBe(15);
    expect(check(tight, 'too-long')).toMatchObject({ ok: false, valueMm: 6, marginMm: -2 });
    expect(tight.cautions.join(' ')).toMatch(/too long/);
    const roomy = wheelFasteningChain({ ...coneBolt, hubThreadDepthMm: 15, hole: 'through', clearanceBehindHubMm: 8 });
    expect(check(roomy, 'too-long')).toMatchObject({ ok: true, marginMm: 2 });
  });

  it('when wheel bolts screw into an aluminium bolt-on spacer, then the aluminium rule applies even on a steel hub', () => {
    // common practice, no source: 1.5 × d in aluminium → 18 mm for M12; the spacer's 25 mm holes are blind against the hub
    const r = wheelFasteningChain({
      ...coneBolt,
      boltLengthMm: 40,
      spacer: { mounting: 'bolt_on', thicknessMm: 25, material: 'aluminium' },
    });
    expect(r.into).toBe('spacer');
    expect(r.material).toBe('aluminium');
    expect(r.engagement.requiredMm).toBe(18);
    expect(r.engagement.engagementMm).toBe(16);
    expect(check(r, 'engagement')).toMatchObject({ ok: false, marginMm: -2 });
    expect(check(r, 'engagement').rule).toMatch(/aluminium/);
    expect(check(r, 'bottoming').ok).toBe(true);
  });

  it('when a slip-on spacer goes in, then it joins the stack and the hub spigot loses its thickness', () => {
    // plane geometry: stack 18 + 8 = 26 → reach 13; spigot 10 − 8 = 2 mm left in the wheel bore
    const r = wheelFasteningChain({
      ...coneBolt,
      spacer: { mounting: 'slip_on', thicknessMm: 8, material: 'aluminium' },
      hubSpigotLengthMm: 10,
    });
    expect(r.stackMm).toBe(26);
    expect(r.engagement.engagementMm).toBe(13);
    expect(r.material).toBe('steel');
    expect(check(r, 'spigot')).toMatchObject({ ok: true, valueMm: 2, marginMm: 2 });
    const swallowed = wheelFasteningChain({
      ...coneBolt,
      boltLengthMm: 60,
      spacer: { mounting: 'slip_on', thicknessMm: 12, material: 'aluminium' },
      hubSpigotLengthMm: 10,
    });
    expect(check(swallowed, 'spigot')).toMatchObject({ ok: false, valueMm: -2 });
    expect(swallowed.cautions.join(' ')).toMatch(/hub-centric spacer/);
  });

  it('when a unified stud carries an open nut, then the nut thread limits the engagement', () => {
    // 1/2-20 UNF: 1.0 × d = 12.7 mm (common practice, no source); stud 38 − wheel 12 = 26 mm reach, nut thread 14 mm
    const r = wheelFasteningChain({
      fastener: 'stud_nut',
      thread: '1/2-20 UNF',
      seat: { type: 'cone60' },
      wheelSeat: { type: 'cone60' },
      wheelClampMm: 12,
      hubMaterial: 'aluminium',
      studLengthMm: 38,
      nutThreadMm: 14,
    });
    expect(r.into).toBe('nut');
    expect(r.material).toBe('steel');
    expect(r.thread.label).toBe('1/2-20 UNF');
    expect(r.engagement.limitedBy).toBe('hub_thread');
    within(r.engagement.requiredMm, 12.7, 1e-9);
    within(check(r, 'engagement').marginMm!, 1.3, 1e-9);
    expect(check(r, 'engagement').ok).toBe(true);
    expect(r.checks.find((c) => c.id === 'bottoming')).toBeUndefined();
  });

  it('when a stud reaches the end of a closed nut, then the nut bottoms out', () => {
    // plane geometry: reach 26 mm into a closed nut threaded 20 mm deep
    const r = wheelFasteningChain({
      fastener: 'stud_nut',
      thread: '7/16-20',
      seat: { type: 'cone60' },
      wheelSeat: { type: 'cone60' },
      wheelClampMm: 12,
      hubMaterial: 'steel',
      studLengthMm: 38,
      nutThreadMm: 20,
      nutClosed: true,
    });
    expect(check(r, 'bottoming')).toMatchObject({ ok: false, marginMm: -6 });
    expect(r.cautions.join(' ')).toMatch(/closed nut/);
  });
});

describe('hub-centric ring', () => {
  it('when the wheel bore is larger than the hub spigot, then a ring from the wheel bore to the spigot is needed', () => {
    // plane geometry: ring outer = wheel bore, inner = hub spigot
    expect(hubCentricRing(57.1, 66.6)).toEqual({
      needed: true,
      outerDiameterMm: 66.6,
      innerDiameterMm: 57.1,
      label: '66.6 → 57.1 mm',
    });
    expect(hubCentricRing(57.1, 57.1)).toMatchObject({ needed: false });
    expect(hubCentricRing(66.6, 57.1)).toBeNull();
  });

  it('when both bores are in the chain, then the centre-bore check passes only if the wheel fits over the spigot', () => {
    const fits = wheelFasteningChain({ ...coneBolt, hubBoreMm: 57.1, wheelBoreMm: 66.6 });
    expect(fits.hubRing).toMatchObject({ needed: true });
    expect(check(fits, 'centre-bore').ok).toBe(true);
    const tooSmall = wheelFasteningChain({ ...coneBolt, hubBoreMm: 66.6, wheelBoreMm: 57.1 });
    expect(tooSmall.hubRing).toBeNull();
    expect(check(tooSmall, 'centre-bore')).toMatchObject({ ok: false });
    within(check(tooSmall, 'centre-bore').marginMm!, -9.5, 1e-9);
  });
});

describe('wheelFasteningChain: bad input', () => {
  it.each([
    [{ fastener: 'rivet' }, 'fastener'],
    [{ thread: 'M12' }, 'thread'],
    [{ seat: { type: 'square' } }, 'seat.type'],
    [{ seat: { type: 'cone60' } }, 'seat.heightMm'],
    [{ seat: { type: 'ball', heightMm: 6 } }, 'seat.ballRadiusMm'],
    [{ wheelSeat: { type: 'ball' } }, 'wheelSeat.ballRadiusMm'],
    [{ wheelClampMm: 0 }, 'wheelClampMm'],
    [{ washerMm: 2 }, 'washerMm'],
    [{ hubMaterial: 'titanium' }, 'hubMaterial'],
    [{ boltLengthMm: undefined }, 'boltLengthMm'],
    [{ boltLengthFrom: 'tip' }, 'boltLengthFrom'],
    [{ hole: 'open' }, 'hole'],
    [{ hubThreadDepthMm: -3 }, 'hubThreadDepthMm'],
    [{ spacer: { mounting: 'glued', thicknessMm: 5, material: 'steel' } }, 'spacer.mounting'],
    [{ spacer: { mounting: 'slip_on', thicknessMm: 0, material: 'steel' } }, 'spacer.thicknessMm'],
    [{ spacer: { mounting: 'bolt_on', thicknessMm: 20, material: 'wood' } }, 'spacer.material'],
    [{ hubThreadDepthMm: 15, hole: 'through', clearanceBehindHubMm: -1 }, 'clearanceBehindHubMm'],
    [{ hubSpigotLengthMm: 0 }, 'hubSpigotLengthMm'],
    [{ hubBoreMm: 57.1, wheelBoreMm: Number.NaN }, 'wheelBoreMm'],
    [{ fastener: 'stud_nut', nutThreadMm: 14 }, 'studLengthMm'],
    [{ fastener: 'stud_nut', studLengthMm: 38 }, 'nutThreadMm'],
  ])('when given %j, then field %s is named', (change, field) => {
    const input = { ...coneBolt, ...change } as WheelFasteningInput;
    expect(() => wheelFasteningChain(input)).toThrow(FitmentInputError);
    expect(() => wheelFasteningChain(input)).toThrow(expect.objectContaining({ field }));
  });

  it('when given nothing, then it is refused', () => {
    expect(() => wheelFasteningChain(null as never)).toThrow(FitmentInputError);
  });
});
