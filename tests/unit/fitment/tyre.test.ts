import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { parseTyreSize, tyreGeometry } from '../../../shared/fitment/tyre';
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
    expect(parseTyreSize('P215/60R16')).toEqual({ widthMm: 215, aspectRatio: 60, construction: 'R', rimIn: 16 });
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
    'LT225/75R16',
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
