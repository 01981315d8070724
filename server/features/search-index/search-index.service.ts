import { createHash } from 'node:crypto';
import { cacheJson, cacheJsonText, fingerprintCache, type CachedJson } from '../../lib/cached-json';
import { AppError } from '../../lib/app-error';
import { and, eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, parts, revisions, swaps } from '../../db/schema/index';
import { toSearchDocument, type SearchDocument } from '../../../shared/search/search-document';
import { buildPieces, type SearchTerms } from '../../../shared/search/shard-plan';

const approvedCurrent = and(eq(revisions.id, swaps.currentRevisionId), eq(revisions.status, 'approved'));

/** Every approved swap at its current revision, as search documents, oldest id first. */
export function searchDocuments(db: Db): SearchDocument[] {
  const rows = db
    .select({ swap: swaps, revision: revisions, chassis })
    .from(swaps)
    .innerJoin(revisions, approvedCurrent)
    .innerJoin(chassis, eq(chassis.id, swaps.chassisId))
    .orderBy(swaps.id)
    .all();
  const records = new Map(
    db
      .select({ id: parts.id, partNumbers: parts.partNumbers, notes: parts.notes })
      .from(parts)
      .all()
      .map((p) => [p.id, p]),
  );
  return rows.map(({ swap, revision, chassis: c }) =>
    toSearchDocument({
      id: swap.id,
      slug: swap.slug,
      axle: swap.axle,
      category: swap.category,
      fittedCount: swap.fittedCount,
      chassis: { slug: c.slug, make: c.make, model: c.model, code: c.code, yearFrom: c.yearFrom, yearTo: c.yearTo },
      data: revision.data,
      approvedAt: revision.reviewedAt ?? revision.updatedAt,
      partRecord: (id) => records.get(id),
    }),
  );
}

/**
 * A cheap summary of everything the documents are built from; when it is unchanged the cached body is served
 * without reading any revision data.
 */
function fingerprint(db: Db): string {
  const row = db
    .select({
      count: sql<number>`count(*)`,
      revisionIds: sql<number>`coalesce(sum(${revisions.id}), 0)`,
      revisionsAt: sql<number>`coalesce(max(${revisions.updatedAt}), 0)`,
      swapsAt: sql<number>`coalesce(max(${swaps.updatedAt}), 0)`,
      fitted: sql<number>`coalesce(sum(${swaps.fittedCount}), 0)`,
      chassisAt: sql<number>`coalesce(max(${chassis.updatedAt}), 0)`,
      // catalogue records lend their numbers to the swaps that use them
      partsAt: sql<number>`(select coalesce(max(${parts.updatedAt}), 0) || ':' || count(*) from ${parts})`,
    })
    .from(swaps)
    .innerJoin(revisions, approvedCurrent)
    .innerJoin(chassis, eq(chassis.id, swaps.chassisId))
    .get();
  return row ? Object.values(row).join(':') : 'empty';
}

/** every catalogue chassis, for the first index's chassis picker */
function catalogue(db: Db): SearchDocument['chassis'][] {
  return db
    .select({
      slug: chassis.slug,
      make: chassis.make,
      model: chassis.model,
      code: chassis.code,
      yearFrom: chassis.yearFrom,
      yearTo: chassis.yearTo,
    })
    .from(chassis)
    .where(eq(chassis.proposed, false))
    .orderBy(chassis.make, chassis.model, chassis.yearFrom)
    .all();
}

function catalogueFingerprint(db: Db): string {
  const row = db
    .select({ count: sql<number>`count(*)`, at: sql<number>`coalesce(max(${chassis.updatedAt}), 0)` })
    .from(chassis)
    .where(eq(chassis.proposed, false))
    .get();
  return `${row?.count ?? 0}:${row?.at ?? 0}`;
}

type Sharded = {
  fingerprint: string;
  generation: string;
  head: CachedJson;
  /** by shard id: the body and the hash its address carries */
  shards: Map<string, { hash: string; body: CachedJson }>;
  terms: Map<string, CachedJson>;
};

/** the hash in an address of the search index: 16 characters of base64url SHA-256 */
const addressHash = (text: string) => createHash('sha256').update(text).digest('base64url').slice(0, 16);

/** Holds the built bodies in memory per app; rebuilds only when the fingerprint moves. */
export function createSearchIndexService(db: Db) {
  const cache = fingerprintCache(1);
  let sharded: Sharded | null = null;

  /** the first index, the shards and the code tables, all built from one reading of the documents */
  const pieces = (): Sharded => {
    const fp = `${fingerprint(db)}|${catalogueFingerprint(db)}`;
    if (sharded?.fingerprint === fp) return sharded;
    const built = buildPieces(searchDocuments(db), catalogue(db), addressHash);
    sharded = {
      fingerprint: fp,
      generation: built.head.generation,
      head: cacheJson(built.head),
      shards: new Map(built.shards.map((s) => [s.id, { hash: s.hash, body: cacheJsonText(s.json) }])),
      terms: new Map([...built.terms].map(([key, table]) => [key, cacheJson(table)])),
    };
    return sharded;
  };

  return {
    /** every approved swap in one answer */
    current(): CachedJson {
      return cache('index', fingerprint(db), () => ({ documents: searchDocuments(db) }));
    },
    head(): CachedJson {
      return pieces().head;
    },
    /** a shard at the hash the first index names; an older hash is gone for good (the reader reloads the first index) */
    shard(id: string, hash: string): CachedJson {
      const shard = pieces().shards.get(id);
      if (!shard || shard.hash !== hash) throw AppError.notFound('That part of the search index');
      return shard.body;
    },
    /** a key no term starts with has an empty table, not a missing one */
    terms(generation: string, key: string): CachedJson {
      const p = pieces();
      if (generation !== p.generation) throw AppError.notFound('That part of the search index');
      return p.terms.get(key) ?? cacheJson({ generation, key, terms: {} } satisfies SearchTerms);
    },
  };
}
