import { and, asc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { carFittedSwaps, cars, revisions, swaps } from '../../db/schema/index';
import { approvedSwapsOn } from '../swaps/approved-swaps';
import type { PlanSwap } from '../../../shared/fitment/plan';
import type { WheelUnderTest } from '../../../shared/fitment/swap-checks';
import type { PlanFittedView, PlanView } from '../../../shared/schemas/plans';
import type { VehicleData } from '../../../shared/schemas/vehicle';

// The car as it is: the approved swaps a member has fitted to a car, at the revision they fitted.

type Fitted = { view: PlanFittedView; input: PlanSwap };

export function fittedSwapsOf(db: Db, carIds: number[]): Map<number, Fitted[]> {
  const out = new Map<number, Fitted[]>();
  if (carIds.length === 0) return out;
  const rows = db
    .select({ link: carFittedSwaps, swap: swaps, revision: revisions })
    .from(carFittedSwaps)
    .innerJoin(swaps, eq(swaps.id, carFittedSwaps.swapId))
    .innerJoin(revisions, eq(revisions.id, carFittedSwaps.revisionId))
    .where(inArray(carFittedSwaps.carId, carIds))
    .orderBy(asc(carFittedSwaps.position))
    .all();
  for (const { link, swap, revision } of rows) {
    const view = { slug: swap.slug, title: revision.data.title, axle: swap.axle, revisionNumber: revision.number };
    const list = out.get(link.carId) ?? [];
    list.push({ view, input: { ...view, data: revision.data } });
    out.set(link.carId, list);
  }
  return out;
}

/** Replaces the car's fitted swaps; each must be approved and for the car's chassis. Run inside the car's write. */
export function setFittedSwaps(db: Db, carId: number, chassisId: number, slugs: string[], now: Date) {
  const found = approvedSwapsOn(
    db,
    slugs,
    chassisId,
    'fittedSwapSlugs',
    'Fitted swaps are approved swaps for the car’s chassis.',
  );

  const before = new Map(
    db
      .select()
      .from(carFittedSwaps)
      .where(eq(carFittedSwaps.carId, carId))
      .all()
      .map((r) => [r.swapId, r]),
  );
  db.delete(carFittedSwaps).where(eq(carFittedSwaps.carId, carId)).run();
  found.forEach((swap, position) => {
    const kept = before.get(swap.id);
    db.insert(carFittedSwaps)
      .values({
        carId,
        swapId: swap.id,
        // a swap already recorded stays at the revision that was fitted
        revisionId: kept?.revisionId ?? swap.currentRevisionId!,
        position,
        createdAt: kept?.createdAt ?? now,
      })
      .run();
  });
}

export type CarAsItIs = {
  view: NonNullable<PlanView['car']>;
  wheel: WheelUnderTest;
  vehicle: VehicleData | null;
  fittedInputs: PlanSwap[];
};

export function carAsItIs(db: Db, carId: number): CarAsItIs | null {
  const car = db
    .select()
    .from(cars)
    .where(and(eq(cars.id, carId)))
    .get();
  if (!car) return null;
  const fitted = fittedSwapsOf(db, [car.id]).get(car.id) ?? [];
  const wheel = {
    diameterIn: car.wheelDiameterIn,
    widthIn: car.wheelWidthIn,
    offsetMm: car.wheelOffsetMm,
    spacerMm: car.spacerMm,
  };
  return {
    view: {
      id: car.id,
      nickname: car.nickname,
      wheel: { ...wheel, tyre: car.tyre },
      fitted: fitted.map((f) => f.view),
      otherChanges: car.otherChanges,
    },
    wheel,
    vehicle: car.vehicle ?? null,
    fittedInputs: fitted.map((f) => f.input),
  };
}
