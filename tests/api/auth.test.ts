import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser, csrfToken, listen, sessionCookieOf, signIn } from './support/auth-helpers';
import { sessions, users } from '../../server/db/schema/users';
import { safeReturnTo } from '../../server/auth/auth.router';

let t: TestApp;
let server: Server;
let agent: () => ReturnType<typeof request.agent>;

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  addUser(t.db, 'gauge_mo', 'moderator');
  addUser(t.db, 'rivet_rosa', 'member');
  addUser(t.db, 'camber_kai', 'member');
});
afterAll(() => {
  server.close();
  t.close();
});

describe('signing in through the real strategy and the fake provider', () => {
  it('when a moderator signs in by login, then the callback returns to the page they came from and /api/me shows them with their role', async () => {
    const a = agent();
    const { start, authorize, callback } = await signIn(a, 'gauge_mo', '/swaps/h31-front-vela-caliper?tab=parts');
    expect(authorize.searchParams.get('state')).toMatch(/^\S{16,}$/);
    expect(authorize.searchParams.get('client_id')).toBe(t.config.auth.clientId);
    expect(callback.status).toBe(302);
    expect(callback.headers.location).toBe('/swaps/h31-front-vela-caliper?tab=parts');

    // the session id changes at sign-in
    const before = sessionCookieOf(start);
    const after = sessionCookieOf(callback);
    expect(before).toBeTruthy();
    expect(after).toBeTruthy();
    expect(after!.split(';')[0]).not.toBe(before!.split(';')[0]);

    const me = await a.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ login: 'gauge_mo', role: 'moderator', shop: null, units: 'metric' });
    expect(typeof me.body.csrfToken).toBe('string');
    const row = t.db.select().from(users).where(eq(users.login, 'gauge_mo')).get()!;
    expect(row.lastSignInAt).toBeInstanceOf(Date);
  });

  it('when the session cookie is set, then it is httpOnly, SameSite=Lax and named swapyard.sid on plain http', async () => {
    const { callback } = await signIn(agent(), 'rivet_rosa');
    const cookie = sessionCookieOf(callback)!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
    expect(cookie).toMatch(/Expires=/i);
  });

  it('when someone new signs in, then a member row is created from the provider profile', async () => {
    const a = agent();
    const { callback } = await signIn(a, 'lugnut_lee');
    expect(callback.headers.location).toBe('/');
    const me = await a.get('/api/me');
    expect(me.body.user).toMatchObject({ login: 'lugnut_lee', role: 'member', name: 'lugnut_lee' });
    const row = t.db.select().from(users).where(eq(users.login, 'lugnut_lee')).get()!;
    expect(row).toMatchObject({
      provider: 'github',
      providerId: 'demo-lugnut_lee',
      email: 'lugnut_lee@members.swapyard.invalid',
      role: 'member',
    });

    // a second sign-in updates the same row instead of adding one
    await signIn(agent(), 'lugnut_lee');
    expect(t.db.select().from(users).where(eq(users.providerId, 'demo-lugnut_lee')).all()).toHaveLength(1);
  });

  it('when the callback carries a state that is not the session’s, then sign-in fails with reason=state and nobody is signed in', async () => {
    const a = agent();
    const start = await a.get('/auth/github');
    const authorize = new URL(start.headers.location, 'http://x');
    authorize.searchParams.set('login', 'rivet_rosa');
    const pick = await a.get(authorize.pathname + authorize.search);
    const back = new URL(pick.headers.location);
    back.searchParams.set('state', 'not-the-state-we-sent');
    const callback = await a.get(back.pathname + back.search);
    expect(callback.status).toBe(302);
    expect(callback.headers.location).toBe('/signin-failed?reason=state');
    expect((await a.get('/api/me')).body.user).toBeNull();
  });

  it('when the callback carries an unknown code, then the provider refuses it and sign-in fails with reason=provider', async () => {
    const a = agent();
    const start = await a.get('/auth/github');
    const state = new URL(start.headers.location, 'http://x').searchParams.get('state')!;
    const callback = await a.get(`/auth/github/callback?code=0123456789abcdef0123&state=${encodeURIComponent(state)}`);
    expect(callback.headers.location).toBe('/signin-failed?reason=provider');
    expect((await a.get('/api/me')).body.user).toBeNull();
  });

  it('when a code is used a second time, then it is refused (codes are single use)', async () => {
    const a = agent();
    const first = await signIn(a, 'camber_kai');
    expect(first.callback.headers.location).toBe('/');
    const b = agent();
    const start = await b.get('/auth/github');
    const state = new URL(start.headers.location, 'http://x').searchParams.get('state')!;
    const replay = await b.get(
      `/auth/github/callback?code=${first.back.searchParams.get('code')}&state=${encodeURIComponent(state)}`,
    );
    expect(replay.headers.location).toBe('/signin-failed?reason=provider');
    expect((await b.get('/api/me')).body.user).toBeNull();
  });

  it('when the person cancels on the authorize page, then sign-in fails with reason=denied', async () => {
    const a = agent();
    const start = await a.get('/auth/github');
    const page = await a.get(start.headers.location);
    const cancel = /href="([^"]*error=access_denied[^"]*)"/.exec(page.text)![1].replace(/&amp;/g, '&');
    const back = new URL(cancel);
    const callback = await a.get(back.pathname + back.search);
    expect(callback.headers.location).toBe('/signin-failed?reason=denied');
  });

  it('when returnTo points at another site or back into /auth, then the sign-in lands on / instead', async () => {
    for (const returnTo of ['//elsewhere.invalid/x', 'https://elsewhere.invalid/', '/\\elsewhere.invalid', '/auth/logout']) {
      const { callback } = await signIn(agent(), 'rivet_rosa', returnTo);
      expect(callback.headers.location).toBe('/');
    }
    expect(safeReturnTo('/chassis/halden-h31?x=1#top')).toBe('/chassis/halden-h31?x=1#top');
    expect(safeReturnTo('/ok\r\nSet-Cookie: x=1')).toBeNull();
  });
});

