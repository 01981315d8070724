import { Router } from 'express';
import type { AppDeps } from '../../app';
import { createSearchIndexService } from './search-index.service';
import { sendCachedJson } from '../../lib/cached-json';
import { validated } from '../../middleware/validate';
import { searchShardParamsSchema, searchTermsParamsSchema } from '../../../shared/schemas/search-index';

/** the same for every reader; revalidated on every visit, so an approval shows at once */
const revalidate = 'public, no-cache';
/** addressed by a hash of what they hold: a new content is a new address */
const immutable = 'public, max-age=31536000, immutable';

export function searchIndexRouter({ db }: AppDeps) {
  const router = Router();
  const service = createSearchIndexService(db);

  // readers revalidate on every visit; an unchanged answer costs a 304 and no body
  router.get('/search-index', (req, res) => {
    sendCachedJson(req, res, service.current());
  });
  router.get('/search-index/head', (req, res) => {
    sendCachedJson(req, res, service.head(), revalidate);
  });
  router.get(
    '/search-index/shards/:shard/:hash',
    validated({ params: searchShardParamsSchema }, ({ params }, req, res) => {
      sendCachedJson(req, res, service.shard(params.shard, params.hash), immutable);
    }),
  );
  router.get(
    '/search-index/terms/:generation/:key',
    validated({ params: searchTermsParamsSchema }, ({ params }, req, res) => {
      sendCachedJson(req, res, service.terms(params.generation, params.key), immutable);
    }),
  );

  return router;
}
