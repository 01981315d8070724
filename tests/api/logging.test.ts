import type { Server } from 'node:http';
import { Writable } from 'node:stream';
import { createRequire } from 'node:module';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser, csrfToken, listen, sessionCookieOf, signIn, type Agent } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';

// The app's real logger (createLogger) writing into memory: what it records of sign-ins, refusals and
// review decisions, what it must never record (cookies, CSRF tokens, OAuth codes and access tokens),
// and whether user input can pass itself off as a log line.

// The OAuth library the sign-in strategy uses, loaded through the strategy's own resolution so it is the
// same module instance. Its token exchange is wrapped only to see the access tokens go by; it still runs.
type TokenCallback = (err: unknown, accessToken?: string, refreshToken?: string, results?: unknown) => void;
type OAuth2Proto = { getOAuthAccessToken: (this: unknown, code: string, params: object, cb: TokenCallback) => void };
const strategyRequire = createRequire(createRequire(import.meta.url).resolve('passport-oauth2'));
const OAuth2 = (strategyRequire('oauth') as { OAuth2: { prototype: OAuth2Proto } }).OAuth2;
const seenAccessTokens: string[] = [];
const seenCodes: string[] = [];
const originalExchange = OAuth2.prototype.getOAuthAccessToken;

let raw = '';
const sink = new Writable({
  write(chunk, _encoding, done) {
    raw += String(chunk);
    done();
  },
});
type Line = Record<string, unknown> & { level: number; time: string; msg: string };
const lines = (): Line[] =>
  raw
    .split('\n')
    .filter((l) => l.length > 0)
    .map((l) => JSON.parse(l) as Line);
const events = (name: string) => lines().filter((l) => l.event === name);

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;

type Member = { agent: Agent; token: string; id: number; login: string; cookies: string[] };
let rosa: Member;
let mo: Member;
/** every sign-in the tests really did: who, and when */
const realSignIns: { userId: number; login: string }[] = [];
const secrets = new Set<string>();

async function member(login: string, role: 'member' | 'moderator' = 'member'): Promise<Member> {
  const id = addUser(t.db, login, role).id;
  const a = agent();
  const { start, callback, pick } = await signIn(a, login);
  realSignIns.push({ userId: id, login });
  const code = new URL(pick.headers.location).searchParams.get('code');
  expect(code).toBeTruthy();
  secrets.add(code!);
  const cookies = [sessionCookieOf(start), sessionCookieOf(callback)].filter((c): c is string => Boolean(c));
  for (const c of cookies) {
    const value = c.split(';')[0].split('=').slice(1).join('=');
    secrets.add(value);
    // the cookie is `s:<session id>.<signature>`, URL-encoded: the id alone must not show either
    const sid = decodeURIComponent(value).replace(/^s:/, '').split('.')[0];
    secrets.add(sid);
  }
  const token = await csrfToken(a);
  secrets.add(token);
  return { agent: a, token, id, login, cookies };
}

const isoUtc = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/;
let startedAt: number;

beforeAll(async () => {
  OAuth2.prototype.getOAuthAccessToken = function (this: unknown, code: string, params: object, cb: TokenCallback) {
    seenCodes.push(code);
    return originalExchange.call(this, code, params, (err, accessToken, refreshToken, results) => {
      if (accessToken) seenAccessTokens.push(accessToken);
      cb(err, accessToken, refreshToken, results);
    });
  };
  startedAt = Date.now();
  t = await makeTestApp({}, undefined, { logDestination: sink });
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await member('rivet_rosa');
  mo = await member('gauge_mo', 'moderator');
});
afterAll(() => {
  OAuth2.prototype.getOAuthAccessToken = originalExchange;
  server?.close();
  t?.close();
});

describe('what is logged', () => {
  it('when members sign in, then each sign-in is one JSON line with the user id, login and an ISO UTC time', () => {
    const signIns = events('sign_in');
    expect(signIns.map((l) => ({ userId: l.userId, login: l.login }))).toEqual(realSignIns);
    for (const l of signIns) {
      expect(l.level).toBe(30);
      expect(l.time).toMatch(isoUtc);
      const at = Date.parse(l.time);
      expect(at).toBeGreaterThanOrEqual(startedAt - 1000);
      expect(at).toBeLessThanOrEqual(Date.now() + 1000);
      expect(l.msg).toBe('signed in');
    }
  });

  it('when a request is refused for lack of a sign-in or a role, then the refusal is logged with who, the route and what was needed', async () => {
    const before = events('authorization_denied').length;
    expect((await request(server).get('/api/me/submissions')).status).toBe(401);
    expect((await rosa.agent.get('/api/review/queue')).status).toBe(403);
    expect((await rosa.agent.post('/api/review/1/approve').set('x-csrf-token', rosa.token).send({})).status).toBe(403);
    const denied = events('authorization_denied').slice(before);
    expect(denied.map((l) => [l.userId, l.method, l.path, l.need])).toEqual([
      [null, 'GET', '/api/me/submissions', 'signed-in'],
      [rosa.id, 'GET', '/api/review/queue', 'review'],
      [rosa.id, 'POST', '/api/review/1/approve', 'review'],
    ]);
    for (const l of denied) {
      expect(l.level).toBe(40);
      expect(l.time).toMatch(isoUtc);
    }
  });

  it('when a moderator sends back and then approves a revision, then each decision is logged with who, what and which revision', async () => {
    const created = await rosa.agent
      .post('/api/submissions')
      .set('x-csrf-token', rosa.token)
      .send({ chassisId, axle: 'front', category: 'brakes', data: swapRecord({ title: 'A record whose decisions are logged' }) });
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    const submit = () => rosa.agent.post(`/api/submissions/${id}/submit`).set('x-csrf-token', rosa.token);
    expect((await submit()).status).toBe(200);
    const sendBack = await mo.agent
      .post(`/api/review/${id}/send-back`)
      .set('x-csrf-token', mo.token)
      .send({ note: 'Add the torque for the bracket bolts, please' });
    expect(sendBack.status).toBe(200);
    expect((await submit()).status).toBe(200);
    expect((await mo.agent.post(`/api/review/${id}/approve`).set('x-csrf-token', mo.token).send({})).status).toBe(200);
    const decisions = events('review_decision').filter((l) => l.revisionId === id);
    expect(decisions.map((l) => [l.action, l.actorId])).toEqual([
      ['sent_back', mo.id],
      ['approved', mo.id],
    ]);
    for (const l of decisions) expect(l.time).toMatch(isoUtc);
    // the member-facing note is the member's business, not the log's
    expect(raw).not.toContain('torque for the bracket bolts');
  });
});

