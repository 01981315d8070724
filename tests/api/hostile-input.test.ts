import type { Server } from 'node:http';
import http from 'node:http';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import { eq, sql } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser, csrfToken, listen, sessionCookieOf, signIn, type Agent, createDraft } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import { multipartBody } from './support/hostile-files';
import { flags, revisionPhotos, revisions, swaps, users } from '../../server/db/schema/index';

// Bodies and parameters built to hurt: too big, too deep, too long, malformed multipart again and again,
// and text that looks like SQL. Each must get a clean 4xx in the error shape (or be stored as plain data),
// the process must keep answering, and nothing may leak: file descriptors, temp files, rows.

const privateTmp = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-hostile-'));
const originalTmp = process.env.TMPDIR;
process.env.TMPDIR = privateTmp;

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;

type Member = { agent: Agent; token: string; id: number; login: string; cookie: string };
let rosa: Member;
let mo: Member;
let ada: Member;

async function member(
  login: string,
  role: 'member' | 'moderator' | 'admin' = 'member',
  extra: Parameters<typeof addUser>[3] = {},
): Promise<Member> {
  const id = addUser(t.db, login, role, extra).id;
  const a = agent();
  const { callback } = await signIn(a, login);
  const cookie = sessionCookieOf(callback)!.split(';')[0];
  return { agent: a, token: await csrfToken(a), id, login, cookie };
}

/** A request written with node's own client, so the body goes out exactly as given. */
function rawRequest(m: Member, method: string, url: string, headers: Record<string, string>, body: Buffer) {
  const { port } = server.address() as { port: number };
  return new Promise<Answer>((resolve, reject) => {
    const req = http.request(
      {
        host: '127.0.0.1',
        port,
        method,
        path: url,
        headers: { cookie: m.cookie, 'x-csrf-token': m.token, 'content-length': String(body.length), ...headers },
      },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () =>
          resolve({
            status: res.statusCode!,
            headers: res.headers as Record<string, string>,
            body: JSON.parse(Buffer.concat(chunks).toString()) as ErrorBody,
          }),
        );
      },
    );
    req.on('error', reject);
    req.end(body);
  });
}

type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };
type Answer = { status: number; body: ErrorBody; headers: Record<string, string> };

/** A clean refusal: the given 4xx, JSON, in the error shape. */
function expectRefusal(res: Answer, status: number | number[]) {
  const allowed = Array.isArray(status) ? status : [status];
  expect(allowed, `${res.status} ${JSON.stringify(res.body)}`).toContain(res.status);
  expect(res.headers['content-type']).toMatch(/^application\/json/);
  expect(typeof res.body.error.code).toBe('string');
  expect(res.body.error.message.length).toBeGreaterThan(5);
  return res.body.error;
}

const fieldsOf = (res: Answer) => res.body.error.fields ?? {};
const post = (m: Member, url: string) => m.agent.post(url).set('x-csrf-token', m.token);
const patch = (m: Member, url: string) => m.agent.patch(url).set('x-csrf-token', m.token);
const sendJson = (req: request.Test, json: string) => req.set('content-type', 'application/json').send(json);

const nestedObject = (levels: number) => '{"a":'.repeat(levels) + '1' + '}'.repeat(levels);
const nestedArray = (levels: number) => '['.repeat(levels) + '1' + ']'.repeat(levels);

const openFds = () => fs.readdirSync('/proc/self/fd').length;
const tempLeftovers = () => fs.readdirSync(privateTmp).filter((f) => f !== path.basename(t.dir));
const uploadDirEntries = () => (fs.existsSync(t.config.uploadDir) ? fs.readdirSync(t.config.uploadDir).sort() : []);
const countOf = (table: typeof swaps | typeof revisions | typeof users | typeof revisionPhotos) =>
  t.db
    .select({ n: sql<number>`count(*)` })
    .from(table)
    .get()!.n;
const settle = (ms = 50) => new Promise((r) => setTimeout(r, ms));

