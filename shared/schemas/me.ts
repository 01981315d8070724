import { z } from 'zod';
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

/** `GET /api/me`: the signed-in user (or null) and the session's CSRF token. */
export type MeResponse = { user: MeUser | null; csrfToken: string };

// eslint-disable-next-line no-control-regex
const noControlChars = /^[^\u0000-\u001f\u007f]*$/;

export const updateMeSchema = z
  .object({
    name: z
      .string()
      .trim()
      .min(1, 'Enter the name other members see')
      .max(80, 'A name is at most 80 characters')
      .regex(noControlChars, 'A name cannot contain control characters')
      .optional(),
    units: unitSystemSchema.optional(),
  })
  .strict()
  .refine((v) => v.name !== undefined || v.units !== undefined, { message: 'Send a name or a units preference to change' });
export type UpdateMeInput = z.infer<typeof updateMeSchema>;
