import type { DigestFrequency } from '../../../shared/schemas/following';

// Digests go out at fixed moments, so a member gets theirs at the same hour each day (or each Monday),
// however often the scheduler looks: the hour after 06:00 UTC; weekly ones on Mondays.

export const DIGEST_HOUR_UTC = 6;
const DAY_MS = 24 * 60 * 60 * 1000;

/** The latest digest moment at or before `now`. */
export function digestMomentAtOrBefore(frequency: DigestFrequency, now: Date): Date {
  const day = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate(), DIGEST_HOUR_UTC));
  let at = day.getTime() > now.getTime() ? day.getTime() - DAY_MS : day.getTime();
  if (frequency === 'weekly') {
    // getUTCDay: Sunday 0, Monday 1
    const sinceMonday = (new Date(at).getUTCDay() + 6) % 7;
    at -= sinceMonday * DAY_MS;
  }
  return new Date(at);
}

/** The first digest moment after `since`: when the next digest is due. */
export function nextDigestAfter(frequency: DigestFrequency, since: Date): Date {
  const last = digestMomentAtOrBefore(frequency, since);
  return new Date(last.getTime() + (frequency === 'weekly' ? 7 : 1) * DAY_MS);
}

/** A follow is due once a digest moment has passed since its window opened. */
export const isDue = (frequency: DigestFrequency, since: Date, now: Date) => digestMomentAtOrBefore(frequency, now) > since;
