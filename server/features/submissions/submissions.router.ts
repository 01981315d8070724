import { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { requirePermission, requireUser } from '../../middleware/require-role';
import { perUserLimit } from '../../middleware/rate-limit';
import { idParamSchema, photoIdSchema } from '../../../shared/schemas/params';
import {
  createSubmissionSchema,
  photoOrderSchema,
  rebaseSubmissionSchema,
  submitSubmissionSchema,
  updateSubmissionSchema,
} from '../../../shared/schemas/submissions';
import { MAX_PHOTO_BYTES } from '../photos/photo-processing';
import { readUpload } from '../photos/photo-upload';
import { storageUse } from '../photos/storage-quota';
import {
  createSubmission,
  deleteSubmission,
  getSubmission,
  keepDraft,
  listMySubmissions,
  submitForReview,
  withdrawFromReview,
  updateSubmission,
  type SubmissionDeps,
} from './submissions.service';
import {
  addPhotos,
  assertCanUpload,
  deletePhoto,
  MAX_PHOTOS_PER_REVISION,
  parseCaptions,
  updatePhotos,
} from './submission-photos.service';
import { rebasePreview, rebaseSubmission } from './submission-rebase.service';

const idParams = z.object({ id: idParamSchema });
const photoParams = z.object({ id: idParamSchema, photoId: photoIdSchema });

export function submissionsRouter({ db, clock, mailer, storage, logger, config }: AppDeps) {
  const router = Router();
  const deps: SubmissionDeps = { db, clock, mailer, storage, logger, appUrl: config.appUrl };
  const hour = 60 * 60 * 1000;
  const submitLimit = perUserLimit({ limit: config.rateLimits.submissionsPerHour, windowMs: hour, what: 'submissions' });
  const uploadLimit = perUserLimit({ limit: config.rateLimits.uploadsPerHour, windowMs: hour, what: 'photo uploads' });

  // memory only, and only on this route: the bytes never touch the disk before they are checked and re-encoded
  const upload = readUpload(
    multer({
      storage: multer.memoryStorage(),
      limits: {
        fileSize: MAX_PHOTO_BYTES,
        files: MAX_PHOTOS_PER_REVISION,
        fields: 4,
        fieldSize: 16 * 1024,
        fieldNameSize: 40,
        parts: MAX_PHOTOS_PER_REVISION + 4,
      },
    }).array('photos', MAX_PHOTOS_PER_REVISION),
    'photos',
  );

  router.post(
    '/submissions',
    requirePermission('submit'),
    submitLimit,
    validated({ body: createSubmissionSchema }, async ({ body }, req, res) => {
      res.status(201).json(await createSubmission(deps, req.user!, body));
    }),
  );

  router.get(
    '/submissions/:id',
    requireUser,
    validated({ params: idParams }, ({ params }, req, res) => {
      res.set('Cache-Control', 'private, no-store').json(getSubmission(db, req.user!, params.id));
    }),
  );

  router.patch(
    '/submissions/:id',
    requirePermission('submit'),
    validated({ params: idParams, body: updateSubmissionSchema }, ({ params, body }, req, res) => {
      res.json(updateSubmission(deps, req.user!, params.id, body));
    }),
  );

  router.post(
    '/submissions/:id/submit',
    requirePermission('submit'),
    submitLimit,
    validated({ params: idParams, body: submitSubmissionSchema }, ({ params, body }, req, res) => {
      res.json(submitForReview(deps, req.user!, params.id, body));
    }),
  );

  router.post(
    '/submissions/:id/withdraw',
    requirePermission('submit'),
    validated({ params: idParams }, ({ params }, req, res) => {
      res.json(withdrawFromReview(deps, req.user!, params.id));
    }),
  );

  router.post(
    '/submissions/:id/keep',
    requirePermission('submit'),
    validated({ params: idParams }, ({ params }, req, res) => {
      res.json(keepDraft(deps, req.user!, params.id));
    }),
  );

  router.get(
    '/submissions/:id/rebase',
    requirePermission('submit'),
    validated({ params: idParams }, ({ params }, req, res) => {
      res.set('Cache-Control', 'private, no-store').json(rebasePreview(db, req.user!, params.id));
    }),
  );

  router.post(
    '/submissions/:id/rebase',
    requirePermission('submit'),
    validated({ params: idParams, body: rebaseSubmissionSchema }, ({ params, body }, req, res) => {
      res.json(rebaseSubmission(deps, req.user!, params.id, body));
    }),
  );

  router.delete(
    '/submissions/:id',
    requirePermission('submit'),
    validated({ params: idParams }, async ({ params }, req, res) => {
      await deleteSubmission(deps, req.user!, params.id);
      res.status(204).end();
    }),
  );

  router.post(
    '/submissions/:id/photos',
    requirePermission('submit'),
    uploadLimit,
    validated({ params: idParams }, ({ params }, req, _res, next) => {
      assertCanUpload(deps, req.user!, params.id, config.storageQuotaBytes);
      next();
    }),
    upload,
    validated({ params: idParams }, async ({ params }, req, res) => {
      const files = (req.files as Express.Multer.File[] | undefined) ?? [];
      const captions = parseCaptions((req.body as Record<string, unknown> | undefined)?.captions);
      res.status(201).json({ photos: await addPhotos(deps, req.user!, params.id, files, captions, config.storageQuotaBytes) });
    }),
  );

  router.patch(
    '/submissions/:id/photos',
    requirePermission('submit'),
    validated({ params: idParams, body: photoOrderSchema }, ({ params, body }, req, res) => {
      res.json({ photos: updatePhotos(deps, req.user!, params.id, body.photos) });
    }),
  );

  router.delete(
    '/submissions/:id/photos/:photoId',
    requirePermission('submit'),
    validated({ params: photoParams }, async ({ params }, req, res) => {
      res.json({ photos: await deletePhoto(deps, req.user!, params.id, params.photoId) });
    }),
  );

  router.get('/me/storage', requireUser, (req, res) => {
    res.set('Cache-Control', 'private, no-store').json(storageUse(db, req.user!.id, config.storageQuotaBytes));
  });

  router.get('/me/submissions', requireUser, (req, res) => {
    res.set('Cache-Control', 'private, no-store').json({ items: listMySubmissions(db, req.user!.id) });
  });

  return router;
}
