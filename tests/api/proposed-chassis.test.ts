import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { listen, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { swapRecord } from './support/swap-fixtures';
import { chassis, mailOutbox, revisions, swaps } from '../../server/db/schema/index';

// A chassis proposed with a submission is the author's (and, once sent, the review desk's) until an
// approval publishes it; declined, it goes. Before, its notes and figures answered anyone at once.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let kai: Member;
let paul: Member;
let mo: Member;
let n = 0;

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  kai = await signedInMember(t.db, agent, 'camber_kai');
  paul = await signedInMember(t.db, agent, 'pistonpaul');
  mo = await signedInMember(t.db, agent, 'gauge_mo', 'moderator');
});
afterAll(() => {
  server.close();
  t.close();
});

const post = (m: Member, path: string, body: object = {}) => m.agent.post(path).set('x-csrf-token', m.token).send(body);

async function proposeInDraft() {
  n++;
  const res = await post(kai, '/api/submissions', {
    newChassis: {
      make: 'Tamsin',
      model: 'Regent',
      code: `TR${n}`,
      yearFrom: 1994,
      yearTo: 2002,
      lugCount: 5,
      pcdMm: 114.3,
      centreBoreMm: 67.1,
      wheelBoltThread: 'M12x1.5',
      notes: 'Private notes from my own measurements',
    },
    axle: 'rear',
    category: 'brakes',
    data: swapRecord({ title: `Regent rear rotors, proposal ${n}` }),
  });
  expect(res.status).toBe(201);
  return { revisionId: res.body.id as number, slug: res.body.chassis.slug as string, chassisId: res.body.chassis.id as number };
}

describe('a chassis proposed with a submission', () => {
  it('when it sits in a draft, then only its author can open it; visitors, other members and moderators get 404', async () => {
    const { slug } = await proposeInDraft();
    const own = await kai.agent.get(`/api/chassis/${slug}`);
    expect(own.status).toBe(200);
    expect(own.body.proposed).toBe(true);
    expect(own.body.chassis.notes).toContain('Private notes');
    expect(own.headers['cache-control']).toBe('private, no-store');
    for (const [who, res] of [
      ['visitor', await request(server).get(`/api/chassis/${slug}`)],
      ['member', await paul.agent.get(`/api/chassis/${slug}`)],
      ['moderator', await mo.agent.get(`/api/chassis/${slug}`)],
    ] as const) {
      expect(res.status, who).toBe(404);
      expect(JSON.stringify(res.body), who).not.toContain('Private notes');
    }
    expect((await request(server).get('/api/chassis')).body.items.map((c: { slug: string }) => c.slug)).not.toContain(slug);
  });

  it('when the submission is sent, then the review desk may open the chassis; the public still may not', async () => {
    const { revisionId, slug } = await proposeInDraft();
    expect((await post(kai, `/api/submissions/${revisionId}/submit`)).status).toBe(200);
    expect((await mo.agent.get(`/api/chassis/${slug}`)).status).toBe(200);
    expect((await request(server).get(`/api/chassis/${slug}`)).status).toBe(404);
    expect((await paul.agent.get(`/api/chassis/${slug}`)).status).toBe(404);
  });

  it('when the submission is approved, then the chassis is public and in the catalogue', async () => {
    const { revisionId, slug } = await proposeInDraft();
    await post(kai, `/api/submissions/${revisionId}/submit`);
    expect((await post(mo, `/api/review/${revisionId}/approve`)).status).toBe(200);
    const page = await request(server).get(`/api/chassis/${slug}`);
    expect(page.status).toBe(200);
    expect(page.body.proposed).toBe(false);
    expect((await request(server).get('/api/chassis')).body.items.map((c: { slug: string }) => c.slug)).toContain(slug);
  });

  it('when the submission is declined, then the proposed chassis and the new swap are removed, and the author is told why', async () => {
    const { revisionId, slug, chassisId } = await proposeInDraft();
    await post(kai, `/api/submissions/${revisionId}/submit`);
    const swapId = t.db.select().from(revisions).where(eq(revisions.id, revisionId)).get()!.swapId;
    const declined = await post(mo, `/api/review/${revisionId}/decline`, { note: 'This chassis already exists as the TR2.' });
    expect(declined.status).toBe(200);
    expect(declined.body.revision.status).toBe('declined');
    expect(t.db.select().from(chassis).where(eq(chassis.id, chassisId)).get()).toBeUndefined();
    expect(t.db.select().from(swaps).where(eq(swaps.id, swapId)).get()).toBeUndefined();
    expect((await mo.agent.get(`/api/chassis/${slug}`)).status).toBe(404);
    const mail = t.db.select().from(mailOutbox).all().at(-1)!;
    expect(mail.to).toBe('camber_kai@members.swapyard.invalid');
    expect(mail.subject).toMatch(/Regent rear rotors/);
    expect(mail.text).toContain('This chassis already exists as the TR2.');
    expect(mail.text).toMatch(/removed/);
  });

  it('when several such submissions are declined at once, then each proposed chassis goes', async () => {
    const a = await proposeInDraft();
    const b = await proposeInDraft();
    for (const p of [a, b]) await post(kai, `/api/submissions/${p.revisionId}/submit`);
    const res = await post(mo, '/api/review/bulk-decline', { revisionIds: [a.revisionId, b.revisionId], note: 'Spam' });
    expect(res.status).toBe(200);
    for (const p of [a, b]) expect(t.db.select().from(chassis).where(eq(chassis.id, p.chassisId)).get()).toBeUndefined();
  });
});
