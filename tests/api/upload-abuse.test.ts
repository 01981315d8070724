import type { Server } from 'node:http';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import { makeTestApp, type TestApp } from './support/test-app';
import { type Agent, type Member, addUser, csrfToken, listen, signIn, signedInMember, createDraft } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import {
  blackPng1Bit,
  gifBytes,
  jpegClaiming,
  multipartBody,
  noiseJpeg,
  pdfBytes,
  svgBytes,
  zipWith,
} from './support/hostile-files';
import { revisionPhotos } from '../../server/db/schema/index';
import { MAX_PHOTO_BYTES, processPhoto } from '../../server/features/photos/photo-processing';
import type { RevisionStatus } from '../../shared/schemas/enums';

// Abuse of POST /api/submissions/:id/photos beyond the cases in uploads.test.ts. Every refusal must be a 4xx
// in the error shape and leave nothing behind: no photo row, no file (temporary ones included) in the upload
// folder, nothing in the temp folder. Accepted oddities (polyglots, hostile names, a lying part header) must
// end up as fresh WebP files under random ids and nothing else.

// everything the process puts in the temp folder (multer, busboy, libvips) lands here, where the test can see it
const privateTmp = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-upload-abuse-'));
const originalTmp = process.env.TMPDIR;
process.env.TMPDIR = privateTmp;

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;

let rosa: Member;
let kai: Member;

const member = (login: string) => signedInMember(t.db, agent, login);

let drafts = 0;
// a member's open drafts each have a title of their own
const newDraft = (m: Member = rosa) =>
  createDraft(m, chassisId, swapRecord({ title: `Vela calipers on the H31, draft ${++drafts}` }));

const upload = (m: Member, id: number) => m.agent.post(`/api/submissions/${id}/photos`).set('x-csrf-token', m.token);
const uploadRaw = (m: Member, id: number, parts: Parameters<typeof multipartBody>[0]) => {
  const { body, contentType } = multipartBody(parts);
  return upload(m, id).set('content-type', contentType).send(body);
};

/** Every entry under a folder, recursively, dot-files included. */
const everything = (dir: string): string[] =>
  fs.existsSync(dir)
    ? fs
        .readdirSync(dir, { withFileTypes: true })
        .flatMap((e) => (e.isDirectory() ? everything(path.join(dir, e.name)).map((f) => `${e.name}/${f}`) : [e.name]))
        .sort()
    : [];
const filesInUploadDir = () => everything(t.config.uploadDir);
const photoRows = () => t.db.select().from(revisionPhotos).all();
/** what is in the private temp folder besides the test app's own folder (database and uploads) */
const tempLeftovers = () => fs.readdirSync(privateTmp).filter((f) => f !== path.basename(t.dir));
/** the test app's folder outside the upload folder: the database files and nothing else */
const appDirOutsideUploads = () =>
  everything(t.dir).filter((f) => !f.startsWith('uploads/') && !/^test\.db(-wal|-shm|-journal)?$/.test(f));

type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };
type Answer = { status: number; body: ErrorBody; headers: Record<string, string> };

/** A refused upload: a 4xx in the error shape, and no new row, upload file or temp file. */
async function refused(run: () => PromiseLike<unknown>, status: number): Promise<Answer> {
  const rows = photoRows().length;
  const files = filesInUploadDir();
  const res = (await run()) as Answer;
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(res.headers['content-type']).toMatch(/^application\/json/);
  expect(typeof res.body.error.code).toBe('string');
  expect(res.body.error.message.length).toBeGreaterThan(10);
  expect(photoRows().length).toBe(rows);
  expect(filesInUploadDir()).toEqual(files);
  expect(tempLeftovers()).toEqual([]);
  expect(appDirOutsideUploads()).toEqual([]);
  return res;
}

/** The field-level reason: present, and a sentence rather than a code. */
function reasonFor(res: Answer, field: string | RegExp): string {
  const fields = res.body.error.fields ?? {};
  const key = typeof field === 'string' ? field : Object.keys(fields).find((k) => field.test(k));
  expect(key && fields[key], `fields: ${JSON.stringify(fields)}`).toBeTruthy();
  return fields[key!];
}

