import { z } from 'zod';
import { singleLine } from './text';
import type { Role } from '../roles';
import { unitSystemSchema, type UnitSystem } from './enums';

export type MeUser = {
  id: number;
  login: string;
  name: string;
  avatarUrl: string | null;
  role: Role;
  shop: { slug: string; name: string } | null;
  units: UnitSystem;
};

/** `GET /api/me`: the signed-in user and the session's CSRF token, or both null for a visitor (who has no session). */
export type MeResponse = { user: MeUser | null; csrfToken: string | null };

export const updateMeSchema = z
  .object({
    name: singleLine().trim().min(1, 'Enter the name other members see').max(80, 'A name is at most 80 characters').optional(),
    units: unitSystemSchema.optional(),
  })
  .strict()
  .refine((v) => v.name !== undefined || v.units !== undefined, { message: 'Send a name or a units preference to change' });
export type UpdateMeInput = z.infer<typeof updateMeSchema>;

/** `POST /auth/email`: ask for a one-time sign-in link. The answer is 202 whether or not the address is known. */
export const emailSignInSchema = z
  .object({
    email: z.string().trim().max(254, 'An address is at most 254 characters').pipe(z.email('Enter an e-mail address like name@example.com')),
    /** a path on this site to land on after signing in */
    returnTo: z.string().max(512).optional(),
  })
  .strict();
export type EmailSignInInput = z.infer<typeof emailSignInSchema>;
export type EmailSignInResponse = { sent: true; minutes: number };
