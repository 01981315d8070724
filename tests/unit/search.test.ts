import { describe, expect, it } from 'vitest';
import { normalisePartNumber, tokenize } from '../../shared/search/normalise';
import { addDocuments, buildIndex, createIndex, search } from '../../shared/search/search-engine';
import { cleanFilters, type SearchRequest } from '../../shared/search/search-types';
import { statsOf } from '../../shared/search/term-index';
import type { SearchDocument } from '../../shared/search/search-document';
import { expectSameWhenSharded, shardedOver } from './support/sharded-search';

const h31 = { slug: 'halden-h31', make: 'Halden', model: 'H31', code: 'H31', yearFrom: 1991, yearTo: 1999 };
const h40 = { slug: 'halden-h40', make: 'Halden', model: 'H40', code: 'H40', yearFrom: 1999, yearTo: 2007 };
const vela = { slug: 'orsino-vela-v2', make: 'Orsino', model: 'Vela', code: 'V2', yearFrom: 1996, yearTo: 2001 };
const regent = { slug: 'tamsin-regent-r5', make: 'Tamsin', model: 'Regent', code: 'R5', yearFrom: 1994, yearTo: null };

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

const docs: SearchDocument[] = [
  doc({
    title: 'Vela four-piston calipers on the front axle',
    chassis: h31,
    partNames: ['Orsino Vela four-piston fixed caliper'],
    partNumbers: ['OV-355-104-L', 'OV-355-104-R'],
    cameOn: ['Orsino Vela 2.0'],
    adapter: { name: 'H31 front bracket', maker: 'Northgate Fabrication', partNumber: 'NF-H31-VB' },
    minWheelIn: 16,
    machining: 'minor',
    cost: { min: 46000, max: 98000, currency: 'EUR' },
    fittedCount: 7,
    updatedAt: '2024-02-01T00:00:00.000Z',
  }),
  doc({
    title: 'Regent rear rotors that keep the drum parking brake',
    chassis: h31,
    axle: 'rear',
    partNames: ['Tamsin Regent rear rotor'],
    partNumbers: ['TR-290-22'],
    cameOn: ['Tamsin Regent 2.5'],
    minWheelIn: 15,
    parkingBrakeKept: true,
    cost: { min: 18000, max: 30000, currency: 'EUR' },
    fittedCount: 2,
    updatedAt: '2024-03-01T00:00:00.000Z',
  }),
  // mentions H31 only as the donor: must rank below the swaps for the H31 itself
  doc({
    title: 'Early saloon calipers on the successor',
    chassis: h40,
    partNames: ['Halden H31 sliding caliper'],
    partNumbers: ['HD-31-280'],
    cameOn: ['Halden H31 saloon'],
    minWheelIn: 15,
    fittedCount: 30,
    updatedAt: '2024-04-01T00:00:00.000Z',
  }),
  doc({
    title: 'Big rotor conversion with machined hubs',
    chassis: h40,
    partNames: ['Vela 330 mm vented rotor'],
    partNumbers: ['OV-330-28'],
    cameOn: ['Orsino Vela 3.0'],
    minWheelIn: 17,
    machining: 'major',
    cost: { min: 120000, max: 210000, currency: 'EUR' },
    fittedCount: 1,
    updatedAt: '2023-12-01T00:00:00.000Z',
  }),
  doc({
    title: 'Wider wheels with hub-centric spacers',
    chassis: vela,
    category: 'wheels_tyres',
    partNames: ['20 mm hub-centric spacer'],
    minWheelIn: 17,
    updatedAt: '2024-05-01T00:00:00.000Z',
  }),
  doc({
    title: 'Rear disc conversion from the Halden estate',
    chassis: regent,
    axle: 'rear',
    partNames: ['Halden H40 rear caliper'],
    cameOn: ['Halden H40 estate'],
    parkingBrakeKept: false,
    updatedAt: '2024-01-15T00:00:00.000Z',
  }),
];

const index = buildIndex(docs);
const slugs = (q: string, filters = {}) => search(index, { q, filters, limit: 50 }).hits.map((h) => h.doc.slug);

describe('part-number normalisation (separators and case do not matter)', () => {
  it.each([
    ['OV-355-104-L', 'ov355104l'],
    ['ov 355.104/l', 'ov355104l'],
    ['NF_H31_VB', 'nfh31vb'],
    ['Ørsino-1', 'ørsino1'],
    ['Vélà-9', 'vela9'],
  ])('%s → %s', (input, expected) => {
    expect(normalisePartNumber(input)).toBe(expected);
  });

  it('indexes the words and the joined form of a part number', () => {
    expect(tokenize('OV-355-104-L')).toEqual(['ov', '355', '104', 'l', 'ov355104l']);
    expect(tokenize('Halden H31')).toEqual(['halden', 'h31']);
  });

  it.each(['ov355104l', 'OV-355-104-L', 'ov-355', 'OV355', 'ov 355 104', 'Ov.355.104.L'])(
    '"%s" finds the part OV-355-104-L',
    (q) => {
      expect(slugs(q)[0]).toBe('vela-four-piston-calipers-on-the-front-axle');
    },
  );

  it('does not treat a different part number as a match', () => {
    expect(slugs('OV-330-28')).toEqual(['big-rotor-conversion-with-machined-hubs']);
    expect(slugs('tr-290')).toEqual(['regent-rear-rotors-that-keep-the-drum-parking-brake']);
  });
});

