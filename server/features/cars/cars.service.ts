import { and, asc, count, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { cars, chassis } from '../../db/schema/index';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import { stripHtml } from '../../lib/sanitize';
import { MAX_CARS, type CarInput, type CarUpdate, type CarView } from '../../../shared/schemas/cars';
import { fittedSwapsOf, setFittedSwaps } from './fitted-swaps';
import { carBrakesAsIs } from '../../../shared/fitment/plan';

type CarRow = typeof cars.$inferSelect;
type ChassisRow = typeof chassis.$inferSelect;

function carView(db: Db, car: CarRow, c: ChassisRow, fitted = fittedSwapsOf(db, [car.id])): CarView {
  const fittedInputs = (fitted.get(car.id) ?? []).map((f) => f.input);
  const brakes = carBrakesAsIs(c.stockBrakes, fittedInputs);
  const changed = brakes.front.source.kind === 'swap' || brakes.rear.source.kind === 'swap';
  return {
    id: car.id,
    nickname: car.nickname,
    chassis: { id: c.id, slug: c.slug, make: c.make, model: c.model, code: c.code, yearFrom: c.yearFrom, yearTo: c.yearTo },
    wheelDiameterIn: car.wheelDiameterIn,
    wheelWidthIn: car.wheelWidthIn,
    wheelOffsetMm: car.wheelOffsetMm,
    tyre: car.tyre,
    spacerMm: car.spacerMm,
    vehicle: car.vehicle ?? null,
    wheelInsideProfile: car.wheelInsideProfile ?? null,
    fitted: (fitted.get(car.id) ?? []).map((f) => f.view),
    brakesAsIs: changed ? { front: brakes.front.corner, rear: brakes.rear.corner } : null,
    otherChanges: car.otherChanges,
    createdAt: car.createdAt.toISOString(),
    updatedAt: car.updatedAt.toISOString(),
  };
}

function knownChassis(db: Db, chassisId: number) {
  const row = db.select().from(chassis).where(eq(chassis.id, chassisId)).get();
  if (!row || row.proposed)
    throw AppError.invalid('Pick a chassis from the catalogue.', { chassisId: 'That chassis is not in the catalogue' });
  return row;
}

export function listCars(db: Db, userId: number): CarView[] {
  const rows = db
    .select({ car: cars, chassis })
    .from(cars)
    .innerJoin(chassis, eq(chassis.id, cars.chassisId))
    .where(eq(cars.userId, userId))
    .orderBy(asc(cars.createdAt), asc(cars.id))
    .all();
  const fitted = fittedSwapsOf(
    db,
    rows.map((r) => r.car.id),
  );
  return rows.map((r) => carView(db, r.car, r.chassis, fitted));
}

export function createCar(db: Db, clock: Clock, userId: number, input: CarInput): CarView {
  const c = knownChassis(db, input.chassisId);
  const owned = db.select({ n: count() }).from(cars).where(eq(cars.userId, userId)).get()?.n ?? 0;
  if (owned >= MAX_CARS) throw AppError.conflict(`You can keep up to ${MAX_CARS} cars. Remove one first.`);
  const now = clock.now();
  const { fittedSwapSlugs, ...fields } = input;
  const row = db.transaction(() => {
    const inserted = db
      .insert(cars)
      .values({ ...fields, nickname: stripHtml(input.nickname).trim() || 'My car', userId, createdAt: now, updatedAt: now })
      .returning()
      .get();
    setFittedSwaps(db, inserted.id, c.id, fittedSwapSlugs, now);
    return inserted;
  });
  return carView(db, row, c);
}

/** Only the owner sees or changes a car; anyone else gets the same answer as for a car that does not exist. */
function ownCar(db: Db, userId: number, id: number) {
  const row = db
    .select()
    .from(cars)
    .where(and(eq(cars.id, id), eq(cars.userId, userId)))
    .get();
  if (!row) throw AppError.notFound('That car');
  return row;
}

export function updateCar(db: Db, clock: Clock, userId: number, id: number, input: CarUpdate): CarView {
  const existing = ownCar(db, userId, id);
  const c = knownChassis(db, input.chassisId ?? existing.chassisId);
  const { fittedSwapSlugs, ...changes } = Object.fromEntries(
    Object.entries(input).filter(([, v]) => v !== undefined),
  ) as CarUpdate;
  if (changes.nickname !== undefined) changes.nickname = stripHtml(changes.nickname).trim() || existing.nickname;
  const now = clock.now();
  const row = db.transaction(() => {
    const updated = db
      .update(cars)
      .set({ ...changes, updatedAt: now })
      .where(eq(cars.id, existing.id))
      .returning()
      .get();
    // a car moved to another chassis cannot keep swaps made for the old one
    const slugs = fittedSwapSlugs ?? (input.chassisId !== undefined && input.chassisId !== existing.chassisId ? [] : undefined);
    if (slugs !== undefined) setFittedSwaps(db, existing.id, c.id, slugs, now);
    return updated;
  });
  return carView(db, row, c);
}

export function deleteCar(db: Db, userId: number, id: number) {
  const existing = ownCar(db, userId, id);
  db.delete(cars).where(eq(cars.id, existing.id)).run();
}
