import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addShop, createDraft, listen, signedInMember, type Member } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import {
  cars,
  chassis,
  fittedReports,
  flags,
  mailOutbox,
  revisionPhotos,
  revisions,
  reviewReasonTemplates,
  shopLinks,
  shops,
  users,
} from '../../server/db/schema/index';

// Bidi controls and invisible format characters in what members write: a title carrying U+202E shows
// reversed on the desk and in e-mail subjects. Every user-written field is cleaned before it is stored.

const RLO = '\u202E'; // right-to-left override
const hostile = (s: string) => `${RLO}${s}\u2066\u200B\u2069\uFEFF\u00AD\u200E\u{E0041}`;
// every bidi embedding, override, isolate and mark, and the common invisible ones
const invisible = /[\u202A-\u202E\u2066-\u2069\u200E\u200F\u061C\u200B\u2060\uFEFF\u00AD]|\u{E0041}/u;

let t: TestApp;
let server: Server;
let rosa: Member;
let kai: Member;
let mo: Member;
let shop: Member;
let chassisId: number;

beforeAll(async () => {
  t = await makeTestApp();
  const l = listen(t.app);
  server = l.server;
  chassisId = addChassis(t.db).id;
  const ridgeway = addShop(t.db, 'ridgeway-performance', 'Ridgeway Performance');
  rosa = await signedInMember(t.db, l.agent, 'rivet_rosa');
  kai = await signedInMember(t.db, l.agent, 'camber_kai');
  mo = await signedInMember(t.db, l.agent, 'gauge_mo', 'moderator');
  shop = await signedInMember(t.db, l.agent, 'ridgeway_shop', 'shop', { shopId: ridgeway.id });
});
afterAll(() => {
  server.close();
  t.close();
});

const send = (m: Member, method: 'post' | 'patch', url: string, body: object) =>
  m.agent[method](url).set('x-csrf-token', m.token).send(body);

describe('bidi and invisible formatting characters', () => {
  it('when a swap title carries a right-to-left override, then the stored title and the e-mail subject have none', async () => {
    const id = await createDraft(rosa, chassisId, swapRecord({ title: hostile('Vela calipers on the H31') }));
    const stored = t.db.select().from(revisions).where(eq(revisions.id, id)).get()!;
    expect(stored.data.title).toBe('Vela calipers on the H31');
    expect((await send(rosa, 'post', `/api/submissions/${id}/submit`, {})).status).toBe(200);
    const mail = t.db.select().from(mailOutbox).all().at(-1)!;
    expect(mail.subject).toBe('At the review desk: Vela calipers on the H31');
  });

  it('when the write-up and part notes carry them, then they are removed and line breaks stay', async () => {
    const record = swapRecord();
    record.parts[0]!.notes = hostile('Left side first');
    const res = await send(rosa, 'post', '/api/submissions', {
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: record,
      body: `${hostile('Line one')}\nLine two`,
    });
    expect(res.status).toBe(201);
    expect(res.body.data.parts[0].notes).toBe('Left side first');
    expect(res.body.body).toBe('Line one\nLine two');
  });

  it('when a proposed chassis, a caption, a profile name, a car, a shop and a template carry them, then none is stored', async () => {
    const proposed = await send(kai, 'post', '/api/submissions', {
      newChassis: {
        make: hostile('Halden'),
        model: hostile('H40'),
        code: `H40${RLO}`,
        yearFrom: 2000,
        yearTo: 2006,
        body: hostile('Saloon'),
        lugCount: 5,
        pcdMm: 112,
        centreBoreMm: 66.6,
        wheelBoltThread: 'M12x1.5',
        notes: hostile('From the owner’s handbook'),
      },
      axle: 'front',
      category: 'brakes',
      data: swapRecord(),
    });
    expect(proposed.status).toBe(201);
    const c = t.db.select().from(chassis).where(eq(chassis.id, proposed.body.chassis.id)).get()!;
    expect([c.make, c.model, c.code, c.body]).toEqual(['Halden', 'H40', 'H40', 'Saloon']);
    expect(c.notes).not.toMatch(invisible);

    const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#1d4d3a' } })
      .jpeg()
      .toBuffer();
    const up = await kai.agent
      .post(`/api/submissions/${proposed.body.id}/photos`)
      .set('x-csrf-token', kai.token)
      .attach('photos', jpeg, 'a.jpg')
      .field('captions', JSON.stringify([hostile('Bracket, left')]));
    expect(up.status).toBe(201);
    expect(up.body.photos[0].caption).toBe('Bracket, left');
    const reorder = await send(kai, 'patch', `/api/submissions/${proposed.body.id}/photos`, {
      photos: [{ id: up.body.photos[0].id, caption: hostile('Bracket, right') }],
    });
    expect(reorder.status).toBe(200);
    expect(t.db.select().from(revisionPhotos).all().at(-1)!.caption).toBe('Bracket, right');

    expect((await send(kai, 'patch', '/api/me', { name: hostile('Kai') })).status).toBe(200);
    expect(t.db.select().from(users).where(eq(users.id, kai.id)).get()!.name).toBe('Kai');

    const car = await send(kai, 'post', '/api/cars', {
      chassisId,
      nickname: hostile('Weekend car'),
      wheelDiameterIn: 16,
      wheelWidthIn: 7,
      wheelOffsetMm: 38,
    });
    expect(car.status).toBe(201);
    expect(t.db.select().from(cars).all().at(-1)!.nickname).toBe('Weekend car');

    const shopEdit = await send(shop, 'patch', '/api/shops/ridgeway-performance', {
      name: hostile('Ridgeway Performance'),
      town: hostile('Northgate'),
      about: hostile('Brake work'),
    });
    expect(shopEdit.status).toBe(200);
    const s = t.db.select().from(shops).where(eq(shops.slug, 'ridgeway-performance')).get()!;
    expect([s.name, s.town, s.about]).toEqual(['Ridgeway Performance', 'Northgate', 'Brake work']);

    const template = await send(mo, 'post', '/api/review/templates', { label: hostile('Photo'), text: hostile('Add a photo') });
    expect(template.status).toBe(201);
    const tpl = t.db.select().from(reviewReasonTemplates).all().at(-1)!;
    expect([tpl.label, tpl.text]).toEqual(['Photo', 'Add a photo']);
  });

  it('when a flag, a fitted report and a shop-link note carry them, then none is stored', async () => {
    const swap = addSwap(t.db, { slug: 'h31-bidi', chassisId, authorId: rosa.id, revisions: [{ status: 'approved' }] });
    expect((await send(kai, 'post', `/api/swaps/${swap.slug}/flags`, { kind: 'other', reason: hostile('Torque looks wrong') })).status).toBe(
      201,
    );
    expect(t.db.select().from(flags).all().at(-1)!.reason).toBe('Torque looks wrong');

    const report = await send(kai, 'post', `/api/swaps/${swap.slug}/fitted-reports`, {
      diameterIn: 16,
      widthIn: 7,
      offsetMm: 38,
      note: hostile('Fits with 2 mm to spare'),
    });
    expect(report.status).toBe(201);
    expect(t.db.select().from(fittedReports).all().at(-1)!.note).toBe('Fits with 2 mm to spare');

    const link = await send(shop, 'post', '/api/shop-links', { swapSlug: swap.slug, note: hostile('Quoted in March') });
    expect(link.status).toBe(201);
    expect(t.db.select().from(shopLinks).all().at(-1)!.note).toBe('Quoted in March');
  });

  it('when text mixes scripts, then letters, joiners and emoji sequences are kept', async () => {
    const title = 'Vela ‏calipers — עברית العربية क्‍ष 👩‍🔧 fitted';
    const id = await createDraft(rosa, chassisId, swapRecord({ title }));
    // only the right-to-left mark (U+200F) goes; the joiners inside the Devanagari and the emoji stay
    expect(t.db.select().from(revisions).where(eq(revisions.id, id)).get()!.data.title).toBe(title.replace('\u200F', ''));
  });
});

