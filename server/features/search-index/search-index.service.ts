import { fingerprintCache, type CachedJson } from '../../lib/cached-json';
import { and, eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, parts, revisions, swaps } from '../../db/schema/index';
import { toSearchDocument, type SearchDocument } from '../../../shared/search/search-document';

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

/** Holds the built body in memory per app; rebuilds only when the fingerprint moves. */
export function createSearchIndexService(db: Db) {
  const cache = fingerprintCache(1);
  return {
    current(): CachedJson {
      return cache('index', fingerprint(db), () => ({ documents: searchDocuments(db) }));
    },
  };
}
