import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { MulterError } from 'multer';
import { AppError } from '../lib/app-error';
import { fieldErrors } from '../../shared/schemas/errors';
import type { Logger } from '../lib/logger';
import { isBusy } from '../db/busy';
import { skipSessionWrite } from '../auth/session-store';

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError('not_found', `There is no API route ${req.method} ${req.path}.`, 404));
};

const multerMessages: Partial<Record<MulterError['code'], [number, string]>> = {
  LIMIT_FILE_SIZE: [413, 'A photo may be at most 8 MB.'],
  LIMIT_FILE_COUNT: [400, 'Too many files in one upload.'],
  LIMIT_UNEXPECTED_FILE: [400, 'Unexpected file field; send photos in the "photos" field.'],
  LIMIT_PART_COUNT: [400, 'Too many parts in the upload.'],
  LIMIT_FIELD_KEY: [400, 'A field name is too long.'],
  LIMIT_FIELD_VALUE: [400, 'A field value is too long.'],
  LIMIT_FIELD_COUNT: [400, 'Too many fields in the upload.'],
};

/** The one place errors become responses: `{ error: { code, message, fields? } }`. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    let status = 500;
    let body: { code: string; message: string; fields?: Record<string, string> } = {
      code: 'internal',
      message: 'Something went wrong on our side. Nothing you entered was lost; try again.',
    };
    const busy = isBusy(err);
    if (busy) {
      // another process kept the database locked past the wait: say when to come back, and do not
      // make this request wait a second time to save its session
      status = 503;
      body = { code: 'busy', message: 'The database is busy for a moment; nothing was changed. Try again in a few seconds.' };
      res.set('Retry-After', '2');
      if (req.session) (req.session as unknown as Record<symbol, boolean>)[skipSessionWrite] = true;
      logger.warn({ event: 'db_busy', method: req.method, path: req.path }, 'database busy');
    } else if (err instanceof AppError) {
      status = err.status;
      body = { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) };
    } else if (err instanceof ZodError) {
      status = 400;
      const fields = fieldErrors(err.issues);
      const first = Object.entries(fields)[0];
      body = {
        code: 'invalid',
        message: first ? `Check the highlighted fields (${first[0]}: ${first[1]}).` : 'The request is not valid.',
        fields,
      };
    } else if (err instanceof MulterError) {
      const [s, message] = multerMessages[err.code] ?? [400, 'The upload could not be read.'];
      status = s;
      body = { code: 'upload_rejected', message, ...(err.field ? { fields: { [err.field]: message } } : {}) };
    } else if (err && typeof err === 'object' && 'type' in err && typeof err.type === 'string') {
      // body-parser errors
      if (err.type === 'entity.too.large') {
        status = 413;
        body = { code: 'too_large', message: 'The request body is too large.' };
      } else if (err.type === 'entity.parse.failed') {
        status = 400;
        body = { code: 'invalid_json', message: 'The request body is not valid JSON.' };
      } else if ('status' in err && typeof err.status === 'number' && err.status < 500) {
        status = err.status;
        body = { code: 'bad_request', message: 'The request could not be read.' };
      }
    } else if (err && typeof err === 'object' && 'status' in err && typeof err.status === 'number' && err.status < 500) {
      status = err.status;
      body = { code: 'bad_request', message: err instanceof Error ? err.message : 'The request could not be read.' };
    }
    if (status >= 500 && !busy) logger.error({ err, method: req.method, path: req.path }, 'request failed');
    if (res.headersSent) return;
    // a refusal or a failure depends on who asked and when: no cache keeps it
    res.status(status).set('Cache-Control', 'no-store').json({ error: body });
  };
}
