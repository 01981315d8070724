import { createHash } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import type { Request, Response } from 'express';

/** A JSON answer built once: its bytes, a strong ETag over them, and the gzip of them. */
export type CachedJson = { etag: string; json: Buffer; gzip: Buffer };

export function cacheJson(value: unknown): CachedJson {
  return cacheJsonText(JSON.stringify(value));
}

/** The same, for JSON already written out. */
export function cacheJsonText(text: string): CachedJson {
  const json = Buffer.from(text);
  return { etag: `"${createHash('sha256').update(json).digest('base64url').slice(0, 27)}"`, json, gzip: gzipSync(json) };
}

/**
 * Sends a cached answer: 304 when the reader's copy is current, else the pre-compressed bytes (the
 * compression middleware leaves an answer that already has a Content-Encoding alone).
 */
export function sendCachedJson(req: Request, res: Response, body: CachedJson, cacheControl: string) {
  res.setHeader('ETag', body.etag);
  res.setHeader('Cache-Control', cacheControl);
  res.setHeader('Vary', 'Accept-Encoding');
  if (req.fresh) {
    res.status(304).end();
    return;
  }
  // the bytes are ready: written straight out rather than through res.send, which would look at them again
  const gzip = req.acceptsEncodings('gzip') === 'gzip';
  const bytes = gzip ? body.gzip : body.json;
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  if (gzip) res.setHeader('Content-Encoding', 'gzip');
  res.setHeader('Content-Length', bytes.length);
  res.end(bytes);
}

/** Keeps one cached answer per key, rebuilt when the key's fingerprint changes. */
export function fingerprintCache(maxEntries = 2000) {
  const entries = new Map<string, { fingerprint: string; body: CachedJson }>();
  return (key: string, fingerprint: string, build: () => unknown): CachedJson => {
    const hit = entries.get(key);
    if (hit?.fingerprint === fingerprint) return hit.body;
    const body = cacheJson(build());
    if (entries.size >= maxEntries) entries.delete(entries.keys().next().value!);
    entries.set(key, { fingerprint, body });
    return body;
  };
}
