import type { Server } from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { type Agent, type Member, addUser, csrfToken, listen, signIn, signedInMember, createDraft } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';
import { revisionPhotos } from '../../server/db/schema/index';

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;

let rosa: Member;
let kai: Member;
let mo: Member;

const member = (login: string, role: 'member' | 'moderator' = 'member') => signedInMember(t.db, agent, login, role);

let drafts = 0;
// a member's open drafts each have a title of their own
const newDraft = (m: Member = rosa) =>
  createDraft(m, chassisId, swapRecord({ title: `Vela calipers on the H31, draft ${++drafts}` }));

const upload = (m: Member, id: number) => m.agent.post(`/api/submissions/${id}/photos`).set('x-csrf-token', m.token);

/** Every entry under the upload folder, temporary files included. */
const filesInUploadDir = () => (fs.existsSync(t.config.uploadDir) ? fs.readdirSync(t.config.uploadDir).sort() : []);
const photoRows = () => t.db.select().from(revisionPhotos).all();

/** Runs a refused upload and checks that it left no new row and no new file behind. */
type ErrorAnswer = { status: number; body: { error: { code: string; message: string; fields?: Record<string, string> } } };
async function expectNothingStored(
  run: () => Promise<{ status: number; body: unknown }>,
  status: number | ((s: number) => boolean),
): Promise<ErrorAnswer> {
  const rows = photoRows().length;
  const files = filesInUploadDir();
  const res = (await run()) as ErrorAnswer;
  if (typeof status === 'number') expect(res.status).toBe(status);
  else expect(status(res.status)).toBe(true);
  expect(res.body.error.message).toBeTruthy();
  expect(photoRows().length).toBe(rows);
  expect(filesInUploadDir()).toEqual(files);
  return res;
}

let jpeg: Buffer;

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await member('rivet_rosa');
  kai = await member('camber_kai');
  mo = await member('gauge_mo', 'moderator');
  jpeg = await sharp({ create: { width: 640, height: 480, channels: 3, background: { r: 184, g: 137, b: 47 } } })
    .jpeg()
    .toBuffer();
});
afterAll(() => {
  server.close();
  t.close();
});

