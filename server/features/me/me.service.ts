import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { shops, users } from '../../db/schema/users';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import type { MeUser, UpdateMeInput } from '../../../shared/schemas/me';

export function getMe(db: Db, userId: number): MeUser | null {
  const row = db
    .select({
      id: users.id,
      login: users.login,
      name: users.name,
      avatarUrl: users.avatarUrl,
      role: users.role,
      units: users.units,
      suspendedAt: users.suspendedAt,
      shopSlug: shops.slug,
      shopName: shops.name,
    })
    .from(users)
    .leftJoin(shops, eq(shops.id, users.shopId))
    .where(eq(users.id, userId))
    .get();
  if (!row || row.suspendedAt) return null;
  const { shopSlug, shopName, suspendedAt: _, ...user } = row;
  return { ...user, shop: shopSlug && shopName !== null ? { slug: shopSlug, name: shopName } : null };
}

export function updateMe(db: Db, clock: Clock, userId: number, input: UpdateMeInput): MeUser {
  const changes = db
    .update(users)
    .set({ ...input, updatedAt: clock.now() })
    .where(eq(users.id, userId))
    .run().changes;
  const me = changes ? getMe(db, userId) : null;
  if (!me) throw AppError.unauthorized('Your account is no longer signed in. Sign in again.');
  return me;
}
