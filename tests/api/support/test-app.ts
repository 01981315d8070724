import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { loadConfig } from '../../../server/config';
import { openDb, migrateDb, closeDb, setBusyTimeout, type Db } from '../../../server/db/client';
import { SHORT_BUSY_TIMEOUT_MS } from '../../../server/db/busy';
import { createApp } from '../../../server/app';
import { createMailer } from '../../../server/mail/mailer';
import { createDiskStorage } from '../../../server/storage/disk-storage';
import { createLogger } from '../../../server/lib/logger';
import type { Clock } from '../../../server/lib/clock';
import type { DestinationStream } from 'pino';
import type { RequestHandler } from 'express';

export type TestApp = Awaited<ReturnType<typeof makeTestApp>>;

export type TestAppOptions = {
  /** where the app's real logger (createLogger: ISO times, redaction) writes its JSON lines; silent without it */
  logDestination?: DestinationStream;
  /** the client's handlers (e.g. `staticClient` over a small built folder), for tests of page addresses */
  client?: RequestHandler[];
};

/** A real app on a fresh SQLite file in a temp folder; each test file arranges its own rows. */
export async function makeTestApp(env: Record<string, string> = {}, clock?: Clock, options: TestAppOptions = {}) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-test-'));
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: path.join(dir, 'test.db'),
    UPLOAD_DIR: path.join(dir, 'uploads'),
    DUMP_DIR: path.join(dir, 'dumps'),
    SESSION_SECRET: 'test-secret-test-secret-test-secret-000',
    LOG_LEVEL: 'silent',
    SERVE_CLIENT: 'none',
    ...env,
  });
  const db: Db = openDb(config.databaseUrl);
  migrateDb(db);
  setBusyTimeout(db, SHORT_BUSY_TIMEOUT_MS);
  const storage = createDiskStorage(config.uploadDir);
  const theClock = clock ?? { now: () => new Date() };
  const logger = options.logDestination ? createLogger('info', options.logDestination) : createLogger('silent');
  const mailer = createMailer({ db, clock: theClock, logger, config });
  const app = createApp({ db, mailer, storage, clock: theClock, config, logger, client: options.client });
  return {
    app,
    db,
    storage,
    mailer,
    config,
    logger,
    dir,
    async close() {
      await mailer.stop();
      closeDb(db);
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
