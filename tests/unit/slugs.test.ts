import { describe, expect, it } from 'vitest';
import { slugify } from '../../server/lib/slugs';

describe('slugify', () => {
  it('when a title is longer than the limit, then the slug ends at the last whole word that fits', () => {
    expect(slugify('Vela calipers on the Halden H31', 24)).toBe('vela-calipers-on-the');
    // a word that ends exactly at the limit is kept whole
    expect(slugify('Vela calipers on the Halden H31', 20)).toBe('vela-calipers-on-the');
    expect(slugify('Vela calipers on the Halden H31', 19)).toBe('vela-calipers-on');
  });

  it('when a title fits, then it is lower case words joined by hyphens, accents and punctuation dropped', () => {
    expect(slugify('Régent: 300 mm rotors — drum-in-hat!')).toBe('regent-300-mm-rotors-drum-in-hat');
  });

  it('when a single word is longer than the limit, then only that word is cut', () => {
    expect(slugify('Supercalifragilistic', 10)).toBe('supercalif');
  });
});
