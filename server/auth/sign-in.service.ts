import { and, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { users } from '../db/schema/users';
import type { Clock } from '../lib/clock';
import type { SessionUser } from '../middleware/require-role';
import { neutraliseSingleLine } from '../../shared/schemas/text';

/** What the provider tells us about the person signing in. */
export type ProviderProfile = {
  provider: 'github';
  providerId: string;
  login: string;
  name: string | null;
  email: string | null;
  avatarUrl: string | null;
};

export type SignInResult = { ok: true; user: SessionUser; created: boolean } | { ok: false; reason: 'suspended'; userId: number };

const sessionColumns = {
  id: users.id,
  login: users.login,
  name: users.name,
  email: users.email,
  avatarUrl: users.avatarUrl,
  role: users.role,
  shopId: users.shopId,
};

/** The signed-in user for this request, or null when the row is gone or suspended. */
export function loadSessionUser(db: Db, id: number): SessionUser | null {
  const row = db
    .select({ ...sessionColumns, suspendedAt: users.suspendedAt })
    .from(users)
    .where(eq(users.id, id))
    .get();
  if (!row || row.suspendedAt) return null;
  const { suspendedAt: _, ...user } = row;
  return user;
}

/** Logins are unique here; a provider rename can collide with someone else's old login. */
export function freeLogin(db: Db, wanted: string, exceptId: number | null): string {
  for (let n = 1; ; n++) {
    const candidate = n === 1 ? wanted : `${wanted}-${n}`;
    const holder = db.select({ id: users.id }).from(users).where(eq(users.login, candidate)).get();
    if (!holder || holder.id === exceptId) return candidate;
  }
}

/**
 * Creates the user on first sign-in (as a member) or refreshes login, avatar and e-mail from
 * the provider. The display name comes from the provider only while the member has none:
 * afterwards it is theirs to change in Swapyard.
 */
export function signInFromProfile(db: Db, clock: Clock, profile: ProviderProfile): SignInResult {
  const now = clock.now();
  // the provider's display name is written by its holder like any other field here
  const providerName = profile.name ? neutraliseSingleLine(profile.name).trim() : '';
  // better-sqlite3 runs the transaction on the one connection, so plain `db` calls inside belong to it
  return db.transaction(() => {
    const existing = db
      .select()
      .from(users)
      .where(and(eq(users.provider, profile.provider), eq(users.providerId, profile.providerId)))
      .get();
    if (existing?.suspendedAt) return { ok: false as const, reason: 'suspended' as const, userId: existing.id };
    // an account first made by an e-mail link, for the address the provider vouches for, gets this provider too
    const byEmail =
      !existing && profile.email
        ? db
            .select()
            .from(users)
            .where(and(eq(users.provider, 'email'), eq(users.providerId, profile.email.trim().toLowerCase())))
            .get()
        : undefined;
    if (byEmail?.suspendedAt) return { ok: false as const, reason: 'suspended' as const, userId: byEmail.id };
    if (byEmail) {
      db.update(users)
        .set({
          provider: profile.provider,
          providerId: profile.providerId,
          avatarUrl: profile.avatarUrl,
          lastSignInAt: now,
          updatedAt: now,
        })
        .where(eq(users.id, byEmail.id))
        .run();
      return { ok: true as const, user: loadSessionUser(db, byEmail.id)!, created: false };
    }
    if (existing) {
      db.update(users)
        .set({
          login: freeLogin(db, profile.login, existing.id),
          name: existing.name || providerName || profile.login,
          ...(profile.email ? { email: profile.email } : {}),
          avatarUrl: profile.avatarUrl,
          lastSignInAt: now,
          updatedAt: now,
        })
        .where(eq(users.id, existing.id))
        .run();
      return { ok: true as const, user: loadSessionUser(db, existing.id)!, created: false };
    }
    const inserted = db
      .insert(users)
      .values({
        provider: profile.provider,
        providerId: profile.providerId,
        login: freeLogin(db, profile.login, null),
        name: providerName || profile.login,
        email: profile.email,
        avatarUrl: profile.avatarUrl,
        role: 'member',
        lastSignInAt: now,
        createdAt: now,
        updatedAt: now,
      })
      .returning({ id: users.id })
      .get();
    return { ok: true as const, user: loadSessionUser(db, inserted.id)!, created: true };
  });
}
