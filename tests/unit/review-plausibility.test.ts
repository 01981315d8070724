import { describe, expect, it } from 'vitest';
import { automaticChecks } from '../../shared/review-checks';
import {
  implausibleTorques,
  proofLoadTorqueNm,
  routesMissingCalipers,
  savingsFromOneSidedLabour,
} from '../../shared/review-plausibility';
import { swapDataSchema, type SwapDataInput } from '../../shared/schemas/swap-data';

// The review checks judge whether figures are believable: a torque no fastener of its kind takes, a cost list where
// only one route pays for the calipers, a saving that comes from labour counted on the new kit's side only.

const caliperPart = {
  role: 'Front caliper',
  kind: 'caliper' as const,
  name: 'Vela four-piston fixed front caliper, left',
  maker: 'Orsino',
  partNumbers: ['OV-355-104-L'],
  quantity: 2,
};

function record(extra: Partial<SwapDataInput> = {}) {
  return swapDataSchema.parse({
    schemaVersion: 2,
    title: 'Vela four-piston calipers on 330 mm rotors',
    parts: [caliperPart],
    fasteners: [
      { id: 'radial-bolts', kind: 'caliper_mount', label: 'Caliper to bracket', thread: 'M10x1.25', propertyClass: '12.9' },
      { id: 'wheel-bolts', kind: 'wheel', label: 'Wheel bolts', thread: 'M12x1.5', propertyClass: '10.9' },
    ],
    torque: [
      { fastenerId: 'radial-bolts', nm: 60 },
      { fastenerId: 'wheel-bolts', nm: 110 },
    ],
    costs: [
      { route: 'as_built', item: 'Vela calipers, pair, used', amountMinor: 32000 },
      { route: 'as_built', item: 'Adapter kit', amountMinor: 18500 },
      { route: 'new_kit', item: 'Vela calipers, pair, new', amountMinor: 98000 },
      { route: 'new_kit', item: 'Adapter kit', amountMinor: 18500 },
    ],
    ...extra,
  });
}

const checkOf = (data: ReturnType<typeof record>, id: string) =>
  automaticChecks({
    data,
    body: '',
    photoCount: 1,
    chassis: { wheelBoltThread: 'M12×1.5' },
    axle: 'front',
    category: 'brakes',
    duplicates: [],
  }).find((c) => c.id === id)!;

const withWheelTorque = (nm: number, fastener: object = {}) =>
  record({
    fasteners: [
      { id: 'radial-bolts', kind: 'caliper_mount', label: 'Caliper to bracket', thread: 'M10x1.25', propertyClass: '12.9' },
      { id: 'wheel-bolts', kind: 'wheel', label: 'Wheel bolts', thread: 'M12x1.5', propertyClass: '10.9', ...fastener },
    ],
    torque: [
      { fastenerId: 'radial-bolts', nm: 60 },
      { fastenerId: 'wheel-bolts', nm },
    ],
  });

describe('proof-load torque of a fastener', () => {
  it('when the thread is M12×1.5 class 10.9, then the ceiling is about 263 N·m', () => {
    // ISO 898-1: A_s = π/4 (d − 0.9382 P)² = π/4 (12 − 1.4073)² = 88.13 mm² (the standard's table: 88.1 mm², from memory);
    // proof stress 830 MPa (from memory) → 73.15 kN; T = 0.3 × 73.15 kN × 12 mm = 263.3 N·m (nut factor 0.3, from memory)
    expect(proofLoadTorqueNm({ thread: 'M12x1.5', propertyClass: '10.9' })!.nm).toBeCloseTo(263.3, 0);
  });

  it('when no class is stated, then the strongest common class (12.9) is assumed and said', () => {
    // A_s = π/4 (10 − 0.9382 × 1.25)² = 61.20 mm²; × 970 MPa = 59.36 kN; × 0.3 × 10 mm = 178.1 N·m
    const ceiling = proofLoadTorqueNm({ thread: 'M10x1.25', propertyClass: '' })!;
    expect(ceiling.nm).toBeCloseTo(178.1, 0);
    expect(ceiling.label).toContain('the strongest assumed');
  });

  it('when the thread is unified, then its ASME B1.1 stress area is used', () => {
    // 1/2-20 UNF: A_s = 0.7854 (0.5 − 0.9743/20)² = 0.1600 in² = 103.2 mm² (ASME B1.1 table: 0.1599 in², from memory);
    // × 970 MPa × 0.3 × 12.7 mm = 381 N·m
    expect(proofLoadTorqueNm({ thread: '1/2-20 UNF', propertyClass: '' })!.nm).toBeCloseTo(381.5, 0);
  });

  it('when the thread cannot be read, then there is no ceiling rather than a guess', () => {
    expect(proofLoadTorqueNm({ thread: 'stock', propertyClass: '10.9' })).toBeNull();
    expect(proofLoadTorqueNm({ thread: '', propertyClass: '10.9' })).toBeNull();
  });
});