/** An accepted upload: exactly one row and its two files (full and thumbnail), both WebP, under a random id. */
async function acceptedOne(run: () => PromiseLike<unknown>) {
  const files = filesInUploadDir();
  const res = (await run()) as { status: number; body: { photos: { id: string; url: string }[] } };
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const photo = res.body.photos.at(-1)!;
  expect(photo.id).toMatch(/^[a-z0-9]{20,40}$/);
  const added = filesInUploadDir().filter((f) => !files.includes(f));
  expect(added.sort()).toEqual([photo.id, `${photo.id}_t`].sort());
  const full = fs.readFileSync(path.join(t.config.uploadDir, photo.id));
  const thumb = fs.readFileSync(path.join(t.config.uploadDir, `${photo.id}_t`));
  expect((await sharp(full).metadata()).format).toBe('webp');
  expect((await sharp(thumb).metadata()).format).toBe('webp');
  expect(tempLeftovers()).toEqual([]);
  return { res, photo, full, thumb };
}

let jpeg: Buffer;
let png: Buffer;

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await member('rivet_rosa');
  kai = await member('camber_kai');
  jpeg = await sharp({ create: { width: 320, height: 240, channels: 3, background: { r: 184, g: 137, b: 47 } } })
    .jpeg()
    .toBuffer();
  png = await sharp({ create: { width: 320, height: 240, channels: 3, background: { r: 29, g: 77, b: 58 } } })
    .png()
    .toBuffer();
});
afterAll(() => {
  server?.close();
  t?.close();
  process.env.TMPDIR = originalTmp;
  if (originalTmp === undefined) delete process.env.TMPDIR;
  fs.rmSync(privateTmp, { recursive: true, force: true });
});

describe('bytes that are not a photo, named as one', () => {
  it.each([
    ['a PDF', () => pdfBytes()],
    ['a ZIP archive', () => zipWith('brackets.html', '<script>alert(1)</script>')],
    ['a GIF', () => gifBytes()],
    ['an SVG with a script', () => svgBytes()],
    ['an HTML page followed by a whole PNG', () => Buffer.concat([Buffer.from('<!doctype html><script>alert(1)</script>'), png])],
  ])('when %s is named .jpg and sent as image/jpeg, then it is 415 on that file', async (_what, make) => {
    const id = await newDraft();
    const bytes = await make();
    const res = await refused(
      () => upload(rosa, id).attach('photos', bytes, { filename: 'caliper.jpg', contentType: 'image/jpeg' }),
      415,
    );
    expect(res.body.error.code).toBe('unsupported_type');
    expect(reasonFor(res, 'photos.0')).toMatch(/JPEG, PNG and WebP/);
  });
});

describe('polyglots: a real photo with something appended', () => {
  it('when a valid PNG is followed by an HTML page with a script, then the photo is kept and the stored WebP carries none of the page', async () => {
    const payload = '<html><body><script>alert(document.cookie)</script><img src=x onerror=alert(2)></body></html>';
    const polyglot = Buffer.concat([png, Buffer.from(payload)]);
    const id = await newDraft();
    const { photo, full, thumb } = await acceptedOne(() => upload(rosa, id).attach('photos', polyglot, 'bracket.png'));
    for (const file of [full, thumb]) {
      expect(file.includes(Buffer.from('<script'))).toBe(false);
      expect(file.includes(Buffer.from('onerror'))).toBe(false);
      expect(file.includes(Buffer.from('<html'))).toBe(false);
    }
    const served = await rosa.agent.get(photo.url);
    expect(served.status).toBe(200);
    expect(served.headers['content-type']).toBe('image/webp');
    expect(Buffer.from(served.body as Buffer).includes(Buffer.from('<script'))).toBe(false);
  });

  it('when a valid JPEG has a ZIP archive appended, then the photo is kept and the stored WebP has no trace of the archive', async () => {
    const zip = zipWith('hidden-payload.html', '<script>alert(1)</script>');
    const polyglot = Buffer.concat([jpeg, zip]);
    const id = await newDraft();
    const { full, thumb } = await acceptedOne(() => upload(rosa, id).attach('photos', polyglot, 'rotor.jpg'));
    for (const file of [full, thumb]) {
      expect(file.includes(Buffer.from([0x50, 0x4b, 0x03, 0x04]))).toBe(false);
      expect(file.includes(Buffer.from([0x50, 0x4b, 0x05, 0x06]))).toBe(false);
      expect(file.includes(Buffer.from('hidden-payload'))).toBe(false);
      expect(file.length).toBeLessThan(polyglot.length);
    }
  });
});

