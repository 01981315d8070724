import { sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import type { ChassisRef, DonorPart, RecordedNumber } from '../../../shared/schemas/graph';
import type { Axle, PartKind } from '../../../shared/schemas/enums';

// The SQL of the interchange graph, over the catalogue, the swaps and their current revisions, with the
// lookup tables the triggers keep (server/db/schema/interchange.ts). Only published rows are read: a swap's
// current revision, approved, on a chassis that is not a proposal. Joins are written in the order they
// must run (CROSS JOIN fixes it in SQLite): from the few rows a page asks about outwards, never from a scan.

/**
 * A stamp read from a part's notes names the same part only when no other record carries that number as
 * its own: "Mirror of OV-355-104-L" points at another part, "early ones carry the stamp …" at an older one.
 */
const counts = (k: string) =>
  sql.raw(
    `(${k}.source = 'number' or not exists (select 1 from part_number_keys o where o.key = ${k}.key and o.source = 'number' and o.part_id <> ${k}.part_id))`,
  );

export type SamePart = { partId: number; matched: 'number' | 'stamp' | 'same_part' };

/**
 * The records of one part: the seed records and, recursively, every record of the same kind that shares a
 * number with one already found (a part recorded twice, a later number, an older stamp).
 */
function samePart(db: Db, seed: SQL): SamePart[] {
  return db.all<SamePart>(sql`
    with recursive
      seed(part_id, matched) as (${seed}),
      same(part_id) as (
        select part_id from seed
        union
        select k2.part_id from same
          cross join part_number_keys k1 on k1.part_id = same.part_id
          cross join part_number_keys k2 on k2.key = k1.key and k2.part_id <> k1.part_id
          cross join parts p1 on p1.id = k1.part_id
          cross join parts p2 on p2.id = k2.part_id and p2.kind = p1.kind
          where ${counts('k1')} and ${counts('k2')}
      )
    select same.part_id as partId, coalesce(seed.matched, 'same_part') as matched
    from same left join seed on seed.part_id = same.part_id
    order by same.part_id`);
}

export const samePartAs = (db: Db, partId: number) => samePart(db, sql`select ${partId}, 'number'`);

/** the records carrying a number (compared by its key), and the records of the same part */
export const samePartByKey = (db: Db, key: string) =>
  samePart(
    db,
    sql`select k.part_id, min(k.source) from part_number_keys k where k.key = ${key} and ${counts('k')} group by k.part_id`,
  );

const ids = (values: number[]) => JSON.stringify(values);

type PartRow = {
  id: number;
  slug: string;
  kind: PartKind;
  name: string;
  maker: string;
  partNumbers: string;
  cameOn: string;
};

export function donorParts(db: Db, partIds: number[]): DonorPart[] {
  if (partIds.length === 0) return [];
  return db
    .all<PartRow>(
      sql`select p.id, p.slug, p.kind, p.name, p.maker, p.part_numbers as partNumbers, p.came_on as cameOn
          from json_each(${ids(partIds)}) i cross join parts p on p.id = i.value order by p.id`,
    )
    .map((p) => ({ ...p, partNumbers: JSON.parse(p.partNumbers), cameOn: JSON.parse(p.cameOn) }));
}

/** every number the records carry or their notes name as an older stamp that counts (see `counts`) */
export function recordedNumbers(db: Db, partIds: number[]): (RecordedNumber & { key: string })[] {
  if (partIds.length === 0) return [];
  return db.all(
    sql`select k.number, k.part_id as partId, k.source, k.key
        from json_each(${ids(partIds)}) i cross join part_number_keys k on k.part_id = i.value
        where ${counts('k')} order by k.source, k.part_id`,
  );
}

/** one part line of a published swap, with the swap's chassis */
export type UseRow = {
  revisionId: number;
  slug: string;
  axle: Axle;
  revisionNumber: number;
  partId: number;
  chassisId: number;
  chassisSlug: string;
} & Omit<ChassisRef, 'slug'>;

const useColumns = sql`r.id as revisionId, s.slug, s.axle, r.number as revisionNumber, l.part_id as partId,
  c.id as chassisId, c.slug as chassisSlug, c.make, c.model, c.code, c.year_from as yearFrom, c.year_to as yearTo`;

/** published swaps whose current revision has a line pointing at one of the parts, newest approval first */
export function swapsUsing(db: Db, partIds: number[]): UseRow[] {
  if (partIds.length === 0) return [];
  return db.all<UseRow>(sql`
    select ${useColumns}
    from json_each(${ids(partIds)}) i
      cross join revision_parts l on l.part_id = i.value
      cross join revisions r on r.id = l.revision_id and r.status = 'approved'
      cross join swaps s on s.id = r.swap_id and s.current_revision_id = r.id
      cross join chassis c on c.id = s.chassis_id and c.proposed = 0
    order by r.reviewed_at desc, r.id desc`);
}

/** the part lines of the published swaps on one chassis */
export function linesOnChassis(db: Db, chassisId: number): UseRow[] {
  return db.all<UseRow>(sql`
    select ${useColumns}
    from chassis c
      cross join swaps s on s.chassis_id = c.id
      cross join revisions r on r.id = s.current_revision_id and r.status = 'approved'
      cross join revision_parts l on l.revision_id = r.id
    where c.id = ${chassisId} and c.proposed = 0
    order by r.reviewed_at desc, r.id desc`);
}

/** catalogue adapters the revisions' lines point at */
export function adaptersIn(db: Db, revisionIds: number[]): { revisionId: number; partId: number }[] {
  if (revisionIds.length === 0) return [];
  return db.all(sql`
    select l.revision_id as revisionId, p.id as partId
    from json_each(${ids(revisionIds)}) i
      cross join revision_parts l on l.revision_id = i.value
      cross join parts p on p.id = l.part_id and p.kind = 'adapter'`);
}

export type RevisionTitle = { title: string; adapter: Record<string, unknown> | null };

/** the title and adapter of a few revisions (the same paths in version 1 and 2), one read of each record */
export function revisionTitles(db: Db, revisionIds: number[]): Map<number, RevisionTitle> {
  if (revisionIds.length === 0) return new Map();
  const rows = db.all<{ revisionId: number; fields: string }>(sql`
    select r.id as revisionId, json_extract(r.data, '$.title', '$.adapter') as fields
    from json_each(${ids(revisionIds)}) i cross join revisions r on r.id = i.value`);
  return new Map(
    rows.map((r) => {
      const [title, adapter] = JSON.parse(r.fields) as [string, Record<string, unknown> | null];
      return [r.revisionId, { title, adapter }];
    }),
  );
}
