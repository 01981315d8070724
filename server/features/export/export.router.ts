import { Router, type Response } from 'express';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { AppDeps } from '../../app';
import { swapsCsv, swapsJson } from './export.service';

/**
 * Streams a file made piece by piece: a piece is asked for only when the connection has taken the last ones,
 * so the export holds one batch of swaps however many there are. Everyone gets the same bytes, so a shared
 * cache may keep it for a few minutes.
 */
async function stream(res: Response, type: string, filename: string, pieces: Iterable<string>) {
  res.set({
    'Content-Type': type,
    'Content-Disposition': `inline; filename="${filename}"`,
    'Cache-Control': 'public, max-age=300',
  });
  // a client that goes away ends the pipeline, and the generator with it
  await pipeline(Readable.from(pieces, { objectMode: false }), res).catch((err: NodeJS.ErrnoException) => {
    if (err.code !== 'ERR_STREAM_PREMATURE_CLOSE') throw err;
  });
}

export function exportRouter({ db, config }: AppDeps) {
  const router = Router();
  router.get('/export/swaps.json', async (_req, res) => {
    await stream(res, 'application/json; charset=utf-8', 'swapyard-swaps.json', swapsJson(db, config.appUrl));
  });
  router.get('/export/swaps.csv', async (_req, res) => {
    await stream(res, 'text/csv; charset=utf-8; header=present', 'swapyard-swaps.csv', swapsCsv(db, config.appUrl));
  });
  return router;
}
