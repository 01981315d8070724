import { and, asc, desc, eq, or, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, parts } from '../../db/schema/index';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import { stripHtml } from '../../lib/sanitize';
import type { AdminChassis, AdminPart, ChassisPatch, PartPatch } from '../../../shared/schemas/catalogue-admin';
import { changeValue, chassisRecordLabel, partLabel, recordChanges, type ChangeRow, type Tx } from './catalogue-changes';
import { setLineKinds } from './part-lines';

const listLimit = 200;
const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);
const everyWord = (q: string, haystack: SQL) =>
  and(
    ...q
      .toLowerCase()
      .split(/\s+/)
      .filter(Boolean)
      .map((w) => sql`lower(${haystack}) like ${`%${escapeLike(w)}%`} escape '\\'`),
  );

// A proposed chassis that only sits in a never-submitted draft is its author's alone (as on the chassis page):
// the catalogue desk sees it once its submission has been sent.
const reviewable = sql`(${chassis.proposed} = 0 or exists (select 1 from swaps s join revisions r on r.swap_id = s.id
  where s.chassis_id = "chassis"."id" and r.status <> 'draft'))`;

const chassisColumns = {
  id: chassis.id,
  slug: chassis.slug,
  make: chassis.make,
  model: chassis.model,
  code: chassis.code,
  yearFrom: chassis.yearFrom,
  yearTo: chassis.yearTo,
  body: chassis.body,
  lugCount: chassis.lugCount,
  pcdMm: chassis.pcdMm,
  centreBoreMm: chassis.centreBoreMm,
  wheelBoltThread: chassis.wheelBoltThread,
  notes: chassis.notes,
  proposed: chassis.proposed,
  swapCount: sql<number>`(select count(*) from swaps s where s.chassis_id = "chassis"."id")`,
  carCount: sql<number>`(select count(*) from cars c where c.chassis_id = "chassis"."id")`,
};

/** Chassis for the catalogue desk: proposed ones first, then by make, model and years. */
export function listAdminChassis(db: Db, q: string): AdminChassis[] {
  const match = q
    ? everyWord(q, sql`${chassis.make} || ' ' || ${chassis.model} || ' ' || ${chassis.code} || ' ' || ${chassis.slug}`)
    : undefined;
  return db
    .select(chassisColumns)
    .from(chassis)
    .where(and(reviewable, match))
    .orderBy(desc(chassis.proposed), asc(chassis.make), asc(chassis.model), asc(chassis.yearFrom))
    .limit(listLimit)
    .all();
}

export function getAdminChassis(db: Db | Tx, id: number): AdminChassis {
  const row = db
    .select(chassisColumns)
    .from(chassis)
    .where(and(eq(chassis.id, id), reviewable))
    .get();
  if (!row) throw AppError.notFound('That chassis');
  return row;
}

const partColumns = {
  id: parts.id,
  slug: parts.slug,
  kind: parts.kind,
  name: parts.name,
  maker: parts.maker,
  partNumbers: parts.partNumbers,
  cameOn: parts.cameOn,
  notes: parts.notes,
  revisionCount: sql<number>`(select count(distinct l.revision_id) from revision_parts l where l.part_id = "parts"."id")`,
};

/** Parts for the catalogue desk, found by words of name and maker or by a number (separators ignored). */
export function listAdminParts(db: Db, q: string): AdminPart[] {
  const key = q.toLowerCase().replace(/[^\p{L}\p{N}]+/gu, '');
  const match = q
    ? or(
        everyWord(q, sql`${parts.name} || ' ' || ${parts.maker} || ' ' || ${parts.kind}`),
        key
          ? sql`${parts.id} in (select part_id from part_number_keys where key like ${`${escapeLike(key)}%`} escape '\\')`
          : undefined,
      )
    : undefined;
  return db.select(partColumns).from(parts).where(match).orderBy(asc(parts.kind), asc(parts.name)).limit(listLimit).all();
}

