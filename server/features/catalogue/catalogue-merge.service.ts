import { eq, inArray, sql } from 'drizzle-orm';
import { chassis, parts, swaps } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';
import { normalisePartNumber } from '../../../shared/search/normalise';
import { partKindLabels } from '../../../shared/schemas/enums';
import type { AdminChassis, AdminPart, MergeResponse } from '../../../shared/schemas/catalogue-admin';
import { getAdminChassis, getAdminPart, type CatalogueDeps } from './catalogue-admin.service';
import { chassisRecordLabel, partLabel, recordChanges, type Tx } from './catalogue-changes';
import { repointLines } from './part-lines';

// Merging folds a duplicate into the record kept: everything that referred to the duplicate refers to the
// kept one, then the duplicate goes, in one transaction. Foreign keys are found from the schema itself
// (every table with a key to `chassis` or `parts`), so a table added later is moved too; the part lines
// inside revisions' JSON are rewritten in SQL (part-lines.ts). A reference that cannot move because the
// kept record already has the same one (a unique key) stops the merge rather than being dropped.

type Reference = { table: string; column: string };

/** Every (table, column) with a foreign key to `target`, read from SQLite's own schema. */
function referencesTo(tx: Tx, target: 'chassis' | 'parts'): Reference[] {
  return tx.all<Reference>(sql`
    select m.name as "table", f."from" as "column" from sqlite_master m, pragma_foreign_key_list(m.name) f
    where m.type = 'table' and f."table" = ${target} order by m.name`);
}

const quoted = (name: string) => sql.raw(`"${name.replace(/"/g, '""')}"`);

/** Points every foreign key at `fromId` to `intoId`, except in the tables given; returns the rows moved per table. */
function moveReferences(tx: Tx, target: 'chassis' | 'parts', fromId: number, intoId: number, except: string[] = []) {
  const moved: Record<string, number> = {};
  for (const ref of referencesTo(tx, target)) {
    if (except.includes(ref.table)) continue;
    const t = quoted(ref.table);
    const c = quoted(ref.column);
    const changes = tx.run(sql`update or ignore ${t} set ${c} = ${intoId} where ${c} = ${fromId}`).changes;
    const left = tx.get<{ n: number }>(sql`select count(*) as n from ${t} where ${c} = ${fromId}`)!.n;
    if (left > 0)
      throw AppError.conflict(
        `The record kept already has ${left} of the same ${ref.table.replace(/_/g, ' ')} entries; sort those out before merging.`,
      );
    if (changes) moved[ref.table] = (moved[ref.table] ?? 0) + changes;
  }
  return moved;
}

function refuseSelf(fromId: number, intoId: number) {
  if (fromId === intoId)
    throw AppError.invalid('A record cannot be merged into itself.', { intoId: 'Choose another record to keep' });
}

/** Each of `extra` not already in `list` (by `key`), after `list`'s own. */
function union(list: string[], extra: string[], key: (s: string) => string = (s) => s) {
  const seen = new Set(list.map(key));
  return [...list, ...extra.filter((s) => !seen.has(key(s)) && seen.add(key(s)))];
}

/**
 * Folds part `fromId` into `intoId` (of the same kind): revisions' lines point at the kept part, which takes
 * the duplicate's numbers, vehicles and notes, so the interchange graph still finds it by every number.
 */
export function mergePart(
  { db, clock }: CatalogueDeps,
  actorId: number,
  fromId: number,
  intoId: number,
): MergeResponse<AdminPart> {
  refuseSelf(fromId, intoId);
  return db.transaction((tx) => {
    const from = getAdminPart(tx, fromId);
    if (!tx.select({ id: parts.id }).from(parts).where(eq(parts.id, intoId)).get())
      throw AppError.invalid('The part to keep does not exist.', { intoId: 'Choose a part from the catalogue' });
    const into = getAdminPart(tx, intoId);
    if (from.kind !== into.kind)
      throw AppError.invalid('Only parts of the same kind can be merged.', {
        intoId: `This is a ${partKindLabels[into.kind].toLowerCase()}; the duplicate is a ${partKindLabels[from.kind].toLowerCase()}. Change one's kind first if they are the same part.`,
      });
    const now = clock.now();
    const revisions = repointLines(tx, fromId, intoId, into.kind);
    const notes =
      from.notes && !into.notes.includes(from.notes) ? [into.notes, from.notes].filter(Boolean).join('\n\n') : into.notes;
    tx.update(parts)
      .set({
        partNumbers: union(into.partNumbers, from.partNumbers, normalisePartNumber).slice(0, 24),
        cameOn: union(into.cameOn, from.cameOn),
        notes,
        updatedAt: now,
      })
      .where(eq(parts.id, intoId))
      .run();
    // the lookup tables belong to the triggers: the duplicate's keys go with its row
    const moved = moveReferences(tx, 'parts', fromId, intoId, ['part_number_keys']);
    tx.delete(parts).where(eq(parts.id, fromId)).run();
    recordChanges(tx, actorId, now, [
      {
        subject: 'part',
        subjectId: intoId,
        subjectLabel: partLabel(into),
        action: 'merge',
        from: partLabel(from),
        to: partLabel(into),
      },
    ]);
    return { kept: getAdminPart(tx, intoId), moved: { revisions, ...moved } };
  });
}

/**
 * Folds chassis `fromId` into `intoId`: swaps, members' cars, plans and anything else keyed to it move to the
 * kept chassis; the swaps keep their addresses. A proposed chassis folded into a published one leaves the
 * catalogue as it was; the kept one must be published, since a merge never publishes anything by itself.
 */
export function mergeChassis(
  { db, clock }: CatalogueDeps,
  actorId: number,
  fromId: number,
  intoId: number,
): MergeResponse<AdminChassis> {
  refuseSelf(fromId, intoId);
  return db.transaction((tx) => {
    const from = getAdminChassis(tx, fromId);
    const into = tx.select().from(chassis).where(eq(chassis.id, intoId)).get();
    if (!into) throw AppError.invalid('The chassis to keep does not exist.', { intoId: 'Choose a chassis from the catalogue' });
    if (into.proposed)
      throw AppError.invalid('The chassis kept must be in the catalogue.', {
        intoId: 'Approve it first, or keep a published chassis',
      });
    const now = clock.now();
    const swapIds = tx
      .select({ id: swaps.id })
      .from(swaps)
      .where(eq(swaps.chassisId, fromId))
      .all()
      .map((s) => s.id);
    const moved = moveReferences(tx, 'chassis', fromId, intoId);
    // a moved swap reads differently in search (its chassis' name): its change shows in the index's fingerprint
    if (swapIds.length) tx.update(swaps).set({ updatedAt: now }).where(inArray(swaps.id, swapIds)).run();
    tx.update(chassis).set({ updatedAt: now }).where(eq(chassis.id, intoId)).run();
    tx.delete(chassis).where(eq(chassis.id, fromId)).run();
    recordChanges(tx, actorId, now, [
      {
        subject: 'chassis',
        subjectId: intoId,
        subjectLabel: chassisRecordLabel(into),
        action: 'merge',
        from: chassisRecordLabel(from),
        to: chassisRecordLabel(into),
      },
    ]);
    return { kept: getAdminChassis(tx, intoId), moved };
  });
}
