import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq, sql } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { listen, signedInMember, type Member } from './support/auth-helpers';
import { addChassis, addPart, swapRecord } from './support/swap-fixtures';
import { addSwap, catalogueLine, swapData } from './support/swap-rows';
import { carFittedSwaps, cars, catalogueChanges, chassis, parts, plans, revisions, swaps } from '../../server/db/schema/index';

// The admins' catalogue desk: corrections with field-level reasons, merging duplicates so that every
// reference follows, approving proposed chassis, and a record of who did each.

let t: TestApp;
let server: Server;
let ada: Member;
let mo: Member;
let kai: Member;
let n = 0;

beforeAll(async () => {
  t = await makeTestApp();
  const { server: s, agent } = listen(t.app);
  server = s;
  ada = await signedInMember(t.db, agent, 'ada_admin', 'admin');
  mo = await signedInMember(t.db, agent, 'gauge_mo', 'moderator');
  kai = await signedInMember(t.db, agent, 'camber_kai');
});
afterAll(() => {
  server.close();
  t.close();
});

const send = (m: Member, method: 'post' | 'patch', path: string, body: object = {}) =>
  m.agent[method](path).set('x-csrf-token', m.token).send(body);

const unique = (base: string) => `${base}-${++n}`;

describe('who may use the catalogue desk', () => {
  it('when a member, a moderator or a visitor calls it, then the answer is 401 or 403 and nothing changes', async () => {
    const part = addPart(t.db, unique('guarded'));
    const c = addChassis(t.db, unique('guarded-chassis'), { proposed: true });
    for (const m of [kai, mo]) {
      expect((await m.agent.get('/api/admin/catalogue/parts')).status).toBe(403);
      expect((await m.agent.get('/api/admin/catalogue/chassis')).status).toBe(403);
      expect((await send(m, 'patch', `/api/admin/catalogue/parts/${part.id}`, { name: 'Renamed by a member' })).status).toBe(403);
      expect((await send(m, 'post', `/api/admin/catalogue/chassis/${c.id}/approve`)).status).toBe(403);
      expect((await send(m, 'post', `/api/admin/catalogue/parts/${part.id}/merge`, { intoId: part.id })).status).toBe(403);
    }
    expect((await request(server).get('/api/admin/catalogue/parts')).status).toBe(401);
    expect(t.db.select().from(parts).where(eq(parts.id, part.id)).get()!.name).toBe(part.name);
    expect(t.db.select().from(chassis).where(eq(chassis.id, c.id)).get()!.proposed).toBe(true);
  });
});

