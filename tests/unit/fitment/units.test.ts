import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { barToPsi, inToMm, kgToLb, lbfFtToNm, lbToKg, mmToIn, nmToLbfFt, psiToBar } from '../../../shared/fitment/units';
import { FitmentInputError } from '../../../shared/fitment/errors';

const relClose = (actual: number, expected: number, rel = 1e-9) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(Math.abs(expected) * rel);

describe('length', () => {
  it('converts inches to millimetres with the exact 25.4 factor', () => {
    relClose(inToMm(13), 330.2); // NIST SP 811 B.8: 1 in = 25.4 mm exactly
    relClose(inToMm(4.5), 114.3); // NIST SP 811 B.8: 5×4.5 in bolt pattern = 5×114.3 mm
    expect(inToMm(1)).toBe(25.4); // NIST SP 811 B.8
  });

  it('converts millimetres to inches', () => {
    relClose(mmToIn(330), 330 / 25.4); // NIST SP 811 B.8
    expect(mmToIn(330)).toBeCloseTo(12.992126, 6); // NIST SP 811 B.8, printed check value
  });
});

describe('torque', () => {
  it('uses 1 lbf·ft = 4.4482216152605 N × 0.3048 m', () => {
    relClose(lbfFtToNm(1), 4.4482216152605 * 0.3048); // NIST SP 811 B.8/B.9
    relClose(lbfFtToNm(1), 1.3558179483314004); // NIST SP 811 B.9
    relClose(lbfFtToNm(80), 80 * 1.3558179483314004); // NIST SP 811 B.9
    expect(lbfFtToNm(80)).toBeCloseTo(108.46544, 5); // NIST SP 811 B.9, printed check value
  });

  it('converts newton metres to pound-force feet', () => {
    relClose(nmToLbfFt(100), 100 / 1.3558179483314004); // NIST SP 811 B.9
    expect(nmToLbfFt(100)).toBeCloseTo(73.756215, 6); // NIST SP 811 B.9, printed check value
  });
});

describe('pressure', () => {
  it('uses 1 psi = 6894.757293168 Pa and 1 bar = 1e5 Pa', () => {
    relClose(psiToBar(1000), (1000 * 6894.757293168) / 1e5); // NIST SP 811 B.8/B.9
    expect(psiToBar(1000)).toBeCloseTo(68.947573, 6); // NIST SP 811, printed check value
    relClose(barToPsi(100), 1e7 / 6894.757293168); // NIST SP 811 B.8/B.9
    expect(barToPsi(100)).toBeCloseTo(1450.3774, 4); // NIST SP 811, printed check value
  });
});

describe('mass', () => {
  it('uses 1 lb = 0.45359237 kg exactly', () => {
    relClose(lbToKg(3000), 3000 * 0.45359237); // NIST SP 811 B.8: pound (avoirdupois)
    expect(lbToKg(3000)).toBeCloseTo(1360.77711, 5); // NIST SP 811 B.8, recomputed
    expect(kgToLb(1450)).toBeCloseTo(3196.7028, 4); // 1450 / 0.45359237
  });
});

describe('round trips', () => {
  const value = fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true });
  const pairs: [string, (x: number) => number, (x: number) => number][] = [
    ['in/mm', inToMm, mmToIn],
    ['lbf·ft/N·m', lbfFtToNm, nmToLbfFt],
    ['psi/bar', psiToBar, barToPsi],
    ['lb/kg', lbToKg, kgToLb],
  ];
  for (const [name, there, back] of pairs) {
    it(`${name} there and back returns the value within 1e-9 relative`, () => {
      fc.assert(
        fc.property(value, (x) => {
          expect(Math.abs(back(there(x)) - x)).toBeLessThanOrEqual(Math.abs(x) * 1e-9 + 1e-300);
          expect(Math.abs(there(back(x)) - x)).toBeLessThanOrEqual(Math.abs(x) * 1e-9 + 1e-300);
        }),
      );
    });
  }
});

describe('bad input', () => {
  it.each([
    ['in', () => inToMm(Number.NaN)],
    ['mm', () => mmToIn(Number.POSITIVE_INFINITY)],
    ['lbfFt', () => lbfFtToNm(Number.NaN)],
    ['nm', () => nmToLbfFt(Number.NEGATIVE_INFINITY)],
    ['psi', () => psiToBar(Number.NaN)],
    ['bar', () => barToPsi('12' as unknown as number)],
  ])('rejects a non-finite %s value', (field, call) => {
    expect(call).toThrow(FitmentInputError);
    expect(call).toThrow(expect.objectContaining({ field }));
  });

  it('converts negative values, which offsets can be', () => {
    expect(mmToIn(-25.4)).toBe(-1); // NIST SP 811 B.8
  });
});