describe('images that would cost too much to decode', () => {
  it('when a 48 KB PNG declares 20000 × 20000 px (a decompression bomb), then it is 422 at once, without decoding', async () => {
    const bomb = blackPng1Bit(20000, 20000);
    expect(bomb.length).toBeLessThan(100 * 1024);
    // it really is that image: the header is valid and says so
    const meta = await sharp(bomb, { limitInputPixels: false }).metadata();
    expect([meta.width, meta.height, meta.format]).toEqual([20000, 20000, 'png']);
    const id = await newDraft();
    const started = performance.now();
    const res = await refused(() => upload(rosa, id).attach('photos', bomb, 'bomb.png'), 422);
    expect(performance.now() - started).toBeLessThan(3000);
    expect(reasonFor(res, 'photos.0')).toMatch(/too many pixels/);
  });

  it('when a JPEG header claims 65000 × 65000 px, then it is 422 on that file', async () => {
    const huge = await jpegClaiming(65000, 65000);
    expect((await sharp(huge, { limitInputPixels: false }).metadata()).width).toBe(65000);
    const id = await newDraft();
    const res = await refused(() => upload(rosa, id).attach('photos', huge, 'huge.jpg'), 422);
    expect(reasonFor(res, 'photos.0')).toMatch(/too many pixels/);
  });

  it.each([
    [1, 59_000_000],
    [59_000_000, 1],
  ])(
    'when a PNG is %i × %i px (under the pixel limit, but one edge millions of pixels long), then it is 422 quickly',
    async (w, h) => {
      const strip = blackPng1Bit(w, h);
      expect(strip.length).toBeLessThan(200 * 1024);
      const id = await newDraft();
      const started = performance.now();
      const res = await refused(() => upload(rosa, id).attach('photos', strip, 'strip.png'), 422);
      expect(performance.now() - started).toBeLessThan(3000);
      expect(reasonFor(res, 'photos.0')).toMatch(/longest side/);
    },
  );
});

describe('broken and empty files', () => {
  it.each([
    ['JPEG', () => jpeg],
    ['PNG', () => png],
  ])('when a %s is cut off halfway, then it is 422 on that file', async (_kind, make) => {
    const whole = make();
    const half = whole.subarray(0, Math.floor(whole.length / 2));
    const id = await newDraft();
    const res = await refused(() => upload(rosa, id).attach('photos', half, 'cut.img'), 422);
    expect(reasonFor(res, 'photos.0')).toMatch(/could not be read/);
  });

  it('when the file has zero bytes, then it is 400 on that file', async () => {
    const id = await newDraft();
    const res = await refused(
      () => uploadRaw(rosa, id, [{ name: 'photos', filename: 'empty.jpg', contentType: 'image/jpeg', data: Buffer.alloc(0) }]),
      400,
    );
    expect(reasonFor(res, 'photos.0')).toMatch(/empty/);
  });

  it('when a good photo is followed by a zero-byte one, then neither is kept', async () => {
    const id = await newDraft();
    const res = await refused(
      () =>
        uploadRaw(rosa, id, [
          { name: 'photos', filename: 'good.jpg', contentType: 'image/jpeg', data: jpeg },
          { name: 'photos', filename: 'empty.jpg', contentType: 'image/jpeg', data: Buffer.alloc(0) },
        ]),
      400,
    );
    expect(reasonFor(res, 'photos.1')).toMatch(/empty/);
  });
});

