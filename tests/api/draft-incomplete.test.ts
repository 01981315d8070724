import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { type Agent, type Member, listen, signedInMember } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';
import { revisions } from '../../server/db/schema/index';
import type { SubmissionView } from '../../shared/schemas/submissions';

// A draft keeps what its author typed: a half-filled row is stored as incomplete beside the valid
// record instead of blocking the save, comes back when the draft opens elsewhere, and holds back
// only the send to review, naming the row.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;
let rosa: Member;

const post = (m: Member, path: string, body?: object) => m.agent.post(path).set('x-csrf-token', m.token).send(body);
const patch = (m: Member, path: string, body: object) => m.agent.patch(path).set('x-csrf-token', m.token).send(body);

/** a fastener row as the form holds it: a fastener named, its torque not yet typed */
const halfFilledFastener = {
  id: 'wheel-bolts',
  kind: 'wheel_bolt',
  label: 'Wheel bolts',
  thread: 'M12x1.5',
  lengthMm: '',
  propertyClass: '',
  quantity: '',
  nm: '',
  lubrication: 'not_stated',
  angleDeg: '',
  singleUse: false,
  notes: '',
};

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await signedInMember(t.db, agent, 'rivet_rosa');
});
afterAll(() => {
  server.close();
  t.close();
});

let drafts = 0;
/** a record with a title of its own: a member's open drafts never share one */
const numbered = () => swapRecord({ title: `Vela calipers on the H31, draft ${++drafts}` });

async function draft(): Promise<SubmissionView> {
  const res = await post(rosa, '/api/submissions', { chassisId, axle: 'front', category: 'brakes', data: numbered() });
  expect(res.status).toBe(201);
  return res.body as SubmissionView;
}

describe('incomplete rows in a draft', () => {
  it('when a draft is saved with a half-filled row, then the rest is stored and the row is kept as incomplete', async () => {
    const d = await draft();
    const res = await patch(rosa, `/api/submissions/${d.id}`, {
      data: swapRecord({ title: 'Vela calipers, torque still to measure' }),
      incompleteRows: [{ list: 'fasteners', index: 2, row: halfFilledFastener }],
    });
    expect(res.status).toBe(200);
    expect(res.body.data.title).toBe('Vela calipers, torque still to measure');
    expect(res.body.incompleteRows).toEqual([{ list: 'fasteners', index: 2, row: halfFilledFastener }]);

    // another browser opening the draft gets the same: the valid record and the incomplete row
    const again = await rosa.agent.get(`/api/submissions/${d.id}`);
    expect(again.body.data.title).toBe('Vela calipers, torque still to measure');
    expect(again.body.incompleteRows).toEqual([{ list: 'fasteners', index: 2, row: halfFilledFastener }]);

    // finishing the row (a save without incomplete rows) clears them
    const done = await patch(rosa, `/api/submissions/${d.id}`, { data: swapRecord() });
    expect(done.body.incompleteRows).toEqual([]);
  });

  it('when a draft with an incomplete row is sent for review, then it is refused naming the row, and nothing changes', async () => {
    const d = await draft();
    await patch(rosa, `/api/submissions/${d.id}`, {
      data: { ...swapRecord(), title: d.data.title },
      incompleteRows: [{ list: 'fasteners', index: 2, row: halfFilledFastener }],
    });
    const res = await post(rosa, `/api/submissions/${d.id}/submit`);
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ 'data.fasteners.2': expect.stringMatching(/incomplete/i) });
    expect(t.db.select().from(revisions).where(eq(revisions.id, d.id)).get()!.status).toBe('draft');
  });

  it('when incomplete rows name an unknown list or are too large, then the save is refused with a field reason', async () => {
    const d = await draft();
    const unknown = await patch(rosa, `/api/submissions/${d.id}`, {
      data: { ...swapRecord(), title: d.data.title },
      incompleteRows: [{ list: 'secrets', index: 0, row: {} }],
    });
    expect(unknown.status).toBe(400);
    expect(Object.keys(unknown.body.error.fields)[0]).toMatch(/^incompleteRows\.0\.list/);
    const huge = await patch(rosa, `/api/submissions/${d.id}`, {
      data: { ...swapRecord(), title: d.data.title },
      incompleteRows: [{ list: 'fasteners', index: 0, row: { notes: 'x'.repeat(20_000) } }],
    });
    expect(huge.status).toBe(400);
    // nothing already saved was lost
    const kept = await rosa.agent.get(`/api/submissions/${d.id}`);
    expect(kept.body.data.title).toBe(d.data.title);
  });
});