describe('ranking', () => {
  it('a chassis-code query ranks that chassis’s swaps above swaps that only mention it', () => {
    const found = slugs('H31');
    expect(found.slice(0, 2).sort()).toEqual([
      'regent-rear-rotors-that-keep-the-drum-parking-brake',
      'vela-four-piston-calipers-on-the-front-axle',
    ]);
    expect(found).toContain('early-saloon-calipers-on-the-successor');
    expect(found.indexOf('early-saloon-calipers-on-the-successor')).toBe(2);
  });

  it('a model query ranks that chassis first, donors after', () => {
    const found = slugs('regent');
    expect(found[0]).toBe('rear-disc-conversion-from-the-halden-estate');
    expect(found).toContain('regent-rear-rotors-that-keep-the-drum-parking-brake');
  });

  it('forgives a typo in a word and in a short chassis code', () => {
    expect(slugs('Haldan').length).toBeGreaterThan(0);
    expect(
      slugs('Haldan').every((s) => index.docs.find((d) => d.slug === s)!.chassis.make === 'Halden' || s.includes('halden')),
    ).toBe(true);
    const codeTypo = slugs('halden h3l');
    expect(codeTypo.slice(0, 2).sort()).toEqual([
      'regent-rear-rotors-that-keep-the-drum-parking-brake',
      'vela-four-piston-calipers-on-the-front-axle',
    ]);
  });

  it('matches prefixes while typing', () => {
    expect(slugs('Ors')).toContain('wider-wheels-with-hub-centric-spacers');
    expect(slugs('calip').length).toBe(3);
  });

  it('when several words are typed, then the swap with every word comes first and the count of such swaps is given', () => {
    const r = search(index, { q: 'vela rotor' });
    expect(r.matchedAll).toBe(1);
    expect(r.hits[0].doc.slug).toBe('big-rotor-conversion-with-machined-hubs');
    const loose = search(index, { q: 'regent zzzqqq' });
    expect(loose.matchedAll).toBe(0);
    expect(loose.total).toBeGreaterThan(0);
    expect(search(index, { q: 'zzzqqq' }).total).toBe(0);
  });
});

describe('sort', () => {
  it('without a query shows everything newest first', () => {
    const r = search(index, { limit: 50 });
    expect(r.sort).toBe('newest');
    expect(r.total).toBe(docs.length);
    expect(r.hits.map((h) => h.doc.updatedAt)).toEqual([...docs.map((d) => d.updatedAt)].sort().reverse());
  });

  it('most fitted orders by fitted reports, within the query', () => {
    const r = search(index, { q: 'caliper', sort: 'fitted' });
    expect(r.hits.map((h) => h.doc.fittedCount)).toEqual([30, 7, 0]);
  });
});

