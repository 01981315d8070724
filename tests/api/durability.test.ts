import { afterAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { freePort } from '../e2e/support/server';
import { signedInClient as signedIn, startChildServer } from './support/child-server';

// The server as a child process on its own database: a burst of submissions, SIGKILL in the
// middle of it, a restart, and every submission that was acknowledged must still be there.

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-durability-'));
const dbFile = path.join(dir, 'server.db');
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

const start = async (port: number) =>
  (await startChildServer(dir, port, { SEED_DEMO: 'auto', SUBMISSION_RATE_LIMIT: '100000', LOG_LEVEL: 'silent' })).child;

const record = (n: number) => ({
  chassisId: 1,
  axle: 'front',
  category: 'brakes',
  data: {
    schemaVersion: 2,
    title: `Durability draft number ${n}`,
    parts: [{ role: 'Front caliper', kind: 'caliper', name: 'Test caliper', quantity: 2 }],
  },
  body: `Draft ${n}`,
});

describe('durability', () => {
  it('when the server is killed mid-burst, then every acknowledged submission survives and the database is intact', async () => {
    const port = await freePort();
    let server = await start(port);
    const base = `http://127.0.0.1:${port}`;
    const client = await signedIn(base, 'camber_kai');

    const acknowledged: number[] = [];
    let failed = 0;
    const send = async (n: number) => {
      try {
        const res = await client.go('/api/submissions', {
          method: 'POST',
          body: JSON.stringify(record(n)),
          headers: { 'content-type': 'application/json', 'x-csrf-token': client.csrf },
        });
        if (res.status === 201) acknowledged.push(((await res.json()) as { id: number }).id);
        else failed++;
      } catch {
        failed++; // the connection died with the process
      }
    };
    // eight writers in parallel; the kill lands while requests are in flight
    let next = 0;
    const writers = Array.from({ length: 8 }, async () => {
      while (next < 400) await send(next++);
    });
    while (acknowledged.length < 60) await new Promise((r) => setTimeout(r, 5));
    server.kill('SIGKILL');
    await Promise.all(writers);
    if (server.exitCode === null && server.signalCode === null) await new Promise((r) => server.once('exit', r));
    expect(acknowledged.length).toBeGreaterThanOrEqual(60);
    expect(failed).toBeGreaterThan(0); // the kill really interrupted the burst

    server = await start(port);
    try {
      const again = await signedIn(base, 'camber_kai');
      const mine = (await (await again.go('/api/me/submissions')).json()) as { items: { id: number }[] };
      const present = new Set(mine.items.map((i) => i.id));
      const lost = acknowledged.filter((id) => !present.has(id));
      console.log(`acknowledged ${acknowledged.length}, refused or cut off ${failed}, lost after SIGKILL ${lost.length}`);
      expect(lost).toEqual([]);
    } finally {
      server.kill('SIGTERM');
      await new Promise((r) => server.once('exit', r));
    }
    const check = new Database(dbFile, { readonly: true });
    expect(check.pragma('integrity_check', { simple: true })).toBe('ok');
    check.close();
  }, 90_000);
});