describe('the fake provider itself', () => {
  it('when the authorize page is opened without a login, then it lists the demo accounts with their roles, without scripts', async () => {
    const a = agent();
    const start = await a.get('/auth/github');
    const page = await a.get(start.headers.location);
    expect(page.status).toBe(200);
    expect(page.type).toBe('text/html');
    expect(page.text).toContain('@gauge_mo');
    expect(page.text).toMatch(/gauge mo.*Moderator/s);
    expect(page.text).not.toMatch(/<script/i);
    expect(page.headers['content-security-policy']).toContain("script-src 'self'");
  });

  it('when the authorize page is asked to send the code to another address, then it refuses with 400', async () => {
    const res = await request(server).get('/auth/fake/authorize').query({
      response_type: 'code',
      client_id: t.config.auth.clientId,
      redirect_uri: 'https://elsewhere.invalid/auth/github/callback',
      state: 'abc',
      login: 'rivet_rosa',
    });
    expect(res.status).toBe(400);
    expect(res.text).toContain('another address');
  });

  it('when the token endpoint gets an unknown code or the profile endpoint a bad token, then they answer like the provider does', async () => {
    const token = await fetch('https://github.com/login/oauth/access_token', {
      method: 'POST',
      headers: { accept: 'application/json', 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ client_id: t.config.auth.clientId, client_secret: 'x', code: 'nope' }),
    });
    expect(token.status).toBe(200);
    expect(await token.json()).toMatchObject({ error: 'bad_verification_code' });
    const profile = await fetch('https://api.github.com/user', { headers: { authorization: 'Bearer not-a-token' } });
    expect(profile.status).toBe(401);
    expect(await profile.json()).toMatchObject({ message: 'Bad credentials' });
  });
});