let drafts = 0;
// a member's open drafts each have a title of their own
const newDraft = (m: Member = rosa, data: unknown = swapRecord({ title: `Vela calipers on the H31, draft ${++drafts}` })) =>
  createDraft(m, chassisId, data);

let jpeg: Buffer;
let approvedSlug: string;

beforeAll(async () => {
  // the limits are not what this file measures; malformed bodies are sent hundreds of times
  t = await makeTestApp({ UPLOAD_RATE_LIMIT: '100000', SUBMISSION_RATE_LIMIT: '100000', FLAG_RATE_LIMIT: '100000' });
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await member('rivet_rosa');
  mo = await member('gauge_mo', 'moderator');
  ada = await member('ada_admin', 'admin');
  addUser(t.db, 'pistonpaul');
  addUser(t.db, 'lathe_lug', 'shop', { name: '100% Lathe & Lug' });
  addUser(t.db, 'kanji_kai', 'member', { name: 'kai 日本 ünï' });
  approvedSlug = addSwap(t.db, {
    slug: 'h31-vela-hostile',
    chassisId,
    authorId: mo.id,
    revisions: [{ status: 'approved' }],
  }).slug;
  jpeg = await sharp({ create: { width: 320, height: 240, channels: 3, background: { r: 184, g: 137, b: 47 } } })
    .jpeg()
    .toBuffer();
});
afterAll(() => {
  server?.close();
  t?.close();
  process.env.TMPDIR = originalTmp;
  if (originalTmp === undefined) delete process.env.TMPDIR;
  fs.rmSync(privateTmp, { recursive: true, force: true });
});

describe('oversized JSON bodies', () => {
  it('when a submission body is 300 KB, then it is 413 in the error shape and nothing is stored', async () => {
    const before = countOf(swaps);
    const body = JSON.stringify({
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: swapRecord({ summary: 'x'.repeat(300 * 1024) }),
    });
    expect(body.length).toBeGreaterThan(256 * 1024);
    const error = expectRefusal((await sendJson(post(rosa, '/api/submissions'), body)) as Answer, 413);
    expect(error.code).toBe('too_large');
    expect(countOf(swaps)).toBe(before);
  });

  it('when an autosave is 2 MB, then it is 413 and the saved draft is unchanged', async () => {
    const id = await newDraft(rosa, swapRecord({ title: 'Saved before the big autosave' }));
    const body = JSON.stringify({ data: swapRecord({ title: 'y'.repeat(2 * 1024 * 1024) }), body: '' });
    expectRefusal((await sendJson(patch(rosa, `/api/submissions/${id}`), body)) as Answer, 413);
    const saved = await rosa.agent.get(`/api/submissions/${id}`);
    expect(saved.body.data.title).toBe('Saved before the big autosave');
  });

  it('when 60 KB of gzip inflates to 60 MB of JSON, then it is 413 without inflating it all', async () => {
    const inflated = `{"data":{"title":"${'z'.repeat(60 * 1024 * 1024)}"}}`;
    const gz = zlib.gzipSync(inflated, { level: 9 });
    expect(gz.length).toBeLessThan(100 * 1024);
    const started = performance.now();
    const res = await rawRequest(
      rosa,
      'POST',
      '/api/submissions',
      { 'content-type': 'application/json', 'content-encoding': 'gzip' },
      gz,
    );
    expectRefusal(res, 413);
    expect(performance.now() - started).toBeLessThan(5000);
  });

  it('when a body is just under the limit, then it is parsed and refused by the schema with a field reason (no 500)', async () => {
    const body = JSON.stringify({
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: swapRecord({ title: 't'.repeat(200 * 1024) }),
    });
    expect(body.length).toBeLessThan(256 * 1024);
    const res = (await sendJson(post(rosa, '/api/submissions'), body)) as Answer;
    expectRefusal(res, 400);
    expect(fieldsOf(res)['data.title']).toBeDefined();
  });
});

