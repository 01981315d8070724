import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { normaliseMaker, partIdentityKey } from '../../../shared/catalogue/part-identity';

// Two records are one part when the same maker gave them the same number, however each was typed.
// The rule (separators and case ignored) is the search's part-number rule: common practice, no source.

describe('normalising makers and part numbers', () => {
  it('ignores spaces, dashes, dots, slashes and case in the number', () => {
    const key = partIdentityKey('Orsino', 'OV-355-104-L');
    for (const typed of ['ov355104l', 'OV 355 104 L', 'ov.355.104.l', 'OV/355/104/L', ' Ov-355 104.l ', 'OV--355__104/L'])
      expect(partIdentityKey('Orsino', typed), typed).toBe(key);
  });

  it('ignores the same in the maker, and accents', () => {
    expect(normaliseMaker('Northgate Fabrication')).toBe('northgatefabrication');
    for (const typed of ['northgate-fabrication', 'NORTHGATE FABRICATION', 'Northgate.Fabrication', 'Nörthgate Fabrication'])
      expect(normaliseMaker(typed), typed).toBe('northgatefabrication');
  });

  it('tells different numbers and makers apart', () => {
    expect(partIdentityKey('Orsino', 'OV-355-104-L')).not.toBe(partIdentityKey('Orsino', 'OV-355-104-R'));
    expect(partIdentityKey('Orsino', 'OV-355-104-L')).not.toBe(partIdentityKey('Halden', 'OV-355-104-L'));
    // the pieces keep their order: 104-355 is another number
    expect(partIdentityKey('Orsino', 'OV-104-355-L')).not.toBe(partIdentityKey('Orsino', 'OV-355-104-L'));
  });

  it('has no key without a maker or a number', () => {
    expect(partIdentityKey('', 'OV-355-104-L')).toBeNull();
    expect(partIdentityKey('Orsino', ' - / ')).toBeNull();
  });

  it('gives one key for any way of separating the same characters (property)', () => {
    const piece = fc.stringMatching(/^[A-Za-z0-9]{1,5}$/);
    const sep = fc.constantFrom(' ', '-', '.', '/', '', ' - ');
    fc.assert(
      fc.property(fc.array(fc.tuple(piece, sep), { minLength: 1, maxLength: 5 }), (pieces) => {
        const typed = pieces.map(([p, s]) => p + s).join('');
        const bare = pieces.map(([p]) => p).join('');
        expect(partIdentityKey('Orsino', typed.toUpperCase())).toBe(partIdentityKey('orsino', bare.toLowerCase()));
      }),
    );
  });
});