describe('request shape', () => {
  it('when 40 files come in one request, then it is 400 naming the photos field', async () => {
    const id = await newDraft();
    const parts = Array.from({ length: 40 }, (_, i) => ({
      name: 'photos',
      filename: `p${i}.jpg`,
      contentType: 'image/jpeg',
      data: jpeg,
    }));
    const res = await refused(() => uploadRaw(rosa, id, parts), 400);
    expect(reasonFor(res, 'photos')).toMatch(/Too many/);
  });

  it('when ten text fields come with the photo, then it is 400 with a field reason', async () => {
    const id = await newDraft();
    const parts = [
      ...Array.from({ length: 10 }, (_, i) => ({ name: `note${i}`, data: 'x' })),
      { name: 'photos', filename: 'a.jpg', contentType: 'image/jpeg', data: jpeg },
    ];
    const res = await refused(() => uploadRaw(rosa, id, parts), 400);
    reasonFor(res, /./);
  });

  it('when the captions field is 20 KB, then it is 400 on captions', async () => {
    const id = await newDraft();
    const res = await refused(
      () =>
        uploadRaw(rosa, id, [
          { name: 'captions', data: JSON.stringify(['x'.repeat(20 * 1024)]) },
          { name: 'photos', filename: 'a.jpg', contentType: 'image/jpeg', data: jpeg },
        ]),
      400,
    );
    reasonFor(res, 'captions');
  });

  it.each(['photo', 'photos[]', 'PHOTOS'])(
    'when the file comes in the field "%s", then it is 400 naming "photos"',
    async (field) => {
      const id = await newDraft();
      const res = await refused(
        () => uploadRaw(rosa, id, [{ name: field, filename: 'a.jpg', contentType: 'image/jpeg', data: jpeg }]),
        400,
      );
      expect(reasonFor(res, field)).toMatch(/"photos"/);
    },
  );

  it('when "photos" is sent as a text field instead of a file, then it is 400 asking for a photo', async () => {
    const id = await newDraft();
    const res = await refused(() => uploadRaw(rosa, id, [{ name: 'photos', data: jpeg.toString('base64') }]), 400);
    expect(reasonFor(res, 'photos')).toMatch(/at least one photo/);
  });

  it.each([
    ['JSON', 'application/json', () => JSON.stringify({ photos: [jpeg.toString('base64')] })],
    ['a form post', 'application/x-www-form-urlencoded', () => `photos=${encodeURIComponent(jpeg.toString('base64'))}`],
    ['raw JPEG bytes', 'image/jpeg', () => jpeg],
    ['plain text', 'text/plain', () => 'photos'],
  ])('when the body is %s instead of multipart, then it is 400 asking for a photo', async (_what, type, body) => {
    const id = await newDraft();
    const res = await refused(() => upload(rosa, id).set('content-type', type).send(body()), 400);
    expect(reasonFor(res, 'photos')).toMatch(/at least one photo/);
  });
});

describe('where the upload goes', () => {
  it('when the revision does not exist, or is another member’s draft sent with a large body, then it is 404 and the body is never kept', async () => {
    await refused(() => upload(rosa, 999_999).attach('photos', jpeg, 'a.jpg'), 404);
    const kais = await newDraft(kai);
    const big = Buffer.concat([jpeg, Buffer.alloc(2 * 1024 * 1024, 0x20)]);
    const res = await refused(() => upload(rosa, kais).attach('photos', big, 'a.jpg'), 404);
    expect(res.body.error.message).not.toMatch(/camber_kai/);
    expect((await request(server).get('/api/health')).status).toBe(200);
  });

  it.each<RevisionStatus>(['in_review', 'approved', 'superseded', 'declined'])(
    'when the author’s own revision is %s, then it is 409 and nothing is added',
    async (status) => {
      const specs = status === 'superseded' ? [{ status }, { status: 'approved' as const }] : [{ status }];
      const { revisionIds } = addSwap(t.db, {
        slug: `h31-locked-${status.replace('_', '-')}`,
        chassisId,
        authorId: rosa.id,
        revisions: specs,
      });
      const res = await refused(() => upload(rosa, revisionIds[0]).attach('photos', jpeg, 'a.jpg'), 409);
      expect(res.body.error.code).toBe('conflict');
    },
  );
});

