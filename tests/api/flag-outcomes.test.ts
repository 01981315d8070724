import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { listen, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, swapData } from './support/swap-rows';
import { flags, mailOutbox } from '../../server/db/schema/index';
import { FLAG_MAIL_INTERVAL_MS, sendDueFlagOutcomes } from '../../server/features/flags/flags.service';
import type { SwapSheetView } from '../../shared/schemas/views';
import type { FlagItem, ReviewDetail } from '../../shared/schemas/submissions';

// Flags with a kind; a safety flag told to the sheet's readers until it is settled; one outcome per
// resolution; a correction that answers a flag; at most one e-mail a day per reporter about outcomes.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;
let rosa: Member;
let kai: Member;
let paul: Member;
let mo: Member;
let now = new Date('2026-06-01T09:00:00Z');
const clock = { now: () => now };
let n = 0;

beforeAll(async () => {
  t = await makeTestApp({}, clock);
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

const send = (m: Member, url: string, body: object = {}) => m.agent.post(url).set('x-csrf-token', m.token).send(body);
const publicSwap = () =>
  addSwap(t.db, { slug: `h31-outcome-${++n}`, chassisId, authorId: rosa.id, revisions: [{ status: 'approved' }] });
// an approved title change moves the address: follow it
const sheet = async (slug: string) => (await request(server).get(`/api/swaps/${slug}`).redirects(1)).body as SwapSheetView;
const raise = async (m: Member, slug: string, kind: string, reason = 'The bracket bolt torque of 35 N·m looks far too low') => {
  const res = await send(m, `/api/swaps/${slug}/flags`, { kind, reason });
  expect(res.status).toBe(201);
  return res.body as FlagItem;
};
const mailsTo = (m: Member) => t.db.select().from(mailOutbox).where(eq(mailOutbox.userId, m.id)).all();
const flagMailsTo = (m: Member) => mailsTo(m).filter((x) => /flag/i.test(x.subject));

describe('flag kinds', () => {
  it('when a flag has no kind or an unknown one, then it is 400 naming the field and nothing is stored', async () => {
    const swap = publicSwap();
    const none = await send(kai, `/api/swaps/${swap.slug}/flags`, { reason: 'The rotor size is wrong' });
    expect(none.status).toBe(400);
    expect(none.body.error.fields.kind).toBeTruthy();
    const odd = await send(kai, `/api/swaps/${swap.slug}/flags`, { kind: 'rude', reason: 'The rotor size is wrong' });
    expect(odd.status).toBe(400);
    expect(odd.body.error.fields.kind).toBeTruthy();
    expect(t.db.select().from(flags).where(eq(flags.swapId, swap.swapId)).all()).toEqual([]);
  });
});

describe('an open safety flag on the sheet', () => {
  it('when a wrong-figure flag is open, then the sheet says so with its gist and never the reporter; other kinds are not shown', async () => {
    const swap = publicSwap();
    expect((await sheet(swap.slug)).openSafetyFlags).toEqual([]);
    const long = `The bracket bolt torque of 35 N·m looks far too low\n\nfor an M12 bolt. ${'More detail. '.repeat(30)}`;
    const wrong = await raise(kai, swap.slug, 'wrong_figure', long);
    await raise(paul, swap.slug, 'duplicate', 'Same as the other Vela sheet');
    const view = await sheet(swap.slug);
    expect(view.openSafetyFlags).toHaveLength(1);
    const [shown] = view.openSafetyFlags;
    expect(shown).toMatchObject({ id: wrong.id, kind: 'wrong_figure', correctionPending: false });
    expect(shown!.gist.startsWith('The bracket bolt torque of 35 N·m looks far too low for an M12 bolt.')).toBe(true);
    expect(shown!.gist.length).toBeLessThanOrEqual(200);
    expect(shown!.gist.endsWith('…')).toBe(true);
    const raw = JSON.stringify(view);
    expect(raw).not.toContain('camber_kai');
    expect(raw).not.toContain('camber kai');
    // the same on an older revision's page
    expect((await request(server).get(`/api/swaps/${swap.slug}/revisions/1`)).body.openSafetyFlags).toHaveLength(1);
  });

  it('when a moderator resolves it, then the sheet no longer says so; one outcome per resolution', async () => {
    const swap = publicSwap();
    const f = await raise(kai, swap.slug, 'unsafe_advice', 'Grinding the knuckle this far weakens it');
    expect((await sheet(swap.slug)).openSafetyFlags.map((x) => x.kind)).toEqual(['unsafe_advice']);
    const bad = await send(mo, `/api/review/flags/${f.id}/resolve`, { outcome: 'probably_fine' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.outcome).toBeTruthy();
    const ok = await send(mo, `/api/review/flags/${f.id}/resolve`, {
      outcome: 'not_a_problem',
      note: 'Within the maker’s limit.',
    });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ status: 'resolved', outcome: 'not_a_problem' });
    expect((await sheet(swap.slug)).openSafetyFlags).toEqual([]);
    expect((await send(mo, `/api/review/flags/${f.id}/resolve`, { outcome: 'spam' })).status).toBe(409);
    expect(t.db.select().from(flags).where(eq(flags.id, f.id)).get()!.outcome).toBe('not_a_problem');
  });
});

describe('a correction that answers a flag', () => {
  async function correctionOf(slug: string, title: string, extra: object = {}) {
    const created = await send(paul, '/api/submissions', { swapSlug: slug, data: swapData(title) });
    expect(created.status).toBe(201);
    return {
      id: created.body.id as number,
      submit: (body: object) => send(paul, `/api/submissions/${created.body.id}/submit`, { ...extra, ...body }),
    };
  }

  it('when a correction is sent without saying what changed, then it is 400 on changeNote and stays a draft', async () => {
    const swap = publicSwap();
    const c = await correctionOf(swap.slug, 'Torque corrected');
    const res = await c.submit({});
    expect(res.status).toBe(400);
    expect(res.body.error.fields.changeNote).toMatch(/what changed and why/);
    expect((await paul.agent.get(`/api/submissions/${c.id}`)).body.status).toBe('draft');
    // a new swap's first revision needs none
    const first = await send(rosa, '/api/submissions', {
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: swapData('A first record'),
    });
    expect((await send(rosa, `/api/submissions/${first.body.id}/submit`)).status).toBe(200);
  });

  it('when the linked correction is approved, then the flag is resolved as fixed, the sheet clears it and the history carries the note', async () => {
    const swap = publicSwap();
    const f = await raise(kai, swap.slug, 'wrong_figure');
    const c = await correctionOf(swap.slug, 'Bracket torque corrected');
    const note = 'Bracket bolt torque raised to 110 N·m, from the bracket maker’s sheet.';
    // a flag of another swap cannot be answered
    const elsewhere = await raise(kai, publicSwap().slug, 'wrong_figure');
    const wrong = await c.submit({ changeNote: note, answersFlagIds: [elsewhere.id] });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields['answersFlagIds.0']).toBeTruthy();
    const sent = await c.submit({ changeNote: note, answersFlagIds: [f.id] });
    expect(sent.status).toBe(200);
    expect(sent.body).toMatchObject({ status: 'in_review', changeNote: note, answersFlags: [{ id: f.id, status: 'open' }] });
    // readers are told a correction is on its way; the flag stays open until it is published
    expect((await sheet(swap.slug)).openSafetyFlags).toMatchObject([{ id: f.id, correctionPending: true }]);
    // the desk shows the note; a flag cannot be marked fixed by a correction nobody published
    const detail = (await mo.agent.get(`/api/review/${c.id}`)).body as ReviewDetail;
    expect(detail.revision.changeNote).toBe(note);
    const early = await send(mo, `/api/review/flags/${f.id}/resolve`, { outcome: 'fixed_by_correction' });
    expect(early.status).toBe(409);

    expect((await send(mo, `/api/review/${c.id}/approve`)).status).toBe(200);
    const flag = t.db.select().from(flags).where(eq(flags.id, f.id)).get()!;
    expect(flag).toMatchObject({ status: 'resolved', outcome: 'fixed_by_correction', correctionRevisionId: c.id });
    const view = await sheet(swap.slug);
    expect(view.openSafetyFlags).toEqual([]);
    expect(view.history[0]).toMatchObject({ number: 2, changeNote: note });
    expect(view.history[1]).toMatchObject({ number: 1, changeNote: null });
  });

  it('when a moderator links a correction on the desk, then approving it resolves the flag; only a correction of that swap links', async () => {
    const swap = publicSwap();
    const f = await raise(kai, swap.slug, 'unsafe_advice', 'No mention of bleeding the brakes');
    const c = await correctionOf(swap.slug, 'Bleeding added', { changeNote: 'Added the bleed and bed-in steps.' });
    expect((await c.submit({})).status).toBe(200);
    const other = publicSwap();
    const foreign = addSwap(t.db, {
      slug: `${other.slug}-b`,
      chassisId,
      authorId: rosa.id,
      revisions: [{ status: 'superseded' }, { status: 'approved' }],
    });
    const refused = await send(mo, `/api/review/flags/${f.id}/link`, { revisionId: foreign.revisionIds[1] });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.revisionId).toBeTruthy();
    const linked = await send(mo, `/api/review/flags/${f.id}/link`, { revisionId: c.id });
    expect(linked.status).toBe(200);
    expect(linked.body.correction).toMatchObject({ revisionId: c.id, number: 2, status: 'in_review' });
    expect(linked.body.corrections.map((x: { revisionId: number }) => x.revisionId)).toEqual([c.id]);
    expect((await send(mo, `/api/review/${c.id}/approve`)).status).toBe(200);
    expect(t.db.select().from(flags).where(eq(flags.id, f.id)).get()!.outcome).toBe('fixed_by_correction');
  });
});

