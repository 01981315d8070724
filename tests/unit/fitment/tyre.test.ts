import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  IMPLIED_ASPECT_RATIO,
  LOAD_INDEX_KG,
  loadIndexKg,
  parseTyreSize,
  SPEED_SYMBOLS,
  speedCapability,
  speedSymbolKmh,
  tyreGeometry,
  tyreLoadCheck,
} from '../../../shared/fitment/tyre';
import { FitmentInputError } from '../../../shared/fitment/errors';

describe('parseTyreSize', () => {
  it('reads width / aspect ratio, construction and rim', () => {
    // tyre code convention: width mm / aspect % / R radial / rim in
    expect(parseTyreSize('225/45R17')).toEqual({ widthMm: 225, aspectRatio: 45, construction: 'R', rimIn: 17 });
  });

  it('reads load index and speed rating after a ZR size', () => {
    // tyre code convention: service description follows the size
    expect(parseTyreSize('225/45ZR17 94W')).toEqual({
      widthMm: 225,
      aspectRatio: 45,
      construction: 'ZR',
      rimIn: 17,
      loadIndex: 94,
      speedRating: 'W',
    });
  });

  it('accepts the P prefix, lower case and stray spaces', () => {
    // tyre code convention: P = passenger tyre
    expect(parseTyreSize('P215/60R16')).toEqual({ widthMm: 215, aspectRatio: 60, construction: 'R', rimIn: 16, prefix: 'P' });
    expect(parseTyreSize('  p 215 / 60 r 16  ')).toEqual(parseTyreSize('P215/60R16'));
    expect(parseTyreSize('205/55 zr16  91 v')).toMatchObject({ construction: 'ZR', loadIndex: 91, speedRating: 'V' });
  });

  it('reads a speed rating without load index and a (Y) rating', () => {
    // tyre code convention
    expect(parseTyreSize('245/35ZR19 Y')).toMatchObject({ speedRating: 'Y' });
    expect(parseTyreSize('245/35ZR19 93(Y)')).toMatchObject({ loadIndex: 93, speedRating: '(Y)' });
    expect(parseTyreSize('245/35ZR19 93')).toMatchObject({ loadIndex: 93 });
    expect(parseTyreSize('245/35ZR19 93')).not.toHaveProperty('speedRating');
  });

  it.each([
    '',
    '225/45',
    '225/45R',
    '225-45R17',
    '22/45R17',
    '225/45X17',
    '225/4R17',
    '225/45R17 94X',
    '225/45R17 94I',
    '225/45R1794W',
    '225/45R17 300W',
    '050/45R17',
    '225/10R17',
    '225/45R40',
  ])('rejects %j with field "code"', (code) => {
    expect(() => parseTyreSize(code)).toThrow(FitmentInputError);
    expect(() => parseTyreSize(code)).toThrow(expect.objectContaining({ field: 'code' }));
  });

  it('rejects a non-string', () => {
    expect(() => parseTyreSize(225 as unknown as string)).toThrow(expect.objectContaining({ field: 'code' }));
  });
});

