import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser, listen, signedInMember, type Member } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, approveNewRevision, swapData } from './support/swap-rows';
import { startSmtp, type TestSmtp } from './support/smtp';
import { cars, follows, mailOutbox, revisions } from '../../server/db/schema/index';
import { sendDueDigests } from '../../server/features/following/digests';
import type { Db } from '../../server/db/client';
import type { FollowItem, FollowList } from '../../shared/schemas/following';

// Following a chassis or a car: the digest holds only what was published for what is followed, since the
// last digest, at the member's frequency; its one-click unsubscribe works without a session (RFC 8058).

const at = (iso: string) => new Date(iso);
// 2026-06-01 is a Monday: daily digests go out after 06:00 UTC, weekly ones on Mondays
const clock = {
  time: at('2026-06-01T10:00:00Z'),
  now() {
    return new Date(this.time);
  },
};

let t: TestApp;
let server: ReturnType<typeof listen>;
let rosa: Member;
let kai: Member;
let h31: number;
let h40: number;
let authorId: number;

/** an approved swap published at `when` (the review desk's approval, without the desk) */
function publish(db: Db, slug: string, chassisId: number, when: string, author = authorId) {
  const s = addSwap(db, {
    slug,
    chassisId,
    authorId: author,
    revisions: [{ status: 'approved', data: swapData(`Swap ${slug} for the test`) }],
  });
  db.update(revisions)
    .set({ reviewedAt: at(when) })
    .where(eq(revisions.id, s.revisionIds[0]!))
    .run();
  return s;
}

const digests = () =>
  sendDueDigests({
    db: t.db,
    mailer: t.mailer,
    clock,
    logger: t.logger,
    appUrl: t.config.appUrl,
    secret: t.config.sessionSecret,
  });
const mailTo = (userId: number) =>
  t.db
    .select()
    .from(mailOutbox)
    .where(eq(mailOutbox.userId, userId))
    .all()
    .filter((m) => m.headers?.['List-Unsubscribe']);

async function follow(m: Member, body: object) {
  return m.agent.post('/api/me/follows').set('x-csrf-token', m.token).send(body);
}

beforeAll(async () => {
  t = await makeTestApp({}, clock);
  server = listen(t.app);
  h31 = addChassis(t.db, 'halden-h31').id;
  h40 = addChassis(t.db, 'halden-h40', { model: 'H40', code: 'H40' }).id;
  authorId = addUser(t.db, 'pistonpaul').id;
  rosa = await signedInMember(t.db, server.agent, 'rivet_rosa');
  kai = await signedInMember(t.db, server.agent, 'camber_kai');
});
afterAll(async () => {
  server.server.close();
  await t.close();
});

