import { z } from 'zod';
import { slugSchema } from './params';

/** a content hash in an address of the search index */
const hashSchema = z.string().regex(/^[A-Za-z0-9_-]{16}$/, 'Sixteen letters, digits, dashes or underscores');

/** `GET /api/search-index/shards/:shard/:hash` */
export const searchShardParamsSchema = z.object({ shard: slugSchema, hash: hashSchema });

/** `GET /api/search-index/terms/:generation/:key`: the first one or two characters of a term with a digit */
export const searchTermsParamsSchema = z.object({
  generation: hashSchema,
  key: z.string().regex(/^[\p{L}\p{N}]{1,2}$/u, 'One or two letters or digits'),
});