describe('tyreGeometry', () => {
  // tyre code convention: sidewall = w × AR/100; Ø = 25.4 × rim + 2 × sidewall; C = πØ
  const rows = [
    { code: '225/45R17', sidewall: 101.25, diameter: 634.3, circumference: 1992.71, revsPerKm: 501.83 },
    { code: '205/55R16', sidewall: 112.75, diameter: 631.9, circumference: 1985.17, revsPerKm: 503.73 },
  ];
  for (const row of rows) {
    it(`matches the reference table for ${row.code}`, () => {
      const g = tyreGeometry(row.code);
      // recomputed from the formula, then against the printed table (± 0.01)
      const w = parseTyreSize(row.code);
      const sidewall = (w.widthMm * w.aspectRatio) / 100;
      const diameter = 25.4 * w.rimIn + 2 * sidewall;
      expect(g.sidewallMm).toBeCloseTo(sidewall, 9);
      expect(g.diameterMm).toBeCloseTo(diameter, 9);
      expect(g.circumferenceMm).toBeCloseTo(Math.PI * diameter, 9);
      expect(g.revsPerMile).toBeCloseTo(1_609_344 / (Math.PI * diameter), 9);
      expect(Math.abs(g.sidewallMm - row.sidewall)).toBeLessThanOrEqual(0.01);
      expect(Math.abs(g.diameterMm - row.diameter)).toBeLessThanOrEqual(0.01);
      expect(Math.abs(g.circumferenceMm - row.circumference)).toBeLessThanOrEqual(0.01);
      expect(Math.abs(g.revsPerKm - row.revsPerKm)).toBeLessThanOrEqual(0.01);
    });
  }

  it('ignores load index and speed rating', () => {
    // tyre code convention: the service description does not change geometry
    expect(tyreGeometry('225/45ZR17 94W')).toEqual(tyreGeometry('225/45R17'));
  });

  it('accepts a parsed size', () => {
    // tyre code convention
    expect(tyreGeometry(parseTyreSize('205/55R16'))).toEqual(tyreGeometry('205/55R16'));
  });

  it('revs per km and circumference multiply to one kilometre', () => {
    // plane geometry: one revolution covers one circumference
    fc.assert(
      fc.property(
        fc.integer({ min: 25, max: 79 }).map((n) => n * 5),
        fc.integer({ min: 5, max: 19 }).map((n) => n * 5),
        fc.integer({ min: 12, max: 24 }),
        (w, ar, rim) => {
          const g = tyreGeometry(`${w}/${ar}R${rim}`);
          expect(g.revsPerKm * g.circumferenceMm).toBeCloseTo(1e6, 6);
          expect(g.diameterMm).toBeGreaterThan(rim * 25.4);
        },
      ),
    );
  });

  it('names the bad field of a parsed size', () => {
    const good = parseTyreSize('225/45R17');
    expect(() => tyreGeometry({ ...good, widthMm: 0 })).toThrow(expect.objectContaining({ field: 'widthMm' }));
    expect(() => tyreGeometry({ ...good, aspectRatio: Number.NaN })).toThrow(expect.objectContaining({ field: 'aspectRatio' }));
    expect(() => tyreGeometry({ ...good, aspectRatio: 120 })).toThrow(expect.objectContaining({ field: 'aspectRatio' }));
    expect(() => tyreGeometry({ ...good, rimIn: -17 })).toThrow(expect.objectContaining({ field: 'rimIn' }));
    expect(() => tyreGeometry('nonsense')).toThrow(expect.objectContaining({ field: 'code' }));
  });
});

describe('every code a car wears', () => {
  it('when a light-truck size carries a load index pair, then both indices and the prefix are read', () => {
    // tyre code convention: LT = light truck; 123/120 = single / twin fitment load index
    expect(parseTyreSize('LT265/75R16 123/120Q')).toEqual({
      prefix: 'LT',
      widthMm: 265,
      aspectRatio: 75,
      construction: 'R',
      rimIn: 16,
      loadIndex: 123,
      dualLoadIndex: 120,
      speedRating: 'Q',
    });
  });

  it('when a van size ends in C, then it is a commercial tyre with its index pair', () => {
    // tyre code convention: C after the rim = commercial
    expect(parseTyreSize('195/70R15C 104/102R')).toMatchObject({
      commercial: true,
      rimIn: 15,
      loadIndex: 104,
      dualLoadIndex: 102,
      speedRating: 'R',
    });
    expect(parseTyreSize('195/70 R15C 104/102 R')).toEqual(parseTyreSize('195/70R15C 104/102R'));
  });

  it.each([
    ['225/45R17 94W XL', 'XL'],
    ['225/45R17 XL 94W', 'XL'],
    ['205/55R16 94V RF', 'RF'],
    ['205/55R16 94V REINF', 'RF'],
    ['205/55R16 94V Extra Load', 'XL'],
  ])('when %j carries a load mark, then it reads as %s', (code, mark) => {
    // tyre code convention: XL extra load, RF / REINF reinforced
    expect(parseTyreSize(code)).toMatchObject({ loadIndex: 94, reinforced: mark });
  });

  it('when the service description is in brackets, then the tyre is rated above the symbol’s speed', () => {
    // speed symbol table (ISO 4000-1 / ETRTO): Y 300 km/h; a bracketed description = above it
    const size = parseTyreSize('285/30ZR20 (99Y)');
    expect(size).toMatchObject({ construction: 'ZR', loadIndex: 99, speedRating: 'Y', bracketed: true });
    expect(speedCapability(size)).toMatchObject({ kmh: 300, above: true });
  });

  it('when an older code has the speed letter in the size, then the size and the speed are both read', () => {
    // tyre code convention (older form): 185/70HR14 = 185/70R14 rated H, 210 km/h
    const size = parseTyreSize('185/70HR14');
    expect(size).toEqual({ widthMm: 185, aspectRatio: 70, construction: 'R', rimIn: 14, speedInSize: 'H' });
    expect(speedCapability(size)).toMatchObject({ symbol: 'HR', kmh: 210, above: false });
    expect(tyreGeometry(size)).toEqual(tyreGeometry('185/70R14'));
  });

  it('when an older code has no aspect ratio, then the 82 % series is implied and its source given', () => {
    // Tire code reference article: an omitted aspect ratio is 82 %. 165 × 0.82 = 135.3; Ø = 15 × 25.4 + 2 × 135.3 = 651.6
    expect(IMPLIED_ASPECT_RATIO).toBe(82);
    const size = parseTyreSize('165SR15');
    expect(size).toEqual({
      widthMm: 165,
      aspectRatio: 82,
      construction: 'R',
      rimIn: 15,
      speedInSize: 'S',
      aspectRatioImplied: true,
    });
    expect(speedCapability(size)).toMatchObject({ kmh: 180 });
    const g = tyreGeometry(size);
    expect(g.sidewallMm).toBeCloseTo(135.3, 9);
    expect(g.diameterMm).toBeCloseTo(651.6, 9);
    expect(parseTyreSize('155R13C')).toMatchObject({ aspectRatio: 82, aspectRatioImplied: true, commercial: true });
  });

  it('when a flotation size is given, then its overall diameter and width come straight from the inches', () => {
    // flotation convention: overall diameter × section width, construction, rim (inches). 31 in = 787.4 mm,
    // sidewall (31 − 15)/2 = 8 in = 203.2 mm, width 10.5 in = 266.7 mm
    const size = parseTyreSize('31x10.50R15 LT 109Q');
    expect(size).toMatchObject({
      format: 'flotation',
      overallDiameterIn: 31,
      rimIn: 15,
      prefix: 'LT',
      loadIndex: 109,
      speedRating: 'Q',
    });
    expect(size.widthMm).toBeCloseTo(266.7, 9);
    const g = tyreGeometry(size);
    expect(g.diameterMm).toBeCloseTo(787.4, 9);
    expect(g.sidewallMm).toBeCloseTo(203.2, 9);
    expect(g.circumferenceMm).toBeCloseTo(Math.PI * 787.4, 9);
    expect(parseTyreSize('31X10.5R15LT')).toMatchObject({ overallDiameterIn: 31, prefix: 'LT' });
    expect(parseTyreSize('LT31x10,50R15')).toMatchObject({ overallDiameterIn: 31, prefix: 'LT' });
  });

  it.each([
    '225/45R17 94X',
    '225/45R17 94Z',
    '225/45R17 94O',
    '225/45R17 94I',
    '225/45R17 94A9',
    '225/45R17 94A',
    '225/45R17 (94X)',
    '225/45R17 102/104R',
    '225/45R17 /102R',
    '185/70HZR14',
    '185/70HB14',
    '15x10.50R15',
    '31x10.50R35',
    'XL XL 225/45R17',
    '225/45R17 94W XL RF',
  ])('when given %j, then it is refused with field "code"', (code) => {
    expect(() => parseTyreSize(code)).toThrow(expect.objectContaining({ field: 'code' }));
  });

  it('when a speed symbol is not in the published table, then the message names the table', () => {
    // ISO 4000-1 / ETRTO speed symbols skip I, O, X; Z is only a size mark (ZR)
    expect(() => parseTyreSize('225/45R17 94X')).toThrow(/not a speed symbol/);
    expect(() => parseTyreSize('225/45R17 94Z')).toThrow(/ZR/);
  });
});

