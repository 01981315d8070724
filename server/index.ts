import path from 'node:path';
import { loadConfig, ConfigError } from './config';
import { openDb, migrateDb, closeDb } from './db/client';
import { createApp } from './app';
import { createMailer } from './mail/mailer';
import { createDiskStorage } from './storage/disk-storage';
import { systemClock } from './lib/clock';
import { createLogger } from './lib/logger';
import { staticClient, viteClient } from './client';
import { seedDemo, isDatabaseEmpty } from './db/seed';

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
  const mailer = createMailer({ db, clock, logger, config });

  const vite = config.serveClient === 'vite' ? await viteClient() : null;
  const client = vite ? vite.handlers : config.serveClient === 'dist' ? staticClient() : undefined;
  const app = createApp({ db, mailer, storage, clock, config, logger, client });

  const server = app.listen(config.port, config.host, () => {
    logger.info(
      { port: config.port, env: config.env, db: path.resolve(config.databaseUrl) },
      `Swapyard listening on ${config.appUrl}`,
    );
  });

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'shutting down');
    server.close(async () => {
      await vite?.close();
      await mailer.stop();
      closeDb(db);
      process.exit(0);
    });
    server.closeAllConnections();
    setTimeout(() => process.exit(1), 5000).unref();
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
}

void main();
