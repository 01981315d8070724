import { z } from 'zod';

export const slugSchema = z
  .string()
  .min(1)
  .max(120)
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'A slug is lower-case letters, digits and dashes');

export const idParamSchema = z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER);
