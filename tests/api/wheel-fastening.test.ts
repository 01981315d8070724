import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from './support/test-app';
import { listen, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { swapRecord } from './support/swap-fixtures';

// A chassis carries how its wheels are held (fastener, seat, hub thread, spigot): proposed with a submission,
// read back with the chassis, and refused field by field when it does not make sense.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let kai: Member;
let n = 0;

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  kai = await signedInMember(t.db, agent, 'camber_kai');
});
afterAll(() => {
  server.close();
  t.close();
});

const post = (m: Member, path: string, body: object = {}) => m.agent.post(path).set('x-csrf-token', m.token).send(body);

function propose(newChassis: Record<string, unknown>) {
  n++;
  return post(kai, '/api/submissions', {
    newChassis: {
      make: 'Tamsin',
      model: 'Kestrel',
      code: `TK${n}`,
      yearFrom: 1992,
      yearTo: 2000,
      lugCount: 5,
      pcdMm: 112,
      centreBoreMm: 66.6,
      ...newChassis,
    },
    axle: 'front',
    category: 'brakes',
    data: swapRecord({ title: `Kestrel front calipers, proposal ${n}` }),
  });
}

const studs = {
  fastener: 'stud_nut',
  seat: 'cone60',
  stockLengthMm: 38,
  nutThreadMm: 16,
  hubMaterial: 'steel',
  front: { spigotLengthMm: 8 },
};

describe('a chassis with its wheel fastening', () => {
  it('when a chassis with unified studs and open nuts is proposed, then the fastening is kept and read back', async () => {
    const res = await propose({ wheelBoltThread: '1/2-20 UNF', wheelFastening: studs });
    expect(res.status).toBe(201);
    const read = await kai.agent.get(`/api/chassis/${res.body.chassis.slug}`);
    expect(read.status).toBe(200);
    expect(read.body.chassis.wheelBoltThread).toBe('1/2-20 UNF');
    expect(read.body.chassis.wheelFastening).toMatchObject({
      fastener: 'stud_nut',
      stockLengthMm: 38,
      nutThreadMm: 16,
      nutClosed: false,
      front: { spigotLengthMm: 8 },
      rear: {},
    });
  });

  it('when the thread does not read, then 400 names the thread field and nothing is created', async () => {
    const before = (await kai.agent.get('/api/me/submissions')).body;
    const res = await propose({ wheelBoltThread: 'half inch fine', wheelFastening: studs });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty(['newChassis.wheelBoltThread']);
    expect((await kai.agent.get('/api/me/submissions')).body).toEqual(before);
  });

  it('when a ball seat comes without its radius, then 400 names the radius field', async () => {
    const res = await propose({ wheelBoltThread: 'M12x1.5', wheelFastening: { ...studs, seat: 'ball' } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty(['newChassis.wheelFastening.ballRadiusMm']);
  });

  it('when the hub thread depth is negative, then 400 names that axle’s field', async () => {
    const res = await propose({
      wheelBoltThread: 'M12x1.5',
      wheelFastening: { ...studs, fastener: 'bolt', front: { threadDepthMm: -4, hole: 'blind' } },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty(['newChassis.wheelFastening.front.threadDepthMm']);
  });
});
