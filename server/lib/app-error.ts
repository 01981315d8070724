/** The one error type services throw; the error middleware turns it into `{ error: { code, message, fields? } }`. */
export class AppError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly status = 400,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
  }

  static notFound(what = 'That page') {
    return new AppError('not_found', `${what} was not found.`, 404);
  }
  static unauthorized(message = 'Sign in to do that.') {
    return new AppError('unauthorized', message, 401);
  }
  static forbidden(message = 'Your account cannot do that.') {
    return new AppError('forbidden', message, 403);
  }
  static conflict(message: string) {
    return new AppError('conflict', message, 409);
  }
  static invalid(message: string, fields?: Record<string, string>) {
    return new AppError('invalid', message, 400, fields);
  }
}
