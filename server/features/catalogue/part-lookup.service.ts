import { and, asc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { partNumberKeys, parts } from '../../db/schema/index';
import { normalisePartNumber } from '../../../shared/search/normalise';
import { normaliseMaker } from '../../../shared/catalogue/part-identity';
import type { CataloguePartOption, PartMatchResponse, PartSearchQuery } from '../../../shared/schemas/catalogue';

const shownLimit = 20;

const optionColumns = {
  id: parts.id,
  kind: parts.kind,
  name: parts.name,
  maker: parts.maker,
  partNumbers: parts.partNumbers,
  cameOn: parts.cameOn,
};

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/**
 * Catalogue parts for the form's picker: every typed word in the name or maker, or the whole text as the
 * start of one of the part's numbers (separators and case ignored, as the search reads part numbers).
 * Parts found by number come first.
 */
export function searchParts(db: Db, { q, kind }: PartSearchQuery): CataloguePartOption[] {
  const ofKind = kind ? eq(parts.kind, kind) : undefined;
  const words = q.toLowerCase().split(/\s+/).filter(Boolean);
  if (words.length === 0)
    return db.select(optionColumns).from(parts).where(ofKind).orderBy(asc(parts.name)).limit(shownLimit).all();
  const key = normalisePartNumber(q);
  const byNumber = key
    ? sql`${parts.id} in (select ${partNumberKeys.partId} from ${partNumberKeys} where ${partNumberKeys.source} = 'number' and ${partNumberKeys.key} like ${`${escapeLike(key)}%`} escape '\\')`
    : sql`0`;
  const byWords = and(
    ...words.map((w): SQL => sql`lower(${parts.name} || ' ' || ${parts.maker}) like ${`%${escapeLike(w)}%`} escape '\\'`),
  )!;
  return db
    .select(optionColumns)
    .from(parts)
    .where(and(ofKind, sql`(${byNumber} or ${byWords})`))
    .orderBy(sql`case when ${byNumber} then 0 else 1 end`, asc(parts.name))
    .limit(shownLimit)
    .all();
}

/**
 * The catalogue part a proposed one already is: the same maker and one of the same numbers, both compared
 * after normalising (`partIdentityKey`). Without a maker or a number there is nothing to compare.
 */
export function findPartMatch(db: Db, maker: string, numbers: string[]): PartMatchResponse['match'] {
  const makerKey = normaliseMaker(maker);
  const keys = [...new Set(numbers.map(normalisePartNumber).filter(Boolean))];
  if (!makerKey || keys.length === 0) return null;
  const rows = db
    .select({ ...optionColumns, key: partNumberKeys.key, number: partNumberKeys.number })
    .from(partNumberKeys)
    .innerJoin(parts, eq(parts.id, partNumberKeys.partId))
    .where(and(eq(partNumberKeys.source, 'number'), inArray(partNumberKeys.key, keys)))
    .orderBy(asc(parts.id))
    .all();
  // the member's numbers in the order they typed them
  for (const key of keys) {
    const row = rows.find((r) => r.key === key && normaliseMaker(r.maker) === makerKey);
    if (row) {
      const { key: _key, number, ...part } = row;
      return { part, number };
    }
  }
  return null;
}
