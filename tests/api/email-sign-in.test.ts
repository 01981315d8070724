import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { desc, eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser, listen, type Agent } from './support/auth-helpers';
import { emailSignInTokens, mailOutbox, users } from '../../server/db/schema/index';
import { listOutbox } from '../../server/features/outbox/outbox.service';
import { EMAIL_LINK_MINUTES, EMAIL_LINKS_PER_ADDRESS_PER_HOUR } from '../../server/auth/email-sign-in.service';
import { EMAIL_LINK_REQUESTS_PER_15_MIN } from '../../server/auth/auth.router';

let now = new Date('2026-11-20T10:00:00Z');
const clock = { now: () => now };
let t: TestApp;
let newAgent: () => Agent;
let close: () => void;
let ip = 1;

beforeAll(async () => {
  t = await makeTestApp({}, clock);
  const l = listen(t.app);
  newAgent = l.agent;
  close = () => l.server.close();
});
afterAll(() => {
  close();
  t.close();
});

/** each test asks from its own address, so the per-address limit of one test does not reach the next */
const fromNewAddress = () => `10.0.0.${ip++}`;

async function ask(agent: Agent, email: string, returnTo?: string, from = fromNewAddress()) {
  return agent
    .post('/auth/email')
    .set('x-forwarded-for', from)
    .send({ email, ...(returnTo ? { returnTo } : {}) });
}

/** the link in the newest message to that address, as its recipient would click it */
function linkFor(email: string): string {
  const row = t.db.select().from(mailOutbox).where(eq(mailOutbox.to, email)).orderBy(desc(mailOutbox.id)).get();
  expect(row, `a message to ${email}`).toBeTruthy();
  const match = /\/auth\/email\/callback\?token=[A-Za-z0-9_-]+/.exec(row!.text);
  expect(match, 'a sign-in link in the message').toBeTruthy();
  return match![0];
}

const me = async (agent: Agent) => (await agent.get('/api/me')).body.user as { login: string; role: string } | null;

