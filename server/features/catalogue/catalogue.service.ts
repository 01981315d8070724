import { eq, and, isNotNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, parts, revisions, swaps } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';
import type { ChassisPageView, PartPageView, ChassisView } from '../../../shared/schemas/views';
import { chassisView, swapCards } from '../swaps/swap-views';

export function listChassis(db: Db): ChassisView[] {
  return db
    .select()
    .from(chassis)
    .where(eq(chassis.proposed, false))
    .orderBy(chassis.make, chassis.model, chassis.yearFrom)
    .all()
    .map(chassisView);
}

export function getChassisPage(db: Db, slug: string): ChassisPageView {
  const row = db.select().from(chassis).where(eq(chassis.slug, slug)).get();
  if (!row) throw AppError.notFound('That chassis');
  return {
    chassis: chassisView(row),
    swaps: swapCards(db, and(eq(swaps.chassisId, row.id), isNotNull(swaps.currentRevisionId))),
  };
}

export function getPartPage(db: Db, id: number): PartPageView {
  const row = db.select().from(parts).where(eq(parts.id, id)).get();
  if (!row) throw AppError.notFound('That part');
  // swaps whose current revision lists this catalogue part
  const usesPart = sql`exists (select 1 from json_each(${revisions.data}, '$.parts') as p where json_extract(p.value, '$.partId') = ${row.id})`;
  return {
    part: {
      id: row.id,
      slug: row.slug,
      kind: row.kind,
      name: row.name,
      maker: row.maker,
      partNumbers: row.partNumbers,
      specs: row.specs,
      cameOn: row.cameOn,
      notes: row.notes,
    },
    swaps: swapCards(db, and(isNotNull(swaps.currentRevisionId), usesPart)),
  };
}