describe('deeply nested JSON', () => {
  it.each([
    ['10,000 levels of objects as the whole body', () => nestedObject(10_000)],
    ['40,000 levels of objects (just under the size limit)', () => nestedObject(40_000)],
    ['100,000 levels of arrays', () => nestedArray(100_000)],
  ])('when a submission body is %s, then it is 400 and the app answers at once', async (_what, make) => {
    const body = make();
    expect(body.length).toBeLessThan(256 * 1024);
    const started = performance.now();
    expectRefusal((await sendJson(post(rosa, '/api/submissions'), body)) as Answer, 400);
    expect(performance.now() - started).toBeLessThan(3000);
    expect((await request(server).get('/api/health')).status).toBe(200);
  });

  it.each([
    ['the record', (deep: string) => `{"chassisId":${chassisId},"axle":"front","category":"brakes","data":${deep}}`],
    [
      'a part',
      (deep: string) => `{"chassisId":${chassisId},"axle":"front","category":"brakes","data":{"title":"x","parts":[${deep}]}}`,
    ],
    [
      'a part number list',
      (deep: string) =>
        JSON.stringify({
          chassisId,
          axle: 'front',
          category: 'brakes',
          data: { ...swapRecord(), parts: [{ ...swapRecord().parts[0], partNumbers: '@@' }] },
        }).replace('"@@"', deep),
    ],
    ['a profile change', (deep: string) => `{"name":${deep}}`],
  ])('when 10,000 levels of nesting sit inside %s, then it is 400 with a field reason', async (where, wrap) => {
    const deep = where === 'a part number list' ? nestedArray(10_000) : nestedObject(10_000);
    const url = where === 'a profile change' ? '/api/me' : '/api/submissions';
    const req = where === 'a profile change' ? patch(rosa, url) : post(rosa, url);
    const res = (await sendJson(req, wrap(deep))) as Answer;
    expectRefusal(res, 400);
    expect(Object.keys(fieldsOf(res)).length).toBeGreaterThan(0);
  });

  it('when a body sets __proto__, then nothing outside the body changes: no role, no polluted prototype', async () => {
    const res = (await sendJson(patch(rosa, '/api/me'), '{"name":"Rosa","__proto__":{"role":"admin","isAdmin":true}}')) as Answer;
    expect([200, 400]).toContain(res.status);
    expect(({} as Record<string, unknown>).role).toBeUndefined();
    expect(({} as Record<string, unknown>).isAdmin).toBeUndefined();
    expect(t.db.select({ role: users.role }).from(users).where(eq(users.id, rosa.id)).get()!.role).toBe('member');
    expect((await rosa.agent.get('/api/review/queue')).status).toBe(403);
  });
});

describe('huge arrays where a few items are expected', () => {
  it('when a record lists 3,000 parts (the most is 40), then it is 400 on data.parts', async () => {
    const part = { role: 'Caliper', kind: 'caliper', name: 'Vela caliper', quantity: 1 };
    const body = JSON.stringify({
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: swapRecord({ parts: Array(3000).fill(part) }),
    });
    expect(body.length).toBeLessThan(256 * 1024);
    const res = (await sendJson(post(rosa, '/api/submissions'), body)) as Answer;
    expectRefusal(res, 400);
    expect(fieldsOf(res)['data.parts']).toMatch(/40/);
  });

  it('when one part has 10,000 part numbers, then it is 400 on that part’s list', async () => {
    const part = { ...swapRecord().parts[0], partNumbers: Array.from({ length: 10_000 }, (_, i) => `OV-${i}`) };
    const res = (await post(rosa, '/api/submissions').send({
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: swapRecord({ parts: [part] }),
    })) as Answer;
    expectRefusal(res, 400);
    expect(fieldsOf(res)['data.parts.0.partNumbers']).toBeDefined();
  });

  it('when a bulk decline names 20,000 revisions, then it is 400 on revisionIds and nothing is declined', async () => {
    const before = t.db.select().from(revisions).where(eq(revisions.status, 'declined')).all().length;
    const res = (await post(mo, '/api/review/bulk-decline').send({
      revisionIds: Array.from({ length: 20_000 }, (_, i) => i + 1),
      note: 'Not a swap',
    })) as Answer;
    expectRefusal(res, 400);
    expect(fieldsOf(res).revisionIds).toBeDefined();
    expect(t.db.select().from(revisions).where(eq(revisions.status, 'declined')).all().length).toBe(before);
  });

  it('when a photo order lists 5,000 photos, then it is 400 on photos', async () => {
    const id = await newDraft();
    const res = (await patch(rosa, `/api/submissions/${id}/photos`).send({
      photos: Array.from({ length: 5000 }, (_, i) => ({ id: `photo${i}xxxxxxxx`, caption: '' })),
    })) as Answer;
    expectRefusal(res, 400);
    expect(fieldsOf(res).photos).toBeDefined();
  });

  it('when the body is an array of 30,000 numbers instead of an object, then it is 400', async () => {
    const res = (await sendJson(
      post(rosa, '/api/submissions'),
      JSON.stringify(Array.from({ length: 30_000 }, (_, i) => i)),
    )) as Answer;
    expectRefusal(res, 400);
  });
});

