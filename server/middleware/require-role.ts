import type { Request, RequestHandler } from 'express';
import type {} from 'passport';
import { AppError } from '../lib/app-error';
import { can, type Permission, type Role } from '../../shared/roles';

/** The signed-in user as every request sees it, read fresh from the database (so role changes apply at once). */
export type SessionUser = {
  id: number;
  login: string;
  name: string;
  email: string | null;
  avatarUrl: string | null;
  role: Role;
  shopId: number | null;
};

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

/** Every refusal is logged with who and what (pino-http puts the request logger on req.log). */
function denied(req: Request, need: string) {
  req.log?.warn(
    { event: 'authorization_denied', userId: req.user?.id ?? null, method: req.method, path: req.originalUrl, need },
    'authorization denied',
  );
}

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) {
    denied(req, 'signed-in');
    return next(AppError.unauthorized());
  }
  next();
};

export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return requireUser(req, _res, next);
    if (!roles.includes(req.user.role)) {
      denied(req, roles.join('|'));
      return next(AppError.forbidden());
    }
    next();
  };
}

export function requirePermission(permission: Permission): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return requireUser(req, _res, next);
    if (!can(req.user.role, permission)) {
      denied(req, permission);
      return next(AppError.forbidden());
    }
    next();
  };
}
