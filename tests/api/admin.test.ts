import type { Server } from 'node:http';
import { spawnSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addShop, addUser, csrfToken, listen, signIn, type Agent } from './support/auth-helpers';
import { sessions, userChanges, users } from '../../server/db/schema/users';

let t: TestApp;
let server: Server;
let agent: () => Agent;
let admin: Agent;
let adminToken: string;
let adminId: number;
let ridgeway: { id: number };

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  adminId = addUser(t.db, 'ada_admin', 'admin').id;
  addUser(t.db, 'rivet_rosa', 'member');
  addUser(t.db, 'pistonpaul', 'member', { name: 'Paul Kolben' });
  addUser(t.db, 'ridgeway_shop', 'member');
  ridgeway = addShop(t.db, 'ridgeway-performance', 'Ridgeway Performance');
  admin = agent();
  await signIn(admin, 'ada_admin');
  adminToken = await csrfToken(admin);
});
afterAll(() => {
  server.close();
  t.close();
});

const idOf = (login: string) => t.db.select({ id: users.id }).from(users).where(eq(users.login, login)).get()!.id;
const patchUser = (login: string, body: object) =>
  admin
    .patch(`/api/admin/users/${idOf(login)}`)
    .set('x-csrf-token', adminToken)
    .send(body);

describe('who may open the admin routes', () => {
  it('when signed out, then the admin routes are 401', async () => {
    const res = await request(server).get('/api/admin/users');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthorized');
  });

  it('when a member asks, then the admin routes are 403, reads and writes alike', async () => {
    const a = agent();
    await signIn(a, 'rivet_rosa');
    expect((await a.get('/api/admin/users')).status).toBe(403);
    expect((await a.get('/api/admin/shops')).status).toBe(403);
    const token = await csrfToken(a);
    const res = await a
      .patch(`/api/admin/users/${idOf('rivet_rosa')}`)
      .set('x-csrf-token', token)
      .send({ role: 'admin' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
    expect(t.db.select().from(users).where(eq(users.login, 'rivet_rosa')).get()!.role).toBe('member');
  });

  it('when an admin searches, then users match by login or name, any case', async () => {
    const byName = await admin.get('/api/admin/users').query({ q: 'KOLBEN' });
    expect(byName.status).toBe(200);
    expect(byName.body.users.map((u: { login: string }) => u.login)).toEqual(['pistonpaul']);
    const byLogin = await admin.get('/api/admin/users').query({ q: 'rosa' });
    expect(byLogin.body.users.map((u: { login: string }) => u.login)).toEqual(['rivet_rosa']);
    const all = await admin.get('/api/admin/users');
    expect(all.body.users.length).toBeGreaterThanOrEqual(4);
    const wildcard = await admin.get('/api/admin/users').query({ q: '%' });
    expect(wildcard.body.users).toEqual([]);
  });

  it('when an admin lists shops, then the picker gets id, slug and name', async () => {
    const res = await admin.get('/api/admin/shops');
    expect(res.body.shops).toEqual([{ id: ridgeway.id, slug: 'ridgeway-performance', name: 'Ridgeway Performance' }]);
  });
});

describe('changing roles, shops and suspension', () => {
  it('when an admin makes a member a moderator, then it applies on the member’s next request in their existing session, and is recorded', async () => {
    const rosa = agent();
    await signIn(rosa, 'rivet_rosa');
    expect((await rosa.get('/api/me')).body.user.role).toBe('member');

    const res = await patchUser('rivet_rosa', { role: 'moderator' });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ login: 'rivet_rosa', role: 'moderator', suspended: false });

    expect((await rosa.get('/api/me')).body.user.role).toBe('moderator');

    const changes = await admin.get(`/api/admin/users/${idOf('rivet_rosa')}/changes`);
    expect(changes.body.changes[0]).toMatchObject({
      field: 'role',
      from: 'member',
      to: 'moderator',
      actor: { login: 'ada_admin' },
    });
    expect(Date.parse(changes.body.changes[0].at)).toBeGreaterThan(Date.now() - 60_000);
  });

  it('when an admin links a shop account to a shop, then /api/me shows the shop; a shop for a non-shop role is a 400 on shopId', async () => {
    const refused = await patchUser('pistonpaul', { shopId: ridgeway.id });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields).toHaveProperty('shopId');

    const missing = await patchUser('ridgeway_shop', { role: 'shop', shopId: 999_999 });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.shopId).toMatch(/Choose a shop/);
    expect(t.db.select().from(users).where(eq(users.login, 'ridgeway_shop')).get()!.role).toBe('member');

    const ok = await patchUser('ridgeway_shop', { role: 'shop', shopId: ridgeway.id });
    expect(ok.status).toBe(200);
    expect(ok.body.user.shop).toEqual({ id: ridgeway.id, slug: 'ridgeway-performance', name: 'Ridgeway Performance' });
    const shopAgent = agent();
    await signIn(shopAgent, 'ridgeway_shop');
    expect((await shopAgent.get('/api/me')).body.user).toMatchObject({
      role: 'shop',
      shop: { slug: 'ridgeway-performance', name: 'Ridgeway Performance' },
    });

    // leaving the shop role drops the link, and both changes are recorded
    const back = await patchUser('ridgeway_shop', { role: 'member' });
    expect(back.body.user.shop).toBeNull();
    const fields = (await admin.get(`/api/admin/users/${idOf('ridgeway_shop')}/changes`)).body.changes.map(
      (c: { field: string; to: string | null }) => `${c.field}:${c.to}`,
    );
    expect(fields).toEqual(expect.arrayContaining(['role:shop', 'shop:ridgeway-performance', 'role:member', 'shop:null']));
  });

  it('when an admin lowers a role, then every session of that user ends; raising a role keeps them signed in', async () => {
    addUser(t.db, 'gauge_mo', 'moderator');
    const laptop = agent();
    const phone = agent();
    await signIn(laptop, 'gauge_mo');
    await signIn(phone, 'gauge_mo');
    const others = t.db.select().from(sessions).all().length - 2;

    const lowered = await patchUser('gauge_mo', { role: 'member' });
    expect(lowered.status).toBe(200);
    expect(lowered.body.sessionsEnded).toBe(2);
    expect((await laptop.get('/api/me')).body.user).toBeNull();
    expect((await phone.get('/api/me')).body.user).toBeNull();
    expect(
      t.db
        .select()
        .from(sessions)
        .where(eq(sessions.userId, idOf('gauge_mo')))
        .all(),
    ).toEqual([]);
    expect(t.db.select().from(sessions).all()).toHaveLength(others); // nobody else was signed out

    await signIn(laptop, 'gauge_mo');
    const raised = await patchUser('gauge_mo', { role: 'moderator' });
    expect(raised.body.sessionsEnded).toBe(0);
    expect((await laptop.get('/api/me')).body.user).toMatchObject({ login: 'gauge_mo', role: 'moderator' });
  });

  it('when an admin suspends a member, then all the member’s sessions end, sign-in is refused, and restoring lets them back', async () => {
    const one = agent();
    const two = agent();
    await signIn(one, 'pistonpaul');
    await signIn(two, 'pistonpaul');
    const paulId = idOf('pistonpaul');
    expect(t.db.select().from(sessions).where(eq(sessions.userId, paulId)).all()).toHaveLength(2);

    const res = await patchUser('pistonpaul', { suspended: true });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ user: { suspended: true }, sessionsEnded: 2 });
    expect(t.db.select().from(sessions).where(eq(sessions.userId, paulId)).all()).toHaveLength(0);
    expect((await one.get('/api/me')).body.user).toBeNull();
    expect((await two.get('/api/me')).body.user).toBeNull();

    const again = await signIn(agent(), 'pistonpaul');
    expect(again.callback.headers.location).toBe('/signin-failed?reason=suspended');

    expect((await patchUser('pistonpaul', { suspended: false })).body.user.suspended).toBe(false);
    const back = agent();
    await signIn(back, 'pistonpaul');
    expect((await back.get('/api/me')).body.user.login).toBe('pistonpaul');
    const recorded = t.db
      .select()
      .from(userChanges)
      .where(and(eq(userChanges.userId, paulId), eq(userChanges.field, 'suspended')))
      .all();
    expect(recorded.map((c) => `${c.fromValue}->${c.toValue}`)).toEqual(['false->true', 'true->false']);
  });

  it('when an admin tries to demote or suspend themselves, then it is refused and nothing changes', async () => {
    const demote = await admin.patch(`/api/admin/users/${adminId}`).set('x-csrf-token', adminToken).send({ role: 'member' });
    expect(demote.status).toBe(403);
    expect(demote.body.error.message).toMatch(/own role/);
    const suspend = await admin.patch(`/api/admin/users/${adminId}`).set('x-csrf-token', adminToken).send({ suspended: true });
    expect(suspend.status).toBe(403);
    expect((await admin.get('/api/me')).body.user.role).toBe('admin');
  });

  it('when the patch is empty, unknown or aimed at a missing user, then it is 400 or 404', async () => {
    expect((await patchUser('rivet_rosa', {})).status).toBe(400);
    const bad = await patchUser('rivet_rosa', { role: 'overlord' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('role');
    expect((await patchUser('rivet_rosa', { karma: 3 })).status).toBe(400);
    const missing = await admin.patch('/api/admin/users/987654').set('x-csrf-token', adminToken).send({ role: 'member' });
    expect(missing.status).toBe(404);
    expect((await admin.get('/api/admin/users/abc/changes')).status).toBe(400);
  });
});

