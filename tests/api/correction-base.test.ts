import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { listen, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';
import { addSwap, approveNewRevision } from './support/swap-rows';
import { revisions, swaps } from '../../server/db/schema/index';
import { swapDataSchema, type SwapDataInput } from '../../shared/schemas/swap-data';

// Two corrections of the same approved revision: approving one, then the other, must never put the first
// one's figures back. A correction records the revision it started from and is brought up to date first.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;
let rosa: Member;
let kai: Member;
let paul: Member;
let mo: Member;

beforeAll(async () => {
  t = await makeTestApp({ SUBMISSION_RATE_LIMIT: '1000' });
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await signedInMember(t.db, agent, 'rivet_rosa');
  kai = await signedInMember(t.db, agent, 'camber_kai');
  paul = await signedInMember(t.db, agent, 'pistonpaul');
  mo = await signedInMember(t.db, agent, 'gauge_mo', 'moderator');
});
afterAll(() => {
  server.close();
  t.close();
});

const record = (extra: Partial<SwapDataInput> = {}) => swapDataSchema.parse(swapRecord(extra));
const withBracketTorque = (nm: number, extra: Partial<SwapDataInput> = {}) =>
  record({
    torque: [
      { fastenerId: 'caliper-bolts', nm: 85 },
      { fastenerId: 'bracket-bolts', nm },
    ],
    ...extra,
  });

const send = (m: Member, method: 'post' | 'patch' | 'get', url: string, body?: object) => {
  const req = m.agent[method](url).set('x-csrf-token', m.token);
  return body ? req.send(body) : req;
};

function approvedSwap(slug: string) {
  return addSwap(t.db, { slug, chassisId, authorId: rosa.id, revisions: [{ status: 'approved', data: withBracketTorque(110) }] });
}

/** A correction started from the swap's current revision, saved with `data` and sent to review. */
async function correction(m: Member, slug: string, data: unknown, submit = true): Promise<number> {
  const created = await send(m, 'post', '/api/submissions', { swapSlug: slug, changeNote: 'Re-measured on the car; the figures now match the parts.', data });
  expect(created.status).toBe(201);
  if (submit) expect((await send(m, 'post', `/api/submissions/${created.body.id}/submit`)).status).toBe(200);
  return created.body.id as number;
}

const currentData = (swapId: number) =>
  t.db
    .select({ data: revisions.data })
    .from(swaps)
    .innerJoin(revisions, eq(revisions.id, swaps.currentRevisionId))
    .where(eq(swaps.id, swapId))
    .get()!.data;
const bracketNm = (data: ReturnType<typeof record>) => data.torque.find((r) => r.fastenerId === 'bracket-bolts')!.nm;

describe('two corrections of the same revision', () => {
  it('when the second correction is approved after the first, then it is refused instead of putting the first one’s torque figure back', async () => {
    const swap = approvedSwap('h31-two-corrections');
    // kai corrects the bracket torque; paul, from the same revision, corrects the title only
    const first = await correction(kai, swap.slug, withBracketTorque(95));
    const second = await correction(
      paul,
      swap.slug,
      withBracketTorque(110, { title: 'Vela four-piston calipers, 330 mm rotors' }),
    );
    expect((await send(mo, 'post', `/api/review/${first}/approve`, {})).status).toBe(200);
    expect(bracketNm(currentData(swap.swapId))).toBe(95);

    const refused = await send(mo, 'post', `/api/review/${second}/approve`, {});
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('behind_current');
    expect(refused.body.error.message).toMatch(/Revision 2 .* approved after this correction was started/);
    expect(refused.body.error.fields.basedOnRevisionId).toMatch(/started from revision 1; revision 2 is the current one/);
    expect(refused.body.error.fields['data.torque[bracket-bolts].nm']).toMatch(
      /changed this \(110 → 95\); this correction would put 110 back/,
    );
    // nothing moved: the first correction's figure stands and the second is still in review
    expect(bracketNm(currentData(swap.swapId))).toBe(95);
    expect(t.db.select().from(revisions).where(eq(revisions.id, second)).get()!.status).toBe('in_review');

    // the desk shows what the newer approval changed, from the revision the correction started from
    const desk = await mo.agent.get(`/api/review/${second}`);
    expect(desk.body.revision.behind).toEqual({ current: { revisionId: first, number: 2 } });
    expect(desk.body.revision.basedOn).toEqual({ revisionId: swap.revisionIds[0], number: 1 });
    expect(desk.body.basedOn.number).toBe(1);
    expect(bracketNm(desk.body.basedOn.data)).toBe(110);

    // sent back, its author brings it up to date: the torque comes from revision 2, the title stays theirs
    expect((await send(mo, 'post', `/api/review/${second}/send-back`, { note: 'Bring it up to date, please.' })).status).toBe(
      200,
    );
    const preview = await send(paul, 'get', `/api/submissions/${second}/rebase`);
    expect(preview.status).toBe(200);
    expect(preview.body.conflicts).toEqual([]);
    expect(preview.body.taken).toEqual(
      expect.arrayContaining([
        { path: 'data.torque[bracket-bolts].nm', base: '110', theirs: '95', mine: '110', from: 'theirs' },
        expect.objectContaining({ path: 'data.title', from: 'mine' }),
      ]),
    );
    const rebased = await send(paul, 'post', `/api/submissions/${second}/rebase`, { currentRevisionId: first });
    expect(rebased.status).toBe(200);
    expect(rebased.body.basedOn).toEqual({ revisionId: first, number: 2 });
    expect(rebased.body.behind).toBeNull();
    expect(bracketNm(rebased.body.data)).toBe(95);

    expect((await send(paul, 'post', `/api/submissions/${second}/submit`)).status).toBe(200);
    expect((await send(mo, 'post', `/api/review/${second}/approve`, {})).status).toBe(200);
    const now = currentData(swap.swapId);
    expect(bracketNm(now)).toBe(95);
    expect(now.title).toBe('Vela four-piston calipers, 330 mm rotors');
  });

  it('when both corrections changed the same figure, then the author picks one before the correction can go on', async () => {
    const swap = approvedSwap('h31-same-figure');
    const first = await correction(kai, swap.slug, withBracketTorque(95));
    const second = await correction(paul, swap.slug, withBracketTorque(100), false);
    expect((await send(mo, 'post', `/api/review/${first}/approve`, {})).status).toBe(200);

    // a draft that is behind cannot go to review
    const submit = await send(paul, 'post', `/api/submissions/${second}/submit`);
    expect(submit.status).toBe(409);
    expect(submit.body.error.code).toBe('behind_current');
    expect(submit.body.error.fields['data.torque[bracket-bolts].nm']).toMatch(/both changed this/);

    const preview = await send(paul, 'get', `/api/submissions/${second}/rebase`);
    expect(preview.body.conflicts).toEqual([{ path: 'data.torque[bracket-bolts].nm', base: '110', theirs: '95', mine: '100' }]);

    const unpicked = await send(paul, 'post', `/api/submissions/${second}/rebase`, { currentRevisionId: first });
    expect(unpicked.status).toBe(400);
    expect(unpicked.body.error.fields['data.torque[bracket-bolts].nm']).toMatch(/pick one/);

    const moved = await send(paul, 'post', `/api/submissions/${second}/rebase`, {
      currentRevisionId: swap.revisionIds[0],
      choices: { 'data.torque[bracket-bolts].nm': 'mine' },
    });
    expect(moved.status).toBe(409);
    expect(moved.body.error.code).toBe('record_moved');

    const picked = await send(paul, 'post', `/api/submissions/${second}/rebase`, {
      currentRevisionId: first,
      choices: { 'data.torque[bracket-bolts].nm': 'mine' },
    });
    expect(picked.status).toBe(200);
    expect(bracketNm(picked.body.data)).toBe(100);
    expect((await send(paul, 'post', `/api/submissions/${second}/submit`)).status).toBe(200);
  });

  it('when a correction starts from the revision the member loaded and another is approved before its first save, then it is behind', async () => {
    const swap = approvedSwap('h31-loaded-earlier');
    const loaded = swap.revisionIds[0]!;
    approveNewRevision(t.db, swap.swapId, withBracketTorque(95), rosa.id);
    const created = await send(kai, 'post', '/api/submissions', {
      swapSlug: swap.slug, changeNote: 'Re-measured on the car; the figures now match the parts.',
      basedOnRevisionId: loaded,
      data: withBracketTorque(110, { title: 'Vela calipers, title corrected' }),
    });
    expect(created.status).toBe(201);
    expect(created.body.basedOn).toEqual({ revisionId: loaded, number: 1 });
    expect(created.body.behind.current.number).toBe(2);

    const other = addSwap(t.db, { slug: 'h31-elsewhere', chassisId, authorId: rosa.id, revisions: [{ status: 'approved' }] });
    const wrong = await send(paul, 'post', '/api/submissions', {
      swapSlug: swap.slug, changeNote: 'Re-measured on the car; the figures now match the parts.',
      basedOnRevisionId: other.revisionIds[0],
      data: withBracketTorque(110),
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.basedOnRevisionId).toMatch(/not an approved revision of this swap/);
  });

  it('when someone other than the author asks to bring a correction up to date, then it is refused', async () => {
    const swap = approvedSwap('h31-not-yours');
    const first = await correction(kai, swap.slug, withBracketTorque(95));
    const second = await correction(paul, swap.slug, withBracketTorque(110, { summary: 'Changed summary.' }));
    expect((await send(mo, 'post', `/api/review/${first}/approve`, {})).status).toBe(200);
    // the moderator sees it on the desk but the merge is its author's
    expect((await send(mo, 'get', `/api/submissions/${second}/rebase`)).status).toBe(403);
    expect((await send(kai, 'get', `/api/submissions/${second}/rebase`)).status).toBe(404);
    // in review it is locked: the author sees the merge but applies it once it is sent back
    expect((await send(paul, 'get', `/api/submissions/${second}/rebase`)).status).toBe(200);
    expect((await send(paul, 'post', `/api/submissions/${second}/rebase`, { currentRevisionId: first })).status).toBe(409);
  });

  it('when a correction starts from the current revision, then it approves as before and there is nothing to bring up to date', async () => {
    const swap = approvedSwap('h31-up-to-date');
    const id = await correction(kai, swap.slug, withBracketTorque(95));
    const preview = await send(kai, 'get', `/api/submissions/${id}/rebase`);
    expect(preview.status).toBe(409);
    expect(preview.body.error.code).toBe('up_to_date');
    expect((await send(mo, 'post', `/api/review/${id}/approve`, {})).status).toBe(200);
    expect(bracketNm(currentData(swap.swapId))).toBe(95);
  });
});
