import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { listen, signedInMember, type Member } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { chassis } from '../../server/db/schema/index';

// A chassis' stock figures for "which axle locks first": shown to everyone, kept by reviewers.

let t: TestApp;
let server: Server;
let moderator: Member;
let member: Member;

const stock = {
  unladen: { massKg: 1280, frontStaticFraction: 0.53, cgHeightMm: 520 },
  laden: { massKg: 1730, frontStaticFraction: 0.47, cgHeightMm: 555 },
  wheelbaseMm: 2700,
  tyreLoadedRadiusMm: { front: 290, rear: 290 },
  rearValve: { kind: 'proportioning', kneeBar: 35, slope: 0.3 },
  basis: 'Kerb weight with a driver; permitted maximum mass',
};

const stored = () => t.db.select().from(chassis).where(eq(chassis.slug, 'halden-h31')).get()!.vehicle;

beforeAll(async () => {
  t = await makeTestApp();
  const l = listen(t.app);
  server = l.server;
  addChassis(t.db, 'halden-h31');
  moderator = await signedInMember(t.db, l.agent, 'gauge_mo', 'moderator');
  member = await signedInMember(t.db, l.agent, 'rivet_rosa');
});
afterAll(() => {
  server.close();
  t.close();
});

describe('PATCH /api/chassis/:slug/vehicle', () => {
  it('when a moderator sets the stock figures, then the chassis page returns them to everyone', async () => {
    const res = await moderator.agent
      .patch('/api/chassis/halden-h31/vehicle')
      .set('x-csrf-token', moderator.token)
      .send({ vehicle: stock });
    expect(res.status).toBe(200);
    expect(res.body.chassis.vehicle).toEqual(stock);
    const page = await request(server).get('/api/chassis/halden-h31');
    expect(page.body.chassis.vehicle).toEqual(stock);
  });

  it('when the figures are impossible, then it is 400 naming each field and the saved figures stay', async () => {
    const res = await moderator.agent
      .patch('/api/chassis/halden-h31/vehicle')
      .set('x-csrf-token', moderator.token)
      .send({
        vehicle: {
          ...stock,
          wheelbaseMm: 270,
          tyreLoadedRadiusMm: { front: 290, rear: -1 },
          rearValve: { kind: 'load-sensing', kneeBarUnladen: 30, slope: 0.3 },
        },
      });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['vehicle.wheelbaseMm']).toBe('Between 1500 and 5000 mm');
    expect(res.body.error.fields['vehicle.tyreLoadedRadiusMm.rear']).toBe('Between 150 and 600 mm');
    expect(res.body.error.fields['vehicle.rearValve.kneeBarLaden']).toBeTruthy();
    expect(stored()).toEqual(stock);
  });

  it('when a load-sensing valve is said to open less when laden, then it is 400 on the laden knee', async () => {
    const res = await moderator.agent
      .patch('/api/chassis/halden-h31/vehicle')
      .set('x-csrf-token', moderator.token)
      .send({ vehicle: { ...stock, rearValve: { kind: 'load-sensing', kneeBarUnladen: 40, kneeBarLaden: 30, slope: 0.3 } } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['vehicle.rearValve.kneeBarLaden']).toBe(
      'A load-sensing valve opens further, not less, when laden',
    );
    expect(stored()).toEqual(stock);
  });

  it('when a member or a visitor tries to change them, then it is 403 or 401 and nothing changes', async () => {
    const byMember = await member.agent
      .patch('/api/chassis/halden-h31/vehicle')
      .set('x-csrf-token', member.token)
      .send({ vehicle: null });
    expect(byMember.status).toBe(403);
    const byVisitor = await request(server).patch('/api/chassis/halden-h31/vehicle').send({ vehicle: null });
    expect([401, 403]).toContain(byVisitor.status);
    expect(stored()).toEqual(stock);
  });

  it('when the chassis does not exist, then it is 404', async () => {
    const res = await moderator.agent
      .patch('/api/chassis/tamsin-nowhere/vehicle')
      .set('x-csrf-token', moderator.token)
      .send({ vehicle: stock });
    expect(res.status).toBe(404);
  });

  it('when a moderator takes the figures away, then the chassis has none and sheets make no lock-order claim', async () => {
    const res = await moderator.agent
      .patch('/api/chassis/halden-h31/vehicle')
      .set('x-csrf-token', moderator.token)
      .send({ vehicle: null });
    expect(res.status).toBe(200);
    expect(res.body.chassis.vehicle).toBeNull();
    expect(stored()).toBeNull();
  });
});
