import { Router, type RequestHandler } from 'express';
import multer, { MulterError } from 'multer';
import { rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { requirePermission, requireUser } from '../../middleware/require-role';
import { AppError } from '../../lib/app-error';
import { idParamSchema, slugSchema } from '../../../shared/schemas/params';
import {
  createFittedReportSchema,
  moderationListQuerySchema,
  updateFittedReportSchema,
} from '../../../shared/schemas/fitted-reports';
import { moderationReports, releaseFittedReport } from './fitted-report-moderation';
import { MAX_PHOTO_BYTES } from '../photos/photo-processing';
import { uploadError } from '../photos/photo-upload';
import { cacheByReader } from '../../lib/cache-policy';
import {
  createFittedReport,
  deleteFittedReport,
  listFittedReports,
  setFittedReportHidden,
  updateFittedReport,
} from './fitted-reports.service';

const slugParams = z.object({ slug: slugSchema });

/** One optional photo per report, in memory, only on the two routes that take one. */
function photoUpload(): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 12, fieldSize: 4096, parts: 14 },
  }).single('photo');
  return (req, res, next) => {
    if (!req.is('multipart/form-data')) return next();
    upload(req, res, (err: unknown) => {
      if (err instanceof MulterError && (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT')) {
        const message = 'Send one photo, in the "photo" field.';
        return next(new AppError('upload_rejected', message, 400, { photo: message }));
      }
      next(uploadError(err, 'photo'));
    });
  };
}

export function fittedReportsRouter({ db, storage, clock, config }: AppDeps) {
  const router = Router();
  const deps = { db, storage, clock, quotaBytes: config.storageQuotaBytes };
  const writeLimit = rateLimit({ windowMs: 15 * 60_000, limit: 60, standardHeaders: 'draft-8', legacyHeaders: false });
  const upload = photoUpload();

  router.get(
    '/swaps/:slug/fitted-reports',
    validated({ params: slugParams }, ({ params }, req, res) => {
      cacheByReader(req, res);
      res.json(listFittedReports(db, params.slug, req.user));
    }),
  );

  router.post(
    '/swaps/:slug/fitted-reports',
    requirePermission('report_fitted'),
    writeLimit,
    upload,
    validated({ params: slugParams, body: createFittedReportSchema }, async ({ params, body }, req, res) => {
      const view = await createFittedReport(
        deps,
        params.slug,
        req.user!,
        body,
        req.file ? { buffer: req.file.buffer } : undefined,
      );
      res.status(201).json(view);
    }),
  );

  router.patch(
    '/swaps/:slug/fitted-reports/mine',
    requireUser,
    writeLimit,
    upload,
    validated({ params: slugParams, body: updateFittedReportSchema }, async ({ params, body }, req, res) => {
      res.json(await updateFittedReport(deps, params.slug, req.user!, body, req.file ? { buffer: req.file.buffer } : undefined));
    }),
  );

  router.delete(
    '/swaps/:slug/fitted-reports/mine',
    requireUser,
    validated({ params: slugParams }, async ({ params }, req, res) => {
      await deleteFittedReport(deps, params.slug, req.user!);
      res.status(204).end();
    }),
  );

  for (const [action, hidden] of [
    ['hide', true],
    ['unhide', false],
  ] as const) {
    router.post(
      `/fitted-reports/:id/${action}`,
      requirePermission('review'),
      validated({ params: z.object({ id: idParamSchema }) }, ({ params }, req, res) => {
        const result = setFittedReportHidden(deps, params.id, req.user!, hidden);
        req.log?.info(
          { event: `fitted_report_${action}`, reportId: params.id, moderatorId: req.user!.id },
          `fitted report ${action}`,
        );
        res.json(result);
      }),
    );
  }

  router.post(
    '/fitted-reports/:id/release',
    requirePermission('review'),
    validated({ params: z.object({ id: idParamSchema }) }, ({ params }, req, res) => {
      const result = releaseFittedReport(deps, params.id, req.user!);
      req.log?.info({ event: 'fitted_report_release', reportId: params.id, moderatorId: req.user!.id }, 'fitted report released');
      res.json(result);
    }),
  );

  router.get(
    '/fitted-reports',
    requirePermission('review'),
    validated({ query: moderationListQuerySchema }, ({ query }, _req, res) => {
      res.set('Cache-Control', 'private, no-store').json(moderationReports(db, query.show));
    }),
  );

  return router;
}
