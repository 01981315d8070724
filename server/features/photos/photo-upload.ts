import type { RequestHandler } from 'express';
import { MulterError } from 'multer';
import { AppError } from '../../lib/app-error';

/**
 * What a failed multipart read becomes. Multer's own limit errors keep their code for the error
 * middleware and, when multer names no field (too many files, parts or fields), get the upload's
 * field. Anything else comes from the body itself (a broken boundary, a missing end, a malformed
 * part header) and is the client's fault: a 400 on the field, never a 500.
 */
export function uploadError(err: unknown, field: string): unknown {
  if (!err) return err;
  if (err instanceof MulterError) {
    if (!err.field) err.field = field;
    return err;
  }
  if (err instanceof AppError) return err;
  const message = 'The upload could not be read; send the photos as multipart/form-data from the form.';
  return new AppError('upload_rejected', message, 400, { [field]: message });
}

/** A multer middleware whose failures all reach the error middleware as 4xx answers naming `field`. */
export function readUpload(upload: RequestHandler, field: string): RequestHandler {
  return (req, res, next) => upload(req, res, (err?: unknown) => next(uploadError(err, field)));
}
