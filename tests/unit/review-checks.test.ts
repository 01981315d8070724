import { describe, expect, it } from 'vitest';
import {
  automaticChecks,
  donorCaliperKeys,
  requiredFasteners,
  sameDonorCaliper,
  type ReviewCheckInput,
} from '../../shared/review-checks';
import type { z } from 'zod';
import { swapDataSchema, testedWheelSchema, type SwapDataInput } from '../../shared/schemas/swap-data';
import type { CheckResult } from '../../shared/schemas/submissions';

const caliper = {
  role: 'Front caliper',
  kind: 'caliper' as const,
  name: 'Vela four-piston fixed front caliper, left',
  maker: 'Orsino',
  partNumbers: ['OV-355-104-L'],
  cameOn: ['Orsino Vela 3.0 (1994–1998)'],
  quantity: 1,
};

const disc = (pistonsPerSideMm: number[], rotorDiameterMm: number, padHeightMm: number) => ({
  kind: 'disc' as const,
  pistonsPerSideMm,
  rotorDiameterMm,
  padHeightMm,
});

// Textbook disc-brake torque (REFERENCES.md, Brakes): stock front 1 × 54 mm on 280/50, swapped front 40 + 44 mm per
// side on 330/55, rear 1 × 38 mm on 280/40 → front share 65.93 % → 73.72 %, a shift of +7.79 points.
const referenceBrakes = {
  before: { front: disc([54], 280, 50), rear: disc([38], 280, 40) },
  after: { front: disc([40, 44], 330, 55), rear: disc([38], 280, 40) },
};

const fits16 = { diameterIn: 16, widthIn: 7, offsetMm: 38, outcome: 'fits' as const, radialClearanceMm: 6, spokeClearanceMm: 5 };

function record(extra: Partial<SwapDataInput> = {}) {
  return swapDataSchema.parse({
    schemaVersion: 2,
    title: 'Vela four-piston calipers on 330 mm rotors',
    parts: [caliper],
    adapter: {
      name: 'H31 radial caliper bracket',
      maker: 'Northgate Fabrication',
      partNumber: 'NF-H31-VB',
      hardwareIncluded: ['M12 caliper bolts, 4'],
    },
    rotors: [{ axle: 'front', diameterMm: 330, thicknessMm: 28, vented: true }],
    fasteners: [
      { id: 'radial-bolts', kind: 'caliper_mount', label: 'Caliper to bracket', thread: 'M10x1.25' },
      { id: 'bracket-bolts', kind: 'bracket_mount', label: 'Bracket to knuckle', thread: 'M12x1.5' },
    ],
    torque: [
      { fastenerId: 'radial-bolts', nm: 55 },
      { fastenerId: 'bracket-bolts', nm: 95 },
    ],
    wheel: { minDiameterIn: 16, caliperRadialProjectionMm: 12, caliperOutboardMm: 30, testedWheels: [fits16] },
    costs: [{ route: 'as_built', item: 'Used calipers', amountMinor: 32000 }],
    ...extra,
  });
}

function run(over: Partial<ReviewCheckInput> & { extra?: Partial<SwapDataInput> } = {}): Record<string, CheckResult> {
  const { extra, ...rest } = over;
  const results = automaticChecks({
    data: record(extra),
    body: 'Fitted over a weekend.',
    photoCount: 2,
    chassis: { wheelBoltThread: 'M12×1.5' },
    axle: 'front',
    category: 'brakes',
    duplicates: [],
    ...rest,
  });
  return Object.fromEntries(results.map((r) => [r.id, r]));
}

/** bolts into a steel hub, as recorded for the chassis (invented figures) */
const haldenHub = {
  wheelBoltThread: 'M12×1.5',
  centreBoreMm: 66.6,
  wheelFastening: {
    fastener: 'bolt' as const,
    seat: 'cone60' as const,
    stockLengthMm: 26,
    lengthFrom: 'seat_end' as const,
    nutClosed: false,
    hubMaterial: 'steel' as const,
    front: { threadDepthMm: 16, hole: 'through' as const, spigotLengthMm: 9 },
    rear: {},
  },
};

const wheelWith = (testedWheels: z.input<typeof testedWheelSchema>[]) => ({
  minDiameterIn: 16,
  caliperRadialProjectionMm: 12,
  caliperOutboardMm: 30,
  testedWheels,
});

