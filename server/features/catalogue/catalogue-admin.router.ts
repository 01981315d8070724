import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { requirePermission } from '../../middleware/require-role';
import { validated } from '../../middleware/validate';
import {
  adminCatalogueQuerySchema,
  catalogueIdParamsSchema,
  chassisPatchSchema,
  mergeBodySchema,
  partPatchSchema,
  type AdminChassisListResponse,
  type AdminChassisResponse,
  type AdminPartListResponse,
  type AdminPartResponse,
  type CatalogueChangesResponse,
} from '../../../shared/schemas/catalogue-admin';
import { approveChassis, editChassis, editPart, listAdminChassis, listAdminParts } from './catalogue-admin.service';
import { mergeChassis, mergePart } from './catalogue-merge.service';
import { listCatalogueChanges } from './catalogue-changes';

const changesQuerySchema = z.object({
  subject: z.enum(['chassis', 'part']).optional(),
  id: z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER).optional(),
});

/** The admins' catalogue desk: edit chassis and parts, merge duplicates, approve proposed chassis. */
export function catalogueAdminRouter({ db, clock }: AppDeps) {
  const deps = { db, clock };
  const router = Router();
  router.use('/admin/catalogue', requirePermission('manage_catalogue'));
  const log = (req: Parameters<Parameters<typeof validated>[1]>[1], event: string, detail: object) =>
    req.log?.info({ event, actorId: req.user!.id, ...detail }, 'catalogue changed by admin');

  router.get(
    '/admin/catalogue/chassis',
    validated({ query: adminCatalogueQuerySchema }, ({ query }, _req, res) => {
      const body: AdminChassisListResponse = { chassis: listAdminChassis(db, query.q) };
      res.json(body);
    }),
  );
  router.patch(
    '/admin/catalogue/chassis/:id',
    validated({ params: catalogueIdParamsSchema, body: chassisPatchSchema }, ({ params, body }, req, res) => {
      const out: AdminChassisResponse = { chassis: editChassis(deps, req.user!.id, params.id, body) };
      log(req, 'chassis_edited', { chassisId: params.id, fields: Object.keys(body) });
      res.json(out);
    }),
  );
  router.post(
    '/admin/catalogue/chassis/:id/approve',
    validated({ params: catalogueIdParamsSchema }, ({ params }, req, res) => {
      const out: AdminChassisResponse = { chassis: approveChassis(deps, req.user!.id, params.id) };
      log(req, 'chassis_approved', { chassisId: params.id });
      res.json(out);
    }),
  );
  router.post(
    '/admin/catalogue/chassis/:id/merge',
    validated({ params: catalogueIdParamsSchema, body: mergeBodySchema }, ({ params, body }, req, res) => {
      const out = mergeChassis(deps, req.user!.id, params.id, body.intoId);
      log(req, 'chassis_merged', { chassisId: params.id, intoId: body.intoId, moved: out.moved });
      res.json(out);
    }),
  );

  router.get(
    '/admin/catalogue/parts',
    validated({ query: adminCatalogueQuerySchema }, ({ query }, _req, res) => {
      const body: AdminPartListResponse = { parts: listAdminParts(db, query.q) };
      res.json(body);
    }),
  );
  router.patch(
    '/admin/catalogue/parts/:id',
    validated({ params: catalogueIdParamsSchema, body: partPatchSchema }, ({ params, body }, req, res) => {
      const out: AdminPartResponse = { part: editPart(deps, req.user!.id, params.id, body) };
      log(req, 'part_edited', { partId: params.id, fields: Object.keys(body) });
      res.json(out);
    }),
  );
  router.post(
    '/admin/catalogue/parts/:id/merge',
    validated({ params: catalogueIdParamsSchema, body: mergeBodySchema }, ({ params, body }, req, res) => {
      const out = mergePart(deps, req.user!.id, params.id, body.intoId);
      log(req, 'part_merged', { partId: params.id, intoId: body.intoId, moved: out.moved });
      res.json(out);
    }),
  );

  router.get(
    '/admin/catalogue/changes',
    validated({ query: changesQuerySchema }, ({ query }, _req, res) => {
      const of = query.subject && query.id ? { subject: query.subject, id: query.id } : undefined;
      const body: CatalogueChangesResponse = { changes: listCatalogueChanges(db, of) };
      res.json(body);
    }),
  );
  return router;
}
