import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { photoIdSchema } from '../../../shared/schemas/params';
import { PUBLIC_PHOTO_CACHE, resolveMedia } from './media.service';
import { storedType, thumbId } from './photo-files';

const params = z.object({ id: photoIdSchema });
const query = z.object({ size: z.enum(['full', 'thumb']).default('full') });

/** GET /media/:id — stored photos are served only through here, never from a public folder. */
export function mediaRouter({ db, storage }: AppDeps) {
  const router = Router();
  router.get(
    '/media/:id',
    validated({ params, query }, async ({ params, query }, req, res) => {
      const media = resolveMedia(db, params.id, req.user);
      let file = query.size === 'thumb' ? thumbId(media.fileId) : media.fileId;
      if (!(await storage.exists(file))) file = media.fileId;
      const data = await storage.read(file);
      res.set({
        'Content-Type': storedType,
        'X-Content-Type-Options': 'nosniff',
        'Content-Disposition': 'inline',
        'Cache-Control': media.public ? PUBLIC_PHOTO_CACHE : 'private, no-store',
      });
      res.send(data);
    }),
  );
  return router;
}
