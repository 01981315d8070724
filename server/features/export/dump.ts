import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Db } from '../../db/client';
import { swapsCsv, swapsJson } from './export.service';

/** dated dumps kept per format; older ones are removed when a new one is written */
export const DUMPS_KEPT = 14;

export const dumpName = (day: string, ext: 'json' | 'csv') => `swapyard-swaps-${day}.${ext}.gz`;
export const latestName = (ext: 'json' | 'csv') => `swapyard-swaps-latest.${ext}.gz`;

/** Writes a file completely and durably under a temporary name, then puts it in place in one step. */
async function writeAtomically(target: string, pieces: Iterable<string>) {
  const partial = `${target}.part`;
  await pipeline(Readable.from(pieces, { objectMode: false }), zlib.createGzip({ level: 9 }), fs.createWriteStream(partial));
  const fd = fs.openSync(partial, 'r');
  fs.fsyncSync(fd);
  fs.closeSync(fd);
  fs.renameSync(partial, target);
}

/**
 * The daily dump for mirrors: the same JSON and CSV the export routes stream, gzipped, named by the day (UTC),
 * with a `latest` copy of each. A mirror never sees a half-written file: each is renamed into place when done.
 */
export async function writeDumps(db: Db, dir: string, siteUrl: string, now = new Date()) {
  fs.mkdirSync(dir, { recursive: true });
  const day = now.toISOString().slice(0, 10);
  const written: { file: string; bytes: number }[] = [];
  for (const [ext, pieces] of [
    ['json', swapsJson(db, siteUrl)],
    ['csv', swapsCsv(db, siteUrl)],
  ] as const) {
    const target = path.join(dir, dumpName(day, ext));
    await writeAtomically(target, pieces);
    fs.copyFileSync(target, path.join(dir, `${latestName(ext)}.part`));
    fs.renameSync(path.join(dir, `${latestName(ext)}.part`), path.join(dir, latestName(ext)));
    written.push({ file: target, bytes: fs.statSync(target).size });
    const dated = fs
      .readdirSync(dir)
      .filter((f) => new RegExp(`^swapyard-swaps-\\d{4}-\\d{2}-\\d{2}\\.${ext}\\.gz$`).test(f))
      .sort();
    for (const old of dated.slice(0, Math.max(0, dated.length - DUMPS_KEPT))) fs.rmSync(path.join(dir, old));
  }
  return written;
}
