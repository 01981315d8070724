import session from 'express-session';
import { setImmediate as yieldToEvents } from 'node:timers/promises';
import { and, eq, inArray, lt, lte, or } from 'drizzle-orm';
import type { Db } from '../db/client';
import { sessions } from '../db/schema/users';
import type { Clock } from '../lib/clock';
import { isBusy } from '../db/busy';

export type SessionLifetimes = {
  /** a session unused this long ends (every request pushes it further) */
  idleMs: number;
  /** a session ends this long after it began (sign-in regenerates it), however busy */
  absoluteMs: number;
};

const day = 24 * 60 * 60 * 1000;
export const defaultLifetimes: SessionLifetimes = { idleMs: 14 * day, absoluteMs: 30 * day };

/** Rolling the expiry on every request would mean a write per request; a minute of slack is plenty. */
const touchSlackMs = 60 * 1000;
const sweepEveryMs = 60 * 60 * 1000;
/** rows deleted per statement: each batch is a short write, and other requests run between batches */
const sweepBatch = 500;

type Row = typeof sessions.$inferSelect;

/**
 * Set on a request's session when its answer is a 503 for a busy database: the store then leaves the
 * session as it is instead of waiting for the same lock a second time to save or touch it.
 */
export const skipSessionWrite = Symbol('skipSessionWrite');
const skipped = (sess: session.SessionData) => Boolean((sess as unknown as Record<symbol, unknown>)[skipSessionWrite]);

function userIdOf(sess: session.SessionData): number | null {
  const user = (sess as { passport?: { user?: unknown } }).passport?.user;
  return typeof user === 'number' ? user : null;
}

/**
 * express-session store over the app's own `sessions` table. Expiry is the store's own
 * (idle and absolute, by the app's clock), not the cookie's, so the server decides when a session ends.
 */
export class SqliteSessionStore extends session.Store {
  private readonly timer: NodeJS.Timeout;
  /** each loaded session's expiry, so a touch writes only when the expiry really moves */
  private readonly loadedExpiry = new Map<string, number>();

  constructor(
    private readonly db: Db,
    private readonly clock: Clock,
    readonly lifetimes: SessionLifetimes = defaultLifetimes,
  ) {
    super();
    this.timer = setInterval(() => {
      // a closed database (tests, shutdown) is not worth a crash; the next start sweeps
      this.sweep().catch(() => undefined);
    }, sweepEveryMs);
    this.timer.unref();
  }

  private now() {
    return this.clock.now().getTime();
  }

  private alive(row: Row, now: number) {
    return row.expiresAt > now && row.createdAt + this.lifetimes.absoluteMs > now;
  }

  /** Deletes every ended session, a small batch at a time, letting other work run in between; returns how many. */
  async sweep(): Promise<number> {
    let total = 0;
    for (;;) {
      const now = this.now();
      const ended = this.db
        .select({ sid: sessions.sid })
        .from(sessions)
        .where(or(lte(sessions.expiresAt, now), lte(sessions.createdAt, now - this.lifetimes.absoluteMs)))
        .limit(sweepBatch);
      const deleted = this.db.delete(sessions).where(inArray(sessions.sid, ended)).run().changes;
      total += deleted;
      if (deleted < sweepBatch) return total;
      await yieldToEvents();
    }
  }

  override get(sid: string, cb: (err: unknown, session?: session.SessionData | null) => void) {
    try {
      const row = this.db.select().from(sessions).where(eq(sessions.sid, sid)).get();
      if (!row) return cb(null, null);
      if (!this.alive(row, this.now())) {
        this.db.delete(sessions).where(eq(sessions.sid, sid)).run();
        return cb(null, null);
      }
      if (this.loadedExpiry.size > 10_000) this.loadedExpiry.clear();
      this.loadedExpiry.set(sid, row.expiresAt);
      cb(null, JSON.parse(row.data) as session.SessionData);
    } catch (err) {
      cb(err);
    }
  }

  override set(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void) {
    this.loadedExpiry.delete(sid);
    if (skipped(sess)) return cb?.();
    try {
      const now = this.now();
      const values = { data: JSON.stringify(sess), userId: userIdOf(sess), expiresAt: now + this.lifetimes.idleMs };
      this.db
        .insert(sessions)
        .values({ sid, ...values, createdAt: now })
        .onConflictDoUpdate({ target: sessions.sid, set: values })
        .run();
      cb?.();
    } catch (err) {
      cb?.(err);
    }
  }

  override touch(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void) {
    const loaded = this.loadedExpiry.get(sid);
    this.loadedExpiry.delete(sid);
    const expiresAt = this.now() + this.lifetimes.idleMs;
    // most requests come within the slack of the last push: no write, so no lock to wait for
    if (skipped(sess) || (loaded !== undefined && loaded >= expiresAt - touchSlackMs)) return cb?.();
    try {
      this.db
        .update(sessions)
        .set({ expiresAt })
        .where(and(eq(sessions.sid, sid), lt(sessions.expiresAt, expiresAt - touchSlackMs)))
        .run();
      cb?.();
    } catch (err) {
      // pushing the expiry can wait for the next request; a busy database is no reason to fail this one
      cb?.(isBusy(err) ? undefined : err);
    }
  }

  override destroy(sid: string, cb?: (err?: unknown) => void) {
    this.loadedExpiry.delete(sid);
    try {
      this.db.delete(sessions).where(eq(sessions.sid, sid)).run();
      cb?.();
    } catch (err) {
      cb?.(err);
    }
  }

  override clear(cb?: (err?: unknown) => void) {
    try {
      this.db.delete(sessions).run();
      cb?.();
    } catch (err) {
      cb?.(err);
    }
  }

  override length(cb: (err: unknown, length?: number) => void) {
    try {
      const now = this.now();
      const rows = this.db.select().from(sessions).all();
      cb(null, rows.filter((r) => this.alive(r, now)).length);
    } catch (err) {
      cb(err);
    }
  }

  /** Ends every session of one user (sign out everywhere, suspension, a lowered role). Returns how many ended. */
  destroyAllFor(userId: number): number {
    return endAllSessions(this.db, userId);
  }

  close() {
    clearInterval(this.timer);
  }
}

/** Ends every session of one user; also for the shell, which has no store. Returns how many ended. */
export function endAllSessions(db: Db, userId: number): number {
  return db.delete(sessions).where(eq(sessions.userId, userId)).run().changes;
}

/** Cookie settings: `__Host-` and Secure behind https (no Domain, Path=/), Lax so the provider's redirect back carries it. */
export function sessionCookie(appUrl: string) {
  const secure = appUrl.startsWith('https:');
  return {
    name: secure ? '__Host-swapyard.sid' : 'swapyard.sid',
    options: { httpOnly: true, sameSite: 'lax' as const, secure, path: '/' },
  };
}

export function sessionMiddleware({ store, secret, appUrl }: { store: SqliteSessionStore; secret: string; appUrl: string }) {
  const cookie = sessionCookie(appUrl);
  return session({
    name: cookie.name,
    secret,
    store,
    resave: false,
    saveUninitialized: false,
    // each answer pushes the cookie's expiry along with the store's idle lifetime
    rolling: true,
    unset: 'destroy',
    cookie: { ...cookie.options, maxAge: store.lifetimes.idleMs },
  });
}
