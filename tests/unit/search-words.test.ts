import { describe, expect, it } from 'vitest';
import { buildIndex, search } from '../../shared/search/search-engine';
import { toSearchDocument, type SearchDocument } from '../../shared/search/search-document';
import { partNumbersIn } from '../../shared/search/normalise';
import { swapDataSchema } from '../../shared/schemas/swap-data';
import { expectSameWhenSharded, shardedOver } from './support/sharded-search';

// The words readers really type: the trade's other names for a part, swapped letters, a part's
// older number, and several words at once.

const h31 = { slug: 'halden-h31', make: 'Halden', model: 'H31', code: 'H31', yearFrom: 1991, yearTo: 1999 };
const vela = { slug: 'orsino-vela', make: 'Orsino', model: 'Vela', code: 'V3', yearFrom: 1994, yearTo: 2001 };
const regent = { slug: 'tamsin-regent', make: 'Tamsin', model: 'Regent', code: 'TR2', yearFrom: 1995, yearTo: 2004 };

let nextId = 1;
function doc(over: Partial<SearchDocument> & Pick<SearchDocument, 'title' | 'chassis'>): SearchDocument {
  return {
    id: nextId++,
    slug: over.title.toLowerCase().replace(/[^a-z0-9]+/g, '-'),
    axle: 'front',
    category: 'brakes',
    partNames: [],
    partNumbers: [],
    cameOn: [],
    adapter: null,
    minWheelIn: null,
    machining: 'none',
    parkingBrakeKept: null,
    cost: null,
    fittedCount: 0,
    updatedAt: '2024-01-01T00:00:00.000Z',
    ...over,
  };
}

const docs = [
  doc({
    title: 'Vela calipers and 330 mm rotors on the H31',
    chassis: h31,
    partNames: ['Orsino Vela four-piston caliper', 'Orsino Vela 330 mm vented rotor'],
    partNumbers: ['OV-355-104-L'],
    otherNumbers: ['OV-355-101-L'],
    minWheelIn: 16,
  }),
  doc({
    title: 'Vela calipers under 15 inch wheels',
    chassis: h31,
    partNames: ['Orsino Vela four-piston caliper'],
    minWheelIn: 15,
  }),
  doc({ title: 'Regent rear drum in hat', chassis: h31, axle: 'rear', partNames: ['Tamsin Regent rear rotor'] }),
  doc({ title: 'Winter wheels on narrow tyres', chassis: vela, category: 'wheels_tyres', partNames: ['15 inch steel wheel'] }),
  doc({ title: 'Handbrake cable from the estate', chassis: regent, axle: 'rear', partNames: ['Regent handbrake cable'] }),
];
const index = buildIndex(docs);
const slugs = (q: string) => search(index, { q, limit: 50 }).hits.map((h) => h.doc.slug);
const bySlug = (s: string) => docs.find((d) => d.slug === s)!;

describe('trade synonyms', () => {
  it('when a reader types "disc", then the swaps that call it a rotor are found', () => {
    const found = slugs('disc');
    expect(found).toContain('vela-calipers-and-330-mm-rotors-on-the-h31');
    expect(found).toContain('regent-rear-drum-in-hat');
  });

  it('when a reader types "tire", then the tyre swaps are found', () => {
    expect(slugs('tire')).toContain('winter-wheels-on-narrow-tyres');
  });

  it('when a reader types the two-word name, then the one-word name matches too (parking brake → handbrake)', () => {
    expect(slugs('parking brake')).toEqual(['handbrake-cable-from-the-estate']);
  });

  it('when the query is the word the record uses, then it ranks above a synonym match', () => {
    const both = buildIndex([
      doc({ title: 'Slotted disc upgrade', chassis: h31 }),
      doc({ title: 'Slotted rotor upgrade', chassis: h31 }),
    ]);
    expect(search(both, { q: 'rotor' }).hits.map((h) => h.doc.title)).toEqual(['Slotted rotor upgrade', 'Slotted disc upgrade']);
  });
});

describe('swapped letters', () => {
  it('when two letters are swapped ("regnet"), then the Regent is found', () => {
    expect(slugs('regnet')).toContain('handbrake-cable-from-the-estate');
    expect(slugs('regnet')).toContain('regent-rear-drum-in-hat');
  });

  it('when two letters are swapped in a longer word ("calpier"), then calipers are found', () => {
    expect(slugs('calpier').length).toBeGreaterThanOrEqual(2);
  });
});

