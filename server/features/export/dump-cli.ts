import { loadConfig } from '../../config';
import { closeDb, openDb } from '../../db/client';
import { writeDumps } from './dump';

// npm run export:dump — run once a day (e.g. from cron: `15 3 * * * cd /srv/swapyard && npm run export:dump`).

const config = loadConfig(process.env);
const db = openDb(config.databaseUrl);
try {
  const t0 = performance.now();
  for (const { file, bytes } of await writeDumps(db, config.dumpDir, config.appUrl))
    console.log(`wrote ${file} (${(bytes / 2 ** 20).toFixed(1)} MiB)`);
  console.log(`done in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
} finally {
  closeDb(db);
}
