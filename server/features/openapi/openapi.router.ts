import { Router } from 'express';
import type { AppDeps } from '../../app';
import { buildOpenApiDocument } from './openapi.document';

export function openApiRouter({ config }: AppDeps) {
  const router = Router();
  // built once: it depends only on the schemas and the site's address
  const document = JSON.stringify(buildOpenApiDocument(config.appUrl));
  router.get('/openapi.json', (_req, res) => {
    res.set('Cache-Control', 'public, no-cache').type('application/json').send(document);
  });
  return router;
}
