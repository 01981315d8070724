import { Router } from 'express';
import type { AppDeps } from '../../app';
import { createSearchIndexService } from './search-index.service';

export function searchIndexRouter({ db }: AppDeps) {
  const router = Router();
  const service = createSearchIndexService(db);

  router.get('/search-index', (req, res) => {
    const body = service.current();
    // readers revalidate on every visit; an unchanged index costs a 304 and no body
    res.set({ ETag: body.etag, 'Cache-Control': 'no-cache', Vary: 'Accept-Encoding' });
    if (req.fresh) {
      res.status(304).end();
      return;
    }
    res.type('application/json').send(body.json);
  });

  return router;
}