describe('facets and filters', () => {
  it('counts every facet over the query results', () => {
    const r = search(index, { q: '' });
    expect(r.facets.make).toEqual([
      { value: 'Halden', label: 'Halden', count: 4 },
      { value: 'Orsino', label: 'Orsino', count: 1 },
      { value: 'Tamsin', label: 'Tamsin', count: 1 },
    ]);
    expect(r.facets.axle.map((f) => [f.value, f.count])).toEqual([
      ['front', 4],
      ['rear', 2],
    ]);
    expect(r.facets.category.map((f) => [f.value, f.count])).toEqual([
      ['brakes', 5],
      ['wheels_tyres', 1],
    ]);
    expect(r.facets.machining.map((f) => [f.value, f.count])).toEqual([
      ['none', 4],
      ['minor', 1],
      ['major', 1],
    ]);
    expect(r.facets.parkingBrake.map((f) => [f.value, f.count])).toEqual([
      ['yes', 1],
      ['no', 1],
    ]);
    // 180 € → under 250; 460 € → 250–500; 1,200 € → 1000–2000
    expect(r.facets.cost.map((f) => [f.value, f.count])).toEqual([
      ['u250', 1],
      ['250-500', 1],
      ['1000-2000', 1],
    ]);
    // cumulative: a 15″ wheel fits the two 15″ swaps and the one with no minimum
    expect(r.facets.wheel.filter((f) => ['15', '16', '17'].includes(f.value)).map((f) => [f.value, f.count])).toEqual([
      ['15', 3],
      ['16', 4],
      ['17', 6],
    ]);
  });

  it('a query matching most swaps counts facets over exactly its results', () => {
    // five of six swaps mention Halden (the Regent one through its donor caliper): the broad-match path
    const r = search(index, { q: 'halden' });
    expect(r.total).toBe(5);
    expect(r.facets.make.map((f) => [f.value, f.count])).toEqual([
      ['Halden', 4],
      ['Tamsin', 1],
    ]);
    expect(r.facets.axle.map((f) => [f.value, f.count])).toEqual([
      ['front', 3],
      ['rear', 2],
    ]);
    expect(r.facets.wheel.filter((f) => ['15', '16', '17'].includes(f.value)).map((f) => [f.value, f.count])).toEqual([
      ['15', 3],
      ['16', 4],
      ['17', 5],
    ]);
    // a filter that holds nothing back takes the filtered path and must count the same
    const filtered = search(index, { q: 'halden', filters: { wheel: 30 } });
    expect(filtered.total).toBe(5);
    expect({ ...filtered.facets, wheel: [] }).toEqual({ ...r.facets, wheel: [] });
  });

  it('a facet keeps counting its other values while one is chosen; the others narrow', () => {
    const r = search(index, { filters: { axle: 'rear' } });
    expect(r.total).toBe(2);
    expect(r.facets.axle.map((f) => [f.value, f.count])).toEqual([
      ['front', 4],
      ['rear', 2],
    ]);
    expect(r.facets.make.map((f) => [f.value, f.count])).toEqual([
      ['Halden', 1],
      ['Tamsin', 1],
    ]);
  });

  it('make narrows the models, model narrows the chassis', () => {
    const r = search(index, { filters: { make: 'Halden' } });
    expect(r.facets.model.map((f) => [f.value, f.count])).toEqual([
      ['H31', 2],
      ['H40', 2],
    ]);
    const m = search(index, { filters: { make: 'Halden', model: 'H40' } });
    expect(m.total).toBe(2);
    expect(m.facets.chassis).toEqual([{ value: 'halden-h40', label: 'H40 (1999–2007)', count: 2 }]);
    expect(m.facets.make.find((f) => f.value === 'Orsino')?.count).toBe(1);
  });

  it('filters combine with the query', () => {
    expect(slugs('caliper', { machining: 'minor' })).toEqual(['vela-four-piston-calipers-on-the-front-axle']);
    expect(slugs('', { wheel: 15, axle: 'front' })).toEqual(['early-saloon-calipers-on-the-successor']);
    expect(slugs('', { parkingBrake: 'yes' })).toEqual(['regent-rear-rotors-that-keep-the-drum-parking-brake']);
    expect(slugs('', { cost: '1000-2000' })).toEqual(['big-rotor-conversion-with-machined-hubs']);
    expect(slugs('', { chassis: 'orsino-vela-v2' })).toEqual(['wider-wheels-with-hub-centric-spacers']);
  });

  it('with no results, says how many each filter is holding back', () => {
    const r = search(index, { q: 'vela', filters: { axle: 'rear', category: 'wheels_tyres' } });
    expect(r.total).toBe(0);
    expect(r.relax).toEqual([
      { filter: 'axle', total: 1 },
      { filter: 'category', total: 0 },
    ]);
  });

  it('drops unknown filter values from a hand-edited address', () => {
    expect(cleanFilters({ axle: 'middle', wheel: 'abc', machining: 'none', make: ' ' })).toEqual({ machining: 'none' });
  });
});

describe('an index filled in batches', () => {
  it('when the documents arrive in several batches with the whole collection’s figures, then it answers as if built at once', () => {
    const batched = createIndex(statsOf(docs));
    addDocuments(batched, docs.slice(3));
    addDocuments(batched, docs.slice(0, 3));
    for (const q of ['H31', 'ov-355', 'Haldan', 'rotor', '', 'regent zzzqqq']) {
      const whole = search(index, { q, limit: 50 });
      const parts = search(batched, { q, limit: 50 });
      expect(parts.hits.map((h) => h.doc.id)).toEqual(whole.hits.map((h) => h.doc.id));
      // the same sums taken in another order: equal to the last few bits
      parts.hits.forEach((h, i) => expect(h.score).toBeCloseTo(whole.hits[i].score!, 9));
      expect(parts.facets).toEqual(whole.facets);
    }
  });
});

describe('the index in shards', () => {
  it('when every model sits in a shard of its own, then the worker answers each of these searches as the whole index', async () => {
    const { index: sharded } = shardedOver(docs);
    const requests: SearchRequest[] = [
      ...['ov355104l', 'OV-355-104-L', 'ov-355', 'OV355', 'ov 355 104', 'Ov.355.104.L', 'OV-330-28', 'tr-290', 'H31'].map(
        (q) => ({ q }),
      ),
      ...['regent', 'Haldan', 'halden h3l', 'Ors', 'calip', 'vela rotor', 'regent zzzqqq', 'zzzqqq', 'halden'].map((q) => ({
        q,
      })),
      { q: 'caliper', sort: 'fitted' },
      { limit: 50 },
      { q: 'halden', filters: { wheel: 30 } },
      { filters: { axle: 'rear' } },
      { filters: { make: 'Halden' } },
      { filters: { make: 'Halden', model: 'H40' } },
      { q: 'caliper', filters: { machining: 'minor' } },
      { filters: { wheel: 15, axle: 'front' } },
      { filters: { chassis: 'orsino-vela-v2' } },
      { q: 'vela', filters: { axle: 'rear', category: 'wheels_tyres' } },
    ];
    for (const r of requests) await expectSameWhenSharded(index, sharded, { limit: 50, ...r });
  });
});
