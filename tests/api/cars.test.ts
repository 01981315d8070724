import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser, csrfToken, listen, signIn, type Agent } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { cars, chassis as chassisTable } from '../../server/db/schema/index';
import type { CarView } from '../../shared/schemas/cars';

let t: TestApp;
let server: Server;
let rosa: { a: Agent; token: string };
let kai: { a: Agent; token: string };
let h31: number;
let h40: number;

const greenCoupe = {
  nickname: 'Green coupe',
  wheelDiameterIn: 16,
  wheelWidthIn: 7,
  wheelOffsetMm: 38,
  tyre: '205/55R16',
  spacerMm: 10,
};

beforeAll(async () => {
  t = await makeTestApp();
  const l = listen(t.app);
  server = l.server;
  addUser(t.db, 'rivet_rosa');
  addUser(t.db, 'camber_kai');
  h31 = addChassis(t.db, 'halden-h31').id;
  h40 = addChassis(t.db, 'halden-h40', { model: 'H40', code: 'H40', yearFrom: 1999, yearTo: 2007 }).id;
  for (const [login, set] of [
    ['rivet_rosa', (v: typeof rosa) => (rosa = v)],
    ['camber_kai', (v: typeof kai) => (kai = v)],
  ] as const) {
    const a = l.agent();
    await signIn(a, login);
    set({ a, token: await csrfToken(a) });
  }
});
afterAll(() => {
  server.close();
  t.close();
});

