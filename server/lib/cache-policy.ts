import type { Request, Response } from 'express';

/**
 * Answers that are the same for every reader and change when their content does. A browser asks again
 * each time (an unchanged answer costs a 304 by its ETag); a shared cache in front (a CDN) may answer
 * for a minute without asking, for ten more while it fetches a fresh copy, and for a day while the
 * origin fails. The app's own API reads revalidate (`cache: 'no-cache'`), so they never show a stale copy.
 */
export const SHARED_ANSWER = 'public, max-age=0, s-maxage=60, stale-while-revalidate=600, stale-if-error=86400';

/** At an address that changes with its content: kept for a year by everyone. */
export const IMMUTABLE_ANSWER = 'public, max-age=31536000, immutable';

/** Depends on who asks: kept by the reader's own browser only, and revalidated. */
export const READER_ANSWER = 'private, no-cache';

/**
 * For answers that differ by reader (a member sees their own controls or reports): a visitor's answer is
 * the same for every visitor, so a shared cache may keep it, keyed by the absent cookie; a member's is theirs.
 */
export function cacheByReader(req: Request, res: Response) {
  if (req.user) res.set('Cache-Control', READER_ANSWER);
  else res.set('Cache-Control', SHARED_ANSWER).vary('Cookie');
}
