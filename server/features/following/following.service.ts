import crypto from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { cars, chassis, follows } from '../../db/schema/index';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import type { CreateFollow, DigestFrequency, FollowItem } from '../../../shared/schemas/following';
import { chassisLabel } from '../../../shared/chassis-label';
import { nextDigestAfter } from './digest-schedule';

export { chassisLabel };

type CarRow = typeof cars.$inferSelect;

/** Every follow of a member with what it names; a car's follow names the car's chassis too. */
function followRows(db: Db, where: ReturnType<typeof eq>) {
  const direct = db
    .select({ follow: follows, chassis })
    .from(follows)
    .innerJoin(chassis, eq(chassis.id, follows.chassisId))
    .where(where)
    .all()
    .map((r) => ({ ...r, car: null as CarRow | null }));
  const viaCar = db
    .select({ follow: follows, car: cars, chassis })
    .from(follows)
    .innerJoin(cars, eq(cars.id, follows.carId))
    .innerJoin(chassis, eq(chassis.id, cars.chassisId))
    .where(where)
    .all();
  return [...direct, ...viaCar].sort(
    (a, b) => a.follow.createdAt.getTime() - b.follow.createdAt.getTime() || a.follow.id - b.follow.id,
  );
}

export type FollowTarget = ReturnType<typeof followRows>[number];

export function followItem({ follow, chassis: c, car }: FollowTarget): FollowItem {
  const ch = { slug: c.slug, label: chassisLabel(c) };
  return {
    id: follow.id,
    frequency: follow.frequency,
    target: car ? { kind: 'car', car: { id: car.id, nickname: car.nickname }, chassis: ch } : { kind: 'chassis', chassis: ch },
    createdAt: follow.createdAt.toISOString(),
    since: follow.since.toISOString(),
    nextDigestAt: nextDigestAfter(follow.frequency, follow.since).toISOString(),
  };
}

export function listFollows(db: Db, userId: number): FollowItem[] {
  return followRows(db, eq(follows.userId, userId)).map(followItem);
}

export function followById(db: Db, id: number): FollowTarget | undefined {
  return followRows(db, eq(follows.id, id))[0];
}

function ownFollow(db: Db, userId: number, id: number) {
  const row = followById(db, id);
  // someone else's follow reads as missing: its id says nothing about another member
  if (!row || row.follow.userId !== userId) throw AppError.notFound('That follow');
  return row;
}

/**
 * Follows a catalogue chassis, or one of the member's own cars. Following what is already followed
 * changes nothing but the frequency, so a second click never makes a second digest.
 */
export function createFollow(db: Db, clock: Clock, userId: number, input: CreateFollow): { item: FollowItem; created: boolean } {
  const now = clock.now();
  let target: { chassisId: number } | { carId: number };
  if (input.carId !== undefined) {
    const car = db
      .select()
      .from(cars)
      .where(and(eq(cars.id, input.carId), eq(cars.userId, userId)))
      .get();
    if (!car) throw AppError.invalid('Follow one of your own cars.', { carId: 'Not one of your cars' });
    target = { carId: car.id };
  } else {
    const c = db.select().from(chassis).where(eq(chassis.slug, input.chassisSlug!)).get();
    if (!c || c.proposed) throw AppError.invalid('Follow a chassis from the catalogue.', { chassisSlug: 'No such chassis' });
    target = { chassisId: c.id };
  }
  const existing = db
    .select()
    .from(follows)
    .where(
      and(
        eq(follows.userId, userId),
        'carId' in target ? eq(follows.carId, target.carId) : eq(follows.chassisId, target.chassisId),
      ),
    )
    .get();
  if (existing) {
    if (existing.frequency !== input.frequency)
      db.update(follows).set({ frequency: input.frequency, updatedAt: now }).where(eq(follows.id, existing.id)).run();
    return { item: followItem(followById(db, existing.id)!), created: false };
  }
  const row = db
    .insert(follows)
    .values({ userId, ...target, frequency: input.frequency, since: now, createdAt: now, updatedAt: now })
    .returning()
    .get();
  return { item: followItem(followById(db, row.id)!), created: true };
}

export function setFollowFrequency(db: Db, clock: Clock, userId: number, id: number, frequency: DigestFrequency): FollowItem {
  ownFollow(db, userId, id);
  db.update(follows).set({ frequency, updatedAt: clock.now() }).where(eq(follows.id, id)).run();
  return followItem(followById(db, id)!);
}

export function stopFollow(db: Db, userId: number, id: number) {
  ownFollow(db, userId, id);
  db.delete(follows).where(eq(follows.id, id)).run();
}

// --- one-click unsubscribe: the token is the follow's id signed with the server's secret ---

const signature = (secret: string, id: number) =>
  crypto.createHmac('sha256', secret).update(`unsubscribe:follow:${id}`).digest('base64url').slice(0, 32);

export const unsubscribeToken = (secret: string, id: number) => `${id}.${signature(secret, id)}`;

/** The follow id a token names, or null when it is not one this server signed. */
export function followIdFromToken(secret: string, token: string): number | null {
  const m = /^([1-9][0-9]{0,15})\.([A-Za-z0-9_-]{32})$/.exec(token);
  if (!m) return null;
  const id = Number(m[1]);
  const expected = Buffer.from(signature(secret, id));
  const given = Buffer.from(m[2]!);
  return crypto.timingSafeEqual(expected, given) ? id : null;
}

export type Unsubscribe = { kind: 'invalid' } | { kind: 'gone' } | { kind: 'found'; target: FollowTarget };

/** What a token points at, without changing anything (the confirm page). */
export function unsubscribeTarget(db: Db, secret: string, token: string): Unsubscribe {
  const id = followIdFromToken(secret, token);
  if (id === null) return { kind: 'invalid' };
  const target = followById(db, id);
  return target ? { kind: 'found', target } : { kind: 'gone' };
}

/** Stops the follow the token names; stopping one already stopped is not an error. */
export function unsubscribe(db: Db, secret: string, token: string): Unsubscribe {
  const found = unsubscribeTarget(db, secret, token);
  if (found.kind === 'found') db.delete(follows).where(eq(follows.id, found.target.follow.id)).run();
  return found;
}