describe('POST /api/submissions/:id/photos — accepted', () => {
  it('when the author uploads a JPEG, then it is re-encoded to WebP under a random id with a thumbnail, and only they can fetch it while it is a draft', async () => {
    const id = await newDraft();
    const res = await upload(rosa, id)
      .attach('photos', jpeg, 'caliper.jpg')
      .field('captions', JSON.stringify(['Bracket fitted, <b>wheel off</b>']));
    expect(res.status).toBe(201);
    expect(res.body.photos).toHaveLength(1);
    const p = res.body.photos[0];
    expect(p).toMatchObject({
      caption: 'Bracket fitted, wheel off',
      width: 640,
      height: 480,
      url: `/media/${p.id}`,
      thumbUrl: `/media/${p.id}?size=thumb`,
    });
    expect(p.id).toMatch(/^[a-z0-9]{20,}$/);
    expect(filesInUploadDir()).toEqual(expect.arrayContaining([p.id, `${p.id}_t`]));
    const stored = await sharp(fs.readFileSync(path.join(t.config.uploadDir, p.id))).metadata();
    expect(stored.format).toBe('webp');
    const thumb = await sharp(fs.readFileSync(path.join(t.config.uploadDir, `${p.id}_t`))).metadata();
    expect(Math.max(thumb.width!, thumb.height!)).toBe(480);

    const own = await rosa.agent.get(p.url);
    expect(own.status).toBe(200);
    expect(own.headers['content-type']).toBe('image/webp');
    expect(own.headers['x-content-type-options']).toBe('nosniff');
    expect((await mo.agent.get(p.url)).status).toBe(404);
    expect((await kai.agent.get(p.url)).status).toBe(404);
    expect((await request(server).get(p.url)).status).toBe(404);
  });

  it('when the file name tries to climb out with ../, then the name is never used and the file sits under a random id', async () => {
    const id = await newDraft();
    const before = filesInUploadDir();
    const res = await upload(rosa, id).attach('photos', jpeg, '../../../../evil-name.jpg');
    expect(res.status).toBe(201);
    const added = filesInUploadDir().filter((f) => !before.includes(f));
    expect(added).toHaveLength(2);
    for (const f of added) expect(f).toMatch(/^[a-z0-9]+(_t)?$/);
    const everything = (dir: string): string[] =>
      fs
        .readdirSync(dir, { withFileTypes: true })
        .flatMap((e) => (e.isDirectory() ? everything(path.join(dir, e.name)) : [e.name]));
    expect(everything(t.dir).some((f) => f.includes('evil'))).toBe(false);
    expect(JSON.stringify(photoRows())).not.toContain('evil');
    expect(JSON.stringify(res.body)).not.toContain('evil');
  });

  it('when a JPEG carries GPS and camera data in its EXIF, then the stored copy has no metadata at all', async () => {
    const withGps = await sharp({ create: { width: 320, height: 240, channels: 3, background: { r: 29, g: 77, b: 58 } } })
      .jpeg()
      .withExif({
        IFD0: { Make: 'Halden test rig', Copyright: 'rivet_rosa' },
        IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' },
      })
      .toBuffer();
    const input = await sharp(withGps).metadata();
    // the input really has EXIF with a GPS IFD (pointer tag 0x8825, little-endian)
    expect(input.exif).toBeDefined();
    expect(input.exif!.includes(Buffer.from([0x25, 0x88]))).toBe(true);
    expect(input.exif!.includes(Buffer.from('Halden test rig'))).toBe(true);

    const id = await newDraft();
    const res = await upload(rosa, id).attach('photos', withGps, 'gps.jpg');
    expect(res.status).toBe(201);
    const file = fs.readFileSync(path.join(t.config.uploadDir, res.body.photos[0].id));
    const stored = await sharp(file).metadata();
    expect(stored.exif).toBeUndefined();
    expect(stored.xmp).toBeUndefined();
    expect(stored.icc).toBeUndefined();
    expect(file.includes(Buffer.from('Halden test rig'))).toBe(false);
    expect(file.includes(Buffer.from('rivet_rosa'))).toBe(false);
    const served = await rosa.agent.get(res.body.photos[0].url);
    expect((await sharp(served.body as Buffer).metadata()).exif).toBeUndefined();
  });

  it('when captions and order change, then PATCH stores them; deleting a photo removes its files', async () => {
    const id = await newDraft();
    const res = await upload(rosa, id)
      .attach('photos', jpeg, 'a.jpg')
      .attach('photos', jpeg, 'b.jpg')
      .field('captions', JSON.stringify(['first', 'second']));
    expect(res.status).toBe(201);
    const [a, b] = res.body.photos as { id: string }[];
    const order = await rosa.agent
      .patch(`/api/submissions/${id}/photos`)
      .set('x-csrf-token', rosa.token)
      .send({
        photos: [
          { id: b.id, caption: 'Now first <script>x</script>' },
          { id: a.id, caption: 'Now second' },
        ],
      });
    expect(order.status).toBe(200);
    expect(order.body.photos.map((p: { id: string; caption: string }) => [p.id, p.caption])).toEqual([
      [b.id, 'Now first '],
      [a.id, 'Now second'],
    ]);
    const partial = await rosa.agent
      .patch(`/api/submissions/${id}/photos`)
      .set('x-csrf-token', rosa.token)
      .send({ photos: [{ id: 'notaphotoofthisrevision', caption: '' }] });
    expect(partial.status).toBe(400);
    expect(partial.body.error.fields['photos.0.id']).toBeDefined();

    const del = await rosa.agent.delete(`/api/submissions/${id}/photos/${a.id}`).set('x-csrf-token', rosa.token);
    expect(del.status).toBe(200);
    expect(del.body.photos.map((p: { id: string }) => p.id)).toEqual([b.id]);
    expect(filesInUploadDir()).not.toContain(a.id);
    expect(filesInUploadDir()).not.toContain(`${a.id}_t`);
  });
});

