import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, type TestApp } from './support/test-app';
import { addPart } from './support/swap-fixtures';

// The submission form's part picker: catalogue parts found as the member types, and the part a proposed
// one already is (same maker and number once separators and case are set aside).

let t: TestApp;
const ids = {} as Record<'velaL' | 'velaR' | 'bolt' | 'otherMaker', number>;

beforeAll(async () => {
  t = await makeTestApp();
  ids.velaL = addPart(t.db, 'vela-l').id;
  ids.velaR = addPart(t.db, 'vela-r', { name: 'Vela four-piston fixed front caliper, right', partNumbers: ['OV-355-104-R'] }).id;
  ids.bolt = addPart(t.db, 'ngf-bolt', {
    kind: 'wheel_fastener',
    name: 'Wheel bolt M12×1.5 × 41 mm, 60° cone seat',
    maker: 'Northgate Fabrication',
    partNumbers: ['NGF-WB-1241'],
  }).id;
  // the same number from another maker is another part
  ids.otherMaker = addPart(t.db, 'other-bolt', {
    kind: 'wheel_fastener',
    name: 'Wheel bolt, long',
    maker: 'Lathe & Lug',
    partNumbers: ['NGF WB 1241'],
  }).id;
});
afterAll(() => t.close());

const match = (maker: string, numbers: string) => request(t.app).get('/api/parts/match').query({ maker, numbers });

describe('a proposed part that is already in the catalogue', () => {
  it('when maker and number match after normalising, then the server answers that part and the number it matched', async () => {
    for (const [maker, numbers] of [
      ['Northgate Fabrication', 'NGF-WB-1241'],
      ['northgate-fabrication', 'ngf wb 1241'],
      ['NORTHGATE.FABRICATION', 'something-else, ngf/wb/1241'],
    ]) {
      const res = await match(maker, numbers);
      expect(res.status, `${maker} ${numbers}`).toBe(200);
      expect(res.body.match.part, `${maker} ${numbers}`).toMatchObject({
        id: ids.bolt,
        kind: 'wheel_fastener',
        maker: 'Northgate Fabrication',
      });
      expect(res.body.match.number).toBe('NGF-WB-1241');
    }
    expect((await match('Lathe and Lug', 'NGF-WB-1241')).body.match).toBeNull();
    expect((await match('Lathe & Lug', 'ngf-wb-1241')).body.match.part.id).toBe(ids.otherMaker);
  });

  it('when the maker differs, the number differs or either is missing, then there is no match', async () => {
    expect((await match('Orsino', 'NGF-WB-1241')).body.match).toBeNull();
    expect((await match('Northgate Fabrication', 'NGF-WB-1236')).body.match).toBeNull();
    expect((await match('', 'NGF-WB-1241')).body.match).toBeNull();
    expect((await match('Northgate Fabrication', ' , ')).body.match).toBeNull();
  });

  it('when the query is too long, then 400 with the field', async () => {
    const res = await match('Orsino', 'x'.repeat(700));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.numbers).toBeTruthy();
  });
});

describe('searching the catalogue as you type', () => {
  const search = (q: string, kind?: string) =>
    request(t.app)
      .get('/api/parts')
      .query(kind ? { q, kind } : { q });

  it('when words of the name and maker are typed, then the parts with all of them come back', async () => {
    const res = await search('vela right');
    expect(res.status).toBe(200);
    expect(res.body.items.map((p: { id: number }) => p.id)).toEqual([ids.velaR]);
    expect(res.body.items[0]).toEqual({
      id: ids.velaR,
      kind: 'caliper',
      name: 'Vela four-piston fixed front caliper, right',
      maker: 'Orsino',
      partNumbers: ['OV-355-104-R'],
      cameOn: ['Orsino Vela 3.0 (1994–1998)'],
    });
  });

  it('when the start of a number is typed in any form, then its parts come first', async () => {
    const ids1 = (await search('ov355')).body.items.map((p: { id: number }) => p.id);
    expect(ids1.sort()).toEqual([ids.velaL, ids.velaR].sort());
    const bolts = (await search('NGF WB')).body.items.map((p: { id: number }) => p.id);
    expect(bolts.sort()).toEqual([ids.bolt, ids.otherMaker].sort());
  });

  it('when a kind is given, then only parts of that kind; an unknown kind is a 400 with the field', async () => {
    expect((await search('', 'wheel_fastener')).body.items.map((p: { id: number }) => p.id).sort()).toEqual(
      [ids.bolt, ids.otherMaker].sort(),
    );
    const bad = await search('bolt', 'gearbox');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.kind).toBeTruthy();
  });

  it('when the text has LIKE wildcards, then they are taken literally', async () => {
    expect((await search('%')).body.items).toEqual([]);
    expect((await search('_')).body.items).toEqual([]);
  });
});
