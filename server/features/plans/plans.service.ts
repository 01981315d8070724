import crypto from 'node:crypto';
import { and, asc, desc, eq, inArray, isNull } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { cars, chassis, planSwaps, plans, revisions, shops, swaps, users } from '../../db/schema/index';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import type { SessionUser } from '../../middleware/require-role';
import { can } from '../../../shared/roles';
import { brakeAxlesChanged, computePlan, type PlanSwap } from '../../../shared/fitment/plan';
import type {
  AdoptPlans,
  CreatePlan,
  PlanCreated,
  PlanList,
  PlanSwapView,
  PlanView,
  UpdatePlan,
} from '../../../shared/schemas/plans';
import type { NewerRevision } from '../../../shared/schemas/shops';
import { chassisView } from '../swaps/swap-views';
import { newerRevisionOf } from '../swaps/newer-revision';
import { approvedSwapsOn } from '../swaps/approved-swaps';
import { carAsItIs } from '../cars/fitted-swaps';

type SwapRow = typeof swaps.$inferSelect;
type PlanRow = typeof plans.$inferSelect;

const randomId = (bytes: number) => crypto.randomBytes(bytes).toString('base64url');
const hashKey = (key: string) => crypto.createHash('sha256').update(key).digest('hex');

function approvedSwaps(db: Db, slugs: string[], chassisId: number): SwapRow[] {
  return approvedSwapsOn(db, slugs, chassisId, 'swapSlugs', 'A plan is made of approved swaps for its chassis.');
}

function revisionData(db: Db, ids: number[]) {
  const rows = ids.length ? db.select().from(revisions).where(inArray(revisions.id, ids)).all() : [];
  return new Map(rows.map((r) => [r.id, r]));
}

/** Two swaps that change the same axle's brakes cannot both be fitted: the plan takes one per axle. */
function refuseBrakeClashes(db: Db, found: SwapRow[]) {
  const data = revisionData(
    db,
    found.map((s) => s.currentRevisionId!),
  );
  const byAxle = new Map<string, number>();
  const fields: Record<string, string> = {};
  found.forEach((swap, i) => {
    for (const axle of brakeAxlesChanged(data.get(swap.currentRevisionId!)!.data)) {
      const earlier = byAxle.get(axle);
      if (earlier !== undefined) {
        fields[`swapSlugs.${i}`] =
          `Both this and “${found[earlier]!.slug}” change the ${axle} brakes; a plan takes one brake swap per axle`;
      } else byAxle.set(axle, i);
    }
  });
  if (Object.keys(fields).length) throw AppError.invalid('Two swaps in the plan change the same brakes.', fields);
}

function knownChassis(db: Db, chassisId: number) {
  const row = db.select().from(chassis).where(eq(chassis.id, chassisId)).get();
  if (!row || row.proposed)
    throw AppError.invalid('Pick a chassis from the catalogue.', { chassisId: 'That chassis is not in the catalogue' });
  return row;
}

function ownCarOn(db: Db, viewer: SessionUser | undefined, carId: number, chassisId: number) {
  if (!viewer) throw AppError.invalid('Sign in to plan for one of your cars.', { carId: 'Sign in to pick one of your cars' });
  const car = db
    .select()
    .from(cars)
    .where(and(eq(cars.id, carId), eq(cars.userId, viewer.id)))
    .get();
  if (!car) throw AppError.invalid('Pick one of your cars.', { carId: 'That is not one of your cars' });
  if (car.chassisId !== chassisId)
    throw AppError.invalid('The car is another chassis.', { carId: 'That car is another chassis' });
  return car;
}

function shopOf(viewer: SessionUser | undefined): number {
  if (!viewer || !can(viewer.role, 'manage_shop_links') || viewer.shopId === null) {
    throw AppError.forbidden('Only a shop account makes plans for its customers.');
  }
  return viewer.shopId;
}

function writeSwaps(db: Db, planId: string, found: SwapRow[], keep: Map<number, number> = new Map()) {
  db.delete(planSwaps).where(eq(planSwaps.planId, planId)).run();
  found.forEach((swap, position) =>
    db
      .insert(planSwaps)
      .values({ planId, swapId: swap.id, revisionId: keep.get(swap.id) ?? swap.currentRevisionId!, position })
      .run(),
  );
}

