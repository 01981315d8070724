import { Router } from 'express';
import { requirePermission } from '../../middleware/require-role';
import { validated } from '../../middleware/validate';
import { adminUserParamsSchema, adminUserPatchSchema, adminUsersQuerySchema } from '../../../shared/schemas/admin';
import type {
  AdminShopsResponse,
  AdminUserResponse,
  AdminUsersResponse,
  UserChangesResponse,
} from '../../../shared/schemas/admin';
import { listChanges, listShops, listUsers, updateUser, type AdminDeps } from './admin.service';

export function adminRouter(deps: AdminDeps) {
  const { db } = deps;
  const router = Router();
  router.use('/admin', requirePermission('manage_users'));

  router.get(
    '/admin/users',
    validated({ query: adminUsersQuerySchema }, ({ query }, req, res) => {
      const body: AdminUsersResponse = { users: listUsers(db, query.q, req.user!.id) };
      res.json(body);
    }),
  );

  router.patch(
    '/admin/users/:id',
    validated({ params: adminUserParamsSchema, body: adminUserPatchSchema }, ({ params, body }, req, res) => {
      const { user, changed, sessionsEnded } = updateUser(deps, { actorId: req.user!.id, userId: params.id, patch: body });
      if (changed)
        req.log?.info(
          { event: 'user_changed', actorId: req.user!.id, userId: user.id, patch: body, sessionsEnded },
          'user changed by admin',
        );
      const out: AdminUserResponse = { user, sessionsEnded };
      res.json(out);
    }),
  );

  router.get(
    '/admin/users/:id/changes',
    validated({ params: adminUserParamsSchema }, ({ params }, _req, res) => {
      const body: UserChangesResponse = { changes: listChanges(db, params.id) };
      res.json(body);
    }),
  );

  router.get('/admin/shops', (_req, res) => {
    const body: AdminShopsResponse = { shops: listShops(db) };
    res.json(body);
  });

  return router;
}
