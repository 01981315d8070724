import { z } from 'zod';

export const slugSchema = z
  .string()
  .min(1)
  .max(120)
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'A slug is lower-case letters, digits and dashes');

export const idParamSchema = z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER);

/** A stored photo's id, as `/media/:id` takes it. */
export const photoIdPattern = /^[a-z0-9]{12,40}$/;
export const photoIdSchema = z.string().regex(photoIdPattern, 'Not a photo id');