export function createPlan(db: Db, clock: Clock, viewer: SessionUser | undefined, input: CreatePlan): PlanCreated {
  const c = knownChassis(db, input.chassisId);
  if (input.carId !== undefined) ownCarOn(db, viewer, input.carId, c.id);
  const shopId = input.forShop ? shopOf(viewer) : null;
  const found = approvedSwaps(db, input.swapSlugs, c.id);
  refuseBrakeClashes(db, found);

  const id = randomId(12);
  const deviceKey = viewer ? undefined : randomId(24);
  const now = clock.now();
  db.transaction(() => {
    db.insert(plans)
      .values({
        id,
        title: input.title ?? '',
        chassisId: c.id,
        carId: input.carId ?? null,
        ownerId: viewer?.id ?? null,
        deviceKeyHash: deviceKey ? hashKey(deviceKey) : null,
        shopId,
        createdAt: now,
        updatedAt: now,
      })
      .run();
    writeSwaps(db, id, found);
  });
  return deviceKey ? { id, deviceKey } : { id };
}

function planRow(db: Db, id: string): PlanRow {
  const row = db.select().from(plans).where(eq(plans.id, id)).get();
  if (!row) throw AppError.notFound('That plan');
  return row;
}

function mayEdit(plan: PlanRow, viewer: SessionUser | undefined, deviceKey: string | undefined): boolean {
  if (plan.ownerId !== null) return viewer?.id === plan.ownerId;
  return Boolean(
    deviceKey && plan.deviceKeyHash && crypto.timingSafeEqual(Buffer.from(hashKey(deviceKey)), Buffer.from(plan.deviceKeyHash)),
  );
}

function editablePlan(db: Db, id: string, viewer: SessionUser | undefined, deviceKey: string | undefined) {
  const plan = planRow(db, id);
  if (!mayEdit(plan, viewer, deviceKey))
    throw AppError.forbidden('Only the plan’s owner can change it; anyone with its address can read it.');
  return plan;
}

/** Anyone with the address reads a plan: the address is random, so sharing it is the owner's choice. */
export function getPlan(db: Db, id: string, viewer: SessionUser | undefined, deviceKey?: string): PlanView {
  const plan = planRow(db, id);
  const c = db.select().from(chassis).where(eq(chassis.id, plan.chassisId)).get()!;
  const rows = db
    .select({ link: planSwaps, swap: swaps })
    .from(planSwaps)
    .innerJoin(swaps, eq(swaps.id, planSwaps.swapId))
    .where(eq(planSwaps.planId, plan.id))
    .orderBy(asc(planSwaps.position))
    .all();
  const data = revisionData(
    db,
    rows.map((r) => r.link.revisionId),
  );
  const cache = new Map<string, NewerRevision | null>();
  const swapInputs: PlanSwap[] = [];
  const swapViews: PlanSwapView[] = rows.map(({ link, swap }) => {
    const revision = data.get(link.revisionId)!;
    swapInputs.push({
      slug: swap.slug,
      title: revision.data.title,
      axle: swap.axle,
      revisionNumber: revision.number,
      data: revision.data,
    });
    return {
      slug: swap.slug,
      title: revision.data.title,
      axle: swap.axle,
      revisionNumber: revision.number,
      newerRevision: newerRevisionOf(db, swap, link.revisionId, cache),
    };
  });

  const car = plan.carId === null ? null : carAsItIs(db, plan.carId);
  const shop = plan.shopId === null ? null : db.select().from(shops).where(eq(shops.id, plan.shopId)).get();
  const owner = plan.ownerId === null ? null : db.select().from(users).where(eq(users.id, plan.ownerId)).get();

  const computed = computePlan({
    chassis: {
      stockBrakes: c.stockBrakes,
      vehicle: c.vehicle ?? null,
      wheelBoltThread: c.wheelBoltThread,
      centreBoreMm: c.centreBoreMm,
      wheelFastening: c.wheelFastening ?? null,
    },
    car: car ? { wheel: car.wheel, vehicle: car.vehicle, fitted: car.fittedInputs } : null,
    swaps: swapInputs,
  });

  return {
    id: plan.id,
    title: plan.title || defaultTitle(c, car?.view.nickname),
    chassis: chassisView(c),
    car: car?.view ?? null,
    swaps: swapViews,
    pinned: shop ? { shop: { slug: shop.slug, name: shop.name } } : null,
    owner: owner ? { login: owner.login, name: owner.name } : null,
    canEdit: mayEdit(plan, viewer, deviceKey),
    createdAt: plan.createdAt.toISOString(),
    updatedAt: plan.updatedAt.toISOString(),
    ...computed,
  };
}