let drafts = 0;
/** a record with a title of its own: a member's open drafts never share one */
const numbered = () => swapRecord({ title: `Vela calipers on the H31, draft ${++drafts}` });

describe('deeply nested markdown', () => {
  const quotes = `Intro line\n${'>'.repeat(39_000)} x`;
  const lists = `${Array.from({ length: 19_000 }, () => '-').join(' ')} x`;

  it('when a write-up nests 39,000 quotes or 19,000 list markers, then the save is a 400 naming the body and the line, and the draft keeps what it had', async () => {
    const id = await createDraft(rosa, chassisId, numbered());
    for (const body of [quotes, lists]) {
      const created = await send(rosa, 'post', '/api/submissions', {
        chassisId,
        axle: 'front',
        category: 'brakes',
        data: swapRecord(),
        body,
      });
      expect(created.status).toBe(400);
      expect(created.body.error.fields.body).toMatch(
        /nested too deeply: line \d+ goes [\d,]+ levels deep, and at most 16 are allowed/,
      );
      const saved = await send(rosa, 'patch', `/api/submissions/${id}`, { data: swapRecord(), body });
      expect(saved.status).toBe(400);
      expect(saved.body.error.fields.body).toMatch(/nested too deeply/);
    }
    expect(quotes.length).toBeLessThan(40_000);
    expect(t.db.select().from(revisions).where(eq(revisions.id, id)).get()!.body).toBe('');
  });

  it('when a shop description or link note nests too deeply, then it is a 400 on that field', async () => {
    const about = await send(shop, 'patch', '/api/shops/ridgeway-performance', { about: '>'.repeat(3000) });
    expect(about.status).toBe(400);
    expect(about.body.error.fields.about).toMatch(/nested too deeply/);
    const swap = addSwap(t.db, { slug: 'h31-deep-note', chassisId, authorId: rosa.id, revisions: [{ status: 'approved' }] });
    const link = await send(shop, 'post', '/api/shop-links', { swapSlug: swap.slug, note: '- '.repeat(1000) });
    expect(link.status).toBe(400);
    expect(link.body.error.fields.note).toMatch(/nested too deeply/);
  });

  it('when a write-up nests lists and quotes a few levels, then it saves', async () => {
    const body = '1. Remove the caliper\n   - hang it up\n     - never by the hose\n       > check the hose';
    const res = await send(rosa, 'post', '/api/submissions', {
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: numbered(),
      body,
    });
    expect(res.status).toBe(201);
    expect(res.body.body).toBe(body);
  });
});
