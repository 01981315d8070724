import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, type TestApp } from './support/test-app';
import { addShop, listen, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, approveNewRevision, swapData } from './support/swap-rows';
import type { BrakeCorner } from '../../shared/schemas/swap-data';
import { DEFAULT_PAD_MU } from '../../shared/fitment/brakes';
import type { PlanView } from '../../shared/schemas/plans';
import type { CarView } from '../../shared/schemas/cars';

let t: TestApp;
let server: Server;
let agent: () => Agent;
let rosa: Member;
let kai: Member;
let shop: Member;
let h31: number;
let h40: number;

const disc = (pistonsPerSideMm: number[], rotorDiameterMm: number, padHeightMm: number): BrakeCorner => ({
  kind: 'disc',
  pistonsPerSideMm,
  rotorDiameterMm,
  padHeightMm,
});
// the test chassis' stock corners (tests/api/support/swap-fixtures.ts)
const STOCK = { front: disc([54], 280, 50), rear: disc([38], 280, 40) };
const priced = (asBuilt: number, budget: number, newKit: number) => [
  { route: 'as_built' as const, item: 'Parts', amountMinor: asBuilt },
  { route: 'budget' as const, item: 'Parts', amountMinor: budget },
  { route: 'new_kit' as const, item: 'Kit', amountMinor: newKit },
];
const frontData = swapData('Four-piston calipers on the H31 front', {
  brakes: { before: STOCK, after: { front: disc([40, 44], 330, 55), rear: STOCK.rear } },
  costs: priced(80_000, 52_000, 160_000),
  installHours: 6,
});
const rearData = swapData('Bigger rear rotors on the H31', {
  brakes: { before: STOCK, after: { front: STOCK.front, rear: disc([38], 300, 44) } },
  costs: priced(48_500, 33_800, 67_900),
  installHours: 4,
});
const otherFront = swapData('Single-piston upgrade on the H31 front', {
  brakes: { before: STOCK, after: { front: disc([57], 300, 52), rear: STOCK.rear } },
  costs: priced(30_000, 20_000, 50_000),
});

let frontSwap: { swapId: number; slug: string };

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  h31 = addChassis(t.db).id;
  h40 = addChassis(t.db, 'halden-h40', { model: 'H40', code: 'H40' }).id;
  rosa = await signedInMember(t.db, agent, 'rivet_rosa');
  kai = await signedInMember(t.db, agent, 'camber_kai');
  const ridgeway = addShop(t.db, 'ridgeway-performance', 'Ridgeway Performance');
  shop = await signedInMember(t.db, agent, 'ridgeway_shop', 'shop', { shopId: ridgeway.id });
  const a = { chassisId: h31, authorId: rosa.id };
  frontSwap = addSwap(t.db, { ...a, slug: 'h31-front-four-piston', revisions: [{ status: 'approved', data: frontData }] });
  addSwap(t.db, { ...a, slug: 'h31-rear-bigger', axle: 'rear', revisions: [{ status: 'approved', data: rearData }] });
  addSwap(t.db, { ...a, slug: 'h31-front-single', revisions: [{ status: 'approved', data: otherFront }] });
  addSwap(t.db, { ...a, slug: 'h31-front-pending', revisions: [{ status: 'in_review', data: otherFront }] });
  addSwap(t.db, { chassisId: h40, authorId: rosa.id, slug: 'h40-front', revisions: [{ status: 'approved' }] });
});
afterAll(() => {
  server.close();
  t.close();
});

const anonymous = () => request(server);