describe('e-mail sign-in links', () => {
  it('when any address asks, then the answer is the same 202 whether or not it is known, and a link goes out through the outbox', async () => {
    addUser(t.db, 'rivet_rosa', 'member', { email: 'rosa@example.com' });
    const known = await ask(newAgent(), 'Rosa@Example.com ');
    const unknown = await ask(newAgent(), 'nobody-yet@example.com');
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    expect(known.body).toEqual({ sent: true, minutes: EMAIL_LINK_MINUTES });
    const rows = t.db.select().from(mailOutbox).all();
    expect(rows.map((r) => r.to).sort()).toEqual(['nobody-yet@example.com', 'rosa@example.com']);
    expect(rows.every((r) => r.secret)).toBe(true);
    // only a hash of the token is stored
    const link = linkFor('rosa@example.com');
    const token = link.split('token=')[1];
    const stored = t.db.select().from(emailSignInTokens).all();
    expect(stored.some((s) => s.tokenHash.includes(token))).toBe(false);
  });

  it('when the address is not an address, then it is a 400 naming the field', async () => {
    const res = await ask(newAgent(), 'not an address');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.email).toMatch(/e-mail address/);
  });

  it('when the link is opened, then it signs in once, lands where the member was, and a second use signs nobody in', async () => {
    await ask(newAgent(), 'rosa@example.com', '/me/cars');
    const link = linkFor('rosa@example.com');
    const browser = newAgent();
    const first = await browser.get(link);
    expect(first.status).toBe(302);
    expect(first.headers.location).toBe('/me/cars');
    expect(await me(browser)).toMatchObject({ login: 'rivet_rosa' });

    const other = newAgent();
    const again = await other.get(link);
    expect(again.status).toBe(302);
    expect(again.headers.location).toBe('/signin-failed?reason=link');
    expect(await me(other)).toBeNull();
  });

  it('when the link is opened in another browser than the one that asked, then that browser is signed in and the asking one is not', async () => {
    const asking = newAgent();
    await ask(asking, 'rosa@example.com');
    const phone = newAgent();
    expect((await phone.get(linkFor('rosa@example.com'))).status).toBe(302);
    expect(await me(phone)).toMatchObject({ login: 'rivet_rosa' });
    expect(await me(asking)).toBeNull();
  });

  it('when the link is older than its lifetime, then it signs nobody in', async () => {
    await ask(newAgent(), 'rosa@example.com');
    const link = linkFor('rosa@example.com');
    now = new Date(now.getTime() + (EMAIL_LINK_MINUTES * 60 + 1) * 1000);
    const late = newAgent();
    const res = await late.get(link);
    expect(res.headers.location).toBe('/signin-failed?reason=link');
    expect(await me(late)).toBeNull();
  });

  it('when a made-up token is used, then it signs nobody in', async () => {
    const res = await newAgent().get('/auth/email/callback?token=AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA');
    expect(res.headers.location).toBe('/signin-failed?reason=link');
  });

  it('when an unknown address uses its link, then a new member is made, with no provider account needed', async () => {
    await ask(newAgent(), 'Shop.Owner+garage@example.com');
    const browser = newAgent();
    await browser.get(linkFor('shop.owner+garage@example.com'));
    const user = await me(browser);
    expect(user).toMatchObject({ role: 'member' });
    const row = t.db.select().from(users).where(eq(users.email, 'shop.owner+garage@example.com')).get()!;
    expect(row.provider).toBe('email');
    expect(row.login).toBe('shop-owner-garage');
  });

  it('when the member later signs in with the provider whose address is the same, then it is the same account', async () => {
    // the fake provider vouches for `<login>@members.swapyard.invalid`
    await ask(newAgent(), 'camber_kai@members.swapyard.invalid');
    const byLink = newAgent();
    await byLink.get(linkFor('camber_kai@members.swapyard.invalid'));
    const id = t.db.select().from(users).where(eq(users.email, 'camber_kai@members.swapyard.invalid')).get()!.id;

    const { signIn } = await import('./support/auth-helpers');
    const byProvider = newAgent();
    await signIn(byProvider, 'camber_kai');
    expect(t.db.select().from(users).where(eq(users.email, 'camber_kai@members.swapyard.invalid')).all()).toHaveLength(1);
    const linked = t.db.select().from(users).where(eq(users.id, id)).get()!;
    expect(linked.provider).toBe('github');
    // and the e-mail link still reaches it
    await ask(newAgent(), 'camber_kai@members.swapyard.invalid');
    const again = newAgent();
    await again.get(linkFor('camber_kai@members.swapyard.invalid'));
    expect(t.db.select().from(users).where(eq(users.email, 'camber_kai@members.swapyard.invalid')).all()).toHaveLength(1);
    expect((await me(again))?.login).toBe(linked.login);
  });

  it('when a suspended member uses a link, then they are refused', async () => {
    addUser(t.db, 'banned_bob', 'member', { email: 'bob@example.com', suspendedAt: new Date() });
    await ask(newAgent(), 'bob@example.com');
    const browser = newAgent();
    const res = await browser.get(linkFor('bob@example.com'));
    expect(res.headers.location).toBe('/signin-failed?reason=suspended');
    expect(await me(browser)).toBeNull();
  });

  it('when one address is asked for too often, then the answer stays 202 but no more links go out', async () => {
    const email = 'flooded@example.com';
    for (let i = 0; i < EMAIL_LINKS_PER_ADDRESS_PER_HOUR + 2; i++) expect((await ask(newAgent(), email)).status).toBe(202);
    expect(t.db.select().from(mailOutbox).where(eq(mailOutbox.to, email)).all()).toHaveLength(EMAIL_LINKS_PER_ADDRESS_PER_HOUR);
  });

  it('when one client asks for many links, then it is rate limited with a clear 429', async () => {
    const from = fromNewAddress();
    const statuses: number[] = [];
    for (let i = 0; i <= EMAIL_LINK_REQUESTS_PER_15_MIN; i++) statuses.push((await ask(newAgent(), `p${i}@example.com`, undefined, from)).status);
    expect(statuses.slice(0, EMAIL_LINK_REQUESTS_PER_15_MIN).every((s) => s === 202)).toBe(true);
    const last = await ask(newAgent(), 'one-more@example.com', undefined, from);
    expect(last.status).toBe(429);
    expect(last.body.error.code).toBe('rate_limited');
  });

  it('when staff read the outbox outside the local demo, then a sign-in message shows no link', () => {
    const items = listOutbox(t.db, 'admin');
    const signIn = items.filter((m) => m.subject === 'Your Swapyard sign-in link');
    expect(signIn.length).toBeGreaterThan(0);
    for (const m of signIn) {
      expect(m.text).not.toMatch(/token=/);
      expect(m.html).not.toMatch(/token=/);
    }
  });
});
