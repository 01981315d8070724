import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import path from 'node:path';
import type { Server } from 'node:http';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { listen, signedInMember, type Member } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import { sessions, users } from '../../server/db/schema/users';

// Another process writing to the database file (the user:role script, a second server, a shell)
// must not freeze this one: writes wait for it with pauses that let other requests run, and a lock
// that outlasts the wait is a 503 with Retry-After.

const root = path.resolve(import.meta.dirname, '../..');

/** A second process that takes the database's write lock and keeps it for `holdMs` (or until killed). */
async function holdWriteLock(file: string, holdMs: number): Promise<ChildProcess> {
  const script = `
    const Database = require('better-sqlite3');
    const db = new Database(${JSON.stringify(file)});
    db.exec('BEGIN IMMEDIATE');
    console.log('locked');
    setTimeout(() => { db.exec('COMMIT'); db.close(); process.exit(0); }, ${holdMs});
  `;
  const child = spawn(process.execPath, ['-e', script], { cwd: root, stdio: ['ignore', 'pipe', 'inherit'] });
  await new Promise<void>((resolve, reject) => {
    child.stdout!.on('data', (d: Buffer) => d.toString().includes('locked') && resolve());
    child.once('exit', (code) => reject(new Error(`the lock holder exited early (${code})`)));
  });
  return child;
}

const released = (child: ChildProcess) =>
  child.exitCode !== null ? Promise.resolve() : new Promise<void>((resolve) => child.once('exit', () => resolve()));

let t: TestApp;
let server: Server;
let kai: Member;

beforeAll(async () => {
  t = await makeTestApp({ DB_BUSY_WAIT_MS: '800' });
  let agent;
  ({ server, agent } = listen(t.app));
  kai = await signedInMember(t.db, agent, 'camber_kai');
  const c = addChassis(t.db);
  addSwap(t.db, { slug: 'h31-vela-front', chassisId: c.id, authorId: kai.id, revisions: [{ status: 'approved' }] });
});
afterAll(async () => {
  server.close();
  await t.close();
});

const rename = (name: string) => kai.agent.patch('/api/me').set('x-csrf-token', kai.token).send({ name });

describe('another process holds the database', () => {
  it('when the lock outlasts the wait, then a write answers 503 with Retry-After, in about the wait, while reads keep being served', async () => {
    const holder = await holdWriteLock(t.config.databaseUrl, 10_000);
    const loop = monitorEventLoopDelay({ resolution: 10 });
    try {
      loop.enable();
      const started = performance.now();
      const write = rename('Kai while locked');
      // while the write waits, the server keeps answering others
      const reads = [];
      for (let i = 0; i < 5; i++) {
        await new Promise((r) => setTimeout(r, 100));
        const readStart = performance.now();
        const sheet = await kai.agent.get('/api/swaps/h31-vela-front');
        reads.push({ status: sheet.status, ms: performance.now() - readStart });
      }
      const res = await write;
      const ms = performance.now() - started;
      loop.disable();

      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe('busy');
      expect(res.headers['retry-after']).toBe('2');
      expect(res.headers['cache-control']).toBe('no-store');
      expect(ms).toBeGreaterThanOrEqual(700);
      expect(ms).toBeLessThan(2500); // the wait, not the wait twice (no second wait to save the session)
      expect(reads.every((r) => r.status === 200)).toBe(true);
      expect(Math.max(...reads.map((r) => r.ms))).toBeLessThan(400);
      // the longest the event loop stood still, in ms: a short busy timeout, not seconds
      expect(loop.max / 1e6).toBeLessThan(300);
    } finally {
      holder.kill();
      await released(holder);
    }
    expect(t.db.select().from(users).where(eq(users.id, kai.id)).get()!.name).not.toBe('Kai while locked');
  });

  it('when the lock is released within the wait, then the write goes through', async () => {
    const holder = await holdWriteLock(t.config.databaseUrl, 300);
    try {
      const res = await rename('Kai after the lock');
      expect(res.status).toBe(200);
      expect(res.body.user.name).toBe('Kai after the lock');
    } finally {
      await released(holder);
    }
  });

  it('when the database is locked, then a signed-in read does not wait to push its session’s expiry', async () => {
    // an expiry a few minutes old: this request would push it, which needs the write lock
    t.db
      .update(sessions)
      .set({ expiresAt: Date.now() + 14 * 24 * 60 * 60 * 1000 - 5 * 60 * 1000 })
      .where(eq(sessions.userId, kai.id))
      .run();
    const holder = await holdWriteLock(t.config.databaseUrl, 10_000);
    try {
      const before = performance.now();
      const me = await kai.agent.get('/api/me');
      expect(me.status).toBe(200);
      expect(me.body.user.login).toBe('camber_kai');
      expect(performance.now() - before).toBeLessThan(400);
    } finally {
      holder.kill();
      await released(holder);
    }
    // the next request, with the database free again, pushes it
    await kai.agent.get('/api/me');
    const row = t.db.select().from(sessions).where(eq(sessions.userId, kai.id)).get()!;
    expect(row.expiresAt).toBeGreaterThan(Date.now() + 14 * 24 * 60 * 60 * 1000 - 60 * 1000);
  });
});