describe('automaticChecks', () => {
  it('when the record is complete, then every check passes and they come in a fixed order', () => {
    const results = automaticChecks({
      data: record({ brakes: { ...referenceBrakes, after: { ...referenceBrakes.before, front: disc([54], 330, 50) } } }),
      body: '',
      photoCount: 1,
      chassis: haldenHub,
      axle: 'front',
      category: 'brakes',
      duplicates: [],
    });
    expect(results.map((r) => r.id)).toEqual([
      'required',
      'photos',
      'torque',
      'clearance',
      'fastening',
      'caliper_fit',
      'figures',
      'balance',
      'costs',
      'duplicate',
    ]);
    expect(results.filter((r) => r.status !== 'pass').map((r) => `${r.id}: ${r.detail}`)).toEqual([
      // 280 → 330 mm front rotor, same pistons: +4.2 points forward, within the advisory threshold
    ]);
  });

  it('when a brakes record has no wheel requirement, then required fields and clearance fail', () => {
    const r = run({ extra: { wheel: null } });
    expect(r.required.status).toBe('fail');
    expect(r.required.detail).toMatch(/wheel requirement/);
    expect(r.clearance.status).toBe('fail');
  });

  it('when the category needs no wheel and no wheel parts are listed, then a missing wheel requirement is fine', () => {
    const r = run({
      category: 'suspension',
      extra: {
        wheel: null,
        parts: [{ ...caliper, kind: 'line', name: 'Braided hose set' }],
        adapter: null,
        rotors: [],
        fasteners: [],
        torque: [],
      },
    });
    expect(r.required.status).toBe('pass');
    expect(r.clearance.status).toBe('pass');
  });

  it('when there is no photo, then the photo check fails', () => {
    expect(run({ photoCount: 0 }).photos.status).toBe('fail');
    expect(run({ photoCount: 1 }).photos.status).toBe('pass');
  });

  describe('torque rows point at the record’s fasteners', () => {
    it('needs caliper and bracket fasteners when the record fits a caliper and an adapter', () => {
      expect(requiredFasteners(record()).map((f) => f.kind)).toEqual(['caliper_mount', 'bracket_mount']);
    });

    it('when a wheel-bolt row mentions the adapter bolts’ thread, then it does not stand in for them (no keyword matching)', () => {
      // before version 2, "Wheel bolts M12×1.5" satisfied the adapter's "M12×1.5 × 35 bolts" by sharing the thread
      const r = run({
        extra: {
          fasteners: [
            { id: 'radial-bolts', kind: 'caliper_mount', label: 'Caliper to bracket' },
            { id: 'wheel-bolts', kind: 'wheel', label: 'Wheel bolts M12×1.5', thread: 'M12x1.5' },
          ],
          torque: [
            { fastenerId: 'radial-bolts', nm: 55 },
            { fastenerId: 'wheel-bolts', nm: 110 },
          ],
        },
      });
      expect(r.torque.status).toBe('fail');
      expect(r.torque.detail).toContain('No bracket or adapter bolts listed');
    });

    it('when a listed fastener has no torque row, then it fails naming that fastener', () => {
      const r = run({ extra: { torque: [{ fastenerId: 'radial-bolts', nm: 55 }] } });
      expect(r.torque.status).toBe('fail');
      expect(r.torque.detail).toContain('No torque value for Bracket to knuckle');
    });

    it('when a torque row points at no listed fastener, then the record does not validate', () => {
      expect(() => record({ torque: [{ fastenerId: 'ghost', nm: 10 }] })).toThrow(/Pick one of the fasteners/);
    });

    it('when bolt-on spacers are fitted, then spacer-to-hub fasteners and wheel bolts are needed', () => {
      const spacers = [{ axle: 'front' as const, thicknessMm: 20, hubCentric: true, mounting: 'bolt_on' as const, quantity: 2 }];
      const r = run({ extra: { spacers } });
      expect(r.torque.status).toBe('fail');
      expect(r.torque.detail).toContain('spacer-to-hub');
      expect(r.torque.detail).toContain('wheel bolts');
      const base = record();
      const fixed = run({
        extra: {
          spacers,
          fasteners: [
            ...base.fasteners,
            { id: 'spacer-nuts', kind: 'spacer_mount', label: 'Spacer to hub nuts' },
            { id: 'wheel', kind: 'wheel', label: 'Wheel bolts' },
          ],
          torque: [...base.torque, { fastenerId: 'spacer-nuts', nm: 110 }, { fastenerId: 'wheel', nm: 110 }],
        },
      });
      expect(fixed.torque.status).toBe('pass');
    });

    it('when nothing that takes a torque is listed, then it passes and says so', () => {
      const r = run({
        category: 'repair',
        extra: {
          parts: [{ ...caliper, kind: 'pad', name: 'Sport pads' }],
          adapter: null,
          fasteners: [],
          torque: [],
          wheel: null,
        },
      });
      expect(r.torque.status).toBe('pass');
      expect(r.torque.detail).toMatch(/No fasteners/);
    });
  });

  describe('clearance: measured before estimated (3 mm is a rule of thumb: common practice, no source)', () => {
    it('when a record documents a wheel that does not fit beside one that does, then it passes and counts it', () => {
      // before version 2 any tested wheel under 3 mm failed the record, so documenting a misfit was punished
      const r = run({
        extra: {
          wheel: wheelWith([
            fits16,
            { diameterIn: 15, widthIn: 6, offsetMm: 38, outcome: 'does_not_fit', radialClearanceMm: -9 },
          ]),
        },
      });
      expect(r.clearance.status).toBe('pass');
      expect(r.clearance.detail).toContain('1 wheel that does not fit');
      expect(r.clearance.detail).toContain('least clearance is 5 mm');
    });

    it('when a measurement exists, then the nominal-diameter estimate does not override it', () => {
      // the estimate for a 16″ barrel (16 × 25.4 − 28 = 378.4 mm) leaves 378.4/2 − (165 + 26) = −1.8 mm, but the
      // wheel was measured at 4 mm: the measurement stands
      const r = run({
        extra: { wheel: { ...wheelWith([{ ...fits16, radialClearanceMm: 4 }]), caliperRadialProjectionMm: 26 } },
      });
      expect(r.clearance.status).toBe('pass');
    });

    it('when the only wheel that fits was measured under 3 mm, then it asks for a look, not a failure', () => {
      const r = run({ extra: { wheel: wheelWith([{ ...fits16, spokeClearanceMm: 1.5 }]) } });
      expect(r.clearance.status).toBe('attention');
      expect(r.clearance.detail).toContain('1.5 mm at the spokes');
    });

    it('when a wheel marked as fitting was measured overlapping, then the record contradicts itself and fails', () => {
      const r = run({ extra: { wheel: wheelWith([{ ...fits16, radialClearanceMm: -2 }]) } });
      expect(r.clearance.status).toBe('fail');
      expect(r.clearance.detail).toContain('overlap the caliper by 2 mm');
    });

    it('when no fitting wheel was measured, then the fit rests on estimates and needs attention', () => {
      const r = run({ extra: { wheel: wheelWith([]) } });
      expect(r.clearance.status).toBe('attention');
      expect(r.clearance.detail).toMatch(/estimates only/);
    });

    it('when a wheel below the stated minimum is recorded as fitting, then it needs attention', () => {
      const r = run({ extra: { wheel: wheelWith([fits16, { ...fits16, diameterIn: 15 }]) } });
      expect(r.clearance.status).toBe('attention');
      expect(r.clearance.detail).toContain('16″ minimum');
    });
  });

  describe('figures agree per axle', () => {
    it('when the rear rotor is smaller than the front, then each is held against its own axle', () => {
      // before version 2 the largest rotor of the record stood for both axles
      const r = run({
        extra: {
          rotors: [
            { axle: 'front', diameterMm: 330, thicknessMm: 28, vented: true },
            { axle: 'rear', diameterMm: 300, thicknessMm: 12, vented: false },
          ],
          brakes: { before: referenceBrakes.before, after: { front: disc([40, 44], 330, 55), rear: disc([38], 300, 44) } },
        },
      });
      expect(r.figures.status).toBe('pass');
    });

    it('when a rotor disagrees with the brake figures of its axle, then it fails naming both', () => {
      const r = run({
        extra: { brakes: referenceBrakes, rotors: [{ axle: 'front', diameterMm: 320, thicknessMm: 28, vented: true }] },
      });
      expect(r.figures.status).toBe('fail');
      expect(r.figures.detail).toContain('front rotor is 320 mm but the front brake figures say 330 mm');
    });

    it('when centring shims sit under radial ears, then they cannot centre the caliper', () => {
      const r = run({
        extra: {
          shims: [{ joint: 'caliper_to_bracket', direction: 'radial', thicknessMm: 1, quantity: 4 }],
          centring: { joint: 'caliper_to_bracket', gapMm: 1, positions: 4 },
        },
      });
      expect(r.figures.status).toBe('fail');
      expect(r.figures.detail).toContain('cannot centre it');
    });

    it('when the shims at the centring joint add up to the measured gap per bolt, then it passes', () => {
      // 4 × 1.0 + 4 × 0.5 = 6 mm over 4 bolt positions = 1.5 mm per bolt (arithmetic)
      const shims = [
        { joint: 'bracket_to_knuckle' as const, direction: 'axial' as const, thicknessMm: 1, quantity: 4 },
        { joint: 'bracket_to_knuckle' as const, direction: 'axial' as const, thicknessMm: 0.5, quantity: 4 },
      ];
      expect(run({ extra: { shims, centring: { joint: 'bracket_to_knuckle', gapMm: 1.5, positions: 4 } } }).figures.status).toBe(
        'pass',
      );
      const r = run({ extra: { shims, centring: { joint: 'bracket_to_knuckle', gapMm: 1.0, positions: 4 } } });
      expect(r.figures.status).toBe('fail');
      expect(r.figures.detail).toContain('1.5 mm per bolt, but the measured gap is 1 mm');
    });

    it('when a caliper’s bleed screw ends up at the bottom, then it fails', () => {
      const r = run({
        extra: {
          calipers: [
            {
              axle: 'front',
              name: 'Vela caliper, left on the right',
              type: 'fixed',
              pistons: [
                { diameterMm: 40, side: 'inboard' },
                { diameterMm: 40, side: 'outboard' },
              ],
              mount: { type: 'radial' },
              bleedScrewWhenFitted: 'bottom',
            },
          ],
        },
      });
      expect(r.figures.status).toBe('fail');
      expect(r.figures.detail).toContain('bleed screw at the bottom');
    });
  });

  describe('brake balance states its direction', () => {
    it('when the front share moves forward 7.79 points (the textbook brake chain), then it says so and that the fronts lock first', () => {
      const r = run({ extra: { brakes: referenceBrakes } });
      expect(r.balance.status).toBe('attention');
      expect(r.balance.detail).toContain('toward the front');
      expect(r.balance.detail).toContain('65.9 % → 73.7 %');
      expect(r.balance.detail).toContain('+7.8 points');
      expect(r.balance.detail).toContain('fronts still lock first');
    });

    it('when a larger rear rotor moves the share rearward, then it is a hazard about the rear locking first', () => {
      // textbook formula (REFERENCES.md): rear 38 mm on 280/40 → 38 mm on 330/44 raises rear torque; share 65.93 % → 61.97 %
      const after = { front: referenceBrakes.before.front, rear: disc([38], 330, 44) };
      const r = run({ extra: { brakes: { ...referenceBrakes, after }, rotors: [] } });
      expect(r.balance.status).toBe('attention');
      expect(r.balance.detail).toMatch(/^Hazard: Balance moves toward the rear/);
      expect(r.balance.detail).toContain('rears lock before the fronts');
      expect(r.balance.detail).not.toContain('toward the front');
    });
  });

  it('when no cost line is given, then the cost check fails; one route is enough', () => {
    expect(run({ extra: { costs: [] } }).costs.status).toBe('fail');
    expect(run().costs.detail).toContain('1 route');
  });

  it('when a likely duplicate is given, then it needs attention and links to it', () => {
    const r = run({ duplicates: [{ slug: 'h31-front-vela-four-piston-330', title: 'Vela calipers on the H31' }] });
    expect(r.duplicate.status).toBe('attention');
    expect(r.duplicate.link).toBe('/swaps/h31-front-vela-four-piston-330');
    expect(r.duplicate.detail).toContain('Vela calipers on the H31');
  });
});

describe('donor caliper identity', () => {
  it('matches by catalogue id or by part number regardless of separators and case', () => {
    const a = record();
    const b = record({ parts: [{ ...caliper, partNumbers: ['ov355104l'] }] });
    const c = record({ parts: [{ ...caliper, partNumbers: ['OV-355-105-L'] }] });
    const d = record({ parts: [{ ...caliper, partNumbers: [], partId: 7 }] });
    const e = record({ parts: [{ ...caliper, partNumbers: ['XX-1'], partId: 7 }] });
    expect(sameDonorCaliper(a, b)).toBe(true);
    expect(sameDonorCaliper(a, c)).toBe(false);
    expect(sameDonorCaliper(d, e)).toBe(true);
    expect([...donorCaliperKeys(e)]).toEqual(['id:7', 'pn:xx1']);
  });

  it('ignores part numbers of parts that are not calipers', () => {
    const a = record({ parts: [{ ...caliper, kind: 'rotor', name: 'Rotor 330' }] });
    expect(sameDonorCaliper(a, record())).toBe(false);
  });
});