describe('malformed multipart, again and again', () => {
  const boundary = 'swapyardBoundary7MA4YWxk';
  const head = `--${boundary}\r\nContent-Disposition: form-data; name="photos"; filename="a.jpg"\r\nContent-Type: image/jpeg\r\n`;
  const variants: [string, () => { type: string; body: Buffer }][] = [
    [
      'a boundary that does not match the header',
      () => ({
        type: `multipart/form-data; boundary=${boundary}`,
        body: multipartBody([{ name: 'photos', filename: 'a.jpg', contentType: 'image/jpeg', data: jpeg }], 'anotherBoundary')
          .body,
      }),
    ],
    [
      'no end boundary',
      () => ({ type: `multipart/form-data; boundary=${boundary}`, body: Buffer.concat([Buffer.from(`${head}\r\n`), jpeg]) }),
    ],
    ['part headers only', () => ({ type: `multipart/form-data; boundary=${boundary}`, body: Buffer.from(head) })],
    [
      'no boundary parameter',
      () => ({ type: 'multipart/form-data', body: multipartBody([{ name: 'photos', filename: 'a.jpg', data: jpeg }]).body }),
    ],
    [
      'a part header without a colon',
      () => ({
        type: `multipart/form-data; boundary=${boundary}`,
        body: Buffer.from(`--${boundary}\r\nthis is not a header\r\n\r\nxyz\r\n--${boundary}--\r\n`),
      }),
    ],
    [
      'random bytes',
      () => ({
        type: `multipart/form-data; boundary=${boundary}`,
        body: Buffer.from(Array.from({ length: 4096 }, (_, i) => (i * 131 + 7) % 256)),
      }),
    ],
  ];

  it('when six kinds of broken multipart go to the upload route 200 times each, then each is a clean 4xx on photos, and no descriptor, file or row is left', async () => {
    const id = await newDraft();
    const url = `/api/submissions/${id}/photos`;
    // warm up: the first requests open what the process keeps open anyway
    for (const [, make] of variants) {
      const { type, body } = make();
      await post(rosa, url).set('content-type', type).send(body);
    }
    await settle();
    const fdsBefore = openFds();
    const rows = countOf(revisionPhotos);
    const files = uploadDirEntries();
    const statuses = new Map<string, Set<number>>();
    for (let round = 0; round < 200; round++) {
      for (const [name, make] of variants) {
        const { type, body } = make();
        const res = (await post(rosa, url).set('content-type', type).send(body)) as Answer;
        const error = expectRefusal(res, 400);
        expect(error.fields?.photos, `${name}: ${JSON.stringify(error)}`).toBeTruthy();
        if (!statuses.has(name)) statuses.set(name, new Set());
        statuses.get(name)!.add(res.status);
      }
      if (round % 50 === 49) expect((await request(server).get('/api/health')).status).toBe(200);
    }
    await settle(200);
    const fdsAfter = openFds();
    console.log(
      `malformed multipart: ${variants.length * 200} requests; open file descriptors ${fdsBefore} before, ${fdsAfter} after`,
    );
    expect(fdsAfter).toBeLessThanOrEqual(fdsBefore + 5);
    expect(countOf(revisionPhotos)).toBe(rows);
    expect(uploadDirEntries()).toEqual(files);
    expect(tempLeftovers()).toEqual([]);
    // and the route still works for a real photo
    const good = await post(rosa, url).attach('photos', jpeg, 'a.jpg');
    expect(good.status).toBe(201);
  }, 120_000);

  it('when 100 uploads are cut off mid-body by the client, then the app keeps answering and no descriptor is left open', async () => {
    const id = await newDraft();
    const { port } = server.address() as { port: number };
    const cookie = rosa.cookie;
    const abortOnce = () =>
      new Promise<void>((resolve) => {
        const req = http.request({
          host: '127.0.0.1',
          port,
          method: 'POST',
          path: `/api/submissions/${id}/photos`,
          headers: {
            cookie,
            'x-csrf-token': rosa.token,
            'content-type': `multipart/form-data; boundary=${boundary}`,
            'content-length': String(4 * 1024 * 1024),
          },
        });
        req.on('error', () => resolve());
        req.on('response', (res) => {
          res.resume();
          resolve();
        });
        req.write(`${head}\r\n`);
        req.write(jpeg.subarray(0, 2000), () => setTimeout(() => req.destroy(), 5));
        req.on('close', () => resolve());
      });
    await abortOnce();
    await settle(100);
    const fdsBefore = openFds();
    const rows = countOf(revisionPhotos);
    for (let i = 0; i < 100; i++) await abortOnce();
    await settle(300);
    const fdsAfter = openFds();
    console.log(`aborted uploads: 100; open file descriptors ${fdsBefore} before, ${fdsAfter} after`);
    expect(fdsAfter).toBeLessThanOrEqual(fdsBefore + 5);
    expect(countOf(revisionPhotos)).toBe(rows);
    expect(tempLeftovers()).toEqual([]);
    expect((await request(server).get('/api/health')).status).toBe(200);
  }, 60_000);

  it('when broken multipart goes to the fitted-report route, then it is 400 on photo, not a 500', async () => {
    for (const [name, make] of variants) {
      for (let i = 0; i < 5; i++) {
        const { type, body } = make();
        const res = (await post(rosa, `/api/swaps/${approvedSlug}/fitted-reports`)
          .set('content-type', type)
          .send(body)) as Answer;
        const error = expectRefusal(res, 400);
        expect(error.fields?.photo, `${name}: ${JSON.stringify(error)}`).toBeTruthy();
      }
    }
    expect((await rosa.agent.get(`/api/swaps/${approvedSlug}/fitted-reports`)).body.items ?? []).toHaveLength(0);
  });
});

