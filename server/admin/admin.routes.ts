import { AnalyteBody, IdParams, InstrumentBody, InviteUserBody, LaboratorySettings, UpdateUserBody } from '@shared/schemas';
import type { AppContext } from '../context';
import { parseRequest } from '../http/parse-request';
import type { RouteSpec } from '../http/routes';
import { listMail } from './admin.repository';
import { analyteCatalog, instrumentCatalog } from './catalog.service';
import { getLaboratory, updateLaboratory } from './laboratory.service';
import { inviteUser, listLabUsers, resendInvitation, sendPasswordReset, unlockLabUser, updateLabUser } from './users.service';
import { mailView } from './views';
import { scopeOf } from '../db/lab-scope';

const ADMIN = ['admin'] as const;
const EVERY_ROLE = ['technologist', 'director', 'quality', 'admin'] as const;
const id = (params: unknown) => parseRequest(IdParams, params, 'params').id;

export function adminRoutes(ctx: AppContext): RouteSpec[] {
  const catalogRoutes = (path: string, service: typeof analyteCatalog | typeof instrumentCatalog, Body: typeof AnalyteBody | typeof InstrumentBody): RouteSpec[] => [
    { method: 'get', path, access: EVERY_ROLE, handler: async (req, res) => res.json(await service.list(ctx.db, req.user!)) },
    {
      method: 'post', path, access: ADMIN,
      handler: async (req, res) => res.status(201).json(await service.create(ctx.db, req.user!, parseRequest(Body, req.body, 'body') as never)),
    },
    {
      method: 'put', path: `${path}/:id`, access: ADMIN,
      handler: async (req, res) => res.json(await service.update(ctx.db, req.user!, id(req.params), parseRequest(Body, req.body, 'body') as never)),
    },
  ];
  return [
    { method: 'get', path: '/laboratory', access: EVERY_ROLE, handler: async (req, res) => res.json(await getLaboratory(ctx.db, req.user!)) },
    {
      method: 'put', path: '/laboratory', access: ADMIN,
      handler: async (req, res) => res.json(await updateLaboratory(ctx.db, req.user!, parseRequest(LaboratorySettings, req.body, 'body'))),
    },
    { method: 'get', path: '/users', access: ADMIN, handler: async (req, res) => res.json(await listLabUsers(ctx, req.user!)) },
    {
      method: 'post', path: '/users', access: ADMIN,
      handler: async (req, res) => res.status(201).json(await inviteUser(ctx, req.user!, parseRequest(InviteUserBody, req.body, 'body'))),
    },
    {
      method: 'patch', path: '/users/:id', access: ADMIN,
      handler: async (req, res) => res.json(await updateLabUser(ctx, req.user!, id(req.params), parseRequest(UpdateUserBody, req.body, 'body'))),
    },
    { method: 'post', path: '/users/:id/unlock', access: ADMIN, handler: async (req, res) => res.json(await unlockLabUser(ctx, req.user!, id(req.params))) },
    {
      method: 'post', path: '/users/:id/invitation', access: ADMIN,
      handler: async (req, res) => {
        await resendInvitation(ctx, req.user!, id(req.params));
        res.status(204).end();
      },
    },
    {
      method: 'post', path: '/users/:id/password-link', access: ADMIN,
      handler: async (req, res) => {
        await sendPasswordReset(ctx, req.user!, id(req.params));
        res.status(204).end();
      },
    },
    ...catalogRoutes('/analytes', analyteCatalog, AnalyteBody),
    ...catalogRoutes('/instruments', instrumentCatalog, InstrumentBody),
    { method: 'get', path: '/mailbox', access: ADMIN, handler: async (req, res) => res.json((await listMail(ctx.db, scopeOf(req.user!))).map(mailView)) },
  ];
}
