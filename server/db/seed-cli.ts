import path from 'node:path';
import { openDb, migrateDb, closeDb } from './client';
import { seedDemo } from './seed';
import { createDiskStorage } from '../storage/disk-storage';
import { systemClock } from '../lib/clock';

// npm run db:seed — empties the database and its stored photos, then loads the demo scenario.
const file = process.env.DATABASE_URL ?? './data/swapyard.db';
const uploadDir = path.resolve(process.env.UPLOAD_DIR ?? './data/uploads');
const db = openDb(file);
try {
  migrateDb(db);
  const { counts } = await seedDemo(
    db,
    { storage: createDiskStorage(uploadDir), clock: systemClock },
    {
      reset: true,
      appUrl: process.env.APP_URL ?? `http://localhost:${process.env.PORT ?? 3000}`,
    },
  );
  console.log(`Demo scenario loaded into ${path.resolve(file)} (photos in ${uploadDir}):`);
  for (const [table, n] of Object.entries(counts)) console.log(`  ${table.padEnd(22)} ${n}`);
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  process.exitCode = 1;
} finally {
  closeDb(db);
}