describe('alternate part numbers', () => {
  it('when a part number is written in a part record’s notes, then it is read out of the text', () => {
    expect(partNumbersIn('Early calipers carry the stamp OV-355-101-R and are the same casting.')).toEqual(['OV-355-101-R']);
    // sizes, threads and plain codes are not part numbers
    expect(partNumbersIn('M12×1.5 bolts, 15-inch wheels, ET35, 2.0 litre, H31 knuckle')).toEqual([]);
  });

  it('when a swap’s part notes name another number, then the search document carries it', () => {
    const data = swapDataSchema.parse({
      schemaVersion: 2,
      title: 'Vela calipers on the H31',
      parts: [
        {
          partId: 7,
          role: 'Front caliper',
          kind: 'caliper',
          name: 'Vela four-piston caliper',
          partNumbers: ['OV-355-104-L'],
          quantity: 1,
          notes: 'Also sold as OV-355-101-L.',
        },
      ],
      currency: 'EUR',
    });
    const d = toSearchDocument({
      id: 1,
      slug: 'x',
      axle: 'front',
      category: 'brakes',
      fittedCount: 0,
      chassis: h31,
      data,
      approvedAt: new Date('2024-01-01T00:00:00Z'),
      partRecord: (id) =>
        id === 7 ? { partNumbers: ['OV-355-104-L'], notes: 'Early calipers carry the stamp OV-355-099-L.' } : undefined,
    });
    expect(d.otherNumbers).toEqual(['OV-355-101-L', 'OV-355-099-L']);
  });

  it.each(['OV-355-101-L', 'ov355101l', 'Ov 355.101 l'])(
    'when "%s" is typed, then the swap with that alternate number is found',
    (q) => {
      expect(slugs(q)[0]).toBe('vela-calipers-and-330-mm-rotors-on-the-h31');
    },
  );
});

describe('several words', () => {
  it('when some swaps match every word, then they come first and the answer says how many', () => {
    const r = search(index, { q: 'H31 vela 15 inch', limit: 50 });
    expect(r.words).toBe(4);
    expect(r.matchedAll).toBe(1);
    expect(r.hits[0].doc.slug).toBe('vela-calipers-under-15-inch-wheels');
    // the rest match some of the words, listed after it
    expect(r.total).toBeGreaterThan(1);
    expect(r.hits.slice(1).map((h) => h.doc.slug)).toContain('vela-calipers-and-330-mm-rotors-on-the-h31');
  });

  it('when swaps match more words, then they rank above swaps that match fewer', () => {
    const r = search(index, { q: 'H31 vela 15 inch', limit: 50 });
    const wordsMatched = (slug: string) => {
      const d = bySlug(slug);
      const text = [d.title, d.chassis.code, d.chassis.model, ...d.partNames].join(' ').toLowerCase();
      return ['h31', 'vela', '15', 'inch'].filter((w) => text.includes(w)).length;
    };
    const counts = r.hits.map((h) => wordsMatched(h.doc.slug));
    expect(counts).toEqual([...counts].sort((a, b) => b - a));
  });

  it('when no swap matches every word, then none is counted as matching all', () => {
    const r = search(index, { q: 'regent zzzqqq' });
    expect(r.matchedAll).toBe(0);
    expect(r.total).toBeGreaterThan(0);
  });

  it('when the query is one word, then every result matches all of it', () => {
    const r = search(index, { q: 'vela' });
    expect(r.words).toBe(1);
    expect(r.matchedAll).toBe(r.total);
  });
});

describe('fits my wheel', () => {
  it('when no swap names a 13″ or 19″ minimum, then the filter still offers every usual diameter', () => {
    const sizes = search(index, {}).facets.wheel.map((f) => Number(f.value));
    expect(sizes).toEqual([13, 14, 15, 16, 17, 18, 19, 20, 21, 22]);
  });

  it('when a 14″ wheel is chosen, then it counts the swaps that name no minimum', () => {
    const wheel = search(index, {}).facets.wheel;
    // three swaps name no minimum; the 15″ and 16″ ones need bigger wheels
    expect(wheel.find((f) => f.value === '14')?.count).toBe(3);
    expect(wheel.find((f) => f.value === '16')?.count).toBe(5);
  });
});

describe('the index in shards', () => {
  it('when every model sits in a shard of its own, then other names, swapped letters, alternate numbers and all-words ranking answer as the whole index', async () => {
    const { index: sharded } = shardedOver(docs);
    const queries = ['disc', 'tire', 'parking brake', 'regnet', 'calpier', 'OV-355-101-L', 'ov355101l', 'Ov 355.101 l'];
    for (const q of [...queries, 'H31 vela 15 inch', 'regent zzzqqq', 'vela', ''])
      await expectSameWhenSharded(index, sharded, { q, limit: 50 });
  });
});
