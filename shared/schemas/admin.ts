import { z } from 'zod';
import { roleSchema, type Role } from '../roles';

export const adminUsersQuerySchema = z.object({
  q: z.string().trim().max(80, 'A search is at most 80 characters').optional().default(''),
});

export const adminUserParamsSchema = z.object({
  id: z.coerce.number().int().positive('A user id is a positive whole number').max(Number.MAX_SAFE_INTEGER),
});

export const adminUserPatchSchema = z
  .object({
    role: roleSchema.optional(),
    shopId: z.number().int().positive('Choose a shop from the list').nullable().optional(),
    suspended: z.boolean().optional(),
  })
  .strict()
  .refine((v) => v.role !== undefined || v.shopId !== undefined || v.suspended !== undefined, {
    message: 'Send a role, a shop or a suspension to change',
  });
export type AdminUserPatch = z.infer<typeof adminUserPatchSchema>;

export type AdminShop = { id: number; slug: string; name: string };

export type AdminUser = {
  id: number;
  /** the admin looking at the list (who cannot demote or suspend themselves) */
  isYou: boolean;
  login: string;
  name: string;
  email: string | null;
  avatarUrl: string | null;
  role: Role;
  shop: AdminShop | null;
  suspended: boolean;
  lastSignInAt: string | null;
  createdAt: string;
};

export const userChangeFields = ['role', 'shop', 'suspended'] as const;
export type UserChangeField = (typeof userChangeFields)[number];

export type UserChange = {
  id: number;
  field: UserChangeField;
  from: string | null;
  to: string | null;
  at: string;
  /** null when the change came from the shell (`npm run user:role`) */
  actor: { login: string; name: string } | null;
};

export type AdminUsersResponse = { users: AdminUser[] };
export type AdminUserResponse = { user: AdminUser; sessionsEnded: number };
export type UserChangesResponse = { changes: UserChange[] };
export type AdminShopsResponse = { shops: AdminShop[] };
