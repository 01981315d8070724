import { afterAll, describe, expect, it } from 'vitest';
import Database from 'better-sqlite3';
import path from 'node:path';
import request from 'supertest';
import { backupDatabase } from '../../server/db/backup';
import { openDb, migrateDb, closeDb } from '../../server/db/client';
import { mailOutbox } from '../../server/db/schema/index';
import { makeTestApp, type TestApp } from './support/test-app';

const apps: TestApp[] = [];
afterAll(() => apps.forEach((a) => a.close()));

describe('online backup', () => {
  it('when writes continue during the backup, then the copy is consistent, opens and serves', async () => {
    const source = await makeTestApp();
    apps.push(source);
    const filler = 'x'.repeat(2000);
    const insert = (n: number) =>
      source.db
        .insert(mailOutbox)
        .values({ to: `m${n}@example.com`, subject: `s${n}`, text: filler, html: filler, createdAt: new Date() })
        .run();
    source.db.$client.transaction(() => {
      for (let i = 0; i < 3000; i++) insert(i);
    })();
    const before = source.db.$client.prepare('select count(*) as n from mail_outbox').get() as { n: number };

    // a second connection keeps writing between the backup's steps
    const writer = new Database(source.config.databaseUrl);
    writer.pragma('busy_timeout = 5000');
    let written = 0;
    const timer = setInterval(() => {
      writer
        .prepare('insert into mail_outbox ("to", subject, text, html, created_at) values (?, ?, ?, ?, ?)')
        .run('w@example.com', `w${written}`, filler, filler, Date.now());
      written++;
    }, 1);

    const target = path.join(source.dir, 'backup', 'copy.db');
    const result = await backupDatabase(source.config.databaseUrl, target);
    clearInterval(timer);
    writer.close();

    expect(result.integrity).toBe('ok');
    expect(written).toBeGreaterThan(0);
    const copy = openDb(target);
    migrateDb(copy);
    const rows = copy.$client.prepare('select count(*) as n from mail_outbox').get() as { n: number };
    expect(rows.n).toBeGreaterThanOrEqual(before.n);
    expect(rows.n).toBeLessThanOrEqual(before.n + written);
    closeDb(copy);

    const served = await makeTestApp({ DATABASE_URL: target });
    apps.push(served);
    const health = await request(served.app).get('/api/swaps?limit=1');
    expect(health.status).toBe(200);
    expect(served.db.$client.prepare('select count(*) as n from mail_outbox').get()).toEqual({ n: rows.n });
  });
});
