import { openDb, migrateDb, closeDb } from './client';

const file = process.env.DATABASE_URL ?? './data/swapyard.db';
const db = openDb(file);
migrateDb(db);
const applied = db.$client.prepare('select count(*) as n from __drizzle_migrations').get() as { n: number };
closeDb(db);
console.log(`${file}: ${applied.n} migrations applied`);