describe('POST /api/submissions/:id/photos — refused, and nothing changes', () => {
  it('when a text file is named .jpg, then it is 415', async () => {
    const id = await newDraft();
    const res = await expectNothingStored(
      () =>
        upload(rosa, id).attach('photos', Buffer.from('just some notes about the bracket\n'.repeat(20)), {
          filename: 'photo.jpg',
          contentType: 'image/jpeg',
        }),
      415,
    );
    expect(res.body.error.code).toBe('unsupported_type');
  });

  it('when a file starts like a JPEG (FF D8 FF) and is not one, then it is refused', async () => {
    const id = await newDraft();
    const fake = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.from('JFIF\0'), Buffer.alloc(4000, 0x41)]);
    const res = await expectNothingStored(
      () => upload(rosa, id).attach('photos', fake, 'fake.jpg'),
      (s) => s >= 400 && s < 500,
    );
    expect(res.status).toBe(422);
  });

  it('when a photo is 9 MB, then it is 413', async () => {
    const id = await newDraft();
    const big = Buffer.concat([jpeg, Buffer.alloc(9 * 1024 * 1024 - jpeg.length, 0)]);
    const res = await expectNothingStored(() => upload(rosa, id).attach('photos', big, 'big.jpg'), 413);
    expect(res.body.error.message).toMatch(/8 MB/);
  });

  it('when one file of a batch is bad, then none of the batch is kept', async () => {
    const id = await newDraft();
    await expectNothingStored(
      () => upload(rosa, id).attach('photos', jpeg, 'good.jpg').attach('photos', Buffer.from('not an image'), 'bad.png'),
      415,
    );
  });

  it('when the revision already has 12 photos, then the 13th is refused with a clear message', async () => {
    const id = await newDraft();
    let req = upload(rosa, id);
    for (let i = 0; i < 12; i++) req = req.attach('photos', jpeg, `p${i}.jpg`);
    const twelve = await req;
    expect(twelve.status).toBe(201);
    expect(twelve.body.photos).toHaveLength(12);
    const res = await expectNothingStored(() => upload(rosa, id).attach('photos', jpeg, 'thirteenth.jpg'), 400);
    expect(res.body.error.code).toBe('too_many_photos');
    expect(res.body.error.message).toMatch(/at most 12 photos/);
  });

  it('when 13 files come in one request, then multer stops it', async () => {
    const id = await newDraft();
    await expectNothingStored(() => {
      let req = upload(rosa, id);
      for (let i = 0; i < 13; i++) req = req.attach('photos', jpeg, `p${i}.jpg`);
      return req;
    }, 400);
  });

  it('when the captions field is not a JSON array, then it is a 400 on captions', async () => {
    const id = await newDraft();
    const res = await expectNothingStored(
      () => upload(rosa, id).attach('photos', jpeg, 'a.jpg').field('captions', 'not json'),
      400,
    );
    expect(res.body.error.fields?.captions).toBeDefined();
  });

  it('when the file comes in another field, then it is a 400 naming the right field', async () => {
    const id = await newDraft();
    const res = await expectNothingStored(() => upload(rosa, id).attach('file', jpeg, 'a.jpg'), 400);
    expect(res.body.error.message).toMatch(/"photos"/);
  });

  it('when someone else uploads, or the revision is in review, then it is refused', async () => {
    const id = await newDraft();
    await expectNothingStored(() => upload(kai, id).attach('photos', jpeg, 'a.jpg'), 404);
    await expectNothingStored(() => upload(mo, id).attach('photos', jpeg, 'a.jpg'), 404);
    await expectNothingStored(() => request(server).post(`/api/submissions/${id}/photos`).attach('photos', jpeg, 'a.jpg'), 401);
    expect((await rosa.agent.post(`/api/submissions/${id}/submit`).set('x-csrf-token', rosa.token)).status).toBe(200);
    const res = await expectNothingStored(() => upload(rosa, id).attach('photos', jpeg, 'a.jpg'), 409);
    expect(res.body.error.message).toMatch(/at the review desk/);
  });
});

describe('upload rate limit', () => {
  it('when a member sends more uploads in an hour than allowed, then the next is 429', async () => {
    const limited = await makeTestApp({ UPLOAD_RATE_LIMIT: '1' });
    const l = listen(limited.app);
    try {
      const c = addChassis(limited.db).id;
      addUser(limited.db, 'rivet_rosa');
      const a = l.agent();
      await signIn(a, 'rivet_rosa');
      const token = await csrfToken(a);
      const draft = await a
        .post('/api/submissions')
        .set('x-csrf-token', token)
        .send({ chassisId: c, axle: 'front', category: 'brakes', data: swapRecord() });
      expect(
        (await a.post(`/api/submissions/${draft.body.id}/photos`).set('x-csrf-token', token).attach('photos', jpeg, 'a.jpg'))
          .status,
      ).toBe(201);
      const second = await a
        .post(`/api/submissions/${draft.body.id}/photos`)
        .set('x-csrf-token', token)
        .attach('photos', jpeg, 'b.jpg');
      expect(second.status).toBe(429);
      expect(limited.db.select().from(revisionPhotos).where(eq(revisionPhotos.revisionId, draft.body.id)).all()).toHaveLength(1);
    } finally {
      l.server.close();
      limited.close();
    }
  });
});
