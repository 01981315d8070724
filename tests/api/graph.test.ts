import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser } from './support/auth-helpers';
import { addChassis, addPart } from './support/swap-fixtures';
import { addSwap, catalogueLine, swapData } from './support/swap-rows';
import { parts } from '../../server/db/schema/index';
import { chassisGraphSchema, partGraphSchema, whereElseSchema } from '../../shared/schemas/graph';

// The interchange graph over rows each test arranges here: two records of one caliper (they share a
// number), an adapter, and swaps around them that must not be shown (in review, on a proposed chassis,
// superseded).

let t: TestApp;
const ids = {} as Record<'velaA' | 'velaB' | 'bracket' | 'mirror', number>;

const line = catalogueLine;

beforeAll(async () => {
  t = await makeTestApp();
  const author = addUser(t.db, 'rivet_rosa').id;
  const h31 = addChassis(t.db, 'halden-h31').id;
  const regent = addChassis(t.db, 'tamsin-regent', { make: 'Tamsin', model: 'Regent', code: 'TR2' }).id;
  const proposed = addChassis(t.db, 'halden-h40', { model: 'H40', code: 'H40', proposed: true }).id;

  ids.velaA = addPart(t.db, 'vela-caliper-l', {
    notes: 'Early ones carry the stamp OV-355-099-L on the bridge.',
    cameOn: ['Orsino Vela 3.0 (1994–1998)'],
  }).id;
  // the same caliper recorded again under a later number: it shares OV-355-104-L with the first record
  ids.velaB = addPart(t.db, 'vela-caliper-l-late', {
    partNumbers: ['OV-355-110-L', 'OV-355-104-L'],
    cameOn: ['Orsino Vela 2.5 (1998–2001)'],
  }).id;
  // a mirror part names the other's number in its notes: that stamp belongs to the other record, not to it
  ids.mirror = addPart(t.db, 'vela-caliper-r', {
    name: 'Vela four-piston fixed front caliper, right',
    partNumbers: ['OV-355-104-R'],
    notes: 'Mirror of OV-355-104-L.',
  }).id;
  ids.bracket = addPart(t.db, 'nf-h31-bracket', {
    kind: 'adapter',
    name: 'H31 radial caliper bracket',
    maker: 'Northgate Fabrication',
    partNumbers: ['NF-H31-VB'],
    specs: {},
    cameOn: [],
  }).id;

  const withA = (title: string) =>
    swapData(title, {
      parts: [
        line(ids.velaA, 'caliper', 'Vela caliper', ['OV-355-104-L']),
        line(ids.bracket, 'adapter', 'H31 radial caliper bracket', ['NF-H31-VB']),
      ],
    });
  const withB = (title: string) => swapData(title, { parts: [line(ids.velaB, 'caliper', 'Vela caliper', ['OV-355-110-L'])] });

  addSwap(t.db, {
    slug: 'h31-vela-front',
    chassisId: h31,
    authorId: author,
    revisions: [{ status: 'approved', data: withA('Vela calipers on the H31') }],
  });
  addSwap(t.db, {
    slug: 'regent-vela-front',
    chassisId: regent,
    authorId: author,
    revisions: [{ status: 'approved', data: withB('Late Vela calipers on the Regent') }],
  });
  addSwap(t.db, {
    slug: 'h31-in-review',
    chassisId: h31,
    authorId: author,
    revisions: [{ status: 'in_review', data: withA('Waiting on the desk') }],
  });
  addSwap(t.db, {
    slug: 'h40-proposed',
    chassisId: proposed,
    authorId: author,
    revisions: [{ status: 'approved', data: withA('On a chassis nobody approved') }],
  });
  // used the caliper in revision 1; revision 2 (current) lists only the right-hand caliper
  addSwap(t.db, {
    slug: 'regent-changed',
    chassisId: regent,
    authorId: author,
    revisions: [
      { status: 'superseded', data: withA('Old revision') },
      {
        status: 'approved',
        data: swapData('Right caliper only', { parts: [line(ids.mirror, 'caliper', 'Vela caliper, right', ['OV-355-104-R'])] }),
      },
    ],
  });
});
afterAll(() => t.close());

const slugsOf = (fits: { swaps: { slug: string }[] }[]) => fits.flatMap((f) => f.swaps.map((s) => s.slug)).sort();

