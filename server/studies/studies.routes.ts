import { CreateStudyBody, IdParams, StudyListQuery, UpdateStudyBody } from '@shared/schemas';
import type { AppContext } from '../context';
import { parseRequest } from '../http/parse-request';
import type { RouteSpec } from '../http/routes';
import { createStudy, getStudy, listStudies, updateStudy, worklist } from './studies.service';

export const EDITORS = ['technologist', 'director'] as const;
export const READERS = ['technologist', 'director', 'quality'] as const;
export const studyId = (params: unknown) => parseRequest(IdParams, params, 'params').id;

export function studiesRoutes(ctx: AppContext): RouteSpec[] {
  return [
    { method: 'get', path: '/worklist', access: READERS, handler: async (req, res) => res.json(await worklist(ctx.db, req.user!)) },
    {
      method: 'get', path: '/studies', access: READERS,
      handler: async (req, res) => res.json(await listStudies(ctx.db, req.user!, parseRequest(StudyListQuery, req.query, 'query'))),
    },
    {
      method: 'post', path: '/studies', access: EDITORS,
      handler: async (req, res) => res.status(201).json(await createStudy(ctx.db, req.user!, parseRequest(CreateStudyBody, req.body, 'body'))),
    },
    { method: 'get', path: '/studies/:id', access: READERS, handler: async (req, res) => res.json(await getStudy(ctx.db, req.user!, studyId(req.params))) },
    {
      method: 'patch', path: '/studies/:id', access: EDITORS,
      handler: async (req, res) => res.json(await updateStudy(ctx.db, req.user!, studyId(req.params), parseRequest(UpdateStudyBody, req.body, 'body'))),
    },
  ];
}
