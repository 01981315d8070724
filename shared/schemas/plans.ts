import { z } from 'zod';
import { singleLine } from './text';
import { slugSchema } from './params';
import type { Axle } from './enums';
import type { ChassisView } from './views';
import type { PlanComputation } from '../fitment/plan';
import type { NewerRevision } from './shops';

// API contract of build plans: several approved swaps on one car, computed together.

export const MAX_PLAN_SWAPS = 6;

const swapSlugsField = z
  .array(slugSchema, { error: 'List the swaps of the plan' })
  .min(1, 'Pick at least one swap')
  .max(MAX_PLAN_SWAPS, `A plan holds at most ${MAX_PLAN_SWAPS} swaps`)
  .refine((slugs) => new Set(slugs).size === slugs.length, 'A swap is listed twice');

const titleField = singleLine().trim().max(80, 'At most 80 characters');

/** A plan's public id: random, unguessable, so a shared link is the only way in. */
export const planIdSchema = z.string().regex(/^[A-Za-z0-9_-]{10,32}$/, 'Not a plan id');

/** A visitor's plan is kept by the device: it holds this key until its owner signs in. */
export const deviceKeySchema = z.string().regex(/^[A-Za-z0-9_-]{20,64}$/, 'Not a device key');

export const createPlanSchema = z.object({
  chassisId: z.number({ error: 'Pick the chassis' }).int().positive('Pick the chassis'),
  carId: z.number().int().positive().optional(),
  swapSlugs: swapSlugsField,
  title: titleField.optional(),
  /** a shop making a plan for a customer pins every swap to the revision it quoted */
  forShop: z.boolean().optional(),
});
export type CreatePlan = z.infer<typeof createPlanSchema>;

export const updatePlanSchema = z
  .object({
    title: titleField,
    carId: z.number().int().positive().nullable(),
    swapSlugs: swapSlugsField,
  })
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Send at least one field to change' });
export type UpdatePlan = z.infer<typeof updatePlanSchema>;

export const adoptPlansSchema = z.object({
  plans: z
    .array(z.object({ id: planIdSchema, deviceKey: deviceKeySchema }))
    .min(1)
    .max(50),
});
export type AdoptPlans = z.infer<typeof adoptPlansSchema>;

/** POST /api/plans; `deviceKey` only for a visitor's plan, shown once */
export type PlanCreated = { id: string; deviceKey?: string };

export type PlanSwapView = {
  slug: string;
  title: string;
  axle: Axle;
  /** the revision the plan uses */
  revisionNumber: number;
  /** the swap's current revision, when it is newer than the one the plan uses */
  newerRevision: NewerRevision | null;
};

export type PlanFittedView = { slug: string; title: string; axle: Axle; revisionNumber: number };

/** GET /api/plans/:id */
export type PlanView = {
  id: string;
  title: string;
  chassis: ChassisView;
  car: {
    id: number;
    nickname: string;
    wheel: { diameterIn: number; widthIn: number; offsetMm: number; spacerMm: number; tyre: string };
    fitted: PlanFittedView[];
    otherChanges: string;
  } | null;
  swaps: PlanSwapView[];
  /** pinned plans (made by a shop) keep the revisions they were made with */
  pinned: { shop: { slug: string; name: string } } | null;
  owner: { login: string; name: string } | null;
  /** the viewer may change it (its owner, or the device that made it) */
  canEdit: boolean;
  createdAt: string;
  updatedAt: string;
} & PlanComputation;

export type PlanListItem = {
  id: string;
  title: string;
  chassis: { slug: string; make: string; model: string; code: string };
  carNickname: string | null;
  swapCount: number;
  updatedAt: string;
};
export type PlanList = { items: PlanListItem[] };
