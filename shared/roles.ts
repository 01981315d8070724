import { z } from 'zod';

export const roles = ['member', 'shop', 'moderator', 'admin'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

export const permissions = ['submit', 'report_fitted', 'flag', 'review', 'manage_shop_links', 'manage_users', 'manage_catalogue'] as const;
export type Permission = (typeof permissions)[number];

const grants: Record<Role, readonly Permission[]> = {
  member: ['submit', 'report_fitted', 'flag'],
  shop: ['submit', 'report_fitted', 'flag', 'manage_shop_links'],
  moderator: ['submit', 'report_fitted', 'flag', 'review'],
  admin: ['submit', 'report_fitted', 'flag', 'review', 'manage_users', 'manage_catalogue'],
};

export const roleLabels: Record<Role, string> = {
  member: 'Member',
  shop: 'Shop',
  moderator: 'Moderator',
  admin: 'Admin',
};

/** what each permission lets a person do, in the words an admin confirms a role change with */
export const permissionLabels: Record<Permission, string> = {
  submit: 'record swaps and propose corrections',
  report_fitted: 'report that they fitted a swap',
  flag: 'flag a swap sheet that looks wrong',
  review: 'decide at the review desk: publish revisions, send them back for rework, resolve flags',
  manage_shop_links: 'make shop links for their shop',
  manage_users: 'change members’ roles, link shop accounts and suspend accounts',
  manage_catalogue: 'edit catalogue chassis and parts, merge duplicates and approve proposed chassis',
};

export function can(role: Role | null | undefined, permission: Permission): boolean {
  return role ? grants[role].includes(permission) : false;
}

export function permissionsOf(role: Role): readonly Permission[] {
  return grants[role];
}

/**
 * Who may read a revision that is not public. Its author always; reviewers only once it has been sent to
 * review: a never-submitted draft (and its photos) is private to its author, even from the review desk.
 */
export function canSeeUnpublishedRevision(
  viewer: { id: number; role: Role } | null | undefined,
  revision: { authorId: number; status: string },
): boolean {
  if (!viewer) return false;
  if (viewer.id === revision.authorId) return true;
  return revision.status !== 'draft' && can(viewer.role, 'review');
}