describe('implausible torque', () => {
  it('when a wheel bolt is given 1,000 N·m, then the torque check needs a fix, naming the usual range, its basis and the proof load', () => {
    const check = checkOf(withWheelTorque(1000), 'torque');
    expect(check.status).toBe('fail');
    expect(check.detail).toContain('1000 N·m for Wheel bolts is outside 60–200 N·m');
    expect(check.detail).toContain('common practice, no source');
    expect(check.detail).toContain('past its proof load at about 263 N·m');
  });

  it('when a wheel bolt is given 110 N·m, then nothing is said about it', () => {
    expect(implausibleTorques(withWheelTorque(110))).toEqual([]);
    expect(checkOf(withWheelTorque(110), 'torque').status).toBe('pass');
  });

  it('when a wheel bolt is given 35 N·m (a figure in the wrong unit, or a guide pin’s), then it is below the range', () => {
    const problems = implausibleTorques(withWheelTorque(35));
    expect(problems).toHaveLength(1);
    expect(problems[0]).toContain('outside 60–200 N·m');
  });

  it('when a figure is inside the usual range but beyond the bolt’s proof load, then only the proof load speaks', () => {
    // an M8×1.25 class 8.8 bracket bolt: A_s = 36.6 mm² × 580 MPa × 0.3 × 8 mm = 51.0 N·m; 90 N·m is usual for brackets
    const data = record({
      fasteners: [{ id: 'b', kind: 'bracket_mount', label: 'Bracket bolts', thread: 'M8x1.25', propertyClass: '8.8' }],
      torque: [{ fastenerId: 'b', nm: 90 }],
    });
    const problems = implausibleTorques(data);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(/past its proof load at about 51 N·m/);
  });
});

describe('costs compared like for like', () => {
  it('when only the as-built route pays for the calipers, then the costs ask for a closer look naming the route that leaves them out', () => {
    const data = record({
      costs: [
        { route: 'as_built', item: 'Vela calipers, pair, used', amountMinor: 32000 },
        { route: 'as_built', item: 'Adapter kit', amountMinor: 18500 },
        { route: 'budget', item: 'Adapter kit', amountMinor: 18500 },
      ],
    });
    expect(routesMissingCalipers(data)).toContain('only as built has a line for the calipers; budget leaves them out');
    const check = checkOf(data, 'costs');
    expect(check.status).toBe('attention');
  });

  it('when a route names the calipers by part number only, then it counts as their line', () => {
    const data = record({
      costs: [
        { route: 'as_built', item: 'OV 355 104 L pair', amountMinor: 32000 },
        { route: 'new_kit', item: 'Vela calipers, pair, new', amountMinor: 98000 },
      ],
    });
    expect(routesMissingCalipers(data)).toBeNull();
  });

  it('when the record fits no caliper, or prices one route, then the calipers are not asked for', () => {
    expect(routesMissingCalipers(record({ parts: [{ ...caliperPart, kind: 'spacer', name: 'Spacer 10 mm' }] }))).toBeNull();
    expect(routesMissingCalipers(record({ costs: [{ route: 'budget', item: 'Adapter kit', amountMinor: 100 }] }))).toBeNull();
  });

  it('when the new kit counts workshop labour and the as-built route none, then the saving is shown like for like', () => {
    const data = record({
      costs: [
        { route: 'as_built', item: 'Vela calipers, pair, used', amountMinor: 50000 },
        { route: 'new_kit', item: 'Vela calipers, pair, new', amountMinor: 52000 },
        { route: 'new_kit', item: 'Workshop labour, 3 h', amountMinor: 24000 },
      ],
    });
    // saving 76,000 − 50,000 = 26,000; labour 24,000 on one side only → 2,000 like for like
    expect(savingsFromOneSidedLabour(data)).toEqual([
      'As built reads EUR 260.00 cheaper than the new kit, but the new kit counts EUR 240.00 of labour and as built none; like for like the saving is EUR 20.00. Count labour on both sides or on neither',
    ]);
    expect(checkOf(data, 'costs').status).toBe('attention');
  });

  it('when the saving is all labour, then it says there is none like for like', () => {
    const data = record({
      costs: [
        { route: 'budget', item: 'Vela calipers, pair, used', amountMinor: 60000 },
        { route: 'new_kit', item: 'Vela calipers, pair, new', amountMinor: 52000 },
        { route: 'new_kit', item: 'Fitting fee', amountMinor: 24000 },
      ],
    });
    expect(savingsFromOneSidedLabour(data)[0]).toContain('like for like there is no saving');
  });

  it('when labour is counted on the route’s side only, or on both, then no saving comes from it', () => {
    const routeOnly = record({
      costs: [
        { route: 'as_built', item: 'Vela calipers, pair, used', amountMinor: 32000 },
        { route: 'as_built', item: 'Workshop labour, 3 h', amountMinor: 24000 },
        { route: 'new_kit', item: 'Vela calipers, pair, new', amountMinor: 98000 },
      ],
    });
    expect(savingsFromOneSidedLabour(routeOnly)).toEqual([]);
    const both = record({
      costs: [
        { route: 'as_built', item: 'Vela calipers, pair, used', amountMinor: 32000 },
        { route: 'as_built', item: 'Labour', amountMinor: 24000 },
        { route: 'new_kit', item: 'Vela calipers, pair, new', amountMinor: 98000 },
        { route: 'new_kit', item: 'Labour', amountMinor: 24000 },
      ],
    });
    expect(savingsFromOneSidedLabour(both)).toEqual([]);
    expect(checkOf(both, 'costs').status).toBe('pass');
  });

  it('when a part line merely says “fitting kit”, then it is not taken for labour', () => {
    const data = record({
      costs: [
        { route: 'as_built', item: 'Vela calipers, pair, used', amountMinor: 32000 },
        { route: 'new_kit', item: 'Vela calipers, pair, new', amountMinor: 98000 },
        { route: 'new_kit', item: 'Hose fitting kit', amountMinor: 2000 },
      ],
    });
    expect(savingsFromOneSidedLabour(data)).toEqual([]);
  });
});