describe('hostile names and headers, on a real photo', () => {
  it('when the file name is 1,000 characters, then the photo is stored under a random id and the name is nowhere', async () => {
    const name = `${'caliper-bracket-'.repeat(62)}abcdefgh.jpg`;
    expect(name.length).toBe(1004);
    const id = await newDraft();
    const { res } = await acceptedOne(() =>
      uploadRaw(rosa, id, [{ name: 'photos', filename: name, contentType: 'image/jpeg', data: jpeg }]),
    );
    expect(JSON.stringify(res.body)).not.toContain('caliper-bracket-caliper');
    expect(JSON.stringify(photoRows())).not.toContain('caliper-bracket-caliper');
  });

  it.each([
    ['../../etc/passwd.jpg', 'passwd'],
    ['..\\\\..\\\\windows-x.png', 'windows-x'],
    ['/absolute/placed-name.jpg', 'placed-name'],
  ])('when the file name is %j, then it is stored under a random id inside the upload folder only', async (filename, marker) => {
    const id = await newDraft();
    const { res } = await acceptedOne(() =>
      uploadRaw(rosa, id, [{ name: 'photos', filename, contentType: 'image/jpeg', data: jpeg }]),
    );
    expect(everything(t.dir).some((f) => f.includes(marker))).toBe(false);
    expect(everything(privateTmp).some((f) => f.includes(marker))).toBe(false);
    expect(JSON.stringify(res.body)).not.toContain(marker);
    expect(JSON.stringify(photoRows())).not.toContain(marker);
  });

  it('when the file name holds a NUL byte, then the part header is malformed and the upload is 400 on photos, not a 500', async () => {
    const id = await newDraft();
    const res = await refused(
      () => uploadRaw(rosa, id, [{ name: 'photos', filename: 'nul\u0000byte.jpg', contentType: 'image/jpeg', data: jpeg }]),
      400,
    );
    expect(res.body.error.code).toBe('upload_rejected');
    expect(reasonFor(res, 'photos')).toMatch(/could not be read/);
    expect(JSON.stringify(photoRows())).not.toContain('byte.jpg');
  });

  it('when a real JPEG is sent with the part header text/html, then it is judged by its bytes, kept, and served as image/webp with nosniff', async () => {
    const id = await newDraft();
    const { photo } = await acceptedOne(() =>
      uploadRaw(rosa, id, [{ name: 'photos', filename: 'page.html', contentType: 'text/html', data: jpeg }]),
    );
    for (const url of [photo.url, `${photo.url}?size=thumb`]) {
      const served = await rosa.agent.get(url);
      expect(served.status).toBe(200);
      expect(served.headers['content-type']).toBe('image/webp');
      expect(served.headers['x-content-type-options']).toBe('nosniff');
      expect(served.headers['content-disposition']).toBe('inline');
      expect(served.headers['cache-control']).toBe('private, no-store');
      expect(served.headers['content-security-policy']).toMatch(/default-src 'self'/);
    }
  });
});

describe('upload rate limit', () => {
  it('when a member passes the upload limit, then the next upload is 429 in the error shape, and another member is not affected', async () => {
    const limited = await makeTestApp({ UPLOAD_RATE_LIMIT: '2' });
    const l = listen(limited.app);
    try {
      const c = addChassis(limited.db).id;
      const signedIn = async (login: string) => {
        addUser(limited.db, login);
        const a = l.agent();
        await signIn(a, login);
        const token = await csrfToken(a);
        const draft = await a
          .post('/api/submissions')
          .set('x-csrf-token', token)
          .send({ chassisId: c, axle: 'front', category: 'brakes', data: swapRecord() });
        return {
          send: () =>
            a.post(`/api/submissions/${draft.body.id}/photos`).set('x-csrf-token', token).attach('photos', jpeg, 'a.jpg'),
        };
      };
      const r = await signedIn('rivet_rosa');
      expect((await r.send()).status).toBe(201);
      expect((await r.send()).status).toBe(201);
      const third = await r.send();
      expect(third.status).toBe(429);
      expect(third.body.error).toMatchObject({ code: 'rate_limited' });
      expect(third.body.error.message).toMatch(/Too many photo uploads/);
      expect(third.headers['ratelimit-policy']).toBeDefined();
      expect(limited.db.select().from(revisionPhotos).all()).toHaveLength(2);
      const k = await signedIn('camber_kai');
      expect((await k.send()).status).toBe(201);
    } finally {
      l.server.close();
      limited.close();
    }
  });
});

describe('processing budget', () => {
  it('when an ~8 MB JPEG of noise is processed, then it finishes and the time is printed (budget 1.5 s)', async () => {
    const big = await noiseJpeg();
    expect(big.length).toBeGreaterThan(7.5 * 1024 * 1024);
    expect(big.length).toBeLessThanOrEqual(MAX_PHOTO_BYTES);
    await processPhoto(jpeg); // warm-up: the first call loads the codecs
    const times: number[] = [];
    let out: Awaited<ReturnType<typeof processPhoto>> | undefined;
    for (let i = 0; i < 3; i++) {
      const started = performance.now();
      out = await processPhoto(big);
      times.push(performance.now() - started);
    }
    expect(Math.max(out!.width, out!.height)).toBe(2048);
    const sorted = [...times].sort((a, b) => a - b);
    console.log(
      `processPhoto on a ${(big.length / 1024 / 1024).toFixed(2)} MiB 3500×2625 noise JPEG: ` +
        `${times.map((x) => `${Math.round(x)} ms`).join(', ')} (median ${Math.round(sorted[1])} ms; budget 1500 ms)`,
    );
    // a loose bound on a shared machine; the figure itself is what the budget is judged on
    expect(sorted[1]).toBeLessThan(10_000);
  }, 60_000);
});
