import { sql } from 'drizzle-orm';
import type { PartKind } from '../../../shared/schemas/enums';
import type { Tx } from './catalogue-changes';

// A swap's part lines sit inside each revision's JSON. These rewrite, in SQL, only the lines that point at one
// catalogue part, in every revision that has one (found through `revision_parts`); the table's trigger then
// rebuilds the lookup from the new JSON in the same statement. Everything else in the record stays as written.

function rewriteLines(tx: Tx, partId: number, line: ReturnType<typeof sql>): number {
  return tx.run(sql`
    update revisions set data = json_set(data, '$.parts', (
      select json_group_array(case when json_extract(l.value, '$.partId') = ${partId} then json(${line}) else json(l.value) end order by l.key)
      from json_each(revisions.data, '$.parts') l
    ))
    where id in (select revision_id from revision_parts where part_id = ${partId})`).changes;
}

/** Lines that point at `partId` take the catalogue's kind. Returns how many revisions changed. */
export function setLineKinds(tx: Tx, partId: number, kind: PartKind): number {
  return rewriteLines(tx, partId, sql`json_set(l.value, '$.kind', ${kind})`);
}

/**
 * Lines that point at `fromId` point at `intoId` instead (and take its kind). Returns how many revisions changed.
 * The id is cast because a bound number arrives as a real, which JSON would keep as `4.0` and the lookup's
 * trigger (which takes integer ids only) would skip.
 */
export function repointLines(tx: Tx, fromId: number, intoId: number, kind: PartKind): number {
  return rewriteLines(tx, fromId, sql`json_set(l.value, '$.partId', cast(${intoId} as integer), '$.kind', ${kind})`);
}
