import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { loadConfig } from '../../../server/config';
import { openDb, migrateDb, closeDb, type Db } from '../../../server/db/client';
import { createApp } from '../../../server/app';
import { createMailer } from '../../../server/mail/mailer';
import { createDiskStorage } from '../../../server/storage/disk-storage';
import { createLogger } from '../../../server/lib/logger';
import type { Clock } from '../../../server/lib/clock';

export type TestApp = Awaited<ReturnType<typeof makeTestApp>>;

/** A real app on a fresh SQLite file in a temp folder; each test file arranges its own rows. */
export async function makeTestApp(env: Record<string, string> = {}, clock?: Clock) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-test-'));
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: path.join(dir, 'test.db'),
    UPLOAD_DIR: path.join(dir, 'uploads'),
    SESSION_SECRET: 'test-secret-test-secret-test-secret-000',
    LOG_LEVEL: 'silent',
    ...env,
  });
  const db: Db = openDb(config.databaseUrl);
  migrateDb(db);
  const storage = createDiskStorage(config.uploadDir);
  const theClock = clock ?? { now: () => new Date() };
  const mailer = createMailer({ db, clock: theClock, from: config.mailFrom });
  const logger = createLogger('silent');
  const app = createApp({ db, mailer, storage, clock: theClock, config, logger });
  return {
    app,
    db,
    storage,
    mailer,
    config,
    dir,
    close() {
      closeDb(db);
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