describe('what is never logged', () => {
  it('when requests carry the session cookie and CSRF token and sign-ins pass OAuth codes and tokens, then none of those values is anywhere in the log', async () => {
    // one more request that carries both the cookie and the token in its headers
    expect((await rosa.agent.patch('/api/me').set('x-csrf-token', rosa.token).send({ units: 'metric' })).status).toBe(200);
    expect(seenAccessTokens.length).toBe(realSignIns.length);
    expect(seenCodes.length).toBe(realSignIns.length);
    for (const v of [...seenAccessTokens, ...seenCodes]) secrets.add(v);
    expect(secrets.size).toBeGreaterThanOrEqual(realSignIns.length * 4);
    // the log did see those requests (so the absence below means something)
    expect(lines().some((l) => (l.req as { url?: string } | undefined)?.url?.startsWith('/auth/github/callback'))).toBe(true);
    expect(lines().some((l) => (l.req as { url?: string } | undefined)?.url?.startsWith('/auth/fake/authorize'))).toBe(true);
    expect(
      lines().some(
        (l) => (l.req as { url?: string } | undefined)?.url === '/api/me' && (l.req as { method?: string }).method === 'PATCH',
      ),
    ).toBe(true);
    for (const secret of secrets) {
      expect(secret.length).toBeGreaterThanOrEqual(16);
      expect(raw.includes(secret), `a secret of ${secret.length} characters is in the log`).toBe(false);
    }
  });
});

describe('forged lines', () => {
  const forged = 'x\n{"level":30,"time":"2026-01-01T00:00:00.000Z","event":"sign_in","userId":999999,"login":"forged_admin"}\n';

  it('when user input carries newlines and fake JSON, then every captured line is one JSON object and no forged sign-in appears', async () => {
    const enc = encodeURIComponent(forged);
    // the provider's error description comes straight from the query string and is logged as the failure's detail
    expect((await request(server).get(`/auth/github/callback?error=server_error&error_description=${enc}`)).status).toBe(302);
    expect((await request(server).get(`/auth/github/callback?error=${enc}`)).status).toBe(302);
    // a login typed on the local sign-in page, a return address, a path and a search
    expect((await request(server).get(`/auth/github?returnTo=${enc}`)).status).toBe(302);
    expect((await request(server).get(`/api/swaps/${enc}`)).status).toBe(400);
    expect((await request(server).get(`/api/nothing-here/${enc}`)).status).toBe(404);
    // headers cannot hold a newline, but they can hold the JSON
    expect((await request(server).get('/api/health').set('user-agent', forged.replace(/\n/g, ' '))).status).toBe(200);
    // text fields: a flag reason and a profile name
    const { slug } = addSwap(t.db, { slug: 'h31-logged-flag', chassisId, authorId: mo.id, revisions: [{ status: 'approved' }] });
    expect(
      (await rosa.agent.post(`/api/swaps/${slug}/flags`).set('x-csrf-token', rosa.token).send({ kind: 'other', reason: forged })).status,
    ).toBe(201);
    expect((await rosa.agent.patch('/api/me').set('x-csrf-token', rosa.token).send({ name: forged })).status).toBe(400);
    // the sign-in page's own login box
    const start = await agent().get('/auth/github');
    const authorize = new URL(start.headers.location, 'http://placeholder');
    authorize.searchParams.set('login', forged);
    expect((await request(server).get(authorize.pathname + authorize.search)).status).toBe(400);

    // the attempts did reach the log (escaped inside a field), so the checks below are not vacuous
    expect(events('sign_in_failed').some((l) => String(l.detail).includes('forged_admin'))).toBe(true);
    expect(raw).toContain('forged_admin');

    const all = raw.split('\n').filter((l) => l.length > 0);
    expect(raw.endsWith('\n')).toBe(true);
    for (const l of all) {
      const parsed = JSON.parse(l) as unknown;
      expect(typeof parsed === 'object' && parsed !== null && !Array.isArray(parsed)).toBe(true);
      expect(typeof (parsed as Line).time).toBe('string');
      expect((parsed as Line).time).toMatch(isoUtc);
    }
    expect(events('sign_in').map((l) => ({ userId: l.userId, login: l.login }))).toEqual(realSignIns);
    expect(lines().some((l) => l.login === 'forged_admin' || l.userId === 999999)).toBe(false);
    expect(lines().some((l) => l.time === '2026-01-01T00:00:00.000Z')).toBe(false);
  });
});