export function getAdminPart(db: Db | Tx, id: number): AdminPart {
  const row = db.select(partColumns).from(parts).where(eq(parts.id, id)).get();
  if (!row) throw AppError.notFound('That part');
  return row;
}

/** The fields of a patch that differ from the record, as change rows. */
function changedFields<T extends object>(
  current: T,
  patch: Partial<T>,
): { field: keyof T & string; from: unknown; to: unknown }[] {
  return (Object.keys(patch) as (keyof T & string)[])
    .filter((k) => patch[k] !== undefined && JSON.stringify(patch[k]) !== JSON.stringify(current[k]))
    .map((field) => ({ field, from: current[field], to: patch[field] }));
}

export type CatalogueDeps = { db: Db; clock: Clock };

/** Corrects a chassis' figures; its address stays as it is. Each changed field is recorded. */
export function editChassis({ db, clock }: CatalogueDeps, actorId: number, id: number, patch: ChassisPatch): AdminChassis {
  return db.transaction((tx) => {
    const current = getAdminChassis(tx, id);
    const next = { ...current, ...patch };
    if (next.yearTo !== null && next.yearTo < next.yearFrom)
      throw AppError.invalid('The last year comes before the first.', {
        yearTo: `The last year cannot be before ${next.yearFrom}`,
      });
    const clean = { ...patch, ...(patch.notes !== undefined ? { notes: stripHtml(patch.notes) } : {}) };
    const changes = changedFields(current, clean);
    if (changes.length === 0) return current;
    const now = clock.now();
    tx.update(chassis)
      .set({ ...clean, updatedAt: now })
      .where(eq(chassis.id, id))
      .run();
    const label = chassisRecordLabel(next);
    recordChanges(
      tx,
      actorId,
      now,
      changes.map((c): ChangeRow => ({
        subject: 'chassis',
        subjectId: id,
        subjectLabel: label,
        action: 'edit',
        field: c.field,
        from: changeValue(c.from),
        to: changeValue(c.to),
      })),
    );
    return getAdminChassis(tx, id);
  });
}

/**
 * Corrects a part. A new kind reaches the part lines that point at it, so a sheet never calls the part one
 * thing and the catalogue another; its numbers feed the interchange lookups through the table's triggers.
 */
export function editPart({ db, clock }: CatalogueDeps, actorId: number, id: number, patch: PartPatch): AdminPart {
  return db.transaction((tx) => {
    const current = getAdminPart(tx, id);
    const clean = { ...patch, ...(patch.notes !== undefined ? { notes: stripHtml(patch.notes) } : {}) };
    const changes = changedFields(current, clean);
    if (changes.length === 0) return current;
    const now = clock.now();
    tx.update(parts)
      .set({ ...clean, updatedAt: now })
      .where(eq(parts.id, id))
      .run();
    if (clean.kind && clean.kind !== current.kind) setLineKinds(tx, id, clean.kind);
    const label = partLabel({ ...current, ...clean });
    recordChanges(
      tx,
      actorId,
      now,
      changes.map((c): ChangeRow => ({
        subject: 'part',
        subjectId: id,
        subjectLabel: label,
        action: 'edit',
        field: c.field,
        from: changeValue(c.from),
        to: changeValue(c.to),
      })),
    );
    return getAdminPart(tx, id);
  });
}

/** Publishes a proposed chassis: from now on it is in the catalogue, on its page and in the form's list. */
export function approveChassis({ db, clock }: CatalogueDeps, actorId: number, id: number): AdminChassis {
  return db.transaction((tx) => {
    const current = getAdminChassis(tx, id);
    if (!current.proposed) throw AppError.conflict('That chassis is already in the catalogue.');
    const now = clock.now();
    tx.update(chassis)
      .set({ proposed: false, updatedAt: now })
      .where(and(eq(chassis.id, id), eq(chassis.proposed, true)))
      .run();
    recordChanges(tx, actorId, now, [
      { subject: 'chassis', subjectId: id, subjectLabel: chassisRecordLabel(current), action: 'approve' },
    ]);
    return getAdminChassis(tx, id);
  });
}
