import type { RequestHandler } from 'express';
import type { Role } from '@shared/schemas';
import { AppError } from './app-error';

/** Every route declares the roles that may call it; a user needs at least one of them. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(new AppError('unauthenticated', 'Sign in first'));
    if (!req.user.roles.some((r) => roles.includes(r))) {
      return next(new AppError('forbidden', `This needs the role ${roles.join(' or ')}`));
    }
    next();
  };
}

/** Any signed-in user. */
export const requireSignedIn: RequestHandler = (req, _res, next) =>
  req.user ? next() : next(new AppError('unauthenticated', 'Sign in first'));
