import path from 'node:path';
import { backupDatabase } from './backup';

const source = process.env.DATABASE_URL ?? './data/swapyard.db';
const stamp = new Date().toISOString().replace(/[:.]/g, '-');
const target = process.argv[2] ?? path.join(path.dirname(source), 'backups', `swapyard-${stamp}.db`);

const { pages, integrity } = await backupDatabase(source, target);
console.log(`backed up ${source} → ${target} (${pages} pages, integrity ${integrity})`);
if (integrity !== 'ok') process.exit(1);