describe('speed symbol table', () => {
  // ISO 4000-1 / ETRTO (UN Regulation No. 30) speed category symbols, as reprinted in tyre charts
  const published: Array<[string, number]> = [
    ['A1', 5],
    ['A2', 10],
    ['A3', 15],
    ['A4', 20],
    ['A5', 25],
    ['A6', 30],
    ['A7', 35],
    ['A8', 40],
    ['B', 50],
    ['C', 60],
    ['D', 65],
    ['E', 70],
    ['F', 80],
    ['G', 90],
    ['J', 100],
    ['K', 110],
    ['L', 120],
    ['M', 130],
    ['N', 140],
    ['P', 150],
    ['Q', 160],
    ['R', 170],
    ['S', 180],
    ['T', 190],
    ['U', 200],
    ['H', 210],
    ['V', 240],
    ['W', 270],
    ['Y', 300],
  ];

  it('when looked up, then every symbol gives the published speed and nothing else is a symbol', () => {
    for (const [symbol, kmh] of published) expect(speedSymbolKmh(symbol)).toBe(kmh);
    expect(Object.keys(SPEED_SYMBOLS).sort()).toEqual(published.map(([s]) => s).sort());
    for (const bad of ['I', 'O', 'X', 'Z', 'A', 'A9', '', 'VR']) {
      expect(() => speedSymbolKmh(bad)).toThrow(expect.objectContaining({ field: 'speedSymbol' }));
    }
  });

  it('when the symbol is in the service description, then it gives the speed; ZR alone means above 240 km/h', () => {
    // same table; "ZR" in the size without a service description: above 240 km/h
    expect(speedCapability(parseTyreSize('225/45R17 94W'))).toMatchObject({ kmh: 270, above: false });
    expect(speedCapability(parseTyreSize('245/35ZR19'))).toMatchObject({ symbol: 'ZR', kmh: 240, above: true });
    expect(speedCapability(parseTyreSize('245/35ZR19 93(Y)'))).toMatchObject({ kmh: 300, above: true });
    expect(speedCapability(parseTyreSize('225/45R17'))).toBeNull();
  });
});