describe('GET /api/graph/parts/:id', () => {
  it('when a part is recorded twice, then its page lists the vehicles of both records and every chassis approved swaps fit it to', async () => {
    const res = await request(t.app).get(`/api/graph/parts/${ids.velaA}`);
    expect(res.status).toBe(200);
    const graph = partGraphSchema.parse(res.body);
    expect(graph.sameAs.map((p) => p.id)).toEqual([ids.velaB]);
    expect(graph.cameOn).toEqual(['Orsino Vela 3.0 (1994–1998)', 'Orsino Vela 2.5 (1998–2001)']);
    expect(graph.fits.map((f) => f.chassis.slug).sort()).toEqual(['halden-h31', 'tamsin-regent']);
    expect(slugsOf(graph.fits)).toEqual(['h31-vela-front', 'regent-vela-front']);
    expect(graph.totals).toEqual({ chassis: 2, swaps: 2 });
    const h31 = graph.fits.find((f) => f.chassis.slug === 'halden-h31')!;
    expect(h31.adapters.map((a) => a.partNumbers[0])).toEqual(['NF-H31-VB']);
    expect(h31.swaps[0].adapter).toEqual({
      name: 'H31 caliper bracket',
      maker: 'Northgate Fabrication',
      partNumber: 'NF-H31-VB',
    });
    // its own number first, the other record's number, and the older stamp from its notes
    expect(graph.numbers.map((n) => `${n.number}:${n.source}`)).toEqual([
      'OV-355-104-L:number',
      'OV-355-110-L:number',
      'OV-355-099-L:stamp',
    ]);
  });

  it("when a part is only named in another record's notes, then that record is not counted as the same part", async () => {
    const res = await request(t.app).get(`/api/graph/parts/${ids.mirror}`);
    const graph = partGraphSchema.parse(res.body);
    expect(graph.sameAs).toEqual([]);
    expect(graph.numbers.map((n) => n.number)).toEqual(['OV-355-104-R']);
    expect(slugsOf(graph.fits)).toEqual(['regent-changed']);
  });

  it('when the part does not exist or the id is not a number, then 404 and 400 with the field', async () => {
    expect((await request(t.app).get('/api/graph/parts/999999')).status).toBe(404);
    const bad = await request(t.app).get('/api/graph/parts/abc');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('id');
  });
});

describe('GET /api/graph/chassis/:slug', () => {
  it('when a chassis has approved swaps, then its donor parts are grouped by kind, each with the swaps that show how', async () => {
    const res = await request(t.app).get('/api/graph/chassis/halden-h31');
    expect(res.status).toBe(200);
    const graph = chassisGraphSchema.parse(res.body);
    expect(graph.kinds.map((k) => k.kind)).toEqual(['caliper', 'adapter']);
    const calipers = graph.kinds[0].parts;
    expect(calipers.map((d) => d.part.id)).toEqual([ids.velaA]);
    expect(calipers[0].swaps.map((s) => s.slug)).toEqual(['h31-vela-front']);
    expect(graph.totals).toEqual({ parts: 2, swaps: 1 });
  });

  it('when a chassis is only proposed, then its graph is not found', async () => {
    expect((await request(t.app).get('/api/graph/chassis/halden-h40')).status).toBe(404);
  });
});

describe('GET /api/graph/where-else', () => {
  it('when an older stamp is typed in lower case with spaces, then the part, its other records and numbers, and every chassis it reaches are listed', async () => {
    const res = await request(t.app).get('/api/graph/where-else').query({ number: 'ov 355 099 l' });
    expect(res.status).toBe(200);
    const found = whereElseSchema.parse(res.body);
    expect(found.key).toBe('ov355099l');
    expect(found.parts.map((p) => [p.id, p.matched])).toEqual([
      [ids.velaA, 'stamp'],
      [ids.velaB, 'same_part'],
    ]);
    expect(found.otherNumbers.map((n) => n.number)).toEqual(['OV-355-104-L', 'OV-355-110-L']);
    expect(found.reaches.map((f) => f.chassis.slug).sort()).toEqual(['halden-h31', 'tamsin-regent']);
    expect(slugsOf(found.reaches)).not.toContain('h31-in-review');
  });

  it('when a number nobody recorded is typed, then the answer is empty, and when nothing usable is typed, then 400 names the field', async () => {
    const none = whereElseSchema.parse((await request(t.app).get('/api/graph/where-else').query({ number: 'ZZ-000' })).body);
    expect([none.parts, none.reaches, none.otherNumbers]).toEqual([[], [], []]);
    const bad = await request(t.app).get('/api/graph/where-else').query({ number: ' -- ' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('number');
  });

  it('when a record loses the shared number, then the two records are no longer the same part', async () => {
    t.db
      .update(parts)
      .set({ partNumbers: ['OV-355-110-L'] })
      .where(eq(parts.id, ids.velaB))
      .run();
    try {
      const found = whereElseSchema.parse(
        (await request(t.app).get('/api/graph/where-else').query({ number: 'OV-355-104-L' })).body,
      );
      expect(found.parts.map((p) => p.id)).toEqual([ids.velaA]);
      expect(found.reaches.map((f) => f.chassis.slug)).toEqual(['halden-h31']);
    } finally {
      t.db
        .update(parts)
        .set({ partNumbers: ['OV-355-110-L', 'OV-355-104-L'] })
        .where(eq(parts.id, ids.velaB))
        .run();
    }
  });
});