function defaultTitle(c: typeof chassis.$inferSelect, nickname?: string) {
  return nickname ? `Plan for ${nickname}` : `Plan for a ${c.make} ${c.model}`;
}

export function updatePlan(
  db: Db,
  clock: Clock,
  id: string,
  viewer: SessionUser | undefined,
  deviceKey: string | undefined,
  input: UpdatePlan,
) {
  const plan = editablePlan(db, id, viewer, deviceKey);
  if (input.carId) ownCarOn(db, viewer, input.carId, plan.chassisId);
  db.transaction(() => {
    if (input.swapSlugs) {
      const found = approvedSwaps(db, input.swapSlugs, plan.chassisId);
      refuseBrakeClashes(db, found);
      // swaps already in the plan keep the revision they were planned with
      const kept = db.select().from(planSwaps).where(eq(planSwaps.planId, plan.id)).all();
      writeSwaps(db, plan.id, found, new Map(kept.map((k) => [k.swapId, k.revisionId])));
    }
    db.update(plans)
      .set({
        ...(input.title !== undefined ? { title: input.title } : {}),
        ...(input.carId !== undefined ? { carId: input.carId } : {}),
        updatedAt: clock.now(),
      })
      .where(eq(plans.id, plan.id))
      .run();
  });
}

/** Moves every swap of the plan to its current revision (after the owner has read what changed). */
export function refreshPlan(db: Db, clock: Clock, id: string, viewer: SessionUser | undefined, deviceKey: string | undefined) {
  const plan = editablePlan(db, id, viewer, deviceKey);
  db.transaction(() => {
    for (const link of db.select().from(planSwaps).where(eq(planSwaps.planId, plan.id)).all()) {
      const swap = db.select().from(swaps).where(eq(swaps.id, link.swapId)).get()!;
      if (swap.currentRevisionId !== null && swap.currentRevisionId !== link.revisionId) {
        db.update(planSwaps)
          .set({ revisionId: swap.currentRevisionId })
          .where(and(eq(planSwaps.planId, plan.id), eq(planSwaps.swapId, swap.id)))
          .run();
      }
    }
    db.update(plans).set({ updatedAt: clock.now() }).where(eq(plans.id, plan.id)).run();
  });
}

export function deletePlan(db: Db, id: string, viewer: SessionUser | undefined, deviceKey: string | undefined) {
  const plan = editablePlan(db, id, viewer, deviceKey);
  db.delete(plans).where(eq(plans.id, plan.id)).run();
}

/** Plans a visitor made on this device become the member's when they sign in; the device keys prove it. */
export function adoptPlans(db: Db, clock: Clock, viewer: SessionUser, input: AdoptPlans): { adopted: string[] } {
  const adopted: string[] = [];
  db.transaction(() => {
    for (const { id, deviceKey } of input.plans) {
      const done = db
        .update(plans)
        .set({ ownerId: viewer.id, deviceKeyHash: null, updatedAt: clock.now() })
        .where(and(eq(plans.id, id), isNull(plans.ownerId), eq(plans.deviceKeyHash, hashKey(deviceKey))))
        .run();
      if (done.changes > 0) adopted.push(id);
    }
  });
  return { adopted };
}

export function listMyPlans(db: Db, viewer: SessionUser): PlanList {
  const rows = db
    .select({ plan: plans, chassis, car: cars })
    .from(plans)
    .innerJoin(chassis, eq(chassis.id, plans.chassisId))
    .leftJoin(cars, eq(cars.id, plans.carId))
    .where(eq(plans.ownerId, viewer.id))
    .orderBy(desc(plans.updatedAt))
    .all();
  const counts = new Map<string, number>();
  if (rows.length) {
    for (const link of db
      .select()
      .from(planSwaps)
      .where(
        inArray(
          planSwaps.planId,
          rows.map((r) => r.plan.id),
        ),
      )
      .all()) {
      counts.set(link.planId, (counts.get(link.planId) ?? 0) + 1);
    }
  }
  return {
    items: rows.map(({ plan, chassis: c, car }) => ({
      id: plan.id,
      title: plan.title || defaultTitle(c, car?.nickname),
      chassis: { slug: c.slug, make: c.make, model: c.model, code: c.code },
      carNickname: car?.nickname ?? null,
      swapCount: counts.get(plan.id) ?? 0,
      updatedAt: plan.updatedAt.toISOString(),
    })),
  };
}