describe('input that looks like SQL', () => {
  const hostile = [
    "' OR 1=1 --",
    '"; DROP TABLE swaps; --',
    "Robert'); DELETE FROM users; --",
    "1' UNION SELECT login, name FROM users --",
    '%',
    '_',
    '\\',
    "%' OR '%'='",
    'Ünïcödé 日本 🚗 \u202Ertl',
  ];

  it('when slugs, ids and photo ids are SQL-looking, then each is a clean 400 or 404', async () => {
    for (const s of hostile) {
      const enc = encodeURIComponent(s);
      for (const url of [
        `/api/swaps/${enc}`,
        `/api/swaps/${enc}/fitted-reports`,
        `/api/swaps/${approvedSlug}/revisions/${enc}`,
        `/api/submissions/${enc}`,
        `/media/${enc}`,
      ]) {
        expectRefusal((await rosa.agent.get(url)) as Answer, [400, 404]);
      }
      expectRefusal(
        (await post(rosa, `/api/swaps/${enc}/flags`).send({ kind: 'wrong_figure', reason: 'The bracket part number is wrong' })) as Answer,
        [400, 404],
      );
      expectRefusal((await post(rosa, '/api/submissions').send({ swapSlug: s, changeNote: 'Re-measured on the car; the figures now match the parts.', data: swapRecord() })) as Answer, [400, 404]);
    }
  });

  it('when the review queue is filtered by an SQL-looking chassis, then it is 400 on chassis', async () => {
    for (const s of hostile) {
      const res = (await mo.agent.get('/api/review/queue').query({ chassis: s })) as Answer;
      expectRefusal(res, 400);
      expect(fieldsOf(res).chassis).toBeDefined();
    }
  });

  it('when an admin searches users for SQL-looking text, then it is matched as literal text', async () => {
    const logins = async (q: string) => {
      const res = await ada.agent.get('/api/admin/users').query({ q });
      expect(res.status).toBe(200);
      return (res.body.users as { login: string }[]).map((u) => u.login).sort();
    };
    const everyone = await logins('');
    expect(everyone.length).toBe(6);
    expect(await logins("' OR 1=1 --")).toEqual([]);
    expect(await logins('"; DROP TABLE swaps; --')).toEqual([]);
    expect(await logins("%' OR '%'='")).toEqual([]);
    // LIKE's wildcards are characters like any other
    expect(await logins('%')).toEqual(['lathe_lug']);
    expect(await logins('_')).toEqual(everyone.filter((l) => l.includes('_')));
    expect(everyone.filter((l) => l.includes('_')).length).toBeLessThan(everyone.length);
    expect(await logins('\\')).toEqual([]);
    expect(await logins('日本')).toEqual(['kanji_kai']);
  });

  it('when text fields hold SQL-looking text, then it is stored and returned verbatim, and every table is still there', async () => {
    const tablesBefore = t.db
      .all<{ name: string }>(sql`select name from sqlite_master where type = 'table' order by name`)
      .map((r) => r.name);
    const usersBefore = countOf(users);
    const [a, b, c, d] = hostile;
    const created = await post(rosa, '/api/submissions').send({
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: swapRecord({ title: `${a} ${b}`, summary: `${c} ${d}` }),
      body: hostile.join('\n'),
    });
    expect(created.status).toBe(201);
    // verbatim except for bidi overrides, which are removed from every field (tests/api/hostile-text.test.ts)
    const kept = (s: string) => s.replace('\u202E', '');
    const saved = await rosa.agent.get(`/api/submissions/${created.body.id}`);
    expect(saved.body.data.title).toBe(`${a} ${b}`);
    expect(saved.body.data.summary).toBe(`${c} ${d}`);
    expect(saved.body.body).toBe(kept(hostile.join('\n')));
    for (const reason of hostile.filter((s) => s.length >= 5)) {
      const flag = await post(rosa, `/api/swaps/${approvedSlug}/flags`).send({ kind: 'other', reason });
      expect(flag.status).toBe(201);
      expect(flag.body.reason).toBe(kept(reason));
      // one open flag per member and swap: each is resolved before the next is sent
      t.db.update(flags).set({ status: 'resolved' }).where(eq(flags.id, flag.body.id)).run();
    }
    const renamed = await patch(rosa, '/api/me').send({ name: "Rosa'; DROP TABLE users; --" });
    expect(renamed.status).toBe(200);
    expect(renamed.body.user.name).toBe("Rosa'; DROP TABLE users; --");

    const tablesAfter = t.db
      .all<{ name: string }>(sql`select name from sqlite_master where type = 'table' order by name`)
      .map((r) => r.name);
    expect(tablesAfter).toEqual(tablesBefore);
    expect(tablesAfter).toEqual(expect.arrayContaining(['swaps', 'users', 'revisions', 'revision_photos', 'flags']));
    expect(countOf(users)).toBe(usersBefore);
    expect(t.db.get<{ ok: string }>(sql`pragma integrity_check`)).toMatchObject({ integrity_check: 'ok' });
    expect((await request(server).get(`/api/swaps/${approvedSlug}`)).status).toBe(200);
  });
});
