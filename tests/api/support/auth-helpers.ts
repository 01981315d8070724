import type { Server } from 'node:http';
import request from 'supertest';
import { expect } from 'vitest';
import type { Db } from '../../../server/db/client';
import { shops, users } from '../../../server/db/schema/users';
import type { Role } from '../../../shared/roles';

export type Agent = ReturnType<typeof request.agent>;

/** A user the fake provider knows by login (provider id `demo-<login>`), as the demo seed makes them. */
export function addUser(db: Db, login: string, role: Role = 'member', extra: Partial<typeof users.$inferInsert> = {}) {
  const now = new Date();
  return db
    .insert(users)
    .values({
      provider: 'github',
      providerId: `demo-${login}`,
      login,
      name: login.replace(/_/g, ' '),
      role,
      email: `${login}@members.swapyard.invalid`,
      createdAt: now,
      updatedAt: now,
      ...extra,
    })
    .returning()
    .get();
}

export function addShop(db: Db, slug: string, name: string) {
  const now = new Date();
  return db.insert(shops).values({ slug, name, createdAt: now, updatedAt: now }).returning().get();
}

export const sessionCookieOf = (res: { headers: Record<string, unknown> }, name = 'swapyard.sid') => {
  const raw = res.headers['set-cookie'];
  const list = Array.isArray(raw) ? (raw as string[]) : [];
  return list.find((c) => c.startsWith(`${name}=`)) ?? null;
};

/**
 * The whole browser dance through the real strategy: /auth/github → the fake authorize page
 * (picking `login`) → the callback. Returns every response on the way.
 */
export async function signIn(agent: Agent, login: string, returnTo?: string) {
  const start = await agent.get(
    returnTo === undefined ? '/auth/github' : `/auth/github?returnTo=${encodeURIComponent(returnTo)}`,
  );
  expect(start.status).toBe(302);
  const authorize = new URL(start.headers.location, 'http://placeholder');
  expect(authorize.pathname).toBe('/auth/fake/authorize');
  authorize.searchParams.set('login', login);
  const pick = await agent.get(authorize.pathname + authorize.search);
  expect(pick.status).toBe(302);
  const back = new URL(pick.headers.location);
  const callback = await agent.get(back.pathname + back.search);
  return { start, authorize, pick, back, callback };
}

/** The session's CSRF token; a visitor has no session and so none (an empty header value). */
export async function csrfToken(agent: Agent): Promise<string> {
  const res = await agent.get('/api/me');
  expect(res.status).toBe(200);
  if (res.body.user) expect(typeof res.body.csrfToken).toBe('string');
  else expect(res.body.csrfToken).toBeNull();
  return (res.body.csrfToken as string | null) ?? '';
}

export function listen(app: { listen: (port: number) => Server }) {
  const server = app.listen(0);
  return { server, agent: () => request.agent(server) };
}

export type Member = { agent: Agent; token: string; id: number; login: string };

/** A user row, an agent signed in as that user through the fake provider, and its CSRF token. */
export async function signedInMember(
  db: Db,
  newAgent: () => Agent,
  login: string,
  role: Role = 'member',
  extra: Partial<typeof users.$inferInsert> = {},
): Promise<Member> {
  const id = addUser(db, login, role, extra).id;
  const agent = newAgent();
  await signIn(agent, login);
  return { agent, token: await csrfToken(agent), id, login };
}

/** A new draft swap by `member` on the given chassis, through the API; returns its revision id. */
export async function createDraft(member: Member, chassisId: number, data: unknown): Promise<number> {
  const res = await member.agent
    .post('/api/submissions')
    .set('x-csrf-token', member.token)
    .send({ chassisId, axle: 'front', category: 'brakes', data });
  expect(res.status).toBe(201);
  return res.body.id as number;
}