describe('sign-out, CSRF and cross-site refusal', () => {
  it('when a signed-in member logs out with the token, then the session ends and the old cookie is worth nothing', async () => {
    const a = agent();
    const { callback } = await signIn(a, 'rivet_rosa');
    const cookie = sessionCookieOf(callback)!.split(';')[0];
    const token = await csrfToken(a);

    const noToken = await a.post('/auth/logout');
    expect(noToken.status).toBe(403);
    expect(noToken.body.error.code).toBe('csrf');

    const out = await a.post('/auth/logout').set('x-csrf-token', token);
    expect(out.status).toBe(204);
    expect((await a.get('/api/me')).body.user).toBeNull();
    const replay = await request(server).get('/api/me').set('Cookie', cookie);
    expect(replay.body.user).toBeNull();
  });

  it('when a mutation under /api has no CSRF header or a wrong one, then it is 403 csrf and nothing changes', async () => {
    const a = agent();
    await signIn(a, 'camber_kai');
    const missing = await a.patch('/api/me').send({ name: 'Kai C.' });
    expect(missing.status).toBe(403);
    expect(missing.body.error).toMatchObject({ code: 'csrf' });
    const wrong = await a.patch('/api/me').set('x-csrf-token', 'f'.repeat(64)).send({ name: 'Kai C.' });
    expect(wrong.status).toBe(403);
    expect(t.db.select().from(users).where(eq(users.login, 'camber_kai')).get()!.name).toBe('camber kai');

    const token = await csrfToken(a);
    const ok = await a.patch('/api/me').set('x-csrf-token', token).send({ name: 'Kai C.', units: 'imperial' });
    expect(ok.status).toBe(200);
    expect(ok.body.user).toMatchObject({ name: 'Kai C.', units: 'imperial' });
    expect((await a.get('/api/me')).body.user).toMatchObject({ name: 'Kai C.', units: 'imperial' });
  });

  it('when the CSRF token of an earlier session is sent after the next sign-in, then it is refused (sign-in gives a fresh token)', async () => {
    const a = agent();
    await signIn(a, 'camber_kai');
    const before = await csrfToken(a);
    await signIn(a, 'camber_kai');
    const res = await a.patch('/api/me').set('x-csrf-token', before).send({ units: 'metric' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
    expect(await csrfToken(a)).not.toBe(before);
  });

  it('when PATCH /api/me has a bad body, then it is a 400 with the field named', async () => {
    const a = agent();
    await signIn(a, 'camber_kai');
    const token = await csrfToken(a);
    const res = await a.patch('/api/me').set('x-csrf-token', token).send({ name: '   ', units: 'cubits' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('name');
    expect(res.body.error.fields).toHaveProperty('units');
  });

  it('when an unsafe request says Sec-Fetch-Site: cross-site, then it is 403 cross_site even with a valid token', async () => {
    const a = agent();
    await signIn(a, 'camber_kai');
    const token = await csrfToken(a);
    const res = await a.patch('/api/me').set('x-csrf-token', token).set('sec-fetch-site', 'cross-site').send({ units: 'metric' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('cross_site');
    const sameOrigin = await a
      .patch('/api/me')
      .set('x-csrf-token', token)
      .set('sec-fetch-site', 'same-origin')
      .send({ units: 'metric' });
    expect(sameOrigin.status).toBe(200);
  });

  it('when signed out, then PATCH /api/me is 401 whatever token it carries, and /api/me hands out no token', async () => {
    const a = agent();
    expect((await a.get('/api/me')).body).toEqual({ user: null, csrfToken: null });
    for (const token of [undefined, 'f'.repeat(64)]) {
      const call = a.patch('/api/me');
      const res = await (token ? call.set('x-csrf-token', token) : call).send({ units: 'metric' });
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe('unauthorized');
    }
  });
});

describe('no session for visitors', () => {
  it('when a visitor asks /api/me 200 times, then no session row is written and no cookie is set', async () => {
    const fresh = await makeTestApp();
    const s = fresh.app.listen(0);
    try {
      for (let i = 0; i < 200; i++) {
        const res = await request(s).get('/api/me');
        expect(res.body).toEqual({ user: null, csrfToken: null });
        expect(res.headers['set-cookie']).toBeUndefined();
      }
      const anon = request.agent(s);
      for (let i = 0; i < 20; i++) await anon.get('/api/me');
      expect((await anon.post('/api/cars').send({})).status).toBe(401);
      expect(fresh.db.select().from(sessions).all()).toEqual([]);
      // starting sign-in is what makes the first row
      await anon.get('/auth/github');
      expect(fresh.db.select().from(sessions).all()).toHaveLength(1);
    } finally {
      s.close();
      await fresh.close();
    }
  });
});

describe('sign out everywhere', () => {
  it('when a member signs out everywhere, then all of their sessions end and other members stay signed in', async () => {
    const laptop = agent();
    const phone = agent();
    const someoneElse = agent();
    await signIn(laptop, 'rivet_rosa');
    await signIn(phone, 'rivet_rosa');
    await signIn(someoneElse, 'camber_kai');
    const rosaId = t.db.select().from(users).where(eq(users.login, 'rivet_rosa')).get()!.id;
    const token = await csrfToken(phone);

    expect((await phone.post('/auth/logout/everywhere')).body.error.code).toBe('csrf');
    const out = await phone.post('/auth/logout/everywhere').set('x-csrf-token', token);
    expect(out.status).toBe(204);
    expect(out.headers['cache-control']).toBe('no-store');
    expect((await laptop.get('/api/me')).body.user).toBeNull();
    expect((await phone.get('/api/me')).body.user).toBeNull();
    expect((await someoneElse.get('/api/me')).body.user).toMatchObject({ login: 'camber_kai' });
    expect(t.db.select().from(sessions).where(eq(sessions.userId, rosaId)).all()).toEqual([]);
  });

  it('when a visitor asks to sign out everywhere, then it is 401', async () => {
    const res = await agent().post('/auth/logout/everywhere');
    expect(res.status).toBe(401);
  });
});

describe('sessions in the database', () => {
  it('when a second app starts over the same database file, then the session from the first still signs the user in', async () => {
    const a = agent();
    const { callback } = await signIn(a, 'gauge_mo');
    const cookie = sessionCookieOf(callback)!.split(';')[0];
    const second = await makeTestApp({ DATABASE_URL: t.config.databaseUrl });
    const s2 = second.app.listen(0);
    try {
      const me = await request(s2).get('/api/me').set('Cookie', cookie);
      expect(me.body.user).toMatchObject({ login: 'gauge_mo', role: 'moderator' });
    } finally {
      s2.close();
      second.close();
    }
  });

  it('when a session is unused past the idle lifetime, or older than the absolute lifetime however busy, then it ends', async () => {
    let now = Date.now();
    const day = 24 * 60 * 60 * 1000;
    const timed = await makeTestApp({}, { now: () => new Date(now) });
    const s = timed.app.listen(0);
    try {
      addUser(timed.db, 'pistonpaul');
      const idle = request.agent(s);
      await signIn(idle, 'pistonpaul');
      const busy = request.agent(s);
      await signIn(busy, 'pistonpaul');

      now += 13 * day;
      expect((await busy.get('/api/me')).body.user?.login).toBe('pistonpaul');
      now += 2 * day; // idle has been quiet for 15 days; busy for 2
      expect((await idle.get('/api/me')).body.user).toBeNull();
      expect((await busy.get('/api/me')).body.user?.login).toBe('pistonpaul');
      now += 13 * day;
      expect((await busy.get('/api/me')).body.user?.login).toBe('pistonpaul');
      now += 3 * day; // 31 days since sign-in
      expect((await busy.get('/api/me')).body.user).toBeNull();
    } finally {
      s.close();
      timed.close();
    }
  });

  it('when the expiry sweep runs, then ended sessions are deleted and live ones stay', async () => {
    let now = Date.now();
    const timed = await makeTestApp({}, { now: () => new Date(now) });
    try {
      const { SqliteSessionStore } = await import('../../server/auth/session-store');
      const store = new SqliteSessionStore(timed.db, { now: () => new Date(now) });
      const cookie = { originalMaxAge: null } as never;
      store.set('old', { cookie });
      now += 10 * 24 * 60 * 60 * 1000;
      store.set('new', { cookie });
      now += 5 * 24 * 60 * 60 * 1000;
      expect(await store.sweep()).toBe(1);
      expect(timed.db.select({ sid: sessions.sid }).from(sessions).all()).toEqual([{ sid: 'new' }]);
      store.close();
    } finally {
      timed.close();
    }
  });
});

describe('the expiry sweep in small batches', () => {
  it('when thousands of sessions have ended, then the sweep deletes them in batches and lets other work run in between', async () => {
    const now = Date.now();
    const timed = await makeTestApp({}, { now: () => new Date(now) });
    const { SqliteSessionStore } = await import('../../server/auth/session-store');
    const store = new SqliteSessionStore(timed.db, { now: () => new Date(now) });
    try {
      const day = 24 * 60 * 60 * 1000;
      const insert = timed.db.$client.prepare(
        'insert into sessions (sid, user_id, data, expires_at, created_at) values (?, null, ?, ?, ?)',
      );
      timed.db.$client.transaction(() => {
        for (let i = 0; i < 6000; i++) insert.run(`idle-${i}`, '{}', now - 1000, now - 20 * day);
        for (let i = 0; i < 1500; i++) insert.run(`old-${i}`, '{}', now + day, now - 31 * day);
        for (let i = 0; i < 3; i++) insert.run(`live-${i}`, '{}', now + day, now - day);
      })();
      let turns = 0;
      const ticker = setInterval(() => turns++, 0);
      let swept: number;
      try {
        swept = await store.sweep();
      } finally {
        clearInterval(ticker);
      }
      expect(swept).toBe(7500);
      expect(turns).toBeGreaterThan(0); // timers ran while the sweep was still going
      expect(
        timed.db
          .select({ sid: sessions.sid })
          .from(sessions)
          .all()
          .map((r) => r.sid)
          .sort(),
      ).toEqual(['live-0', 'live-1', 'live-2']);
    } finally {
      store.close();
      await timed.close();
    }
  });
});

describe('behind https', () => {
  it('when APP_URL is https, then the cookie is __Host- prefixed and Secure', async () => {
    const secure = await makeTestApp({ APP_URL: 'https://swapyard.example' });
    const s = secure.app.listen(0);
    try {
      const res = await request(s).get('/auth/github').set('x-forwarded-proto', 'https');
      const cookie = sessionCookieOf(res, '__Host-swapyard.sid');
      expect(cookie).toMatch(/Secure/i);
      expect(cookie).toMatch(/Path=\//);
      expect(cookie).not.toMatch(/Domain=/i);
    } finally {
      s.close();
      secure.close();
    }
  });
});

describe('rate limit on /auth', () => {
  it('when one address passes the limit, then /auth answers 429 with a clear message in the error shape', async () => {
    const limited = await makeTestApp({ AUTH_RATE_LIMIT: '3' });
    const s = limited.app.listen(0);
    try {
      for (let i = 0; i < 3; i++) expect((await request(s).get('/auth/github')).status).toBe(302);
      const res = await request(s).get('/auth/github');
      expect(res.status).toBe(429);
      expect(res.body.error.code).toBe('rate_limited');
      expect(res.body.error.message).toMatch(/Too many sign-in attempts/);
      expect(res.headers['retry-after']).toBeDefined();
    } finally {
      s.close();
      limited.close();
    }
  });
});
