import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, type TestApp } from './support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(() => t.close());

describe('health and unknown routes', () => {
  it('when the health route is asked, then it answers ok', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
  });

  it('when an unknown API route is asked, then it is a JSON 404 in the shared error shape', async () => {
    const res = await request(t.app).get('/api/nope');
    expect(res.status).toBe(404);
    expect(res.type).toBe('application/json');
    expect(res.body.error.code).toBe('not_found');
    expect(res.body.error.message).toMatch(/nope/);
  });

  it('when a JSON body is malformed, then the answer is a 400 invalid_json', async () => {
    const res = await request(t.app).post('/api/health').set('content-type', 'application/json').send('{"a":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
  });

  it('when the database is opened, then WAL, synchronous FULL and foreign keys are on and every migration applied', () => {
    const sqlite = t.db.$client;
    expect(sqlite.pragma('journal_mode', { simple: true })).toBe('wal');
    expect(sqlite.pragma('synchronous', { simple: true })).toBe(2);
    expect(sqlite.pragma('foreign_keys', { simple: true })).toBe(1);
    const applied = sqlite.prepare('select count(*) as n from __drizzle_migrations').get() as { n: number };
    const files = fs.readdirSync('drizzle').filter((f: string) => f.endsWith('.sql'));
    expect(applied.n).toBe(files.length);
  });
});

describe('security headers', () => {
  it('when any answer goes out, then it carries the strict content security policy and nosniff', async () => {
    const res = await request(t.app).get('/api/health');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("script-src 'self'");
    expect(csp).toMatch(/script-src 'self'(;|$)/);
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("base-uri 'none'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
  });
});
