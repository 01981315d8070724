import { z } from 'zod';
import { parseTyreSize } from '../fitment/tyre';
import { FitmentInputError } from '../fitment/errors';

/** A tyre size as on the sidewall, read by the tyre computations; empty means not given. */
export const tyreSizeField = z
  .string()
  .trim()
  .max(40)
  .superRefine((v, ctx) => {
    if (v === '') return;
    try {
      parseTyreSize(v);
    } catch (err) {
      ctx.addIssue({
        code: 'custom',
        message: err instanceof FitmentInputError ? err.message : 'Not a tyre size like 205/55R16',
      });
    }
  });
