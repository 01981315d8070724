import { eq, and, isNotNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis, parts, revisions, swaps } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';
import type { ChassisPageView, PartPageView, ChassisView } from '../../../shared/schemas/views';
import { chassisView, swapCards } from '../swaps/swap-views';
import type { SessionUser } from '../../middleware/require-role';
import { canSeeUnpublishedRevision } from '../../../shared/roles';
import type { Clock } from '../../lib/clock';
import type { VehicleData } from '../../../shared/schemas/vehicle';

export function listChassis(db: Db): ChassisView[] {
  return db
    .select()
    .from(chassis)
    .where(eq(chassis.proposed, false))
    .orderBy(chassis.make, chassis.model, chassis.yearFrom)
    .all()
    .map(chassisView);
}

/**
 * A chassis proposed with a submission is not in the catalogue until an approval publishes it: until then
 * its author may open it, and reviewers may once a submission on it has been sent to review (a chassis in a
 * never-submitted draft is as private as the draft). Everyone else gets the same 404 as for no chassis.
 */
function maySeeProposed(db: Db, chassisId: number, viewer: SessionUser | undefined): boolean {
  if (!viewer) return false;
  const onIt = db
    .select({ authorId: revisions.authorId, status: revisions.status })
    .from(revisions)
    .innerJoin(swaps, eq(swaps.id, revisions.swapId))
    .where(eq(swaps.chassisId, chassisId))
    .all();
  return onIt.some((r) => canSeeUnpublishedRevision(viewer, r));
}

export function getChassisPage(db: Db, slug: string, viewer: SessionUser | undefined): ChassisPageView {
  const row = db.select().from(chassis).where(eq(chassis.slug, slug)).get();
  if (!row || (row.proposed && !maySeeProposed(db, row.id, viewer))) throw AppError.notFound('That chassis');
  return {
    chassis: chassisView(row),
    proposed: row.proposed,
    swaps: swapCards(db, and(eq(swaps.chassisId, row.id), isNotNull(swaps.currentRevisionId))),
  };
}

/** Sets (or, with null, removes) a catalogue chassis' stock figures for the brake-distribution analysis. */
export function setChassisVehicle(db: Db, clock: Clock, slug: string, vehicle: VehicleData | null): ChassisView {
  const row = db
    .update(chassis)
    .set({ vehicle, updatedAt: clock.now() })
    .where(and(eq(chassis.slug, slug), eq(chassis.proposed, false)))
    .returning()
    .get();
  if (!row) throw AppError.notFound('That chassis');
  return chassisView(row);
}

export function getPartPage(db: Db, id: number): PartPageView {
  const row = db.select().from(parts).where(eq(parts.id, id)).get();
  if (!row) throw AppError.notFound('That part');
  // swaps whose current revision lists this catalogue part, found through the part-line lookup (revision_parts)
  // from the part outwards, so no revision is read that does not use it
  const usesPart = sql`${swaps.id} in (select r.swap_id from revision_parts l join revisions r on r.id = l.revision_id where l.part_id = ${row.id})
    and ${revisions.id} in (select l.revision_id from revision_parts l where l.part_id = ${row.id})`;
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