describe('a correction published before the flag', () => {
  it('when a moderator tries to link the revision the reader flagged, then it is refused and not offered', async () => {
    const swap = addSwap(t.db, {
      slug: `h31-outcome-${++n}`,
      chassisId,
      authorId: rosa.id,
      revisions: [{ status: 'superseded' }, { status: 'approved' }],
    });
    const f = await raise(kai, swap.slug, 'wrong_figure');
    expect(f.corrections).toEqual([]);
    const res = await send(mo, `/api/review/flags/${f.id}/link`, { revisionId: swap.revisionIds[1] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.revisionId).toMatch(/after the flag/);
  });
});

describe('one e-mail a day per reporter about flag outcomes', () => {
  it('when several of a member’s flags are settled in a day, then they get one message now and the rest together a day later', async () => {
    now = new Date('2026-06-10T08:00:00Z');
    // what other reporters had waiting goes out first, so the figures below are this member's alone
    sendDueFlagOutcomes({ ...t, clock, appUrl: t.config.appUrl });
    const swaps = [publicSwap(), publicSwap(), publicSwap(), publicSwap()];
    const raised = [];
    for (const s of swaps) raised.push(await raise(paul, s.slug, 'other', 'The write-up repeats itself'));
    const before = flagMailsTo(paul).length;

    expect((await send(mo, `/api/review/flags/${raised[0]!.id}/resolve`, { outcome: 'not_a_problem' })).status).toBe(200);
    expect(flagMailsTo(paul).length).toBe(before + 1);

    now = new Date(now.getTime() + 60 * 60 * 1000);
    expect((await send(mo, `/api/review/flags/${raised[1]!.id}/resolve`, { outcome: 'duplicate' })).status).toBe(200);
    expect(
      (await send(mo, '/api/review/flags/bulk-resolve', { ids: [raised[2]!.id], outcome: 'not_a_problem', note: 'Fine as is' }))
        .status,
    ).toBe(200);
    // settled, but the day is not over: no second message yet, and the sweep sends none either
    expect(flagMailsTo(paul).length).toBe(before + 1);
    expect(sendDueFlagOutcomes({ ...t, clock, appUrl: t.config.appUrl })).toBe(0);
    expect(flagMailsTo(paul).length).toBe(before + 1);

    // a flag settled as spam is never mailed about
    expect((await send(mo, `/api/review/flags/${raised[3]!.id}/resolve`, { outcome: 'spam' })).status).toBe(200);

    now = new Date(new Date('2026-06-10T08:00:00Z').getTime() + FLAG_MAIL_INTERVAL_MS);
    expect(sendDueFlagOutcomes({ ...t, clock, appUrl: t.config.appUrl })).toBe(1);
    const mails = flagMailsTo(paul).slice(before);
    expect(mails).toHaveLength(2);
    expect(mails[1]!.subject).toBe('What became of 2 of your flags');
    expect(mails[1]!.text).toContain('Already reported');
    expect(mails[1]!.text).toContain('Not a problem');
    expect(mails[1]!.text).toContain('Fine as is');
    expect(mails[1]!.text).not.toContain(swaps[3]!.slug);
    // nothing left to tell
    expect(sendDueFlagOutcomes({ ...t, clock, appUrl: t.config.appUrl })).toBe(0);
    const settled = t.db
      .select()
      .from(flags)
      .where(eq(flags.reporterId, paul.id))
      .all()
      .filter((f) => f.status === 'resolved');
    expect(settled.length).toBeGreaterThanOrEqual(4);
    expect(settled.every((f) => f.reporterNotifiedAt !== null)).toBe(true);
  });
});
