import { Router } from 'express';
import type { AppDeps } from '../../app';
import { createSearchIndexService } from './search-index.service';
import { sendCachedJson } from '../../lib/cached-json';

export function searchIndexRouter({ db }: AppDeps) {
  const router = Router();
  const service = createSearchIndexService(db);

  // readers revalidate on every visit; an unchanged index costs a 304 and no body
  router.get('/search-index', (req, res) => {
    sendCachedJson(req, res, service.current());
  });

  return router;
}
