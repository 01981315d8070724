import { asc, desc, eq, or, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { Db } from '../../db/client';
import { shops, userChanges, users } from '../../db/schema/users';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import type { AdminShop, AdminUser, AdminUserPatch, UserChange, UserChangeField } from '../../../shared/schemas/admin';
import { can, permissionsOf, type Role } from '../../../shared/roles';

export type AdminDeps = {
  db: Db;
  clock: Clock;
  /** ends every session of a user; returns how many ended */
  endSessions: (userId: number) => number;
};

const listLimit = 200;

/** A role that loses anything the old one could do is a lowering (shop → member, admin → moderator, moderator → shop). */
export const isLowering = (from: Role, to: Role) => permissionsOf(from).some((p) => !can(to, p));

const userColumns = {
  id: users.id,
  login: users.login,
  name: users.name,
  email: users.email,
  avatarUrl: users.avatarUrl,
  role: users.role,
  suspendedAt: users.suspendedAt,
  lastSignInAt: users.lastSignInAt,
  createdAt: users.createdAt,
  shopId: shops.id,
  shopSlug: shops.slug,
  shopName: shops.name,
};

type UserRow = NonNullable<ReturnType<ReturnType<typeof selectUsers>['get']>>;

function toAdminUser(r: UserRow, viewerId: number | null): AdminUser {
  return {
    id: r.id,
    isYou: r.id === viewerId,
    login: r.login,
    name: r.name,
    email: r.email,
    avatarUrl: r.avatarUrl,
    role: r.role,
    shop:
      r.shopId !== null && r.shopSlug !== null && r.shopName !== null
        ? { id: r.shopId, slug: r.shopSlug, name: r.shopName }
        : null,
    suspended: r.suspendedAt !== null,
    lastSignInAt: r.lastSignInAt?.toISOString() ?? null,
    createdAt: r.createdAt.toISOString(),
  };
}

function selectUsers(db: Db) {
  return db.select(userColumns).from(users).leftJoin(shops, eq(shops.id, users.shopId));
}

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/** Users whose login or name contains the search (any case), by login. */
export function listUsers(db: Db, q: string, viewerId: number | null = null): AdminUser[] {
  const query = selectUsers(db);
  const pattern = `%${escapeLike(q.toLowerCase())}%`;
  const rows = q
    ? query.where(
        or(sql`lower(${users.login}) like ${pattern} escape '\\'`, sql`lower(${users.name}) like ${pattern} escape '\\'`),
      )
    : query;
  return rows
    .orderBy(asc(users.login))
    .limit(listLimit)
    .all()
    .map((r) => toAdminUser(r, viewerId));
}

export function getUser(db: Db, id: number, viewerId: number | null = null): AdminUser {
  const row = selectUsers(db).where(eq(users.id, id)).get();
  if (!row) throw AppError.notFound('That user');
  return toAdminUser(row, viewerId);
}

export function listShops(db: Db): AdminShop[] {
  return db.select({ id: shops.id, slug: shops.slug, name: shops.name }).from(shops).orderBy(asc(shops.name)).all();
}

export type UpdateUserInput = {
  /** who makes the change; null from the shell */
  actorId: number | null;
  userId: number;
  patch: AdminUserPatch;
};

/**
 * Changes role, shop link and suspension, recording each changed field (who, when, from → to).
 * A shop link belongs to shop accounts only, so leaving the shop role drops it. Suspension and a
 * lowered role end all the user's sessions at once: they sign in again under the new rules.
 */
export function updateUser({ db, clock, endSessions }: AdminDeps, { actorId, userId, patch }: UpdateUserInput) {
  const now = clock.now();
  const result = db.transaction(() => {
    const current = getUser(db, userId);
    if (actorId === userId) {
      if (patch.role !== undefined && patch.role !== current.role) {
        throw AppError.forbidden('You cannot change your own role. Ask another admin to do it.');
      }
      if (patch.suspended) throw AppError.forbidden('You cannot suspend your own account.');
    }
    const role = patch.role ?? current.role;
    let shop: AdminShop | null = current.shop;
    if (patch.shopId !== undefined && patch.shopId !== null) {
      if (role !== 'shop') {
        throw AppError.invalid('Only shop accounts are linked to a shop.', {
          shopId: 'Make this a shop account first, or leave the shop empty',
        });
      }
      const found = db
        .select({ id: shops.id, slug: shops.slug, name: shops.name })
        .from(shops)
        .where(eq(shops.id, patch.shopId))
        .get();
      if (!found) throw AppError.invalid('There is no such shop.', { shopId: 'Choose a shop from the list' });
      shop = found;
    } else if (patch.shopId === null || role !== 'shop') {
      shop = null;
    }
    const suspended = patch.suspended ?? current.suspended;

    const changes: { field: UserChangeField; from: string | null; to: string | null }[] = [];
    if (role !== current.role) changes.push({ field: 'role', from: current.role, to: role });
    if ((shop?.id ?? null) !== (current.shop?.id ?? null))
      changes.push({ field: 'shop', from: current.shop?.slug ?? null, to: shop?.slug ?? null });
    if (suspended !== current.suspended)
      changes.push({ field: 'suspended', from: String(current.suspended), to: String(suspended) });
    if (changes.length === 0) return { changed: false, endSessions: false };

    db.update(users)
      .set({
        role,
        shopId: shop?.id ?? null,
        ...(suspended !== current.suspended ? { suspendedAt: suspended ? now : null } : {}),
        updatedAt: now,
      })
      .where(eq(users.id, userId))
      .run();
    db.insert(userChanges)
      .values(changes.map((c) => ({ userId, actorId, field: c.field, fromValue: c.from, toValue: c.to, at: now })))
      .run();
    return { changed: true, endSessions: (suspended && !current.suspended) || isLowering(current.role, role) };
  });
  const sessionsEnded = result.endSessions ? endSessions(userId) : 0;
  return { user: getUser(db, userId, actorId), changed: result.changed, sessionsEnded };
}

export function listChanges(db: Db, userId: number): UserChange[] {
  getUser(db, userId);
  const actor = alias(users, 'actor');
  return db
    .select({
      id: userChanges.id,
      field: userChanges.field,
      from: userChanges.fromValue,
      to: userChanges.toValue,
      at: userChanges.at,
      actorLogin: actor.login,
      actorName: actor.name,
    })
    .from(userChanges)
    .leftJoin(actor, eq(actor.id, userChanges.actorId))
    .where(eq(userChanges.userId, userId))
    .orderBy(desc(userChanges.at), desc(userChanges.id))
    .all()
    .map(({ actorLogin, actorName, at, field, ...c }) => ({
      ...c,
      field: field as UserChangeField,
      at: at.toISOString(),
      actor: actorLogin !== null ? { login: actorLogin, name: actorName ?? actorLogin } : null,
    }));
}

/** The shell's way to set a role (the first admin of a deployment): same rules and record, no actor. */
export function setRoleByLogin(deps: AdminDeps, login: string, role: AdminUser['role']) {
  const row = deps.db
    .select({ id: users.id })
    .from(users)
    .where(eq(sql`lower(${users.login})`, login.toLowerCase()))
    .get();
  if (!row) throw AppError.notFound(`A user with the login "${login}"`);
  return updateUser(deps, { actorId: null, userId: row.id, patch: { role } });
}