describe('following and managing', () => {
  it('when a member follows a chassis and their own car, then both are listed with their frequency; following again makes no second follow', async () => {
    const car = t.db
      .insert(cars)
      .values({
        userId: kai.id,
        chassisId: h40,
        nickname: 'Blue H40',
        wheelDiameterIn: 16,
        wheelWidthIn: 7,
        wheelOffsetMm: 38,
        createdAt: clock.now(),
        updatedAt: clock.now(),
      })
      .returning()
      .get();
    const a = await follow(rosa, { chassisSlug: 'halden-h31', frequency: 'daily' });
    expect(a.status).toBe(201);
    const again = await follow(rosa, { chassisSlug: 'halden-h31', frequency: 'daily' });
    expect(again.status).toBe(200);
    expect(again.body.follow.id).toBe(a.body.follow.id);
    expect((await follow(kai, { chassisSlug: 'halden-h31', frequency: 'weekly' })).status).toBe(201);
    const byCar = await follow(kai, { carId: car.id, frequency: 'daily' });
    expect(byCar.status).toBe(201);
    expect(byCar.body.follow.target).toEqual({
      kind: 'car',
      car: { id: car.id, nickname: 'Blue H40' },
      chassis: { slug: 'halden-h40', label: expect.stringContaining('H40') },
    });

    const list = (await kai.agent.get('/api/me/follows')).body as FollowList;
    expect(list.items.map((f) => [f.target.kind, f.frequency])).toEqual([
      ['chassis', 'weekly'],
      ['car', 'daily'],
    ]);
    // weekly: the next Monday 06:00 UTC; daily: the next 06:00 UTC
    expect(list.items[0]!.nextDigestAt).toBe('2026-06-08T06:00:00.000Z');
    expect(list.items[1]!.nextDigestAt).toBe('2026-06-02T06:00:00.000Z');
  });

  it('when someone follows another member’s car, or a chassis that does not exist, then it is 400 naming the field and nothing is followed', async () => {
    const kaisCar = t.db.select().from(cars).where(eq(cars.userId, kai.id)).get()!;
    const before = t.db.select().from(follows).all().length;
    const res = await follow(rosa, { carId: kaisCar.id });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.carId).toMatch(/Not one of your cars/);
    const none = await follow(rosa, { chassisSlug: 'no-such-chassis' });
    expect(none.body.error.fields.chassisSlug).toBeTruthy();
    const both = await follow(rosa, { chassisSlug: 'halden-h31', carId: kaisCar.id });
    expect(both.status).toBe(400);
    expect(t.db.select().from(follows).all()).toHaveLength(before);
  });

  it('when a member changes another member’s follow, then it is 404 and unchanged; their own frequency change and stop apply', async () => {
    const kais = ((await kai.agent.get('/api/me/follows')).body as FollowList).items[0]!;
    expect(
      (await rosa.agent.patch(`/api/me/follows/${kais.id}`).set('x-csrf-token', rosa.token).send({ frequency: 'daily' })).status,
    ).toBe(404);
    expect((await rosa.agent.delete(`/api/me/follows/${kais.id}`).set('x-csrf-token', rosa.token)).status).toBe(404);
    expect(t.db.select().from(follows).where(eq(follows.id, kais.id)).get()!.frequency).toBe('weekly');
    const bad = await kai.agent.patch(`/api/me/follows/${kais.id}`).set('x-csrf-token', kai.token).send({ frequency: 'hourly' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.frequency).toBeTruthy();
    expect((await request(server.server).get('/api/me/follows')).status).toBe(401);
  });
});

