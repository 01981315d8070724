import { Router } from 'express';
import type { AppDeps } from '../../app';
import { buildOpenApiDocument } from './openapi.document';
import { SHARED_ANSWER } from '../../lib/cache-policy';

export function openApiRouter({ config }: AppDeps) {
  const router = Router();
  // built once: it depends only on the schemas and the site's address
  const document = JSON.stringify(buildOpenApiDocument(config.appUrl));
  router.get('/openapi.json', (_req, res) => {
    res.set('Cache-Control', SHARED_ANSWER).type('application/json').send(document);
  });
  return router;
}
