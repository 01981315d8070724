import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { makeTestApp, type TestApp } from './support/test-app';
import { type Agent, type Member, createDraft, listen, signedInMember } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';

// A draft that was never sent to review belongs to its author alone: the review desk sees a revision
// only once it has been submitted, and the same holds for the draft's photos.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;
let rosa: Member;
let mo: Member;
let ada: Member;
let jpeg: Buffer;

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await signedInMember(t.db, agent, 'rivet_rosa');
  mo = await signedInMember(t.db, agent, 'gauge_mo', 'moderator');
  ada = await signedInMember(t.db, agent, 'ada_admin', 'admin');
  jpeg = await sharp({ create: { width: 320, height: 240, channels: 3, background: { r: 29, g: 77, b: 58 } } })
    .jpeg()
    .toBuffer();
});
afterAll(() => {
  server.close();
  t.close();
});

let drafts = 0;
/** a record with a title of its own: a member's open drafts never share one */
const numbered = () => swapRecord({ title: `Vela calipers on the H31, draft ${++drafts}` });

async function draftWithPhoto() {
  const id = await createDraft(rosa, chassisId, numbered());
  const up = await rosa.agent
    .post(`/api/submissions/${id}/photos`)
    .set('x-csrf-token', rosa.token)
    .attach('photos', jpeg, 'caliper.jpg');
  expect(up.status).toBe(201);
  return { id, photoUrl: up.body.photos[0].url as string };
}

describe('drafts are private to their author', () => {
  it('when a moderator or admin opens a never-submitted draft or its photo, then both answer 404 like a missing one', async () => {
    const { id, photoUrl } = await draftWithPhoto();
    expect((await rosa.agent.get(`/api/submissions/${id}`)).status).toBe(200);
    expect((await rosa.agent.get(photoUrl)).status).toBe(200);
    for (const reviewer of [mo, ada]) {
      const sub = await reviewer.agent.get(`/api/submissions/${id}`);
      expect(sub.status).toBe(404);
      expect(sub.body.error.code).toBe('not_found');
      expect((await reviewer.agent.get(photoUrl)).status).toBe(404);
      expect((await reviewer.agent.get(`${photoUrl}?size=thumb`)).status).toBe(404);
      expect((await reviewer.agent.get(`/api/review/${id}`)).status).toBe(404);
    }
  });

  it('when the author sends the draft to review, then the desk may open it and its photo', async () => {
    const { id, photoUrl } = await draftWithPhoto();
    const sent = await rosa.agent.post(`/api/submissions/${id}/submit`).set('x-csrf-token', rosa.token);
    expect(sent.status).toBe(200);
    expect((await mo.agent.get(`/api/submissions/${id}`)).status).toBe(200);
    const photo = await mo.agent.get(photoUrl);
    expect(photo.status).toBe(200);
    expect(photo.headers['cache-control']).toBe('private, no-store');
  });
});
