import { describe, expect, it } from 'vitest';
import {
  automaticChecks,
  donorCaliperKeys,
  fastenersOf,
  sameDonorCaliper,
  type ReviewCheckInput,
} from '../../shared/review-checks';
import { swapDataSchema, type SwapDataInput } from '../../shared/schemas/swap-data';
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

// Textbook disc-brake torque: stock front 1 × 54 mm on 280/50, swapped front 40 + 44 mm per side
// on 330/55, rear 1 × 38 mm on 280/40 → front share 65.93 % → 73.72 %, a shift of 7.79 points.
const referenceBrakes = {
  before: {
    front: { pistonsPerSideMm: [54], rotorDiameterMm: 280, padHeightMm: 50 },
    rear: { pistonsPerSideMm: [38], rotorDiameterMm: 280, padHeightMm: 40 },
  },
  after: {
    front: { pistonsPerSideMm: [40, 44], rotorDiameterMm: 330, padHeightMm: 55 },
    rear: { pistonsPerSideMm: [38], rotorDiameterMm: 280, padHeightMm: 40 },
  },
};

function record(extra: Partial<SwapDataInput> = {}) {
  return swapDataSchema.parse({
    title: 'Vela four-piston calipers on 330 mm rotors',
    parts: [caliper],
    adapter: {
      name: 'H31 radial caliper bracket',
      maker: 'Northgate Fabrication',
      partNumber: 'NF-H31-VB',
      hardwareIncluded: ['M12 caliper bolts, 4'],
    },
    rotors: [{ diameterMm: 330, thicknessMm: 28, vented: true }],
    torque: [
      { fastener: 'Caliper to bracket M12 bolts', nm: 85 },
      { fastener: 'Adapter bracket to knuckle', nm: 110 },
    ],
    wheel: { minDiameterIn: 16, caliperRadialProjectionMm: 12, caliperOutboardMm: 30 },
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

describe('automaticChecks', () => {
  it('when the record is complete, then every check passes and they come in a fixed order', () => {
    const results = automaticChecks({
      data: record(),
      body: '',
      photoCount: 1,
      chassis: { wheelBoltThread: 'M12×1.5' },
      axle: 'front',
      category: 'brakes',
      duplicates: [],
    });
    expect(results.map((r) => r.id)).toEqual(['required', 'photos', 'torque', 'clearance', 'balance', 'costs', 'duplicate']);
    // no brake figures on a brakes record: attention, never a pass or a fail
    expect(results.map((r) => r.status)).toEqual(['pass', 'pass', 'pass', 'pass', 'attention', 'pass', 'pass']);
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
      extra: { wheel: null, parts: [{ ...caliper, kind: 'line', name: 'Braided hose set' }], adapter: null, rotors: [] },
    });
    expect(r.required.status).toBe('pass');
    expect(r.clearance.status).toBe('pass');
  });

  it('when no category is given, then a listed caliper is what asks for the wheel requirement', () => {
    expect(run({ category: undefined, extra: { wheel: null } }).required.status).toBe('fail');
  });

  it('when there is no photo, then the photo check fails', () => {
    expect(run({ photoCount: 0 }).photos.status).toBe('fail');
    expect(run({ photoCount: 1 }).photos.status).toBe('pass');
  });

  describe('torque for every fastener', () => {
    it('lists the caliper, the adapter and each item of its included hardware', () => {
      const labels = fastenersOf(record()).map((f) => f.label);
      expect(labels).toEqual([
        'Vela four-piston fixed front caliper, left (mounting bolts)',
        'H31 radial caliper bracket',
        'M12 caliper bolts, 4',
      ]);
    });

    it('when the adapter has no torque row, then it fails naming the adapter', () => {
      // names the caliper and the M12 hardware, but neither "adapter" nor "bracket"
      const r = run({ extra: { torque: [{ fastener: 'Caliper to mount M12 bolts', nm: 85 }] } });
      expect(r.torque.status).toBe('fail');
      expect(r.torque.detail).toContain('H31 radial caliper bracket');
      expect(r.torque.detail).not.toContain('(mounting bolts) (needs');
    });

    it('when there are no torque rows at all, then every fastener is named as missing', () => {
      const r = run({ extra: { torque: [] } });
      expect(r.torque.status).toBe('fail');
      for (const label of ['Vela four-piston', 'H31 radial caliper bracket', 'M12 caliper bolts'])
        expect(r.torque.detail).toContain(label);
    });

    it('when a hardware part shares only a generic word with the torque rows, then it is still missing', () => {
      const r = run({ extra: { parts: [caliper, { ...caliper, kind: 'hardware', name: 'Banjo bolts', partNumbers: [] }] } });
      expect(r.torque.status).toBe('fail');
      expect(r.torque.detail).toContain('Banjo bolts');
      const fixed = run({
        extra: {
          parts: [caliper, { ...caliper, kind: 'hardware', name: 'Banjo bolts', partNumbers: [] }],
          torque: [...record().torque, { fastener: 'Banjo bolt at the caliper', nm: 30 }],
        },
      });
      expect(fixed.torque.status).toBe('pass');
    });

    it('when bolt-on spacers are fitted, then a spacer torque row is needed', () => {
      const spacers = [{ thicknessMm: 20, hubCentric: true, mounting: 'bolt_on' as const, quantity: 2 }];
      expect(run({ extra: { spacers } }).torque.status).toBe('fail');
      expect(
        run({ extra: { spacers, torque: [...record().torque, { fastener: 'Spacer to hub nuts', nm: 110 }] } }).torque.status,
      ).toBe('pass');
    });

    it('when nothing that takes a torque is listed, then it passes and says so', () => {
      const r = run({
        category: 'repair',
        extra: { parts: [{ ...caliper, kind: 'pad', name: 'Sport pads' }], adapter: null, torque: [], wheel: null },
      });
      expect(r.torque.status).toBe('pass');
      expect(r.torque.detail).toMatch(/No fasteners/);
    });
  });

  describe('radial clearance on the record’s own smallest wheel (common practice, no source: at least 3 mm)', () => {
    it('when the caliper clears a 16″ barrel, then it passes with the computed figure', () => {
      // barrel estimated as 16 × 25.4 − 28 = 378.4 mm (BARREL_ALLOWANCE_MM, common practice, no source);
      // clearance = 378.4 / 2 − (330 / 2 + 12) = 12.2 mm (geometry: radius difference)
      const r = run();
      expect(r.clearance.status).toBe('pass');
      expect(r.clearance.detail).toContain('12.2 mm');
    });

    it('when the caliper reaches within 3 mm of the barrel, then it fails', () => {
      // 378.4 / 2 − (330 / 2 + 22) = 2.2 mm < 3 mm
      const r = run({ extra: { wheel: { minDiameterIn: 16, caliperRadialProjectionMm: 22, caliperOutboardMm: 30 } } });
      expect(r.clearance.status).toBe('fail');
      expect(r.clearance.detail).toContain('2.2 mm');
    });

    it('when exactly 3 mm remain, then it passes (the rule is "not below 3 mm")', () => {
      // 378.4 / 2 − (330 / 2 + 21.2) = 3.0 mm
      expect(
        run({ extra: { wheel: { minDiameterIn: 16, caliperRadialProjectionMm: 21.2, caliperOutboardMm: 30 } } }).clearance.status,
      ).toBe('pass');
    });

    it('when tested wheels are given, then the smallest one is checked, with the barrel measured on the minimum wheel', () => {
      // barrel 380 mm measured on the 16″ minimum; the 17″ wheel adds 25.4 mm; the 16″ one is the smallest tested
      const wheel = {
        minDiameterIn: 16,
        barrelInnerDiameterMm: 360,
        caliperRadialProjectionMm: 12,
        caliperOutboardMm: 30,
        testedWheels: [
          { diameterIn: 17, widthIn: 7.5, offsetMm: 35 },
          { diameterIn: 16, widthIn: 7, offsetMm: 35 },
        ],
      };
      // 360 / 2 − (165 + 12) = 3 mm → pass; with 359 mm → 2.5 mm → fail
      expect(run({ extra: { wheel } }).clearance.status).toBe('pass');
      const r = run({ extra: { wheel: { ...wheel, barrelInnerDiameterMm: 359 } } });
      expect(r.clearance.status).toBe('fail');
      expect(r.clearance.detail).toContain('16″ wheel');
    });

    it('when a measured clearance on a tested wheel is below 3 mm, then it fails even if the estimate passes', () => {
      const wheel = {
        minDiameterIn: 16,
        caliperRadialProjectionMm: 12,
        caliperOutboardMm: 30,
        testedWheels: [{ diameterIn: 16, widthIn: 7, offsetMm: 35, spokeClearanceMm: 1.5 }],
      };
      const r = run({ extra: { wheel } });
      expect(r.clearance.status).toBe('fail');
      expect(r.clearance.detail).toContain('spokes 1.5 mm');
    });

    it('when no rotor diameter is known, then clearance needs attention instead of a verdict', () => {
      expect(run({ extra: { rotors: [], brakes: null } }).clearance.status).toBe('attention');
    });
  });

  describe('brake balance', () => {
    it('when the front share moves 7.79 points (the textbook brake chain), then it is flagged for attention', () => {
      const r = run({ extra: { brakes: referenceBrakes } });
      expect(r.balance.status).toBe('attention');
      expect(r.balance.detail).toContain('65.9 % → 73.7 %');
      expect(r.balance.detail).toContain('+7.8 points');
    });

    it('when the front share moves less than 5 points, then it passes', () => {
      // same textbook formula: only the front rotor grows to 300 mm → share 65.93 % → 67.78 %, +1.85 points
      const after = { ...referenceBrakes.before, front: { ...referenceBrakes.before.front, rotorDiameterMm: 300 } };
      const r = run({ extra: { brakes: { ...referenceBrakes, after } } });
      expect(r.balance.status).toBe('pass');
      expect(r.balance.detail).toContain('65.9 % → 67.8 %');
      expect(r.balance.detail).toContain('+1.8 points');
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