describe('/api/cars', () => {
  it('when signed out, then listing cars is 401', async () => {
    const res = await request(server).get('/api/cars');
    expect(res.status).toBe(401);
  });

  it('when a member adds a car, then it is listed with its chassis, and only for them', async () => {
    const res = await rosa.a
      .post('/api/cars')
      .set('x-csrf-token', rosa.token)
      .send({ ...greenCoupe, chassisId: h31 });
    expect(res.status).toBe(201);
    const car = res.body.car as CarView;
    expect(car).toMatchObject({ ...greenCoupe, chassis: { slug: 'halden-h31', code: 'H31' } });

    const mine = await rosa.a.get('/api/cars');
    expect(mine.body.items.map((c: CarView) => c.nickname)).toEqual(['Green coupe']);
    expect((await kai.a.get('/api/cars')).body.items).toEqual([]);
  });

  it('when the tyre size or wheel is wrong, then it is 400 with a reason per field and nothing is saved', async () => {
    const before = t.db.select().from(cars).all().length;
    const res = await rosa.a
      .post('/api/cars')
      .set('x-csrf-token', rosa.token)
      .send({ chassisId: h31, nickname: '', wheelDiameterIn: 9, wheelWidthIn: 7, wheelOffsetMm: 38, tyre: '205/55-16' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.tyre).toMatch(/not a tyre size/);
    expect(res.body.error.fields.wheelDiameterIn).toBe('Between 10 and 24 in');
    expect(res.body.error.fields.nickname).toBeDefined();
    const unknownChassis = await rosa.a
      .post('/api/cars')
      .set('x-csrf-token', rosa.token)
      .send({ ...greenCoupe, chassisId: 9999 });
    expect(unknownChassis.status).toBe(400);
    expect(unknownChassis.body.error.fields.chassisId).toMatch(/not in the catalogue/);
    expect(t.db.select().from(cars).all()).toHaveLength(before);
  });

  it('when the owner gives the car its own brake-balance figures, then they are kept and can be taken back to the stock ones', async () => {
    const [car] = (await rosa.a.get('/api/cars')).body.items as CarView[];
    expect(car!.vehicle).toBeNull();
    const own = {
      unladen: { massKg: 1230, frontStaticFraction: 0.52, cgHeightMm: 500 },
      laden: { massKg: 1630, frontStaticFraction: 0.47, cgHeightMm: 535 },
      wheelbaseMm: 2700,
      tyreLoadedRadiusMm: { front: 298, rear: 298 },
      rearValve: { kind: 'proportioning', kneeBar: 35, slope: 0.3 },
      basis: 'Corner scales, full tank',
    };
    const res = await rosa.a.patch(`/api/cars/${car!.id}`).set('x-csrf-token', rosa.token).send({ vehicle: own });
    expect(res.status).toBe(200);
    expect((res.body.car as CarView).vehicle).toEqual(own);
    expect(((await rosa.a.get('/api/cars')).body.items as CarView[])[0]!.vehicle).toEqual(own);

    const back = await rosa.a.patch(`/api/cars/${car!.id}`).set('x-csrf-token', rosa.token).send({ vehicle: null });
    expect((back.body.car as CarView).vehicle).toBeNull();
    expect(t.db.select().from(cars).where(eq(cars.id, car!.id)).get()!.vehicle).toBeNull();
  });

  it('when the brake-balance figures are impossible, then it is 400 naming each field and the saved figures stay', async () => {
    const [car] = (await rosa.a.get('/api/cars')).body.items as CarView[];
    const res = await rosa.a
      .patch(`/api/cars/${car!.id}`)
      .set('x-csrf-token', rosa.token)
      .send({
        vehicle: {
          unladen: { massKg: 1230, frontStaticFraction: 52, cgHeightMm: 500 },
          laden: { massKg: 900, frontStaticFraction: 0.47, cgHeightMm: 535 },
          wheelbaseMm: 2700,
          tyreLoadedRadiusMm: { front: 298, rear: 298 },
          rearValve: { kind: 'proportioning', kneeBar: 35, slope: 3 },
        },
      });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['vehicle.unladen.frontStaticFraction']).toBe('Between 20 and 80 %');
    expect(res.body.error.fields['vehicle.rearValve.slope']).toBe('Between 0 and 1');
    expect(t.db.select().from(cars).where(eq(cars.id, car!.id)).get()!.vehicle).toBeNull();
  });

  it('when a new car comes with figures whose laden mass is below the unladen one, then it is 400 on that field and no car is added', async () => {
    const before = t.db.select().from(cars).all().length;
    const res = await rosa.a
      .post('/api/cars')
      .set('x-csrf-token', rosa.token)
      .send({
        ...greenCoupe,
        chassisId: h31,
        vehicle: {
          unladen: { massKg: 1230, frontStaticFraction: 0.52, cgHeightMm: 500 },
          laden: { massKg: 1100, frontStaticFraction: 0.47, cgHeightMm: 535 },
          wheelbaseMm: 2700,
          tyreLoadedRadiusMm: { front: 298, rear: 298 },
          rearValve: { kind: 'load-sensing', kneeBarUnladen: 30, kneeBarLaden: 55, slope: 0.3 },
        },
      });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['vehicle.laden.massKg']).toBe('The laden mass is below the unladen mass');
    expect(t.db.select().from(cars).all()).toHaveLength(before);
  });

  it('when a chassis carries stock figures, then its page and the chassis list return them, and a chassis without returns null', async () => {
    const stock = {
      unladen: { massKg: 1280, frontStaticFraction: 0.53, cgHeightMm: 520 },
      laden: null,
      wheelbaseMm: 2700,
      tyreLoadedRadiusMm: { front: 290, rear: 290 },
      rearValve: { kind: 'electronic' as const },
      basis: 'Kerb weight with a driver',
    };
    t.db.update(chassisTable).set({ vehicle: stock }).where(eq(chassisTable.id, h31)).run();
    const page = await request(t.app).get('/api/chassis/halden-h31');
    expect(page.status).toBe(200);
    expect(page.body.chassis.vehicle).toEqual(stock);
    const list = (await request(t.app).get('/api/chassis')).body.items as { slug: string; vehicle: unknown }[];
    expect(list.find((c) => c.slug === 'halden-h31')!.vehicle).toEqual(stock);
    expect(list.find((c) => c.slug === 'halden-h40')!.vehicle).toBeNull();
  });

  it('when the owner edits a car, then only the fields sent change', async () => {
    const [car] = (await rosa.a.get('/api/cars')).body.items as CarView[];
    const res = await rosa.a
      .patch(`/api/cars/${car!.id}`)
      .set('x-csrf-token', rosa.token)
      .send({ chassisId: h40, wheelOffsetMm: 42 });
    expect(res.status).toBe(200);
    expect(res.body.car).toMatchObject({
      chassis: { slug: 'halden-h40' },
      wheelOffsetMm: 42,
      tyre: '205/55R16',
      spacerMm: 10,
      nickname: 'Green coupe',
    });
    const bad = await rosa.a.patch(`/api/cars/${car!.id}`).set('x-csrf-token', rosa.token).send({ tyre: 'fat ones' });
    expect(bad.status).toBe(400);
    expect(t.db.select().from(cars).where(eq(cars.id, car!.id)).get()!.tyre).toBe('205/55R16');
  });

  it('when the owner records the wheel’s inside profile, then it is kept in mm and read back; an edit that leaves it out keeps it', async () => {
    const [car] = (await rosa.a.get('/api/cars')).body.items as CarView[];
    const profile = [
      { zMm: -120, rMm: 202 },
      { zMm: 14, rMm: 202 },
      { zMm: 31, rMm: 196 },
      { zMm: 39, rMm: 182 },
      { zMm: 40, rMm: 90 },
    ];
    const res = await rosa.a.patch(`/api/cars/${car!.id}`).set('x-csrf-token', rosa.token).send({ wheelInsideProfile: profile });
    expect(res.status).toBe(200);
    expect(res.body.car.wheelInsideProfile).toEqual(profile);
    const other = await rosa.a.patch(`/api/cars/${car!.id}`).set('x-csrf-token', rosa.token).send({ wheelOffsetMm: 40 });
    expect(other.body.car.wheelInsideProfile).toEqual(profile);
    expect(t.db.select().from(cars).where(eq(cars.id, car!.id)).get()!.wheelInsideProfile).toEqual(profile);
  });

  it('when a profile point is bad, then it is 400 naming that point’s field, and the saved profile is untouched', async () => {
    const [car] = (await rosa.a.get('/api/cars')).body.items as CarView[];
    const saved = t.db.select().from(cars).where(eq(cars.id, car!.id)).get()!.wheelInsideProfile;
    const send = (wheelInsideProfile: unknown) =>
      rosa.a.patch(`/api/cars/${car!.id}`).set('x-csrf-token', rosa.token).send({ wheelInsideProfile });

    const negative = await send([
      { zMm: 0, rMm: 200 },
      { zMm: 30, rMm: -5 },
    ]);
    expect(negative.status).toBe(400);
    expect(negative.body.error.fields['wheelInsideProfile.1.rMm']).toBe('A radius is 0 or more');

    const missing = await send([{ zMm: 0, rMm: 200 }, { rMm: 150 }]);
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields['wheelInsideProfile.1.zMm']).toMatch(/Enter z/);

    const turnsBack = await send([
      { zMm: 0, rMm: 200 },
      { zMm: 20, rMm: 180 },
      { zMm: 30, rMm: 190 },
      { zMm: 40, rMm: 100 },
    ]);
    expect(turnsBack.status).toBe(400);
    expect(turnsBack.body.error.fields['wheelInsideProfile.2.rMm']).toMatch(/turns back/);

    const one = await send([{ zMm: 0, rMm: 200 }]);
    expect(one.status).toBe(400);
    expect(one.body.error.fields.wheelInsideProfile).toMatch(/at least two points/);

    expect(t.db.select().from(cars).where(eq(cars.id, car!.id)).get()!.wheelInsideProfile).toEqual(saved);
  });

  it('when another member edits or deletes the car, then it is 404 and the car is untouched', async () => {
    const [car] = (await rosa.a.get('/api/cars')).body.items as CarView[];
    const edit = await kai.a.patch(`/api/cars/${car!.id}`).set('x-csrf-token', kai.token).send({ nickname: 'Mine now' });
    expect(edit.status).toBe(404);
    const del = await kai.a.delete(`/api/cars/${car!.id}`).set('x-csrf-token', kai.token);
    expect(del.status).toBe(404);
    expect(t.db.select().from(cars).where(eq(cars.id, car!.id)).get()!.nickname).toBe('Green coupe');
  });

  it('when the owner deletes the car, then it is gone from their list', async () => {
    const [car] = (await rosa.a.get('/api/cars')).body.items as CarView[];
    expect((await rosa.a.delete(`/api/cars/${car!.id}`).set('x-csrf-token', rosa.token)).status).toBe(204);
    expect((await rosa.a.get('/api/cars')).body.items).toEqual([]);
  });
});
