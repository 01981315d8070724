import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, type TestApp } from './support/test-app';

// SERVICE_WORKER=off takes the offline app back: browsers that installed it fetch /sw.js on their next
// visit and get a worker that answers nothing and unregisters itself.

const apps: TestApp[] = [];
afterAll(async () => {
  for (const t of apps) await t.close();
});

describe('GET /sw.js', () => {
  it('when the offline app is switched off, then /sw.js unregisters itself, handles no request, and is always revalidated', async () => {
    const t = await makeTestApp({ SERVICE_WORKER: 'off' });
    apps.push(t);
    const res = await request(t.app).get('/sw.js');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['cache-control']).toBe('no-cache');
    expect(res.text).toContain('self.registration.unregister()');
    expect(res.text).not.toMatch(/addEventListener\(\s*'fetch'/);
  });

  it('when it is on, then /sw.js is the built one (none without a built client)', async () => {
    const t = await makeTestApp({ SERVICE_WORKER: 'on' });
    apps.push(t);
    expect(t.config.serviceWorker).toBe(true);
    expect((await request(t.app).get('/sw.js')).status).toBe(404);
  });
});
