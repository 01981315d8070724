import path from 'node:path';
import { loadConfig, ConfigError } from './config';
import { openDb, migrateDb, closeDb, setBusyTimeout } from './db/client';
import { SHORT_BUSY_TIMEOUT_MS } from './db/busy';
import { trackRequests } from './lib/request-drain';
import { scheduleOrphanSweep } from './features/photos/orphan-files';
import { createApp } from './app';
import { createMailer } from './mail/mailer';
import { createDiskStorage } from './storage/disk-storage';
import { systemClock } from './lib/clock';
import { createLogger } from './lib/logger';
import { staticClient, viteClient } from './client';
import { seedDemo, isDatabaseEmpty } from './db/seed';
import { startDraftExpiry } from './features/submissions/draft-expiry';
import { startFlagOutcomeMail } from './features/flags/flags.service';
import { startDigestScheduler } from './features/following/digests';

async function main() {
  let config;
  try {
    config = loadConfig();
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(1);
    }
    throw err;
  }
  const logger = createLogger(config.logLevel);
  const db = openDb(config.databaseUrl);
  migrateDb(db);
  const storage = createDiskStorage(config.uploadDir);
  const clock = systemClock;
  if (config.seedDemo && isDatabaseEmpty(db)) {
    const counts = await seedDemo(db, { storage, clock }, { appUrl: config.appUrl });
    logger.info({ counts }, 'demo scenario loaded into an empty database');
  }
  // from here on a statement never holds the event loop long for another process's lock (see db/busy.ts)
  setBusyTimeout(db, SHORT_BUSY_TIMEOUT_MS);
  const mailer = createMailer({ db, clock, logger, config });
  const stopOrphanSweep = scheduleOrphanSweep({ db, storage, clock, logger });

  const vite = config.serveClient === 'vite' ? await viteClient() : null;
  const client = vite ? vite.handlers : config.serveClient === 'dist' ? staticClient() : undefined;
  const app = createApp({ db, mailer, storage, clock, config, logger, client });

  const server = app.listen(config.port, config.host, () => {
    logger.info(
      { port: config.port, env: config.env, db: path.resolve(config.databaseUrl) },
      `Swapyard listening on ${config.appUrl}`,
    );
  });

  const requests = trackRequests(server);
  // outcomes of flags held back by the one-message-a-day rule go out once their day has passed
  const stopFlagOutcomeMail = startFlagOutcomeMail({ db, storage, mailer, clock, logger, appUrl: config.appUrl });
  const stopDraftExpiry = startDraftExpiry({
    db,
    storage,
    mailer,
    clock,
    logger,
    appUrl: config.appUrl,
    expiry: config.draftExpiry,
  });

  const stopDigests = startDigestScheduler({
    db,
    mailer,
    clock,
    logger,
    appUrl: config.appUrl,
    secret: config.sessionSecret,
  });

  // Stop accepting, let requests in flight finish (at most STOP_TIMEOUT_MS), let a delivery in progress
  // record its result, then close the database so the WAL is checkpointed.
  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal, inFlight: requests.inFlight }, 'stopping: no new connections, finishing requests in flight');
    const deadline = config.stopTimeoutMs + config.mailDelivery.timeoutMs * 3 + 5000;
    setTimeout(() => {
      logger.error({ signal }, 'stop took too long; exiting');
      process.exit(1);
    }, deadline).unref();
    const cut = await requests.drain(config.stopTimeoutMs);
    if (cut) logger.warn({ cut }, 'requests still running at the stop timeout were cut off');
    stopDraftExpiry();
    stopFlagOutcomeMail();
    stopDigests();
    await mailer.stop();
    stopOrphanSweep();
    await vite?.close();
    closeDb(db);
    logger.info({ signal }, 'stopped');
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('SIGINT', () => void stop('SIGINT'));
}

void main();
