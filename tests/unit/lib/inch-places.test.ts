import { describe, expect, it } from 'vitest';
import { inchPlaces, round } from '../../../src/lib/units';
import { mmToIn } from '../../../shared/fitment/units';

// Lengths shown in inches at the trade's usual precision (common practice, no source): hundredths for sizes,
// lengths and clearances, thousandths for shims, gaps and fits. 1 in = 25.4 mm exactly (NIST SP 811, B.8).
const inches = (mm: number, mmDigits: number) => `${round(mmToIn(mm), inchPlaces(mmDigits))} in`;

describe('lengths in inches', () => {
  it('when a centre bore of 66.6 mm is shown, then it reads 2.62 in, not 2.622 in', () => {
    expect(inches(66.6, 1)).toBe('2.62 in');
  });

  it('when a 1 mm shim is shown to hundredths of a millimetre, then it reads thousandths: 0.039 in, not 0.0394 in', () => {
    expect(inches(1, 2)).toBe('0.039 in');
  });

  it('when a rotor of 330 mm is shown to whole millimetres, then it reads hundredths: 12.99 in', () => {
    expect(inches(330, 0)).toBe('12.99 in');
  });
});
