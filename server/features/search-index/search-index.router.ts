import { Router } from 'express';
import type { AppDeps } from '../../app';
import { createSearchIndexService } from './search-index.service';
import { sendCachedJson } from '../../lib/cached-json';
import { validated } from '../../middleware/validate';
import { searchShardParamsSchema, searchTermsParamsSchema } from '../../../shared/schemas/search-index';
import { IMMUTABLE_ANSWER, SHARED_ANSWER } from '../../lib/cache-policy';

export function searchIndexRouter({ db }: AppDeps) {
  const router = Router();
  const service = createSearchIndexService(db);

  // the app revalidates on every visit (an unchanged answer costs a 304 and no body); shards and code
  // tables sit at addresses that change with their content
  router.get('/search-index', (req, res) => {
    sendCachedJson(req, res, service.current(), SHARED_ANSWER);
  });
  router.get('/search-index/head', (req, res) => {
    sendCachedJson(req, res, service.head(), SHARED_ANSWER);
  });
  router.get(
    '/search-index/shards/:shard/:hash',
    validated({ params: searchShardParamsSchema }, ({ params }, req, res) => {
      sendCachedJson(req, res, service.shard(params.shard, params.hash), IMMUTABLE_ANSWER);
    }),
  );
  router.get(
    '/search-index/terms/:generation/:key',
    validated({ params: searchTermsParamsSchema }, ({ params }, req, res) => {
      sendCachedJson(req, res, service.terms(params.generation, params.key), IMMUTABLE_ANSWER);
    }),
  );

  return router;
}