describe('digests', () => {
  let rosaFollow: FollowItem;
  beforeAll(async () => {
    rosaFollow = ((await rosa.agent.get('/api/me/follows')).body as FollowList).items[0]!;
  });

  it('when the daily moment passes, then each follower gets one digest of only the new published swaps on what they follow', async () => {
    publish(t.db, 'h31-before-following', h31, '2026-06-01T09:00:00Z');
    const fresh = publish(t.db, 'h31-fresh-swap', h31, '2026-06-01T12:00:00Z');
    publish(t.db, 'h40-other-chassis', h40, '2026-06-01T13:00:00Z');
    publish(t.db, 'h31-rosas-own', h31, '2026-06-01T14:00:00Z', rosa.id);
    addSwap(t.db, { slug: 'h31-still-at-desk', chassisId: h31, authorId, revisions: [{ status: 'in_review' }] });
    // a correction to a swap published before rosa followed, approved after
    const older = t.db
      .select()
      .from(revisions)
      .all()
      .find((r) => r.data.title === 'Swap h31-before-following for the test')!;
    const corrected = approveNewRevision(t.db, older.swapId, swapData('Corrected swap before following'), authorId);
    t.db
      .update(revisions)
      .set({ reviewedAt: at('2026-06-02T05:00:00Z') })
      .where(eq(revisions.id, corrected.revisionId))
      .run();

    clock.time = at('2026-06-02T05:30:00Z');
    expect(digests()).toEqual({ due: 0, sent: 0 });
    expect(mailTo(rosa.id)).toHaveLength(0);

    clock.time = at('2026-06-02T06:10:00Z');
    const run = digests();
    expect(run.sent).toBe(2); // rosa's chassis, kai's car (his weekly chassis follow is not due on a Tuesday)
    const [mail] = mailTo(rosa.id);
    expect(mail!.subject).toBe('New for the Halden H31 (1991–1999): 2 swaps published');
    expect(mail!.text).toContain('Swap h31-fresh-swap for the test (front axle) — new swap');
    expect(mail!.text).toContain('Corrected swap before following (front axle) — updated to revision 2');
    expect(mail!.text).toContain(`/swaps/${fresh.slug}`);
    for (const absent of ['h40-other-chassis', 'h31-rosas-own', 'h31-still-at-desk']) expect(mail!.text).not.toContain(absent);
    expect(mail!.text).toMatch(/torque every fastener to spec/);
    const kais = mailTo(kai.id);
    expect(kais).toHaveLength(1);
    expect(kais[0]!.subject).toBe('For your Blue H40: a swap published');
    expect(kais[0]!.text).toContain('Swap h40-other-chassis for the test');

    // the same moment again: nothing new, no second message
    clock.time = at('2026-06-02T06:40:00Z');
    expect(digests().sent).toBe(0);
    expect(mailTo(rosa.id)).toHaveLength(1);
    expect(t.db.select().from(follows).where(eq(follows.id, rosaFollow.id)).get()!.since).toEqual(at('2026-06-02T06:10:00Z'));
  });

  it('when the next day passes, then the daily digest holds only what was published since the last one; the weekly one waits for Monday and holds the whole week', async () => {
    publish(t.db, 'h31-tuesday-swap', h31, '2026-06-02T10:00:00Z');
    clock.time = at('2026-06-03T06:05:00Z');
    digests();
    const rosas = mailTo(rosa.id);
    expect(rosas).toHaveLength(2);
    expect(rosas[1]!.text).toContain('h31-tuesday-swap');
    expect(rosas[1]!.text).not.toContain('h31-fresh-swap');
    expect(mailTo(kai.id).filter((m) => m.subject.includes('Halden H31'))).toHaveLength(0);

    clock.time = at('2026-06-07T23:00:00Z'); // Sunday: still no weekly digest
    digests();
    expect(mailTo(kai.id).filter((m) => m.subject.includes('Halden H31'))).toHaveLength(0);

    clock.time = at('2026-06-08T06:02:00Z');
    digests();
    const weekly = mailTo(kai.id).filter((m) => m.subject.includes('Halden H31'));
    expect(weekly).toHaveLength(1);
    expect(weekly[0]!.subject).toBe('New for the Halden H31 (1991–1999): 4 swaps published');
    for (const slug of ['h31-fresh-swap', 'h31-tuesday-swap', 'h31-rosas-own']) expect(weekly[0]!.text).toContain(slug);
    expect(weekly[0]!.text).toContain('updated to revision 2');
    expect(weekly[0]!.text).toContain('once a week');
    // rosa's daily follow had nothing new since Wednesday: no message
    expect(mailTo(rosa.id)).toHaveLength(2);
  });
});

