import { and, desc, eq, gt, inArray, lt, lte, ne, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, follows, revisions, swaps, users } from '../../db/schema/index';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import type { Mailer } from '../../mail/mailer';
import { followDigest, type DigestSwap } from '../../mail/messages';
import { digestFrequencies } from '../../../shared/schemas/following';
import { digestMomentAtOrBefore } from './digest-schedule';
import { chassisLabel, followById, unsubscribeToken, type FollowTarget } from './following.service';

// The digest of a follow: the swaps published on its chassis since its last digest, in one message
// through the outbox. Nothing published, no message; either way the window moves on.

export type DigestDeps = { db: Db; mailer: Mailer; clock: Clock; logger: Logger; appUrl: string; secret: string };

const published = ['approved', 'superseded'] as const;

/** Swaps on the chassis with a revision published in (since, until], newest first; the follower's own work is left out. */
export function swapsPublishedBetween(db: Db, chassisId: number, since: Date, until: Date, followerId: number): DigestSwap[] {
  const rows = db
    .select({
      swapId: swaps.id,
      slug: swaps.slug,
      axle: swaps.axle,
      number: revisions.number,
      title: sql<string>`json_extract(${revisions.data}, '$.title')`,
      reviewedAt: revisions.reviewedAt,
    })
    .from(revisions)
    .innerJoin(swaps, eq(swaps.id, revisions.swapId))
    .innerJoin(chassis, eq(chassis.id, swaps.chassisId))
    .where(
      and(
        eq(swaps.chassisId, chassisId),
        eq(chassis.proposed, false),
        sql`${swaps.currentRevisionId} is not null`,
        inArray(revisions.status, [...published]),
        gt(revisions.reviewedAt, since),
        lte(revisions.reviewedAt, until),
        ne(revisions.authorId, followerId),
      ),
    )
    .orderBy(desc(revisions.reviewedAt), desc(revisions.id))
    .all();
  const bySwap = new Map<number, (typeof rows)[number]>();
  for (const r of rows) if (!bySwap.has(r.swapId)) bySwap.set(r.swapId, r);
  const swapIds = [...bySwap.keys()];
  // a swap is new when nothing of it was published before the window opened
  const older = new Set(
    swapIds.length
      ? db
          .selectDistinct({ swapId: revisions.swapId })
          .from(revisions)
          .where(
            and(inArray(revisions.swapId, swapIds), inArray(revisions.status, [...published]), lte(revisions.reviewedAt, since)),
          )
          .all()
          .map((r) => r.swapId)
      : [],
  );
  return [...bySwap.values()].map((r) => ({
    slug: r.slug,
    title: r.title,
    axle: r.axle,
    revisionNumber: r.number,
    isNew: !older.has(r.swapId),
  }));
}

/** Writes one follow's digest (when something was published) and moves its window to `now`, in one transaction. */
function sendDigest(deps: DigestDeps, target: FollowTarget, now: Date): boolean {
  const { db } = deps;
  const { follow } = target;
  const user = db.select().from(users).where(eq(users.id, follow.userId)).get();
  if (!user) return false;
  const found = swapsPublishedBetween(db, target.chassis.id, follow.since, now, user.id);
  return db.transaction((tx) => {
    // the window moves only from where this run found it: a second process running the same digest changes nothing
    const moved = tx
      .update(follows)
      .set({ since: now })
      .where(and(eq(follows.id, follow.id), eq(follows.since, follow.since)))
      .run().changes;
    if (!moved || found.length === 0 || user.suspendedAt) return false;
    const appUrl = deps.appUrl.replace(/\/$/, '');
    deps.mailer.queue(
      tx,
      user,
      followDigest({
        appUrl,
        name: user.name || user.login,
        followed: target.car
          ? { kind: 'car', nickname: target.car.nickname, chassis: chassisLabel(target.chassis) }
          : { kind: 'chassis', chassis: chassisLabel(target.chassis), slug: target.chassis.slug },
        frequency: follow.frequency,
        swaps: found,
        unsubscribeUrl: `${appUrl}/unsubscribe/${unsubscribeToken(deps.secret, follow.id)}`,
      }),
    );
    return true;
  });
}

/** Sends every digest that is due at the clock's time; returns how many messages were written. */
export function sendDueDigests(deps: DigestDeps): { due: number; sent: number } {
  const now = deps.clock.now();
  let due = 0;
  let sent = 0;
  for (const frequency of digestFrequencies) {
    const moment = digestMomentAtOrBefore(frequency, now);
    const ids = deps.db
      .select({ id: follows.id })
      .from(follows)
      .where(and(eq(follows.frequency, frequency), lt(follows.since, moment)))
      .all();
    for (const { id } of ids) {
      const target = followById(deps.db, id);
      if (!target) continue;
      due++;
      if (sendDigest(deps, target, now)) sent++;
    }
  }
  return { due, sent };
}

/** Looks for due digests a minute after start and then every quarter hour, until stopped. */
export function startDigestScheduler(deps: DigestDeps, everyMs = 15 * 60 * 1000): () => void {
  const run = () => {
    try {
      const r = sendDueDigests(deps);
      if (r.due) deps.logger.info({ event: 'follow_digests', ...r }, 'follow digests sent');
    } catch (err) {
      deps.logger.error({ err, event: 'follow_digests_failed' }, 'follow digests could not be sent; the next run tries again');
    }
  };
  const first = setTimeout(run, 60_000);
  const timer = setInterval(run, everyMs);
  first.unref();
  timer.unref();
  return () => {
    clearTimeout(first);
    clearInterval(timer);
  };
}