describe('load index table', () => {
  // ISO 4000-1 / ETRTO load index, as reprinted in tyre makers' charts (kg per tyre)
  const published: Array<[number, number]> = [
    [60, 250],
    [62, 265],
    [75, 387],
    [80, 450],
    [83, 487],
    [91, 615],
    [94, 670],
    [95, 690],
    [97, 730],
    [100, 800],
    [104, 900],
    [109, 1030],
    [115, 1215],
    [119, 1360],
    [120, 1400],
    [123, 1550],
    [133, 2060],
    [141, 2575],
    [142, 2650],
    [145, 2900],
    [150, 3350],
  ];

  it('when looked up, then the table gives the published kilograms', () => {
    for (const [index, kg] of published) expect(loadIndexKg(index)).toBe(kg);
    // 135: one chart prints 2190 kg; the pound edition's 4806 lb is 4806 × 0.45359237 = 2179.97 kg (NIST SP 811)
    expect(loadIndexKg(135)).toBe(2180);
    expect(Math.abs(4806 * 0.45359237 - loadIndexKg(135))).toBeLessThan(0.5);
  });

  it('covers 60 to 150 without a gap and rises with every index', () => {
    // the table is monotonic by construction (each step ≈ 2.5 % more load)
    for (let i = 61; i <= 150; i++) expect(LOAD_INDEX_KG[i]).toBeGreaterThan(LOAD_INDEX_KG[i - 1]);
  });

  it('when an index is outside the range carried or not a whole number, then the field is named', () => {
    expect(() => loadIndexKg(59)).toThrow(expect.objectContaining({ field: 'loadIndex' }));
    expect(() => loadIndexKg(151)).toThrow(expect.objectContaining({ field: 'loadIndex' }));
    expect(() => loadIndexKg(94.5)).toThrow(expect.objectContaining({ field: 'loadIndex' }));
  });
});

describe('tyreLoadCheck', () => {
  it('when two 104-index tyres carry an 1800 kg axle, then they pass with nothing to spare; one kilogram more fails', () => {
    // load index table: 104 → 900 kg per tyre; 2 × 900 = 1800 kg
    const exact = tyreLoadCheck({ size: '195/70R15C 104/102R', axleLoadKg: 1800 });
    expect(exact).toMatchObject({ loadIndex: 104, capacityPerTyreKg: 900, axleCapacityKg: 1800, marginKg: 0, ok: true });
    expect(exact.source).toMatch(/ISO 4000-1/);
    expect(tyreLoadCheck({ size: '195/70R15C 104/102R', axleLoadKg: 1801 })).toMatchObject({ ok: false, marginKg: -1 });
  });

  it('when the axle runs twin tyres, then the second index of the pair applies to each of four', () => {
    // load index table: 102 → 850 kg; 4 × 850 = 3400 kg
    expect(tyreLoadCheck({ size: '195/70R15C 104/102R', axleLoadKg: 3000, tyresOnAxle: 4 })).toMatchObject({
      loadIndex: 102,
      axleCapacityKg: 3400,
      marginKg: 400,
      ok: true,
    });
  });

  it('when the tyre is XL, then the check says the load needs the reinforced pressure', () => {
    // tyre code convention: XL reaches its index at a higher inflation pressure
    expect(tyreLoadCheck({ size: '225/45R17 94W XL', axleLoadKg: 1200 }).note).toMatch(/XL/);
  });

  it('when inputs are impossible, then the field is named', () => {
    expect(() => tyreLoadCheck({ size: '225/45R17', axleLoadKg: 900 })).toThrow(expect.objectContaining({ field: 'code' }));
    expect(() => tyreLoadCheck({ size: '225/45R17 94W', axleLoadKg: 0 })).toThrow(
      expect.objectContaining({ field: 'axleLoadKg' }),
    );
    expect(() => tyreLoadCheck({ size: '225/45R17 94W', axleLoadKg: 900, tyresOnAxle: 3 })).toThrow(
      expect.objectContaining({ field: 'tyresOnAxle' }),
    );
  });

  it('capacity × tyres − load is the margin, and ok is margin ≥ 0', () => {
    // plane arithmetic over the table
    fc.assert(
      fc.property(fc.integer({ min: 60, max: 150 }), fc.integer({ min: 100, max: 8000 }), (index, load) => {
        const r = tyreLoadCheck({ size: `225/45R17 ${index}V`, axleLoadKg: load });
        expect(r.marginKg).toBe(2 * LOAD_INDEX_KG[index] - load);
        expect(r.ok).toBe(r.marginKg >= 0);
      }),
    );
  });
});
