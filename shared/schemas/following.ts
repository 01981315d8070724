import { z } from 'zod';
import { slugSchema } from './params';

// API contract of following a chassis or one of my cars: a digest e-mail of swaps published for it.

export const digestFrequencies = ['daily', 'weekly'] as const;
export const digestFrequencySchema = z.enum(digestFrequencies);
export type DigestFrequency = z.infer<typeof digestFrequencySchema>;
export const digestFrequencyLabels: Record<DigestFrequency, string> = {
  daily: 'Once a day',
  weekly: 'Once a week',
};

/** POST /api/me/follows — exactly one of a chassis (by slug) or one of the member's cars (by id) */
export const createFollowSchema = z
  .object({
    chassisSlug: slugSchema.optional(),
    carId: z.coerce.number().int().positive().optional(),
    frequency: digestFrequencySchema.default('weekly'),
  })
  .refine((v) => (v.chassisSlug === undefined) !== (v.carId === undefined), {
    message: 'Follow either a chassis or one of your cars',
    path: ['chassisSlug'],
  });
export type CreateFollow = z.infer<typeof createFollowSchema>;

/** PATCH /api/me/follows/:id */
export const updateFollowSchema = z.object({ frequency: digestFrequencySchema });

export type FollowItem = {
  id: number;
  frequency: DigestFrequency;
  /** what is followed: a chassis, or a car (which names its chassis) */
  target:
    | { kind: 'chassis'; chassis: { slug: string; label: string } }
    | { kind: 'car'; car: { id: number; nickname: string }; chassis: { slug: string; label: string } };
  createdAt: string;
  /** swaps published since this moment go into the next digest */
  since: string;
  /** when the next digest is due (sent only when something was published) */
  nextDigestAt: string;
};

/** GET /api/me/follows */
export type FollowList = { items: FollowItem[] };