describe('npm run user:role', () => {
  const run = (...args: string[]) =>
    spawnSync(process.execPath, ['--import', 'tsx', 'server/auth/user-role-cli.ts', ...args], {
      env: { ...process.env, DATABASE_URL: t.config.databaseUrl },
      encoding: 'utf8',
      timeout: 30_000,
    });

  it('when the shell sets a role by login, then the user has it and the change is recorded without an actor', () => {
    addUser(t.db, 'camber_kai', 'member');
    const res = run('camber_kai', 'admin');
    expect(res.stderr).toBe('');
    expect(res.status).toBe(0);
    expect(res.stdout).toMatch(/camber_kai .* is now Admin/);
    expect(t.db.select().from(users).where(eq(users.login, 'camber_kai')).get()!.role).toBe('admin');
    const change = t.db
      .select()
      .from(userChanges)
      .where(eq(userChanges.userId, idOf('camber_kai')))
      .get()!;
    expect(change).toMatchObject({ field: 'role', fromValue: 'member', toValue: 'admin', actorId: null });
  });

  it('when the shell lowers a role, then the user’s open sessions end', async () => {
    addUser(t.db, 'lathe_shop', 'shop');
    const shop = agent();
    await signIn(shop, 'lathe_shop');
    expect((await shop.get('/api/me')).body.user.role).toBe('shop');
    const res = run('lathe_shop', 'member');
    expect(res.status).toBe(0);
    expect(res.stdout).toMatch(/lathe_shop .* is now Member\. Their 1 open session was ended/);
    expect((await shop.get('/api/me')).body.user).toBeNull();
  });

  it('when the login or role is unknown, then it says so and exits non-zero', () => {
    const unknownLogin = run('nobody_here', 'admin');
    expect(unknownLogin.status).toBe(1);
    expect(unknownLogin.stderr).toMatch(/No user has the login "nobody_here"/);
    const unknownRole = run('camber_kai', 'overlord');
    expect(unknownRole.status).toBe(2);
    expect(unknownRole.stderr).toMatch(/not a role.*member, shop, moderator, admin/);
  });
});