describe('one-click unsubscribe', () => {
  const unsubscribeUrlOf = (userId: number) => {
    const header = mailTo(userId)[0]!.headers!['List-Unsubscribe']!;
    return new URL(/^<(.+)>$/.exec(header)![1]!);
  };

  it('when the digest is written, then it carries List-Unsubscribe with an https-or-app address and List-Unsubscribe-Post for one click', () => {
    const mail = mailTo(rosa.id)[0]!;
    expect(mail.headers).toEqual({
      'List-Unsubscribe': expect.stringMatching(new RegExp(`^<${t.config.appUrl}/unsubscribe/\\d+\\.[A-Za-z0-9_-]{32}>$`)),
      'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
    });
    expect(mail.text).toContain(unsubscribeUrlOf(rosa.id).href);
  });

  it('when the link is fetched with GET (as a mail scanner does), then it shows a confirmation and the follow stays', async () => {
    const url = unsubscribeUrlOf(rosa.id);
    const res = await request(server.server).get(url.pathname);
    expect(res.status).toBe(200);
    expect(res.text).toContain('Stop e-mails about the Halden H31 (1991–1999)?');
    expect(res.text).toContain('name="List-Unsubscribe" value="One-Click"');
    expect(res.headers['set-cookie']).toBeUndefined();
    expect(t.db.select().from(follows).where(eq(follows.userId, rosa.id)).all()).toHaveLength(1);
  });

  it('when a tampered token or a POST without the one-click body arrives, then nothing is stopped', async () => {
    const url = unsubscribeUrlOf(rosa.id);
    const [id, sig] = url.pathname.split('/').pop()!.split('.');
    const forged = `/unsubscribe/${Number(id) + 1}.${sig}`;
    expect((await request(server.server).post(forged).type('form').send('List-Unsubscribe=One-Click')).status).toBe(404);
    const otherSig = `/unsubscribe/${id}.${'A'.repeat(32)}`;
    expect((await request(server.server).post(otherSig).type('form').send('List-Unsubscribe=One-Click')).status).toBe(404);
    expect((await request(server.server).post(url.pathname).type('form').send('List-Unsubscribe=Maybe')).status).toBe(400);
    expect(t.db.select().from(follows).all()).toHaveLength(3);
  });

  it('when the mail program POSTs List-Unsubscribe=One-Click without any session or CSRF token, then exactly that follow stops', async () => {
    const url = unsubscribeUrlOf(rosa.id);
    const res = await request(server.server).post(url.pathname).type('form').send('List-Unsubscribe=One-Click');
    expect(res.status).toBe(200);
    expect(res.text).toContain('no more digests');
    expect(t.db.select().from(follows).where(eq(follows.userId, rosa.id)).all()).toHaveLength(0);
    expect(t.db.select().from(follows).where(eq(follows.userId, kai.id)).all()).toHaveLength(2);
    // a second POST (a retry) is not an error
    expect((await request(server.server).post(url.pathname).type('form').send('List-Unsubscribe=One-Click')).status).toBe(200);
    expect((await request(server.server).get(url.pathname)).text).toContain('already stopped');
  });

  it('when the one-click body comes as multipart form data, then it stops the follow too', async () => {
    const url = unsubscribeUrlOf(kai.id);
    const res = await request(server.server).post(url.pathname).field('List-Unsubscribe', 'One-Click');
    expect(res.status).toBe(200);
    expect(t.db.select().from(follows).where(eq(follows.userId, kai.id)).all()).toHaveLength(1);
  });
});

describe('delivery', () => {
  let smtp: TestSmtp;
  let d: TestApp;
  afterAll(async () => {
    await d?.close();
    await smtp?.close();
  });

  it('when a digest is delivered through the outbox, then the message on the wire carries both unsubscribe headers', async () => {
    smtp = await startSmtp();
    const c = {
      time: at('2026-06-01T10:00:00Z'),
      now() {
        return new Date(this.time);
      },
    };
    d = await makeTestApp({ SMTP_URL: `smtp://127.0.0.1:${smtp.port}`, MAIL_RETRY_MS: '50' }, c);
    const chassisId = addChassis(d.db).id;
    const member = addUser(d.db, 'rivet_rosa');
    const author = addUser(d.db, 'pistonpaul');
    d.db
      .insert(follows)
      .values({ userId: member.id, chassisId, frequency: 'daily', since: c.now(), createdAt: c.now(), updatedAt: c.now() })
      .run();
    publish(d.db, 'h31-wire-swap', chassisId, '2026-06-01T11:00:00Z', author.id);
    c.time = at('2026-06-02T07:00:00Z');
    expect(
      sendDueDigests({
        db: d.db,
        mailer: d.mailer,
        clock: c,
        logger: d.logger,
        appUrl: 'https://swapyard.example',
        secret: d.config.sessionSecret,
      }).sent,
    ).toBe(1);
    for (let i = 0; i < 100 && smtp.received.length === 0; i++) await new Promise((r) => setTimeout(r, 50));
    expect(smtp.received).toHaveLength(1);
    const head = smtp.received[0]!.raw.split(/\r?\n\r?\n/)[0]!.replace(/\r?\n[ \t]+/g, ' ');
    expect(head).toMatch(/^List-Unsubscribe: <https:\/\/swapyard\.example\/unsubscribe\/\d+\.[A-Za-z0-9_-]{32}>$/m);
    expect(head).toMatch(/^List-Unsubscribe-Post: List-Unsubscribe=One-Click$/m);
  });
});
