import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { Role } from '@shared/schemas';
import { scopeOf } from '../db/lab-scope';
import { requireRole, requireSignedIn } from './require-role';

export type Access = readonly Role[] | 'public' | 'signed-in';

/** One API route with the roles it allows; the role-matrix test walks every one of these. */
export interface RouteSpec {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  access: Access;
  before?: RequestHandler[];
  /** A POST that only reads and re-computes (a re-check); it changes no record. */
  readOnly?: boolean;
  /** Served before the session is read (health checks: they must answer without the session store). */
  sessionless?: boolean;
  handler: (req: Request, res: Response) => unknown;
}

export function guardFor(access: Access): RequestHandler[] {
  if (access === 'public') return [];
  if (access === 'signed-in') return [requireSignedIn];
  return [requireRole(...access)];
}

export function routerFrom(specs: readonly RouteSpec[]): Router {
  const router = Router();
  for (const s of specs) {
    router[s.method](s.path, ...guardFor(s.access), ...(s.before ?? []), async (req, res) => {
      // The request's laboratory scope is made here, once, from the signed-in user; services reach the same
      // object with scopeOf(me) and filter every query of laboratory rows through it (server/db/lab-scope.ts).
      if (req.user) scopeOf(req.user);
      await s.handler(req, res);
    });
  }
  return router;
}