describe('making a plan', () => {
  it('when anyone posts a chassis and two swaps, then it answers 201 with the plan id, and the plan has integer totals per route', async () => {
    const res = await anonymous()
      .post('/api/plans')
      .send({ chassisId: h31, swapSlugs: ['h31-front-four-piston', 'h31-rear-bigger'] });
    expect(res.status).toBe(201);
    expect(res.body.id).toMatch(/^[A-Za-z0-9_-]{10,32}$/);

    const plan = await anonymous().get(`/api/plans/${res.body.id}`);
    expect(plan.status).toBe(200);
    const view = plan.body as PlanView;
    expect(view.costs.totals).toEqual({ as_built: 128_500, budget: 85_800, new_kit: 227_900 });
    expect(view.swaps.map((s) => [s.slug, s.axle])).toEqual([
      ['h31-front-four-piston', 'front'],
      ['h31-rear-bigger', 'rear'],
    ]);
    expect(view.brakes.shift.direction).toBe('forward');
    expect(view.time.totalHours).toBe(10);
    expect(plan.headers['set-cookie']).toBeUndefined();
  });

  it('when a swap is unknown, unapproved or for another chassis, then the answer names the list position', async () => {
    const res = await anonymous()
      .post('/api/plans')
      .send({ chassisId: h31, swapSlugs: ['h31-front-four-piston', 'nope', 'h31-front-pending', 'h40-front'] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      'swapSlugs.1': 'No approved swap “nope”',
      'swapSlugs.2': 'No approved swap “h31-front-pending”',
      'swapSlugs.3': 'That swap is for another chassis',
    });
  });

  it('when two swaps change the same axle’s brakes, then the plan is refused with the clash named', async () => {
    const res = await anonymous()
      .post('/api/plans')
      .send({ chassisId: h31, swapSlugs: ['h31-front-four-piston', 'h31-front-single'] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['swapSlugs.1']).toMatch(/both this and “h31-front-four-piston” change the front brakes/i);
  });

  it('when the body is not a plan, then each wrong field is named', async () => {
    const res = await anonymous().post('/api/plans').send({ chassisId: 'x', swapSlugs: [] });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['chassisId', 'swapSlugs']);
  });

  it('when a visitor plans for a car, then they are told to sign in', async () => {
    const res = await anonymous()
      .post('/api/plans')
      .send({ chassisId: h31, carId: 1, swapSlugs: ['h31-rear-bigger'] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.carId).toMatch(/sign in/i);
  });
});

describe('who may change a plan', () => {
  it('when a visitor makes a plan, then only their device key changes it, and signing in adopts it', async () => {
    const made = await anonymous()
      .post('/api/plans')
      .send({ chassisId: h31, swapSlugs: ['h31-rear-bigger'] });
    const { id, deviceKey } = made.body as { id: string; deviceKey: string };
    expect(deviceKey).toMatch(/^[A-Za-z0-9_-]{20,64}$/);

    const refused = await anonymous().patch(`/api/plans/${id}`).send({ title: 'Mine now' });
    expect(refused.status).toBe(403);
    const read = await anonymous().get(`/api/plans/${id}`).set('x-plan-key', deviceKey);
    expect(read.body.canEdit).toBe(true);
    const edited = await anonymous().patch(`/api/plans/${id}`).set('x-plan-key', deviceKey).send({ title: 'Rear first' });
    expect(edited.status).toBe(200);
    expect(edited.body.title).toBe('Rear first');

    const wrongKey = await rosa.agent
      .post('/api/me/plans/adopt')
      .set('x-csrf-token', rosa.token)
      .send({ plans: [{ id, deviceKey: 'x'.repeat(32) }] });
    expect(wrongKey.body.adopted).toEqual([]);
    const adopted = await rosa.agent
      .post('/api/me/plans/adopt')
      .set('x-csrf-token', rosa.token)
      .send({ plans: [{ id, deviceKey }] });
    expect(adopted.body.adopted).toEqual([id]);

    const mine = await rosa.agent.get('/api/me/plans');
    expect(mine.body.items.map((p: { id: string }) => p.id)).toContain(id);
    // the device key no longer opens it: the plan has an owner now
    const afterAdopt = await anonymous().patch(`/api/plans/${id}`).set('x-plan-key', deviceKey).send({ title: 'Again' });
    expect(afterAdopt.status).toBe(403);
  });

  it('when a member shares a plan, then another member reads it but cannot change or delete it', async () => {
    const made = await rosa.agent
      .post('/api/plans')
      .set('x-csrf-token', rosa.token)
      .send({ chassisId: h31, swapSlugs: ['h31-front-four-piston'] });
    expect(made.body.deviceKey).toBeUndefined();
    const read = await kai.agent.get(`/api/plans/${made.body.id}`);
    expect(read.status).toBe(200);
    expect(read.body.canEdit).toBe(false);
    expect(read.body.owner.login).toBe('rivet_rosa');
    const del = await kai.agent.delete(`/api/plans/${made.body.id}`).set('x-csrf-token', kai.token);
    expect(del.status).toBe(403);
    const own = await rosa.agent.delete(`/api/plans/${made.body.id}`).set('x-csrf-token', rosa.token);
    expect(own.status).toBe(204);
    expect((await anonymous().get(`/api/plans/${made.body.id}`)).status).toBe(404);
  });

  it('when a member plans for someone else’s car, then it is refused', async () => {
    const car = await kai.agent
      .post('/api/cars')
      .set('x-csrf-token', kai.token)
      .send({ chassisId: h31, nickname: 'Kai’s H31', wheelDiameterIn: 16, wheelWidthIn: 7, wheelOffsetMm: 38 });
    const res = await rosa.agent
      .post('/api/plans')
      .set('x-csrf-token', rosa.token)
      .send({ chassisId: h31, carId: car.body.car.id, swapSlugs: ['h31-rear-bigger'] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.carId).toBe('That is not one of your cars');
  });
});

describe('the car as it is', () => {
  it('when a car has a front swap fitted, then a plan for it starts from that swap, and says so', async () => {
    const car = await rosa.agent
      .post('/api/cars')
      .set('x-csrf-token', rosa.token)
      .send({
        chassisId: h31,
        nickname: 'Winter saloon',
        wheelDiameterIn: 16,
        wheelWidthIn: 7,
        wheelOffsetMm: 38,
        fittedSwapSlugs: ['h31-front-single'],
        otherChanges: 'Braided hoses all round',
      });
    expect(car.status).toBe(201);
    const view = car.body.car as CarView;
    expect(view.fitted.map((f) => f.slug)).toEqual(['h31-front-single']);
    expect(view.otherChanges).toBe('Braided hoses all round');
    // the car's brakes as they are, for a sheet opened for it: the fitted front with the stock rear
    expect(view.brakesAsIs).toMatchObject({
      front: { ...disc([57], 300, 52), padMu: otherFront.brakes!.padMu },
      rear: { ...STOCK.rear, padMu: DEFAULT_PAD_MU },
    });

    const made = await rosa.agent
      .post('/api/plans')
      .set('x-csrf-token', rosa.token)
      .send({ chassisId: h31, carId: view.id, swapSlugs: ['h31-rear-bigger'] });
    expect(made.status).toBe(201);
    const plan = (await rosa.agent.get(`/api/plans/${made.body.id}`)).body as PlanView;
    expect(plan.car!.fitted.map((f) => f.slug)).toEqual(['h31-front-single']);
    expect(plan.brakes.asIs.front.source).toMatchObject({ kind: 'swap', slug: 'h31-front-single' });
    expect(plan.brakes.planned.front.source).toMatchObject({ kind: 'swap', slug: 'h31-front-single' });
    expect(plan.brakes.planned.rear.source).toMatchObject({ kind: 'swap', slug: 'h31-rear-bigger' });
    expect(plan.wheels.checks).toHaveLength(1);
  });

  it('when a car has no swap fitted, then its brakes are the stock ones and no car-as-it-is start is given', async () => {
    const car = await rosa.agent
      .post('/api/cars')
      .set('x-csrf-token', rosa.token)
      .send({ chassisId: h31, nickname: 'Stock saloon', wheelDiameterIn: 16, wheelWidthIn: 7, wheelOffsetMm: 38 });
    expect(car.status).toBe(201);
    expect((car.body.car as CarView).brakesAsIs).toBeNull();
  });

  it('when a fitted swap is for another chassis, then the car is not saved and the field is named', async () => {
    const res = await rosa.agent
      .post('/api/cars')
      .set('x-csrf-token', rosa.token)
      .send({
        chassisId: h31,
        nickname: 'Odd one',
        wheelDiameterIn: 16,
        wheelWidthIn: 7,
        wheelOffsetMm: 38,
        fittedSwapSlugs: ['h40-front'],
      });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['fittedSwapSlugs.0']).toBe('That swap is for another chassis');
    const list = await rosa.agent.get('/api/cars');
    expect(list.body.items.map((c: CarView) => c.nickname)).not.toContain('Odd one');
  });
});

describe('newer revisions and shops', () => {
  it('when a planned swap gets a newer approved revision, then the plan says what changed until its owner brings it up to date', async () => {
    const made = await rosa.agent
      .post('/api/plans')
      .set('x-csrf-token', rosa.token)
      .send({ chassisId: h31, swapSlugs: ['h31-front-four-piston'] });
    const { number } = approveNewRevision(t.db, frontSwap.swapId, { ...frontData, installHours: 7 }, rosa.id);

    const stale = (await anonymous().get(`/api/plans/${made.body.id}`)).body as PlanView;
    expect(stale.swaps[0]!.revisionNumber).toBe(number - 1);
    expect(stale.swaps[0]!.newerRevision).toMatchObject({ number });
    expect(stale.swaps[0]!.newerRevision!.summary).not.toBe('');
    expect(stale.time.totalHours).toBe(6);

    const refused = await kai.agent.post(`/api/plans/${made.body.id}/refresh`).set('x-csrf-token', kai.token);
    expect(refused.status).toBe(403);
    const fresh = await rosa.agent.post(`/api/plans/${made.body.id}/refresh`).set('x-csrf-token', rosa.token);
    expect(fresh.body.swaps[0].revisionNumber).toBe(number);
    expect(fresh.body.swaps[0].newerRevision).toBeNull();
    expect(fresh.body.time.totalHours).toBe(7);
  });

  it('when a shop makes a plan for a customer, then it is pinned to the shop; a member cannot make a shop plan', async () => {
    const made = await shop.agent
      .post('/api/plans')
      .set('x-csrf-token', shop.token)
      .send({ chassisId: h31, swapSlugs: ['h31-rear-bigger'], forShop: true, title: 'Quote 118 for the green coupe' });
    expect(made.status).toBe(201);
    const plan = (await anonymous().get(`/api/plans/${made.body.id}`)).body as PlanView;
    expect(plan.pinned).toEqual({ shop: { slug: 'ridgeway-performance', name: 'Ridgeway Performance' } });

    const member = await kai.agent
      .post('/api/plans')
      .set('x-csrf-token', kai.token)
      .send({ chassisId: h31, swapSlugs: ['h31-rear-bigger'], forShop: true });
    expect(member.status).toBe(403);
  });
});