describe('editing', () => {
  it('when an admin corrects a chassis, then the figures change, its address stays, and each field is recorded with who changed it', async () => {
    const c = addChassis(t.db, unique('halden-h31'));
    const res = await send(ada, 'patch', `/api/admin/catalogue/chassis/${c.id}`, {
      code: 'H31A',
      centreBoreMm: 66.5,
      yearTo: 2000,
    });
    expect(res.status).toBe(200);
    expect(res.body.chassis).toMatchObject({
      code: 'H31A',
      centreBoreMm: 66.5,
      yearTo: 2000,
      slug: c.slug,
      body: c.body,
      notes: c.notes,
    });
    const page = await request(server).get(`/api/chassis/${c.slug}`);
    expect(page.body.chassis.code).toBe('H31A');
    const changes = (await ada.agent.get(`/api/admin/catalogue/changes?subject=chassis&id=${c.id}`)).body.changes;
    expect(changes.map((ch: { field: string; from: string; to: string }) => [ch.field, ch.from, ch.to]).sort()).toEqual([
      ['centreBoreMm', '66.6', '66.5'],
      ['code', 'H31', 'H31A'],
      ['yearTo', '1999', '2000'],
    ]);
    expect(changes[0].actor.login).toBe('ada_admin');
    expect(changes[0].action).toBe('edit');
  });

  it('when the input is bad, then the answer is 400 with a reason per field and the record is as it was', async () => {
    const c = addChassis(t.db, unique('bad-input'));
    const part = addPart(t.db, unique('bad-input-part'));
    const bad = await send(ada, 'patch', `/api/admin/catalogue/chassis/${c.id}`, {
      lugCount: 2,
      make: '',
      wheelBoltThread: 'twelve',
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['lugCount', 'make', 'wheelBoltThread']);
    const years = await send(ada, 'patch', `/api/admin/catalogue/chassis/${c.id}`, { yearTo: 1980 });
    expect(years.status).toBe(400);
    expect(years.body.error.fields.yearTo).toMatch(/1991/);
    const unknown = await send(ada, 'patch', `/api/admin/catalogue/chassis/${c.id}`, { slug: 'elsewhere' });
    expect(unknown.status).toBe(400);
    const kind = await send(ada, 'patch', `/api/admin/catalogue/parts/${part.id}`, { kind: 'gearbox', partNumbers: [] });
    expect(kind.status).toBe(400);
    expect(Object.keys(kind.body.error.fields).sort()).toEqual(['kind', 'partNumbers']);
    expect((await send(ada, 'patch', `/api/admin/catalogue/parts/${part.id}`, {})).status).toBe(400);
    expect((await send(ada, 'patch', '/api/admin/catalogue/parts/99999', { name: 'Nothing here' })).status).toBe(404);
    expect(t.db.select().from(chassis).where(eq(chassis.id, c.id)).get()).toMatchObject({
      lugCount: 5,
      make: 'Halden',
      yearTo: 1999,
    });
    expect(t.db.select().from(parts).where(eq(parts.id, part.id)).get()).toMatchObject({
      kind: 'caliper',
      partNumbers: ['OV-355-104-L'],
    });
    expect(t.db.select().from(catalogueChanges).where(eq(catalogueChanges.subjectId, c.id)).all()).toEqual([]);
  });

  it('when a part changes kind, then the lines that point at it say the new kind too', async () => {
    const author = kai.id;
    const c = addChassis(t.db, unique('kind-chassis'));
    const bolt = addPart(t.db, unique('bolt'), {
      kind: 'hardware',
      name: 'Wheel bolt M12×1.5 × 41 mm',
      maker: 'Northgate Fabrication',
      partNumbers: ['NGF-WB-1241'],
    });
    const swap = addSwap(t.db, {
      slug: unique('kind-swap'),
      chassisId: c.id,
      authorId: author,
      revisions: [
        {
          status: 'approved',
          data: swapData('Longer bolts', { parts: [catalogueLine(bolt.id, 'hardware', 'Bolts', ['NGF-WB-1241'])] }),
        },
      ],
    });
    const res = await send(ada, 'patch', `/api/admin/catalogue/parts/${bolt.id}`, { kind: 'wheel_fastener' });
    expect(res.status).toBe(200);
    const data = t.db.select().from(revisions).where(eq(revisions.id, swap.revisionIds[0])).get()!.data;
    expect(data.parts[0]).toMatchObject({ partId: bolt.id, kind: 'wheel_fastener', name: 'Bolts' });
  });
});

describe('merging parts', () => {
  it('when a duplicate part is merged, then every revision line, the graph and the numbers follow the kept part and no line is left pointing at the duplicate', async () => {
    const c = addChassis(t.db, unique('merge-parts-chassis'));
    const kept = addPart(t.db, unique('vela-l'), { partNumbers: ['OV-355-104-L'], cameOn: ['Orsino Vela 3.0 (1994–1998)'] });
    const dup = addPart(t.db, unique('vela-l-again'), {
      partNumbers: ['OV 355 104 L', 'OV-355-110-L'],
      cameOn: ['Orsino Vela 2.5 (1998–2001)'],
      notes: 'Early ones carry the stamp OV-355-099-L.',
    });
    const other = addPart(t.db, unique('bracket'), {
      kind: 'adapter',
      name: 'Bracket',
      maker: 'Northgate Fabrication',
      partNumbers: ['NGF-H31-V330-F'],
    });
    const lines = [
      catalogueLine(dup.id, 'caliper', 'Vela caliper', ['OV-355-110-L']),
      catalogueLine(other.id, 'adapter', 'Bracket', ['NGF-H31-V330-F']),
    ];
    const approved = addSwap(t.db, {
      slug: unique('merge-approved'),
      chassisId: c.id,
      authorId: kai.id,
      revisions: [
        { status: 'superseded', data: swapData('Vela on H31, first write-up', { parts: lines }) },
        { status: 'approved', data: swapData('Vela on H31', { parts: lines }) },
      ],
    });
    const draft = addSwap(t.db, {
      slug: unique('merge-draft'),
      chassisId: c.id,
      authorId: kai.id,
      revisions: [{ status: 'draft', data: swapData('Vela on H31, a draft', { parts: lines }) }],
    });

    const res = await send(ada, 'post', `/api/admin/catalogue/parts/${dup.id}/merge`, { intoId: kept.id });
    expect(res.status).toBe(200);
    expect(res.body.moved.revisions).toBe(3);
    expect(res.body.kept.partNumbers).toEqual(['OV-355-104-L', 'OV-355-110-L']);
    expect(res.body.kept.cameOn).toEqual(['Orsino Vela 3.0 (1994–1998)', 'Orsino Vela 2.5 (1998–2001)']);
    expect(res.body.kept.notes).toContain('OV-355-099-L');

    for (const id of [...approved.revisionIds, ...draft.revisionIds]) {
      const data = t.db.select().from(revisions).where(eq(revisions.id, id)).get()!.data;
      expect(data.parts.map((p) => p.partId)).toEqual([kept.id, other.id]);
      expect(data.parts[0].name).toBe('Vela caliper');
    }
    // no orphan: no row, lookup or line refers to the duplicate
    expect(t.db.select().from(parts).where(eq(parts.id, dup.id)).get()).toBeUndefined();
    expect(t.db.all(sql`select * from revision_parts where part_id = ${dup.id}`)).toEqual([]);
    expect(t.db.all(sql`select revision_id from revision_parts where part_id = ${kept.id}`)).toHaveLength(3);
    expect(t.db.all(sql`select * from part_number_keys where part_id = ${dup.id}`)).toEqual([]);
    expect(
      t.db.all(
        sql`select r.id from revisions r, json_each(r.data, '$.parts') l where json_extract(l.value, '$.partId') = ${dup.id}`,
      ),
    ).toEqual([]);
    expect(
      t.db.all(sql`select l.part_id from revision_parts l left join parts p on p.id = l.part_id where p.id is null`),
    ).toEqual([]);

    // the graph: the kept part reaches the swap, and the duplicate's numbers and stamps now find it
    const graph = await request(server).get(`/api/graph/parts/${kept.id}`);
    expect(graph.status).toBe(200);
    expect(JSON.stringify(graph.body)).toContain('Vela on H31');
    const where = await request(server).get('/api/graph/where-else?number=ov355110l');
    const found = where.body.parts as { id: number; matched: string }[];
    expect(found.filter((p) => p.matched === 'number').map((p) => p.id)).toEqual([kept.id]);
    expect(found.map((p) => p.id)).not.toContain(dup.id);
    expect((await request(server).get(`/api/parts/${dup.id}`)).status).toBe(404);
    const sheet = await request(server).get(`/api/parts/${kept.id}`);
    expect(sheet.body.swaps.map((s: { slug: string }) => s.slug)).toEqual([approved.slug]);

    const changes = (await ada.agent.get(`/api/admin/catalogue/changes?subject=part&id=${kept.id}`)).body.changes;
    expect(changes[0]).toMatchObject({ action: 'merge', actor: { login: 'ada_admin' } });
    expect(changes[0].from).toContain(`#${dup.id}`);
  });

  it('when the parts are of different kinds, the same part, or the kept one does not exist, then 400 with the reason on intoId and nothing moves', async () => {
    const caliper = addPart(t.db, unique('kind-a'));
    const rotor = addPart(t.db, unique('kind-b'), { kind: 'rotor', name: 'Rotor', partNumbers: ['OV-330-028-V'] });
    for (const intoId of [rotor.id, caliper.id, 999999]) {
      const res = await send(ada, 'post', `/api/admin/catalogue/parts/${caliper.id}/merge`, { intoId });
      expect(res.status, String(intoId)).toBe(400);
      expect(res.body.error.fields.intoId, String(intoId)).toBeTruthy();
    }
    expect(
      (await send(ada, 'post', `/api/admin/catalogue/parts/${caliper.id}/merge`, { intoId: 'two' })).body.error.fields.intoId,
    ).toBeTruthy();
    expect(t.db.select().from(parts).where(eq(parts.id, caliper.id)).get()).toBeTruthy();
  });
});

describe('chassis', () => {
  async function propose(code: string) {
    const res = await send(kai, 'post', '/api/submissions', {
      newChassis: {
        make: 'Tamsin',
        model: 'Regent',
        code,
        yearFrom: 1994,
        yearTo: 2002,
        lugCount: 5,
        pcdMm: 114.3,
        centreBoreMm: 67.1,
        wheelBoltThread: 'M12x1.5',
      },
      axle: 'rear',
      category: 'brakes',
      data: swapRecord({ title: `Regent rear rotors on the ${code}` }),
    });
    expect(res.status).toBe(201);
    return { revisionId: res.body.id as number, slug: res.body.chassis.slug as string, id: res.body.chassis.id as number };
  }

  it('when a proposed chassis is approved, then it becomes public and joins the catalogue list; before that the public gets 404', async () => {
    const p = await propose(unique('TR'));
    // a chassis in a draft that was never sent is its author's alone, even from the catalogue desk
    expect((await ada.agent.get('/api/admin/catalogue/chassis')).body.chassis.map((c: { id: number }) => c.id)).not.toContain(
      p.id,
    );
    expect((await send(ada, 'post', `/api/admin/catalogue/chassis/${p.id}/approve`)).status).toBe(404);
    await send(kai, 'post', `/api/submissions/${p.revisionId}/submit`);
    const listed = (await ada.agent.get('/api/admin/catalogue/chassis')).body.chassis.find((c: { id: number }) => c.id === p.id);
    expect(listed).toMatchObject({ proposed: true, swapCount: 1 });
    expect((await request(server).get(`/api/chassis/${p.slug}`)).status).toBe(404);

    const res = await send(ada, 'post', `/api/admin/catalogue/chassis/${p.id}/approve`);
    expect(res.status).toBe(200);
    expect(res.body.chassis.proposed).toBe(false);
    expect((await request(server).get(`/api/chassis/${p.slug}`)).status).toBe(200);
    expect((await request(server).get('/api/chassis')).body.items.map((c: { slug: string }) => c.slug)).toContain(p.slug);
    expect((await send(ada, 'post', `/api/admin/catalogue/chassis/${p.id}/approve`)).status).toBe(409);
    const changes = (await ada.agent.get(`/api/admin/catalogue/changes?subject=chassis&id=${p.id}`)).body.changes;
    expect(changes.map((c: { action: string }) => c.action)).toEqual(['approve']);
  });

  it('when a duplicate chassis is merged, then swaps, cars, fitted swaps and plans follow the kept chassis and nothing points at the duplicate', async () => {
    const kept = addChassis(t.db, unique('tamsin-regent'), { make: 'Tamsin', model: 'Regent', code: 'TR2' });
    const p = await propose(unique('TR2'));
    await send(kai, 'post', `/api/submissions/${p.revisionId}/submit`);
    const now = new Date();
    const published = addSwap(t.db, {
      slug: unique('on-dup'),
      chassisId: p.id,
      authorId: kai.id,
      revisions: [{ status: 'approved' }],
    });
    const car = t.db
      .insert(cars)
      .values({
        userId: kai.id,
        chassisId: p.id,
        nickname: 'Regent estate',
        wheelDiameterIn: 16,
        wheelWidthIn: 7,
        wheelOffsetMm: 38,
        createdAt: now,
        updatedAt: now,
      })
      .returning()
      .get();
    t.db
      .insert(carFittedSwaps)
      .values({ carId: car.id, swapId: published.swapId, revisionId: published.revisionIds[0], createdAt: now })
      .run();
    t.db
      .insert(plans)
      .values({ id: unique('plan-regent'), chassisId: p.id, carId: car.id, ownerId: kai.id, createdAt: now, updatedAt: now })
      .run();

    const bad = await send(ada, 'post', `/api/admin/catalogue/chassis/${kept.id}/merge`, { intoId: p.id });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.intoId).toMatch(/Approve it first/);

    const res = await send(ada, 'post', `/api/admin/catalogue/chassis/${p.id}/merge`, { intoId: kept.id });
    expect(res.status).toBe(200);
    expect(res.body.moved).toMatchObject({ swaps: 2, cars: 1, plans: 1 });
    expect(t.db.select().from(chassis).where(eq(chassis.id, p.id)).get()).toBeUndefined();
    const onKept = t.db.select().from(swaps).where(eq(swaps.chassisId, kept.id)).all();
    expect(onKept.map((s) => s.slug)).toContain(published.slug);
    expect(t.db.select().from(cars).where(eq(cars.id, car.id)).get()!.chassisId).toBe(kept.id);
    expect(t.db.select().from(carFittedSwaps).where(eq(carFittedSwaps.carId, car.id)).all()).toHaveLength(1);
    for (const table of ['swaps', 'cars', 'plans'])
      expect(t.db.get<{ n: number }>(sql.raw(`select count(*) as n from ${table} where chassis_id = ${p.id}`))!.n, table).toBe(0);
    // the moved swap keeps its address and is listed on the kept chassis' page
    const page = await request(server).get(`/api/chassis/${kept.slug}`);
    expect(page.body.swaps.map((s: { slug: string }) => s.slug)).toContain(published.slug);
    expect((await request(server).get(`/api/swaps/${published.slug}`)).status).toBe(200);
    // the submission that proposed the duplicate can still be decided, now on the kept chassis
    expect((await send(mo, 'post', `/api/review/${p.revisionId}/approve`)).status).toBe(200);
    const changes = (await ada.agent.get(`/api/admin/catalogue/changes?subject=chassis&id=${kept.id}`)).body.changes;
    expect(changes[0]).toMatchObject({ action: 'merge', actor: { login: 'ada_admin' } });
  });
});
